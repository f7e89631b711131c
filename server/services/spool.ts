import { once } from 'node:events';
import { createWriteStream, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Readable } from 'node:stream';
import { InputError } from '../../src/errors.js';
import { PayloadTooLargeError } from '../http-errors.js';

export interface SpooledFile {
  path: string;
  bytes: number;
  dispose(): void;
}

/**
 * Streams a request body to a private temporary file, never holding it in memory. Once more than
 * `limitBytes` have arrived it stops writing, deletes the partial file, discards the rest of the
 * body (so the 413 reply can still reach the client) and throws PayloadTooLargeError.
 */
export async function spoolToFile(body: Readable, limitBytes: number): Promise<SpooledFile> {
  const dir = mkdtempSync(join(tmpdir(), 'forehalo-http-'));
  const path = join(dir, 'upload');
  const dispose = () => rmSync(dir, { recursive: true, force: true });
  const out = createWriteStream(path);
  let bytes = 0;
  try {
    await new Promise<void>((resolve, reject) => {
      const onData = (chunk: Buffer) => {
        bytes += chunk.length;
        if (bytes > limitBytes) {
          body.off('data', onData);
          body.off('end', resolve);
          body.resume(); // discard the remainder
          reject(
            new PayloadTooLargeError(
              `Upload exceeds the limit of ${limitBytes} bytes (FOREHALO_UPLOAD_LIMIT)`,
            ),
          );
          return;
        }
        if (!out.write(chunk)) {
          body.pause();
          out.once('drain', () => body.resume());
        }
      };
      body.on('data', onData);
      body.once('end', resolve);
      body.once('error', () =>
        reject(
          new InputError(
            'upload_interrupted',
            'The upload ended before the whole body arrived; nothing was stored',
          ),
        ),
      );
      body.once('aborted', () =>
        reject(new InputError('upload_interrupted', 'The client aborted the upload; nothing was stored')),
      );
    });
    out.end();
    await once(out, 'close');
  } catch (err) {
    out.destroy();
    dispose();
    throw err;
  }
  if (bytes === 0) {
    dispose();
    throw new InputError('empty_upload', 'The request body is empty: send the catalogue file as the body');
  }
  return { path, bytes, dispose };
}
