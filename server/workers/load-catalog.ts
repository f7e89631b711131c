/**
 * Worker-thread entry: loads one spooled catalogue file into the store with its own SQLite
 * connection, so the HTTP event loop keeps answering queries during a long load. Posts exactly one
 * message: `{ ok: true, summary }` or `{ ok: false, error }` (a plain-object error, see serialise).
 */
import { parentPort, workerData } from 'node:worker_threads';
import { loadCatalog, openStore } from '../../src/store/index.js';
import { serialiseError } from './errors.js';
import type { LoadJob } from './load-job.js';

const job = workerData.job as LoadJob;

async function main() {
  const store = openStore(job.dbPath);
  try {
    const summary = await loadCatalog(store, {
      source: job.filePath,
      fileName: job.fileName,
      name: job.name,
      format: job.format,
      map: job.map,
      skipInvalid: job.skipInvalid,
      mode: job.mode,
      onProgress: (rowsRead) => parentPort?.postMessage({ progress: rowsRead }),
    });
    parentPort?.postMessage({ ok: true, summary });
  } finally {
    store.close();
  }
}

main().catch((err) => parentPort?.postMessage({ ok: false, error: serialiseError(err) }));
