import { closeSync, openSync, readSync, statSync } from 'node:fs';

/**
 * Rough number of data lines in a text catalogue from its size and the mean length of the lines in
 * its first 256 KiB (for progress bars only; undefined for tiny or non-text files).
 */
export function estimateRowCount(path: string): number | undefined {
  try {
    const size = statSync(path).size;
    const buf = Buffer.alloc(Math.min(size, 1 << 18));
    const fd = openSync(path, 'r');
    let n: number;
    try {
      n = readSync(fd, buf, 0, buf.length, 0);
    } finally {
      closeSync(fd);
    }
    let lines = 0;
    for (let i = 0; i < n; i++) if (buf[i] === 10) lines++;
    if (lines < 2 || buf.includes(0)) return undefined;
    return Math.max(1, Math.round((size / n) * lines) - 1);
  } catch {
    return undefined;
  }
}
