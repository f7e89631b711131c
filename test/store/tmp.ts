import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach } from 'vitest';
import { openStore, type Store } from '../../src/store/index.js';

/** A temporary folder and store per test, removed afterwards. */
export function useTmp() {
  const dirs: string[] = [];
  const stores: Store[] = [];
  afterEach(() => {
    for (const s of stores.splice(0)) s.close();
    for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
  });
  return {
    dir(): string {
      const d = mkdtempSync(join(tmpdir(), 'forehalo-test-'));
      dirs.push(d);
      return d;
    },
    file(name: string, content: string | Buffer): string {
      const p = join(this.dir(), name);
      writeFileSync(p, content);
      return p;
    },
    store(options?: Parameters<typeof openStore>[1]): Store {
      const s = openStore(join(this.dir(), 'test.db'), options);
      stores.push(s);
      return s;
    },
  };
}
