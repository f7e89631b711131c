import type Database from 'better-sqlite3';

/**
 * Galaxy keys (migrations/0004_galaxy_runs.sql): gkey = run · 2^48 + hpx · 2^18 + seq, where seq
 * numbers the rows of one HEALPix pixel within the run (0 for almost every row). A run is one sorted
 * part of a load, or the merge of a large load's parts; galaxy_run says which catalogue owns it.
 * This module holds the key layout and the statements that follow from it; every other module asks
 * here.
 */
export const RUN_SHIFT = 48;
export const SEQ_BITS = 18;
/** Rows of one run in one storage pixel (seq < 2^18, i.e. 262,144 rows at one 26″ spot). */
export const MAX_PIXEL_ROWS = 2 ** SEQ_BITS;
/** The stored columns of galaxy besides gkey (hpx and run are computed from gkey). */
export const GALAXY_STORED_COLUMNS =
  'catalog_id, object_id, ra_deg, dec_deg, z, z_err, z_kind, log_mstar, log_mstar_err, mass_estimated, g_mag, i_mag, log_mhalo, mhalo_def, log_mhalo_err, group_id, source_position';
/** Run numbers in use at once (the CHECK of galaxy_run). */
export const MAX_RUNS = 2 ** 15;

/** SQL condition: the row g lies in the run given by the SQL expression `run`. */
export function inRun(run: string, g = 'g'): string {
  return `${g}.gkey BETWEEN (${run}) << ${RUN_SHIFT} AND (((${run}) + 1) << ${RUN_SHIFT}) - 1`;
}

/**
 * SQL condition: the row g lies in run `run` with lo ≤ hpx ≤ hi (SQL expressions): one contiguous
 * key range, so one seek and a forward scan.
 */
export function inRunPixels(run: string, lo: string, hi: string, g = 'g'): string {
  return `${g}.gkey BETWEEN ${runKeySql(run, `(${lo}) << ${SEQ_BITS}`)}
    AND ${runKeySql(run, `((${hi}) + 1) << ${SEQ_BITS}`)} - 1`;
}

/**
 * SQL: the key of a row of run `run` whose pixel part (hpx · 2^18 + seq, below 2^48) is `pixelKey`
 * (SQL expressions). The run is shifted in SQL: keys pass 2^53, beyond a JavaScript number. The two
 * parts share no bits, and the bitwise OR also makes a bound double an integer ('+' would keep it a
 * double and round keys above 2^53).
 */
export function runKeySql(run: string, pixelKey: string): string {
  return `(((${run}) << ${RUN_SHIFT}) | (${pixelKey}))`;
}

/** The pixel part of a key, hpx · 2^18 + seq: an exact double (< 2^48), bound as a number. */
export function pixelKey(hpx: number, seq: number): number {
  return hpx * MAX_PIXEL_ROWS + seq;
}

/**
 * SQL: the rows g of one catalogue (bound as `param`), as a FROM fragment and a WHERE condition;
 * k.run is each row's run.
 */
export function catalogRows(param: string, g = 'g'): { from: string; where: string } {
  return {
    from: `galaxy_run k CROSS JOIN galaxy ${g}`,
    where: `k.catalog_id = ${param} AND ${inRun('k.run', g)}`,
  };
}

/** The same for the runs listed in a JSON array (bound as `param`, e.g. the runs of one load). */
export function listedRunRows(param: string, g = 'g'): { from: string; where: string } {
  return {
    from: `(SELECT value AS run FROM json_each(${param})) k CROSS JOIN galaxy ${g}`,
    where: inRun('k.run', g),
  };
}

/** The runs of a catalogue, ascending. */
export function catalogRuns(db: Database.Database, catalogId: number): number[] {
  return db
    .prepare<[number], number>('SELECT run FROM galaxy_run WHERE catalog_id = ? ORDER BY run')
    .pluck()
    .all(catalogId);
}

/** A free run number for a new part of catalogue `catalogId` (recorded at once). */
export function allocateRun(db: Database.Database, catalogId: number): number {
  const run = db
    .prepare<[], number>(
      `SELECT CASE WHEN NOT EXISTS (SELECT 1 FROM galaxy_run WHERE run = 0) THEN 0 ELSE (
         SELECT r.run + 1 FROM galaxy_run r
         WHERE NOT EXISTS (SELECT 1 FROM galaxy_run s WHERE s.run = r.run + 1)
         ORDER BY r.run LIMIT 1) END`,
    )
    .pluck()
    .get()!;
  if (run >= MAX_RUNS) {
    throw new Error(
      `the database holds ${MAX_RUNS} runs of galaxies, its limit; drop or reload catalogues to free some`,
    );
  }
  db.prepare('INSERT INTO galaxy_run (run, catalog_id) VALUES (?, ?)').run(run, catalogId);
  return run;
}

/** Delete the rows of these runs and free the run numbers (inside the caller's transaction). */
function dropRuns(db: Database.Database, runs: readonly number[]): number {
  const del = db.prepare<[{ run: number }]>(`DELETE FROM galaxy WHERE ${inRun('@run', 'galaxy')}`);
  const free = db.prepare<[{ run: number }]>('DELETE FROM galaxy_run WHERE run = @run');
  let n = 0;
  for (const run of runs) {
    n += del.run({ run }).changes;
    free.run({ run });
  }
  return n;
}

/** Delete every galaxy row of a catalogue and free its runs (inside the caller's transaction). */
export function deleteCatalogGalaxies(db: Database.Database, catalogId: number): number {
  return dropRuns(db, catalogRuns(db, catalogId));
}

/**
 * Merge runs of one catalogue into one new run, inside the caller's transaction: the rows are copied
 * in HEALPix order (SQLite's sorter, which spills to temporary files, so memory stays flat) with
 * fresh keys, then the old runs are deleted. Used when a load wrote many parts, so that a cone
 * search of the catalogue is again a handful of range scans. Returns the new run.
 */
export function mergeRuns(db: Database.Database, catalogId: number, runs: readonly number[]): number {
  const run = allocateRun(db, catalogId);
  const cols = GALAXY_STORED_COLUMNS.split(', ')
    .map((c) => `g.${c}`)
    .join(', ');
  const rows = listedRunRows('@runs');
  // seq: the row's rank within its pixel; capped so that an absurd pile-up (> 2^18 rows at one
  // spot) fails on the primary key instead of spilling into the pixel bits.
  const seq = `min(row_number() OVER (PARTITION BY g.hpx ORDER BY g.gkey) - 1, ${MAX_PIXEL_ROWS - 1})`;
  db.prepare(
    `INSERT INTO galaxy (gkey, ${GALAXY_STORED_COLUMNS})
     SELECT ${runKeySql('@run', `(g.hpx << ${SEQ_BITS}) + ${seq}`)}, ${cols}
     FROM ${rows.from} WHERE ${rows.where}
     ORDER BY g.hpx, g.gkey`,
  ).run({ run, runs: JSON.stringify(runs) });
  dropRuns(db, runs);
  return run;
}
