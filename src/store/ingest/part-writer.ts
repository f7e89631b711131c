import type Database from 'better-sqlite3';
import { InputError } from '../../errors.js';
import { pixelSizeRad } from '../../sky/healpix-order.js';
import { MAX_PIXEL_ROWS, pixelKey, runKeySql } from '../runs.js';
import { STORAGE_ORDER } from '../storage-order.js';
import {
  codeAt,
  groupIdAt,
  idAt,
  MHALO_DEF_CODES,
  numberAt,
  type StagedBatch,
  Z_KIND_CODES,
} from './staged-batch.js';

/**
 * Rows per INSERT statement. better-sqlite3 pays a fixed cost per statement call that is larger than
 * the cost of binding one row; a multi-row VALUES list shares it (bench/load.ts measured ~2.3× the
 * rows/s of one call per row at 50 rows, with no further gain beyond that).
 */
const ROWS_PER_STATEMENT = 50;

/** The stored columns in the order they are bound, with where each comes from in a StagedBatch. */
const COLUMNS = [
  ['gkey', 'key', 0],
  ['object_id', 'id', 0],
  ['ra_deg', 'n', 1],
  ['dec_deg', 'n', 2],
  ['z', 'n', 3],
  ['z_err', 'n', 4],
  ['z_kind', 'zkind', 0],
  ['log_mstar', 'n', 5],
  ['log_mstar_err', 'n', 6],
  ['mass_estimated', 'c', 1],
  ['g_mag', 'n', 7],
  ['i_mag', 'n', 8],
  ['log_mhalo', 'n', 9],
  ['mhalo_def', 'mdef', 2],
  ['log_mhalo_err', 'n', 10],
  ['group_id', 'group', 0],
  ['source_position', 'n', 11],
] as const;

/**
 * Per column, the SQL literal shared by every row of the batch (NULL for a column empty in all
 * rows, the code for a z_kind / mass-estimated / mass-definition column with one value throughout),
 * or undefined when the column must be bound row by row. Literals come from the fixed code tables
 * of staged-batch.ts, never from the file.
 */
function sharedLiterals(b: StagedBatch): (string | undefined)[] {
  const literal = (x: string | number | null) =>
    x === null ? 'NULL' : typeof x === 'number' ? `${x}` : `'${x}'`;
  const sameCode = (k: number): number | undefined => {
    const first = codeAt(b, 0, k);
    for (let i = 1; i < b.length; i++) if (codeAt(b, i, k) !== first) return undefined;
    return first;
  };
  return COLUMNS.map(([, kind, k]) => {
    if (kind === 'n') {
      for (let i = 0; i < b.length; i++) if (!Number.isNaN(numberAt(b, i, k))) return undefined;
      return 'NULL';
    }
    if (kind === 'group') return b.groupIds.some((g) => g !== null) ? undefined : 'NULL';
    if (kind === 'id' || kind === 'key') return undefined;
    const code = sameCode(k);
    if (code === undefined) return undefined;
    if (kind === 'zkind') return literal(Z_KIND_CODES[code]);
    if (kind === 'mdef') return literal(MHALO_DEF_CODES[code]);
    return literal(code);
  });
}

/** Storage pixel size, for messages [arcsec] (≈ 25.8″ at order 13). */
const STORAGE_PIXEL_ARCSEC = ((pixelSizeRad(STORAGE_ORDER) * 180) / Math.PI) * 3600;

/** For rows sorted by hpx (column 0 of `n`), each row's rank among the rows of its pixel. */
function pixelRanks(n: Float64Array, count: number): Uint32Array {
  const seq = new Uint32Array(count);
  for (let i = 1; i < count; i++) {
    if (n[i] !== n[i - 1]) continue;
    seq[i] = seq[i - 1] + 1;
    if (seq[i] >= MAX_PIXEL_ROWS) {
      throw new InputError(
        'too_many_at_one_position',
        `more than ${MAX_PIXEL_ROWS - 1} rows fall in one ${STORAGE_PIXEL_ARCSEC.toFixed(1)}″ HEALPix pixel (nested index ${n[i]} at order ${STORAGE_ORDER}); are positions missing or set to a default?`,
      );
    }
  }
  return seq;
}

/**
 * Appends sorted parts (see part-sort.ts) of one catalogue to the galaxy table inside the caller's
 * open transaction. A column with one value in every row of a part (often NULL) is written as a
 * literal instead of being bound row by row.
 */
export function createPartWriter(db: Database.Database) {
  const statements = new Map<string, Database.Statement>();
  const statementFor = (shared: (string | undefined)[], rows: number): Database.Statement => {
    const key = `${shared.join('|')}:${rows}`;
    let stmt = statements.get(key);
    if (!stmt) {
      // The key's pixel part is bound (pixelKey), the run added in SQL (runs.ts).
      const one = `(@catalogId, ${shared.map((l, c) => (c === 0 ? runKeySql('@run', '?') : (l ?? '?'))).join(', ')})`;
      stmt = db.prepare(
        `INSERT INTO galaxy (catalog_id, ${COLUMNS.map(([name]) => name).join(', ')})
         VALUES ${Array.from({ length: rows }, () => one).join(', ')}`,
      );
      statements.set(key, stmt);
    }
    return stmt;
  };
  return {
    /** Insert the rows of one sorted part (see part-sort.ts) as run `run` of catalogue `catalogId`. */
    write(catalogId: number, run: number, b: StagedBatch): number {
      const count = b.length;
      if (count === 0) return 0;
      const shared = sharedLiterals(b);
      const used = COLUMNS.filter((_, c) => shared[c] === undefined);
      const named = { catalogId, run };
      const full = statementFor(shared, ROWS_PER_STATEMENT);
      const values: unknown[] = new Array(ROWS_PER_STATEMENT * used.length);
      const { numbers: n, codes, stride } = b;
      const width = used.length;
      const seq = pixelRanks(n, count);
      for (let start = 0; start < count; start += ROWS_PER_STATEMENT) {
        const rows = Math.min(ROWS_PER_STATEMENT, count - start);
        if (rows < ROWS_PER_STATEMENT) values.length = rows * width;
        // Filled column by column: one branch per column and statement rather than per value.
        for (let j = 0; j < width; j++) {
          const [, kind, k] = used[j];
          let v = j;
          // A NaN binds as SQL NULL (see StagedBatch).
          if (kind === 'key')
            // seq = the row's rank within its pixel: keys grow row by row.
            for (let r = 0; r < rows; r++, v += width) values[v] = pixelKey(n[start + r], seq[start + r]);
          else if (kind === 'n')
            for (let r = 0; r < rows; r++, v += width) values[v] = n[k * stride + start + r];
          else if (kind === 'id') for (let r = 0; r < rows; r++, v += width) values[v] = idAt(b, start + r);
          else if (kind === 'zkind')
            for (let r = 0; r < rows; r++, v += width) values[v] = Z_KIND_CODES[codes[start + r]];
          else if (kind === 'c')
            for (let r = 0; r < rows; r++, v += width) values[v] = codes[k * stride + start + r];
          else if (kind === 'mdef')
            for (let r = 0; r < rows; r++, v += width)
              values[v] = MHALO_DEF_CODES[codes[k * stride + start + r]];
          else for (let r = 0; r < rows; r++, v += width) values[v] = groupIdAt(b, start + r);
        }
        (rows === ROWS_PER_STATEMENT ? full : statementFor(shared, rows)).run(values, named);
      }
      return count;
    },
  };
}
