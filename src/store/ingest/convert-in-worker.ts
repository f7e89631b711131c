import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { InputError } from '../../errors.js';
import { FileFormatError } from '../readers/types.js';
import type { ConvertEnd, ConvertInput, ConvertSink } from './convert-file.js';

/** The worker entry next to this module: .js when built, .ts when run from source under tsx. */
function workerFile(): URL | undefined {
  for (const ext of ['.js', '.ts']) {
    const url = new URL(`./convert-worker${ext}`, import.meta.url);
    if (existsSync(fileURLToPath(url))) return url;
  }
  return undefined;
}

/** A parsing worker needs little: batches are small and short-lived (keeps peak RSS down). */
const LIMITS = { maxOldGenerationSizeMb: 96 };

/** Raised when the worker cannot start (e.g. a test runner that cannot load .ts in workers). */
export class WorkerUnavailableError extends Error {}

interface WorkerError {
  input: boolean;
  name: string;
  code: string;
  message: string;
  details: unknown;
}

function rebuild(e: WorkerError): Error {
  if (!e.input) return new Error(e.message);
  if (e.name === 'FileFormatError') return new FileFormatError(e.message, e.details as never);
  const err = new InputError(e.code, e.message, e.details);
  err.name = e.name;
  return err;
}

/** Run convertFile in a worker thread; the sink runs here (the thread that owns the database). */
export function convertInWorker(
  input: ConvertInput,
  sink: ConvertSink,
  signal?: AbortSignal,
): Promise<ConvertEnd> {
  const file = workerFile();
  if (!file || (!file.pathname.endsWith('.js') && !process.execArgv.some((a) => a.includes('tsx')))) {
    return Promise.reject(new WorkerUnavailableError('no loadable worker entry'));
  }
  return new Promise((resolve, reject) => {
    // Built code runs the .js entry directly. From source (under tsx) the worker first registers
    // tsx's loader in its own thread, then imports the .ts entry.
    const worker = file.pathname.endsWith('.js')
      ? new Worker(file, { workerData: input, resourceLimits: LIMITS })
      : new Worker(
          `import('tsx/esm/api').then((m) => { m.register(); return import(${JSON.stringify(file.href)}); })`,
          { eval: true, workerData: input, resourceLimits: LIMITS },
        );
    let started = false;
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      void worker.terminate();
      fn();
    };
    worker.on(
      'message',
      (m: {
        type: string;
        header?: never;
        rows?: never;
        rowsRead?: number;
        end?: ConvertEnd;
        error?: WorkerError;
      }) => {
        if (settled) return;
        try {
          started = true;
          if (m.type === 'header') sink.header(m.header!);
          else if (m.type === 'batch') {
            const r = sink.batch(m.rows!, m.rowsRead!);
            if (r instanceof Promise)
              r.then(
                () => worker.postMessage('ack'),
                (e) => finish(() => reject(e)),
              );
            else worker.postMessage('ack');
          } else if (m.type === 'end') finish(() => resolve(m.end!));
          else if (m.type === 'error') finish(() => reject(rebuild(m.error!)));
        } catch (e) {
          finish(() => reject(e));
        }
      },
    );
    signal?.addEventListener('abort', () => finish(() => reject(signal.reason)), { once: true });
    worker.on('error', (e) => finish(() => reject(started ? e : new WorkerUnavailableError(e.message))));
    worker.on('exit', (code) =>
      finish(() => reject(new Error(`the parsing worker stopped (exit code ${code})`))),
    );
  });
}
