import type { MhaloDef, StagedRow, ZKind } from './row-converter.js';

/**
 * A batch of checked rows in columns, so it crosses from the parsing worker to the loading thread
 * as transferred buffers instead of one cloned array per row (which cost the loading thread more
 * than inserting the row), and holds no boxed numbers while it waits.
 *
 * numbers: NUMBER_COLUMNS values per row, row after row; NaN stands for SQL NULL (a checked row
 * never holds a NaN: unreadable numbers are rejected; SQLite stores any bound NaN double as NULL). codes: zKind, massEstimated and mhaloDef
 * per row as small integers (see Z_KIND_CODES, MHALO_DEF_CODES; 0 = NULL for mhaloDef).
 */
export interface StagedBatch {
  length: number;
  numbers: Float64Array<ArrayBuffer>;
  codes: Uint8Array<ArrayBuffer>;
  ids: string[];
  groupIds: (string | null)[];
}

/** hpx, ra_deg, dec_deg, z, z_err, log_mstar, log_mstar_err, g_mag, i_mag, log_mhalo, log_mhalo_err, source_position */
export const NUMBER_COLUMNS = 12;
export const CODE_COLUMNS = 3;

export const Z_KIND_CODES: readonly ZKind[] = ['spec', 'photo'];
export const MHALO_DEF_CODES: readonly (MhaloDef | null)[] = [null, '200c', '200m', 'vir'];

const orNaN = (x: number | null) => (x === null ? Number.NaN : x);

/** Collects StagedRows into one StagedBatch of at most `capacity` rows. */
export function createBatchBuilder(capacity: number) {
  let numbers = new Float64Array(capacity * NUMBER_COLUMNS);
  let codes = new Uint8Array(capacity * CODE_COLUMNS);
  let ids: string[] = [];
  let groupIds: (string | null)[] = [];
  return {
    get length(): number {
      return ids.length;
    },
    push(r: StagedRow): void {
      const i = ids.length;
      if (i === capacity) throw new Error('internal: staged batch is full');
      const o = i * NUMBER_COLUMNS;
      numbers[o] = r[0];
      numbers[o + 1] = r[2];
      numbers[o + 2] = r[3];
      numbers[o + 3] = r[4];
      numbers[o + 4] = orNaN(r[5]);
      numbers[o + 5] = orNaN(r[7]);
      numbers[o + 6] = orNaN(r[8]);
      numbers[o + 7] = orNaN(r[10]);
      numbers[o + 8] = orNaN(r[11]);
      numbers[o + 9] = orNaN(r[12]);
      numbers[o + 10] = orNaN(r[14]);
      numbers[o + 11] = r[16];
      const c = i * CODE_COLUMNS;
      codes[c] = r[6] === 'spec' ? 0 : 1;
      codes[c + 1] = r[9];
      codes[c + 2] = MHALO_DEF_CODES.indexOf(r[13]);
      ids.push(r[1]);
      groupIds.push(r[15]);
    },
    /** The rows so far as a batch (it owns the buffers); the builder starts a new batch. */
    take(): StagedBatch {
      const batch: StagedBatch = { length: ids.length, numbers, codes, ids, groupIds };
      numbers = new Float64Array(capacity * NUMBER_COLUMNS);
      codes = new Uint8Array(capacity * CODE_COLUMNS);
      ids = [];
      groupIds = [];
      return batch;
    },
  };
}
