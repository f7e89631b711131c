/**
 * Worker-thread entry: parse and check a catalogue file (convertFile) and post the staged rows to
 * the loading thread, at most two batches ahead of it (each batch is acknowledged), so memory stays
 * flat while parsing and SQLite writes run on two cores.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { InputError } from '../../errors.js';
import { type ConvertInput, convertFile } from './convert-file.js';
import { sha256OfFile } from './source-file.js';
import { transferables } from './staged-batch.js';

const port = parentPort!;
let credits = 2;
let wake: (() => void) | null = null;
port.on('message', (m) => {
  if (m === 'ack') {
    credits++;
    wake?.();
    wake = null;
  }
});

const input = workerData as ConvertInput;
// The hash reads the file again alongside the parsing (it is in the page cache by then): this
// thread has time to spare, the loading thread has none.
const hashing = input.hashFile ? sha256OfFile(input.path) : undefined;
hashing?.catch(() => {}); // awaited below; never an unhandled rejection meanwhile

try {
  const end = await convertFile(input, {
    header: (header) => port.postMessage({ type: 'header', header }),
    batch: async (rows, rowsRead) => {
      while (credits === 0) await new Promise<void>((r) => (wake = r));
      credits--;
      // The number, code and id-offset buffers are transferred, not copied; the ids go as one string.
      port.postMessage({ type: 'batch', rows, rowsRead }, transferables(rows));
    },
  });
  if (hashing) end.sha256 = await hashing;
  port.postMessage({ type: 'end', end });
} catch (err) {
  const e = err as Error;
  port.postMessage({
    type: 'error',
    error: {
      input: err instanceof InputError,
      name: e?.name,
      code: (err as InputError).code,
      message: e?.message ?? String(err),
      details: (err as InputError).details,
    },
  });
}
port.close();
