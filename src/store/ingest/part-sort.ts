import { CODE_COLUMNS, idAt, NUMBER_COLUMNS, numberAt, type StagedBatch } from './staged-batch.js';

/** A row left out of a part because an earlier row of the part has the same HEALPix index and id. */
export interface RemovedTwin {
  objectId: string;
  /** Source line/row of the removed (later) row. */
  position: number;
}

/** Largest part (row indices of a part are kept in 32-bit arrays; parts are far smaller in use). */
export const MAX_PART_ROWS = 2 ** 22;

/**
 * Put one part of a load in storage order: by HEALPix index, then object id, then source position.
 * Sorted this way, a part is appended to the galaxy table as one run whose keys grow row by row,
 * which is what makes a load one write per row (see migrations/0004_galaxy_runs.sql). The rows are
 * moved into that order here, in the parsing thread, so the writing thread (the busier one) reads
 * them front to back. A row with the same hpx and id as an earlier row of the part is a duplicate
 * that can never be kept: it is left out and returned in `removed`, so the caller can report the id
 * with every position where it occurs.
 */
export function sortPart(batch: StagedBatch): { part: StagedBatch; removed: RemovedTwin[] } {
  const n = batch.length;
  if (n > MAX_PART_ROWS) throw new Error(`internal: a part holds at most ${MAX_PART_ROWS} rows, got ${n}`);
  // Column 0 holds hpx (see StagedBatch).
  const { order: sorted, keys } = radixOrder(batch.numbers.subarray(0, n));
  // Rows sharing a pixel (rare at the storage order) are ordered by id; file order breaks ties.
  const removed: RemovedTwin[] = [];
  let m = 0;
  for (let s = 0; s < n; ) {
    const hpx = keys[s];
    let e = s + 1;
    while (e < n && keys[e] === hpx) e++;
    if (e - s === 1) {
      sorted[m++] = sorted[s];
    } else {
      const slice = Array.from(sorted.subarray(s, e));
      const id = (i: number) => idAt(batch, i);
      slice.sort((a, b) => (id(a) < id(b) ? -1 : id(a) > id(b) ? 1 : a - b));
      for (let k = 0; k < slice.length; k++) {
        const i = slice[k];
        if (k > 0 && id(i) === id(slice[k - 1])) {
          removed.push({ objectId: id(i), position: numberAt(batch, i, NUMBER_COLUMNS - 1) });
        } else {
          sorted[m++] = i;
        }
      }
    }
    s = e;
  }
  return { part: gather(batch, sorted.subarray(0, m)), removed };
}

/** Radix digits: hpx < 12·4^13 < 2^30 is sorted in three passes of 10 bits. */
const DIGIT_BITS = 10;
const PASSES = 3;

/**
 * Indices of `hpx` ordered by value, ties in index order, and the values in that order: a least-
 * significant-digit radix sort, stable in every pass (Knuth, TAOCP vol. 3, §5.2.5). Three counting
 * passes over a part cost the parsing thread far less than a comparison sort of its keys.
 */
export function radixOrder(hpx: Float64Array): { order: Uint32Array; keys: Uint32Array } {
  const n = hpx.length;
  const counts = new Uint32Array(1 << DIGIT_BITS);
  const keys = Uint32Array.from(hpx);
  let from = new Uint32Array(n);
  let to = new Uint32Array(n);
  for (let i = 0; i < n; i++) from[i] = i;
  const mask = (1 << DIGIT_BITS) - 1;
  for (let pass = 0, shift = 0; pass < PASSES; pass++, shift += DIGIT_BITS) {
    counts.fill(0);
    for (let i = 0; i < n; i++) counts[(keys[i] >>> shift) & mask]++;
    let sum = 0;
    for (let d = 0; d < counts.length; d++) {
      const c = counts[d];
      counts[d] = sum;
      sum += c;
    }
    for (let j = 0; j < n; j++) {
      const i = from[j];
      to[counts[(keys[i] >>> shift) & mask]++] = i;
    }
    [from, to] = [to, from];
  }
  // The keys in sorted order too (read front to back by the caller, instead of through `order`).
  for (let j = 0; j < n; j++) to[j] = keys[from[j]];
  return { order: from, keys: to };
}

/**
 * The rows of `batch` listed in `order`, in that order, as a new batch. Column by column: each
 * column is a short array, so the reordering stays in cache (see StagedBatch). The id text is
 * shared; only the offsets move.
 */
function gather(batch: StagedBatch, order: Uint32Array): StagedBatch {
  const m = order.length;
  const numbers = new Float64Array(m * NUMBER_COLUMNS);
  for (let c = 0; c < NUMBER_COLUMNS; c++) {
    const from = batch.numbers.subarray(c * batch.stride, c * batch.stride + batch.length);
    const base = c * m;
    for (let j = 0; j < m; j++) numbers[base + j] = from[order[j]];
  }
  const codes = new Uint8Array(m * CODE_COLUMNS);
  for (let c = 0; c < CODE_COLUMNS; c++) {
    const from = batch.codes.subarray(c * batch.stride, c * batch.stride + batch.length);
    const base = c * m;
    for (let j = 0; j < m; j++) codes[base + j] = from[order[j]];
  }
  const idStarts = new Uint32Array(m);
  const idEnds = new Uint32Array(m);
  for (let j = 0; j < m; j++) {
    idStarts[j] = batch.idStarts[order[j]];
    idEnds[j] = batch.idEnds[order[j]];
  }
  const groupIds = batch.groupIds.length === 0 ? [] : Array.from(order, (i) => batch.groupIds[i]);
  return { length: m, stride: m, numbers, codes, idText: batch.idText, idStarts, idEnds, groupIds };
}
