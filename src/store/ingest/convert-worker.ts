/**
 * Worker-thread entry: parse and check a catalogue file (convertFile) and post the staged rows to
 * the loading thread, at most two batches ahead of it (each batch is acknowledged), so memory stays
 * flat while parsing and SQLite writes run on two cores.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { InputError } from '../../errors.js';
import { type ConvertInput, convertFile } from './convert-file.js';

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

try {
  const end = await convertFile(workerData as ConvertInput, {
    header: (header) => port.postMessage({ type: 'header', header }),
    batch: async (rows, rowsRead) => {
      while (credits === 0) await new Promise<void>((r) => (wake = r));
      credits--;
      // The number and code buffers are transferred, not copied.
      port.postMessage({ type: 'batch', rows, rowsRead }, [rows.numbers.buffer, rows.codes.buffer]);
    },
  });
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
