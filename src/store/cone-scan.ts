import type Database from 'better-sqlite3';
import type { PixelRange } from '../sky/index.js';
import { SCAN_GALAXY_COLUMNS } from './galaxy-row.js';
import { inRunPixels } from './runs.js';

/** Filters applied inside SQLite before a row reaches JavaScript (all bounds inclusive). */
export interface ScanFilter {
  catalogId: number;
  zMin: number;
  zMax: number;
  /** A band in declination that contains the whole cone (cheap pre-test; the exact test follows). */
  decLoDeg: number;
  decHiDeg: number;
  /**
   * Mass hint: when set, a row is kept only if log_mstar ≥ minLogMstar, or log_mhalo ≥ minLogMhalo,
   * or it has neither mass, or it is linked to a twin in another catalogue (its twin may be the
   * preferred row, so dropping it could change which row stands for the galaxy).
   */
  mass?: { minLogMstar: number; minLogMhalo: number };
  /** Whether any object of the catalogue is linked to a twin; if not, physical_link is not joined. */
  linked: boolean;
}

/** Ranges per statement: each count gets its own prepared statement (a VALUES list of that size). */
export const MAX_SCAN_RANGES = 64;

const cache = new WeakMap<Database.Database, Map<string, Database.Statement>>();

function scanStatement(
  db: Database.Database,
  nRanges: number,
  withMass: boolean,
  linked: boolean,
): Database.Statement {
  let byShape = cache.get(db);
  if (!byShape) {
    byShape = new Map();
    cache.set(db, byShape);
  }
  const key = `${nRanges}:${withMass ? 1 : 0}:${linked ? 1 : 0}`;
  let stmt = byShape.get(key);
  if (!stmt) {
    const values = Array.from({ length: nRanges }, () => '(?, ?)').join(', ');
    const mass = withMass
      ? `AND (g.log_mstar >= @minLogMstar OR g.log_mhalo >= @minLogMhalo
           OR (g.log_mstar IS NULL AND g.log_mhalo IS NULL)${linked ? ' OR p.physical_key IS NOT NULL' : ''})`
      : '';
    // CROSS JOIN keeps runs and ranges as the outer loops: one key seek per run and pixel range,
    // then a contiguous scan of the table (rows are keyed by run and pixel, see runs.ts); the z,
    // Dec (and, for a catalogue without links, mass) terms are tested on each row before any join.
    // Without links there is no join at all.
    const link = linked
      ? 'LEFT JOIN physical_link p ON p.catalog_id = g.catalog_id AND p.object_id = g.object_id'
      : '';
    stmt = db
      .prepare(
        `WITH r (lo, hi) AS (VALUES ${values}),
           k (run) AS (SELECT run FROM galaxy_run WHERE catalog_id = @catalogId)
         SELECT ${SCAN_GALAXY_COLUMNS}, ${linked ? 'p.physical_key' : 'NULL'}
         FROM k CROSS JOIN r CROSS JOIN galaxy g ${link}
         WHERE ${inRunPixels('k.run', 'r.lo', 'r.hi')}
           AND g.z BETWEEN @zMin AND @zMax AND g.dec_deg BETWEEN @decLoDeg AND @decHiDeg ${mass}`,
      )
      .raw(true);
    byShape.set(key, stmt);
  }
  return stmt;
}

/**
 * Raw rows (SCAN_GALAXY_COLUMNS, physical key) of one catalogue inside the given storage-order HEALPix ranges
 * that pass the filter, in chunks of at most MAX_SCAN_RANGES ranges per statement.
 */
export function scanRanges(
  db: Database.Database,
  ranges: readonly PixelRange[],
  filter: ScanFilter,
  out: unknown[][],
): void {
  const named = {
    catalogId: filter.catalogId,
    zMin: filter.zMin,
    zMax: filter.zMax,
    decLoDeg: filter.decLoDeg,
    decHiDeg: filter.decHiDeg,
    ...(filter.mass ?? {}),
  };
  for (let start = 0; start < ranges.length; start += MAX_SCAN_RANGES) {
    const chunk = ranges.slice(start, start + MAX_SCAN_RANGES);
    const flat: number[] = [];
    for (const [lo, hi] of chunk) flat.push(lo, hi);
    const rows = scanStatement(db, chunk.length, filter.mass !== undefined, filter.linked).all(
      ...flat,
      named,
    );
    for (const r of rows) out.push(r as unknown[]);
  }
}
