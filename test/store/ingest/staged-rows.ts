import type { StagedRow } from '../../../src/store/ingest/row-converter.js';

/** A checked photometric row with the given pixel, id and source position (invented values). */
export function photoRow(hpx: number, id: string, position: number): StagedRow {
  return [hpx, id, 10, 20, 0.1, 0.01, 'photo', 10, 0.1, 0, null, null, null, null, null, null, position];
}
