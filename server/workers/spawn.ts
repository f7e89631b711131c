import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';

/**
 * Starts a worker thread running the ES module at `entryUrl` (a sibling .ts file under tsx/vitest,
 * .js once built). From TypeScript sources the worker first registers tsx's loader, so the same code
 * path works in development, in tests and from dist/.
 */
const BOOTSTRAP = `
const { workerData } = require('node:worker_threads');
(async () => {
  if (workerData.__tsLoader) { const { register } = await import(workerData.__tsLoader); register(); }
  await import(workerData.__entry);
})().catch((err) => { setImmediate(() => { throw err; }); });
`;

function tsLoaderUrl(): string | undefined {
  try {
    const require = createRequire(import.meta.url);
    return pathToFileURL(require.resolve('tsx/esm/api').replace(/index\.cjs$/, 'index.mjs')).href;
  } catch {
    return undefined;
  }
}

export function spawnModuleWorker(entryUrl: URL, data: Record<string, unknown>): Worker {
  const fromTs = entryUrl.pathname.endsWith('.ts');
  const loader = fromTs ? tsLoaderUrl() : undefined;
  if (fromTs && !loader) throw new Error('running from TypeScript sources needs the tsx dev dependency');
  return new Worker(BOOTSTRAP, {
    eval: true,
    workerData: { ...data, __entry: entryUrl.href, __tsLoader: loader },
  });
}

/** The URL of a worker module in this folder, with the extension this file was loaded with (.ts or .js). */
export function workerModuleUrl(name: string): URL {
  const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
  return new URL(`./${name}${ext}`, import.meta.url);
}
