import { dropCatalog, getCatalog, listCatalogs, type Store } from '../../src/store/index.js';
import { reviveError, type SerialisedError } from '../workers/errors.js';
import type { LoadJob } from '../workers/load-job.js';
import { spawnModuleWorker, workerModuleUrl } from '../workers/spawn.js';
import { spoolToFile } from './spool.js';
import type { CatalogService, LoadRequest } from './types.js';

const LOAD_WORKER = workerModuleUrl('load-catalog');

/** Runs one load job in a worker thread; resolves with the store's load summary. */
export function runLoadInWorker(job: LoadJob): Promise<unknown> {
  return new Promise((resolve, reject) => {
    const worker = spawnModuleWorker(LOAD_WORKER, { job });
    let settled = false;
    worker.on('message', (message: { ok?: boolean; summary?: unknown; error?: SerialisedError }) => {
      if (message.ok === true) {
        settled = true;
        resolve(message.summary);
      } else if (message.ok === false && message.error) {
        settled = true;
        reject(reviveError(message.error));
      }
    });
    worker.on('error', (err) => {
      settled = true;
      reject(err);
    });
    worker.on('exit', (code) => {
      if (!settled) reject(new Error(`catalogue load worker exited with code ${code} before reporting`));
    });
  });
}

/**
 * Catalogue operations for the HTTP layer. Reads use the server's store connection; loads spool the
 * body to a temporary file and run in a worker thread with its own connection, one at a time; drops
 * queue behind them.
 */
export function createCatalogService(store: Store, dbPath: string): CatalogService {
  // Writes run one at a time, in arrival order: a load's final copy and commit hold the database's
  // write lock, and a drop queued behind it waits here instead of blocking the event loop on
  // SQLite's busy wait.
  let queue: Promise<unknown> = Promise.resolve();
  const inTurn = <T>(write: () => T | Promise<T>): Promise<T> => {
    const run = queue.then(write);
    queue = run.catch(() => undefined);
    return run;
  };
  return {
    list: () => listCatalogs(store),
    show: (name) => getCatalog(store, name),
    drop: (name) => inTurn(() => dropCatalog(store, name)),
    async load(request: LoadRequest) {
      const spooled = await spoolToFile(request.body, request.limitBytes);
      const job: LoadJob = {
        dbPath,
        filePath: spooled.path,
        fileName: request.fileName ?? `${request.name}.${request.format ?? 'upload'}`,
        name: request.name,
        format: request.format as LoadJob['format'],
        map: request.map,
        skipInvalid: request.skipInvalid,
        mode: request.mode,
      };
      try {
        return await inTurn(() => runLoadInWorker(job));
      } finally {
        spooled.dispose();
      }
    },
  };
}
