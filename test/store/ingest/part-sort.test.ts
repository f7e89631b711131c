import { describe, expect, it } from 'vitest';
import { sortPart } from '../../../src/store/ingest/part-sort.js';
import type { StagedRow } from '../../../src/store/ingest/row-converter.js';
import {
  CODE_COLUMNS,
  codeAt,
  createBatchBuilder,
  groupIdAt,
  idAt,
  NUMBER_COLUMNS,
  numberAt,
} from '../../../src/store/ingest/staged-batch.js';
import { photoRow } from './staged-rows.js';

function batchOf(rows: StagedRow[]) {
  const b = createBatchBuilder(rows.length);
  for (const r of rows) b.push(r);
  return b.take();
}

/** (hpx, id, position) of the part's rows in storage order. */
function stored(part: ReturnType<typeof sortPart>['part']): [number, string, number][] {
  return Array.from({ length: part.length }, (_, i) => [
    numberAt(part, i, 0),
    idAt(part, i),
    numberAt(part, i, NUMBER_COLUMNS - 1),
  ]);
}

describe('sortPart', () => {
  it('orders a part by HEALPix index, then id (the key order), moving every column with its row', () => {
    const rows = [
      photoRow(900, 'b', 2),
      photoRow(5, 'z', 3),
      photoRow(900, 'a', 4),
      photoRow(805306367, 'q', 5),
      photoRow(0, 'm', 6),
    ];
    const batch = batchOf(rows);
    const { part, removed } = sortPart(batch);
    expect(removed).toEqual([]);
    expect(stored(part)).toEqual([
      [0, 'm', 6],
      [5, 'z', 3],
      [900, 'a', 4],
      [900, 'b', 2],
      [805306367, 'q', 5],
    ]);
    // Every column travels with its row: the part holds the same rows, reordered.
    const byPosition = (b: typeof part) =>
      Array.from({ length: b.length }, (_, i) => [
        ...Array.from({ length: NUMBER_COLUMNS }, (_, c) => numberAt(b, i, c)),
        ...Array.from({ length: CODE_COLUMNS }, (_, c) => codeAt(b, i, c)),
        idAt(b, i),
        groupIdAt(b, i),
      ]).sort((x, y) => (x[NUMBER_COLUMNS - 1] as number) - (y[NUMBER_COLUMNS - 1] as number));
    expect(byPosition(part)).toEqual(byPosition(batchOf(rows)));
  });

  it('leaves out a row that repeats the pixel and id of an earlier row, keeping the first by position', () => {
    const rows = [
      photoRow(7, 'x', 10),
      photoRow(3, 'y', 11),
      photoRow(7, 'x', 12),
      photoRow(7, 'x', 13),
      photoRow(8, 'x', 14),
    ];
    const { part, removed } = sortPart(batchOf(rows));
    expect(stored(part)).toEqual([
      [3, 'y', 11],
      [7, 'x', 10],
      [8, 'x', 14],
    ]);
    expect(removed).toEqual([
      { objectId: 'x', position: 12 },
      { objectId: 'x', position: 13 },
    ]);
  });

  it('sorts a large random part exactly as a plain comparison sort would', () => {
    let s = 12345;
    const rnd = () => {
      s = (Math.imul(s, 1103515245) + 12345) >>> 0;
      return s / 2 ** 32;
    };
    const rows = Array.from({ length: 20_000 }, (_, i) =>
      photoRow(Math.floor(rnd() * 3000), `g${Math.floor(rnd() * 1e6)}`, i + 2),
    );
    const expected = rows
      .map((r) => [r[0], r[1], r[16]] as [number, string, number])
      .sort((a, b) => a[0] - b[0] || (a[1] < b[1] ? -1 : a[1] > b[1] ? 1 : a[2] - b[2]));
    const { part, removed } = sortPart(batchOf(rows));
    const seen = new Set<string>();
    const kept = expected.filter(([h, id]) => {
      const k = `${h}/${id}`;
      if (seen.has(k)) return false;
      seen.add(k);
      return true;
    });
    expect(stored(part)).toEqual(kept);
    expect(removed.length).toBe(expected.length - kept.length);
  });
});
