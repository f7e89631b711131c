import { NUMBER_COLUMNS, type StagedBatch } from './staged-batch.js';

/** A row left out of a part because an earlier row of the part has the same HEALPix index and id. */
export interface RemovedTwin {
  objectId: string;
  /** Source line/row of the removed (later) row. */
  position: number;
}

/** Largest part: row indices must fit below 2^21 so hpx · 2^21 + index stays an exact double. */
export const MAX_PART_ROWS = 2 ** 21;
const INDEX_SPAN = 2 ** 21;

/**
 * Put one part of a load in storage order: by HEALPix index, then object id, then source position.
 * Sorted this way, a part is appended to the clustered galaxy table at the right-hand end of its key
 * range, which is what makes a load one write per row (see migrations/0004_galaxy_parts.sql).
 * The rows are not moved: the part gets `order`, the row indices in storage order (moving 100k-row
 * parts cost the parsing thread more than parsing them; the writing thread reads through `order`).
 * A row with the same hpx and id as an earlier row of the part cannot be stored (it would repeat
 * the primary key); it is left out of `order` and returned in `removed`, so the caller can report
 * the id as a duplicate with every position where it occurs.
 */
export function sortPart(batch: StagedBatch): { part: StagedBatch; removed: RemovedTwin[] } {
  const n = batch.length;
  if (n > MAX_PART_ROWS) throw new Error(`internal: a part holds at most ${MAX_PART_ROWS} rows, got ${n}`);
  const { numbers, ids } = batch;
  // hpx < 12·4^13 < 2^30, so hpx · 2^21 + i < 2^51: one typed-array sort orders by (hpx, file order).
  const keys = new Float64Array(n);
  for (let i = 0; i < n; i++) keys[i] = numbers[i * NUMBER_COLUMNS] * INDEX_SPAN + i;
  keys.sort();
  const sorted = new Uint32Array(n);
  for (let i = 0; i < n; i++) sorted[i] = keys[i] % INDEX_SPAN;
  // Rows sharing a pixel (rare at the storage order) are ordered by id; file order breaks ties.
  const removed: RemovedTwin[] = [];
  let m = 0;
  for (let s = 0; s < n; ) {
    const hpx = numbers[sorted[s] * NUMBER_COLUMNS];
    let e = s + 1;
    while (e < n && numbers[sorted[e] * NUMBER_COLUMNS] === hpx) e++;
    if (e - s === 1) {
      sorted[m++] = sorted[s];
    } else {
      const slice = Array.from(sorted.subarray(s, e));
      slice.sort((a, b) => (ids[a] < ids[b] ? -1 : ids[a] > ids[b] ? 1 : a - b));
      for (let k = 0; k < slice.length; k++) {
        const i = slice[k];
        if (k > 0 && ids[i] === ids[slice[k - 1]]) {
          removed.push({ objectId: ids[i], position: numbers[i * NUMBER_COLUMNS + NUMBER_COLUMNS - 1] });
        } else {
          sorted[m++] = i;
        }
      }
    }
    s = e;
  }
  return { part: { ...batch, order: m === n ? sorted : sorted.slice(0, m) }, removed };
}
