import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The package's root folder (the one holding web/ and fixtures/demo/), found by walking up from this
 * file, so it works from the sources (src/cli/demo) and from the built package (dist/src/cli/demo).
 */
export function packageRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 6; i++) {
    if (existsSync(join(dir, 'web', 'index.html')) && existsSync(join(dir, 'package.json'))) return dir;
    dir = dirname(dir);
  }
  throw new Error(
    'cannot find the forehalo package folder (web/index.html) above ' + fileURLToPath(import.meta.url),
  );
}
