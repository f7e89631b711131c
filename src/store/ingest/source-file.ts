import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { type Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { InputError } from '../../errors.js';

/** A catalogue source resolved to a file on disk, with its SHA-256 and a clean-up hook. */
export interface SourceFile {
  readonly path: string;
  /** File name recorded in the catalogue table (the original name, not a spool path). */
  readonly fileName: string;
  /**
   * SHA-256 of the file (hex). Known at once for a spooled stream (hashed while spooled); for a
   * path it is computed on the first call (a load normally gets it from its parsing worker instead).
   */
  sha256(): Promise<string>;
  /** Whether sha256() is already known (no file read needed). */
  readonly sha256Known: boolean;
  readonly bytes: number;
  dispose(): void;
}

export async function sha256OfFile(path: string): Promise<string> {
  const hash = createHash('sha256');
  await pipeline(createReadStream(path, { highWaterMark: 1 << 20 }), hash);
  return hash.digest('hex');
}

/**
 * A path is used in place; a stream (e.g. an HTTP request body) is spooled to a private temporary
 * file while it is hashed, so every reader can seek and sniff it and memory stays flat.
 */
export async function resolveSource(source: string | Readable, fileName?: string): Promise<SourceFile> {
  if (typeof source === 'string') {
    let bytes: number;
    try {
      const st = statSync(source);
      if (!st.isFile()) throw new Error('not a regular file');
      bytes = st.size;
    } catch (err) {
      throw new InputError('bad_file', `cannot read ${source}: ${(err as Error).message}`, { file: source });
    }
    let hashing: Promise<string> | undefined;
    return {
      path: source,
      fileName: fileName ?? basename(source),
      sha256: () => {
        hashing ??= sha256OfFile(source);
        return hashing;
      },
      sha256Known: false,
      bytes,
      dispose: () => {},
    };
  }
  const dir = mkdtempSync(join(tmpdir(), 'forehalo-upload-'));
  const path = join(dir, 'source');
  const hash = createHash('sha256');
  let bytes = 0;
  const tap = new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      bytes += chunk.length;
      done(null, chunk);
    },
  });
  try {
    await pipeline(source, tap, createWriteStream(path));
  } catch (err) {
    rmSync(dir, { recursive: true, force: true });
    throw err;
  }
  const digest = hash.digest('hex');
  return {
    path,
    fileName: fileName ?? 'upload',
    sha256: () => Promise.resolve(digest),
    sha256Known: true,
    bytes,
    dispose: () => rmSync(dir, { recursive: true, force: true }),
  };
}
