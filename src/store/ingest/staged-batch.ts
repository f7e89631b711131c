import type { MhaloDef, StagedRow, ZKind } from './row-converter.js';

/**
 * A batch of checked rows in columns, so it crosses from the parsing worker to the loading thread
 * as transferred buffers instead of one cloned array per row (which cost the loading thread more
 * than inserting the row), and holds no boxed numbers while it waits.
 *
 * numbers: NUMBER_COLUMNS columns, column after column (column c of row i at c·stride + i; a
 * column is contiguous, so reordering a part (part-sort.ts) and binding a column (part-writer.ts)
 * touch memory in short strides: row-major rows reordered at random cost ~0.3 µs per row in cache
 * misses). NaN stands for SQL NULL (a checked row never holds a NaN: unreadable numbers are
 * rejected; SQLite stores any bound NaN double as NULL). codes: zKind, massEstimated and mhaloDef
 * as small integers, laid out the same way (see Z_KIND_CODES, MHALO_DEF_CODES; 0 = NULL for mhaloDef).
 * Ids: one string of all ids and where each row's id starts and ends in it (one long string crosses
 * threads as one copy, and is read back without touching 32k scattered string objects).
 */
export interface StagedBatch {
  length: number;
  /** Distance between columns in numbers and codes (≥ length). */
  stride: number;
  numbers: Float64Array<ArrayBuffer>;
  codes: Uint8Array<ArrayBuffer>;
  idText: string;
  idStarts: Uint32Array<ArrayBuffer>;
  idEnds: Uint32Array<ArrayBuffer>;
  /** Group id per row, or empty when every row's group id is null. */
  groupIds: (string | null)[];
}

/** hpx, ra_deg, dec_deg, z, z_err, log_mstar, log_mstar_err, g_mag, i_mag, log_mhalo, log_mhalo_err, source_position */
export const NUMBER_COLUMNS = 12;
export const CODE_COLUMNS = 3;

export const Z_KIND_CODES: readonly ZKind[] = ['spec', 'photo'];
export const MHALO_DEF_CODES: readonly (MhaloDef | null)[] = [null, '200c', '200m', 'vir'];

/** Number column c of row i. */
export function numberAt(b: StagedBatch, i: number, c: number): number {
  return b.numbers[c * b.stride + i];
}

/** Code column c of row i. */
export function codeAt(b: StagedBatch, i: number, c: number): number {
  return b.codes[c * b.stride + i];
}

/** Id of row i. */
export function idAt(b: StagedBatch, i: number): string {
  return b.idText.slice(b.idStarts[i], b.idEnds[i]);
}

/** Group id of row i. */
export function groupIdAt(b: StagedBatch, i: number): string | null {
  return b.groupIds.length === 0 ? null : b.groupIds[i];
}

/** The buffers of a batch that can be transferred to another thread instead of copied. */
export function transferables(b: StagedBatch): ArrayBuffer[] {
  return [b.numbers.buffer, b.codes.buffer, b.idStarts.buffer, b.idEnds.buffer];
}

const orNaN = (x: number | null) => (x === null ? Number.NaN : x);

/**
 * Where the row converter puts a checked row: its stored columns as arguments, in the order of
 * StagedRow (numbers stay unboxed on the way into a batch's typed arrays).
 */
export interface RowTarget {
  add(...row: StagedRow): void;
}

/** Collects rows into one StagedBatch of at most `capacity` rows. */
export function createBatchBuilder(capacity: number) {
  let numbers = new Float64Array(capacity * NUMBER_COLUMNS);
  let codes = new Uint8Array(capacity * CODE_COLUMNS);
  let ids: string[] = [];
  let groupIds: (string | null)[] = [];
  let anyGroup = false;
  const builder = {
    get length(): number {
      return ids.length;
    },
    /** The id of the row added last. */
    lastId(): string {
      return ids[ids.length - 1];
    },
    add: ((
      hpx,
      objectId,
      raDeg,
      decDeg,
      z,
      zErr,
      zKind,
      logMstar,
      logMstarErr,
      massEstimated,
      gMag,
      iMag,
      logMhalo,
      mhaloDef,
      logMhaloErr,
      groupId,
      position,
    ) => {
      const i = ids.length;
      if (i === capacity) throw new Error('internal: staged batch is full');
      const c = capacity;
      numbers[i] = hpx;
      numbers[c + i] = raDeg;
      numbers[2 * c + i] = decDeg;
      numbers[3 * c + i] = z;
      numbers[4 * c + i] = orNaN(zErr);
      numbers[5 * c + i] = orNaN(logMstar);
      numbers[6 * c + i] = orNaN(logMstarErr);
      numbers[7 * c + i] = orNaN(gMag);
      numbers[8 * c + i] = orNaN(iMag);
      numbers[9 * c + i] = orNaN(logMhalo);
      numbers[10 * c + i] = orNaN(logMhaloErr);
      numbers[11 * c + i] = position;
      codes[i] = zKind === 'spec' ? 0 : 1;
      codes[c + i] = massEstimated;
      codes[2 * c + i] = mhaloDef === null ? 0 : MHALO_DEF_CODES.indexOf(mhaloDef);
      ids.push(objectId);
      groupIds.push(groupId);
      if (groupId !== null) anyGroup = true;
    }) satisfies RowTarget['add'],
    push(r: StagedRow): void {
      builder.add(...r);
    },
    /** The rows so far as a batch (it owns the buffers); the builder starts a new batch. */
    take(): StagedBatch {
      const n = ids.length;
      const idStarts = new Uint32Array(n);
      const idEnds = new Uint32Array(n);
      let end = 0;
      for (let i = 0; i < n; i++) {
        idStarts[i] = end;
        end += ids[i].length;
        idEnds[i] = end;
      }
      const batch: StagedBatch = {
        length: n,
        stride: capacity,
        numbers,
        codes,
        idText: ids.join(''),
        idStarts,
        idEnds,
        groupIds: anyGroup ? groupIds : [],
      };
      numbers = new Float64Array(capacity * NUMBER_COLUMNS);
      codes = new Uint8Array(capacity * CODE_COLUMNS);
      ids = [];
      groupIds = [];
      anyGroup = false;
      return batch;
    },
  };
  return builder;
}
