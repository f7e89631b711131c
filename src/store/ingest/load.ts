import { statSync } from 'node:fs';
import type { Readable } from 'node:stream';
import type Database from 'better-sqlite3';
import { ConflictError, InputError } from '../../errors.js';
import { matchCatalog, rebuildPhysicalLinks } from '../duplicates.js';
import type { Store } from '../open.js';
import { allocateRun, deleteCatalogGalaxies, inRun, inRunPixels, listedRunRows, mergeRuns } from '../runs.js';
import { STORAGE_ORDER } from '../storage-order.js';
import {
  type ConvertEnd,
  type ConvertHeader,
  type ConvertInput,
  type ConvertSink,
  convertFile,
} from './convert-file.js';
import { convertInWorker, WorkerUnavailableError } from './convert-in-worker.js';
import { estimateRowCount } from './estimate-rows.js';
import type { Field } from './fields.js';
import { parseMapSpec } from './mapping.js';
import type { SourceFormat } from './open-table.js';
import { MAX_PART_ROWS } from './part-sort.js';
import { createPartWriter } from './part-writer.js';
import { ProblemLog, type RowProblem } from './problems.js';
import type { IngestDefaults } from './row-converter.js';
import { resolveSource, type SourceFile } from './source-file.js';
import { TAYLOR2011 } from './taylor2011.js';

export type LoadMode = 'create' | 'replace' | 'append';

export interface LoadOptions {
  /** A file path, or a byte stream such as an HTTP request body (spooled to a temp file). */
  source: string | Readable;
  /** Original file name when source is a stream (recorded, and used to check the format). */
  fileName?: string;
  format?: SourceFormat;
  /** Field separator for CSV/TSV when it is not ',' / tab. */
  delimiter?: string;
  name: string;
  description?: string;
  /** Explicit column mapping: 'ra=ALPHA_J2000,dec=DELTA_J2000' or an object. */
  map?: string | Partial<Record<Field, string>>;
  /** Load the good rows and store a report of the bad ones instead of refusing the file. */
  skipInvalid?: boolean;
  mode?: LoadMode;
  defaults?: IngestDefaults;
  /** Called after each batch with the number of source rows read so far. */
  onProgress?: (rowsRead: number) => void;
  /**
   * Source rows per part (default PART_ROWS; tests use small parts). Each part is sorted
   * into storage order and appended as a unit; cone searches scan once per part.
   */
  batchSize?: number;
  /**
   * Parse and check in a worker thread while this thread writes (default true; falls back to this
   * thread where a worker cannot start, e.g. under a test runner that cannot load .ts in workers).
   */
  parseInWorker?: boolean;
  /** Merge the load's parts into one run when there are more than this many (default MERGE_ABOVE_RUNS). */
  mergeAboveRuns?: number;
}

export interface LoadReport {
  /** Number of problems found (all of them when skipInvalid, else until the load stopped). */
  problemCount: number;
  /** First 100 problems. */
  problems: RowProblem[];
  skippedRows: number;
  duplicateIds: { objectId: string; positions: number[] }[];
}

export interface LoadSummary {
  name: string;
  /** 'loaded' (new), 'replaced', 'appended', or 'unchanged' (same file already stored under this name). */
  outcome: 'loaded' | 'replaced' | 'appended' | 'unchanged';
  /** Rows stored by this load (0 when unchanged). */
  rows: number;
  /** Rows in the catalogue after the load. */
  totalRows: number;
  skipped: number;
  sha256: string;
  format: SourceFormat;
  warnings: string[];
  report: LoadReport;
  mapping: Record<string, unknown>;
  duplicatePairs: number;
  message: string;
}

const NAME_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$/;

export function checkCatalogName(name: string): void {
  if (!NAME_PATTERN.test(name)) {
    throw new InputError(
      'bad_catalog_name',
      `catalogue name '${name}' must be 1–64 characters: letters, digits, '.', '_' or '-', starting with a letter or digit`,
      { field: 'name' },
    );
  }
}

function rejectRows(log: ProblemLog, complete: boolean, fileName: string): never {
  const first = log.problems.slice(0, 5).map(ProblemLog.format).join('; ');
  const count = complete ? `${log.count}` : `at least ${log.count}`;
  throw new InputError(
    'invalid_rows',
    `${fileName}: ${count} problem(s) in the rows, nothing was loaded (first: ${first}). Fix the file, or load the good rows with the skip-invalid option.`,
    { problems: log.problems, problemCount: log.count, complete },
  );
}

/** Loads on one connection run one after another (each holds the connection's write transaction). */
const loadQueues = new WeakMap<Database.Database, Promise<unknown>>();
const loading = new WeakSet<Database.Database>();

/** True while a load holds this connection's write transaction (other writes must wait). */
export function loadInProgress(db: Database.Database): boolean {
  return loading.has(db);
}

/** Stands in the catalogue row, inside the load's transaction, until the file's SHA-256 is known. */
const PENDING_SHA256 = '0'.repeat(64);

/** How long a load waits for another process's write to finish before giving up [ms]. */
const WRITE_LOCK_WAIT_MS = 300_000;

/**
 * Load a catalogue file into the store as one atomic step. Rows stream through the reader in a
 * worker thread, are checked and converted (positions to degrees, masses to log10 M☉, σ/(1+z) to
 * σ, colour-based masses where needed), and are sorted part by part into storage order; this
 * thread appends each part to the galaxy table as one run (runs.ts) inside ONE write transaction that also
 * holds the catalogue row, the duplicate-id check and the cross-catalogue links. Until its commit
 * nothing of the load is visible to other connections; an error rolls it back, and a crash (even
 * SIGKILL) leaves the previous state, since SQLite ignores uncommitted WAL frames on recovery.
 * While a load runs, this connection holds the database's write lock: other writers wait.
 */
export async function loadCatalog(store: Store, options: LoadOptions): Promise<LoadSummary> {
  checkCatalogName(options.name);
  const defaults = options.defaults ?? {};
  if (defaults.zErr !== undefined && !(Number.isFinite(defaults.zErr) && defaults.zErr >= 0)) {
    throw new InputError('bad_option', `default z error must be a finite number ≥ 0, got ${defaults.zErr}`, {
      field: 'zErr',
    });
  }
  const explicitMap = typeof options.map === 'string' ? parseMapSpec(options.map) : (options.map ?? {});
  const src = await resolveSource(options.source, options.fileName);
  try {
    const previous = loadQueues.get(store.db) ?? Promise.resolve();
    const run = previous.then(() => loadLocked(store, options, src, defaults, explicitMap));
    loadQueues.set(
      store.db,
      run.catch(() => undefined),
    );
    return await run;
  } finally {
    src.dispose();
  }
}

/**
 * Rows per part (one run each). Parts are small so the parsing worker and its hand-over stay small
 * in memory (bench/load.ts: 256k-row parts raised peak RSS at 5M rows to 374 MB; 64k-row parts
 * loaded 1M rows ~10 % slower than 32k-row parts) and the last part's write, which nothing
 * overlaps, is short. A load of more than MERGE_ABOVE_RUNS parts is merged into one run before it
 * commits (mergeRuns), so a cone search never seeks in more than that many runs of one catalogue.
 */
const PART_ROWS = 32_768;
/**
 * Loads with more parts than this are merged into one run (above about 1.3 million rows). A 1M-row
 * load keeps its 31 runs: merging them would cost it more time than the load itself took (bench/
 * load.ts), while the extra seeks cost a cone search little (README, performance).
 */
const MERGE_ABOVE_RUNS = 40;

function beginImmediate(db: Database.Database): void {
  const wait = db.pragma('busy_timeout', { simple: true }) as number;
  db.pragma(`busy_timeout = ${WRITE_LOCK_WAIT_MS}`);
  try {
    db.exec('BEGIN IMMEDIATE');
  } finally {
    db.pragma(`busy_timeout = ${wait}`);
  }
}

async function loadLocked(
  store: Store,
  options: LoadOptions,
  src: SourceFile,
  defaults: IngestDefaults,
  explicitMap: Partial<Record<Field, string>>,
): Promise<LoadSummary> {
  const { db, statements } = store;
  const mode = options.mode ?? 'create';
  const warnings: string[] = [];
  const expectedRows = estimateRowCount(src.path) ?? Math.max(1, Math.round(statSync(src.path).size / 64));
  const input: ConvertInput = {
    path: src.path,
    fileName: src.fileName,
    format: options.format,
    delimiter: options.delimiter,
    explicitMap,
    defaults,
    batchSize: Math.min(options.batchSize ?? PART_ROWS, MAX_PART_ROWS),
    skipInvalid: options.skipInvalid ?? false,
    expectedRows,
    hashFile: !src.sha256Known,
  };
  const skipInvalid = input.skipInvalid;

  // Parsing (and hashing the file) starts at once, in a worker thread, while this thread opens the
  // write transaction; parts wait (the worker is at most two ahead) until the catalogue row exists.
  let target: { catalogId: number; runs: number[] } | undefined;
  let opened!: () => void;
  const ready = new Promise<void>((resolve) => {
    opened = resolve;
  });
  let rowsWritten = 0;
  const writer = createPartWriter(db);
  let header: ConvertHeader | undefined;
  const sink: ConvertSink = {
    header: (h) => {
      header = h;
      warnings.push(...h.warnings);
    },
    batch: async (rows, rowsRead) => {
      if (!target) await ready;
      abort.signal.throwIfAborted();
      if (rows.length > 0) {
        // Each part is one run: its own key range, appended in key order (see runs.ts).
        const run = allocateRun(db, target!.catalogId);
        target!.runs.push(run);
        rowsWritten += writer.write(target!.catalogId, run, rows);
      }
      options.onProgress?.(rowsRead);
    },
  };
  const abort = new AbortController();
  // A load given up before its transaction opened must not leave a part waiting forever.
  abort.signal.addEventListener('abort', () => opened(), { once: true });
  let parsedInWorker = false;
  const converting = (async (): Promise<ConvertEnd> => {
    if (options.parseInWorker ?? true) {
      try {
        const end = await convertInWorker(input, sink, abort.signal);
        parsedInWorker = true;
        return end;
      } catch (err) {
        if (!(err instanceof WorkerUnavailableError)) throw err;
      }
    }
    return convertFile(input, sink, abort.signal);
  })();
  converting.catch(() => {}); // settled below; never an unhandled rejection meanwhile

  try {
    beginImmediate(db);
  } catch (err) {
    abort.abort(err);
    await converting.catch(() => {});
    throw err;
  }
  loading.add(db);
  try {
    const existing = statements.catalogByName.get(options.name);
    // The file's hash is still being computed; it is needed now only when the name is taken (it
    // tells a repeated load from a conflict), otherwise when the catalogue row is completed.
    let sha256 = existing ? await src.sha256() : PENDING_SHA256;
    if (existing && existing.source_sha256 === sha256 && mode !== 'replace') {
      abort.abort(new Error('unchanged'));
      await converting.catch(() => {});
      db.exec('ROLLBACK');
      return unchanged(store, options.name, sha256, existing.format, mode);
    }
    if (existing && mode === 'create') {
      throw new ConflictError(
        'catalog_exists',
        `catalogue '${options.name}' already exists (from ${existing.source_file}); choose replace or append, or another name`,
        { name: options.name },
      );
    }
    if (!existing && mode !== 'create')
      warnings.push(`catalogue '${options.name}' did not exist; created it`);
    const appending = existing !== undefined && mode === 'append';
    if (existing && !appending) {
      deleteCatalogGalaxies(db, existing.catalog_id);
      statements.deleteCatalog.run(existing.catalog_id);
    }
    const catalogId = appending
      ? existing.catalog_id
      : Number(
          statements.insertCatalog.run(
            options.name,
            options.description ?? existing?.description ?? '',
            src.fileName,
            sha256,
            'csv', // placeholder until the reader has said what the file is (set below)
            0,
            0,
            new Date().toISOString(),
            '{}',
            '{}',
          ).lastInsertRowid,
        );
    target = { catalogId, runs: [] };
    opened();
    const end = await converting;
    sha256 = end.sha256 ?? (await src.sha256());
    const table = header!;
    const mapping = table.mapping;
    const log = new ProblemLog();
    for (const p of end.problems) log.add(p);
    log.count = end.problemCount;
    log.badRows = end.badRows;
    const { massUnit, massUnitHow } = table;
    if (end.rowsRead === 0) {
      throw new InputError('no_rows', `${src.fileName} has a header but no data rows`, {
        file: src.fileName,
      });
    }
    if (log.count > 0 && !skipInvalid) rejectRows(log, !end.stopped, src.fileName);

    const mappingRecord = {
      columns: mapping.column,
      recognisedBy: mapping.how,
      units: {
        ra: table.columns[mapping.index.ra!].unit ?? 'deg (decimal or sexagesimal hours)',
        dec: table.columns[mapping.index.dec!].unit ?? 'deg (decimal or sexagesimal)',
        logMstar: massUnit,
        logMstarUnitFrom: massUnitHow,
        photoZErr: defaults.zErrKind ?? 'sigma',
      },
      defaults,
      storageOrder: STORAGE_ORDER,
      delimiter: options.delimiter,
      parsedInWorker,
    };
    addWarnings(warnings, end.counts);

    // Many parts: one merged run, so cone searches of this catalogue stay a few range scans.
    if (target.runs.length > (options.mergeAboveRuns ?? MERGE_ABOVE_RUNS)) {
      target.runs = [mergeRuns(db, catalogId, target.runs)];
    }
    const runs = JSON.stringify(target.runs);
    // Ids must be unique within the file (and so within the catalogue, since an append replaces
    // rows by id): the parsing side named the candidates, settled here against the stored rows.
    const repeats = repeatedIds(db, runs, end);
    const duplicateIds = repeats.slice(0, 100).map((d) => ({ objectId: d.objectId, positions: d.positions }));
    let removedAsDuplicates = 0;
    if (repeats.length > 0) {
      for (const d of repeats) {
        for (const pos of d.positions.slice(1)) {
          log.add({
            position: pos,
            positionKind: table.positionKind,
            column: mapping.column.id ?? 'id',
            value: d.objectId,
            reason: `duplicate id (first at ${table.positionKind} ${d.positions[0]})`,
          });
        }
      }
      if (!skipInvalid) rejectRows(log, true, src.fileName);
      removedAsDuplicates = dropLaterOccurrences(db, repeats) + end.removedTwinCount;
      log.badRows += removedAsDuplicates;
    }
    const stored = rowsWritten - (removedAsDuplicates - end.removedTwinCount);
    if (appending) {
      // An appended row replaces the stored row with its id (rows of the catalogue's earlier runs).
      db.prepare(
        `DELETE FROM galaxy WHERE gkey IN (
           SELECT g.gkey FROM galaxy_run k CROSS JOIN galaxy g
           WHERE k.catalog_id = @catalogId AND k.run NOT IN (SELECT value FROM json_each(@runs))
             AND ${inRun('k.run')}
             AND g.object_id IN (SELECT n.object_id FROM ${NEW_ROWS.from} WHERE ${NEW_ROWS.where}))`,
      ).run({ catalogId, runs });
      // Runs left empty are freed (run numbers are a finite resource).
      db.prepare(
        `DELETE FROM galaxy_run WHERE catalog_id = @catalogId
           AND NOT EXISTS (SELECT 1 FROM galaxy g WHERE ${inRun('galaxy_run.run')})`,
      ).run({ catalogId });
    }
    const total = appending ? statements.galaxyCount.get({ catalogId })! : stored;
    const report = {
      problemCount: log.count,
      problems: log.problems,
      skippedRows: log.badRows,
      duplicateIds,
      warnings,
    };
    db.prepare(
      `UPDATE catalog SET source_file = ?, source_sha256 = ?, format = ?, row_count = ?,
         rows_skipped = ${appending ? 'rows_skipped + ' : ''}?, loaded_at = ?, mapping_json = ?, report_json = ?,
         description = coalesce(?, description) WHERE catalog_id = ?`,
    ).run(
      src.fileName,
      sha256,
      table.format,
      total,
      log.badRows,
      new Date().toISOString(),
      JSON.stringify(mappingRecord),
      JSON.stringify(report),
      options.description ?? null,
      catalogId,
    );
    const pairs = matchCatalog(store, catalogId);
    rebuildPhysicalLinks(store);
    db.exec('COMMIT');

    const outcome = !existing ? 'loaded' : mode === 'replace' ? 'replaced' : 'appended';
    return {
      name: options.name,
      outcome,
      rows: stored,
      totalRows: total,
      skipped: log.badRows,
      sha256: sha256,
      format: table.format,
      warnings,
      report: { problemCount: log.count, problems: log.problems, skippedRows: log.badRows, duplicateIds },
      mapping: mappingRecord,
      duplicatePairs: pairs,
      message: `${outcome} catalogue '${options.name}': ${stored} rows stored${log.badRows ? `, ${log.badRows} skipped` : ''}, ${total} in total`,
    };
  } catch (err) {
    abort.abort(err);
    await converting.catch(() => {});
    if (db.inTransaction) db.exec('ROLLBACK');
    throw err;
  } finally {
    loading.delete(db);
  }
}

interface Occurrence {
  position: number;
  /** Where the row is stored (absent for a twin left out of its part). */
  key?: { run: number; hpx: number };
}

interface RepeatedId {
  objectId: string;
  /** Every line/row where the id occurs, ascending (the first is kept). */
  positions: number[];
  occurrences: Occurrence[];
}

/** SQL: the rows n of this load's runs (bound as the JSON array @runs). */
const NEW_ROWS = listedRunRows('@runs', 'n');

/** Ids of this load (its runs, a JSON array) that occur more than once, with every occurrence. */
function repeatedIds(db: Database.Database, runs: string, end: ConvertEnd): RepeatedId[] {
  const byId = new Map<string, Occurrence[]>();
  const note = (id: string, o: Occurrence) => {
    const list = byId.get(id);
    if (list) list.push(o);
    else byId.set(id, [o]);
  };
  if (end.idCheckAll || end.idCandidates.length > 0) {
    const rows = end.idCheckAll
      ? db
          .prepare(
            `SELECT n.object_id, n.run, n.hpx, n.source_position FROM ${NEW_ROWS.from}
             WHERE ${NEW_ROWS.where} AND n.object_id IN (
               SELECT n.object_id FROM ${NEW_ROWS.from} WHERE ${NEW_ROWS.where}
               GROUP BY n.object_id HAVING COUNT(*) > 1)`,
          )
          .raw(true)
          .all({ runs })
      : db
          .prepare(
            `SELECT n.object_id, n.run, n.hpx, n.source_position FROM ${NEW_ROWS.from}
             WHERE ${NEW_ROWS.where} AND n.object_id IN (SELECT value FROM json_each(@candidates))`,
          )
          .raw(true)
          .all({ runs, candidates: JSON.stringify(end.idCandidates) });
    for (const r of rows as [string, number, number, number][]) {
      note(r[0], { position: r[3], key: { run: r[1], hpx: r[2] } });
    }
  }
  for (const t of end.removedTwins) note(t.objectId, { position: t.position });
  const out: RepeatedId[] = [];
  for (const [objectId, occurrences] of byId) {
    if (occurrences.length < 2) continue;
    occurrences.sort((a, b) => a.position - b.position);
    out.push({ objectId, positions: occurrences.map((o) => o.position), occurrences });
  }
  return out.sort((a, b) => a.positions[1] - b.positions[1]);
}

/** Keep the first occurrence of each repeated id; returns how many stored rows were deleted. */
function dropLaterOccurrences(db: Database.Database, repeats: readonly RepeatedId[]): number {
  const del = db.prepare<[{ run: number; hpx: number; id: string; position: number }]>(
    `DELETE FROM galaxy WHERE ${inRunPixels('@run', '@hpx', '@hpx', 'galaxy')}
       AND object_id = @id AND source_position = @position`,
  );
  let n = 0;
  for (const d of repeats) {
    for (const o of d.occurrences.slice(1)) {
      if (o.key) n += del.run({ ...o.key, id: d.objectId, position: o.position }).changes;
    }
  }
  return n;
}

function unchanged(
  store: Store,
  name: string,
  sha256: string,
  format: SourceFormat,
  mode: LoadMode,
): LoadSummary {
  const row = store.statements.catalogByName.get(name)!;
  return {
    name,
    outcome: 'unchanged',
    rows: 0,
    totalRows: row.row_count,
    skipped: 0,
    sha256,
    format,
    warnings: [],
    report: { problemCount: 0, problems: [], skippedRows: 0, duplicateIds: [] },
    mapping: JSON.parse(row.mapping_json),
    duplicatePairs: store.statements.matchCount.get(row.catalog_id, row.catalog_id)!.n,
    message: `catalogue '${name}' already holds this file (SHA-256 ${sha256.slice(0, 12)}…); nothing to do${mode === 'append' ? ' (append of the same file)' : ''}`,
  };
}

function addWarnings(
  warnings: string[],
  counts: {
    raWrapped: number;
    massEstimated: number;
    estimatedBeyondCalibration: number;
    idsGenerated: number;
  },
): void {
  if (counts.raWrapped > 0)
    warnings.push(`${counts.raWrapped} row(s) had RA exactly 360°, stored as 0° (same meridian)`);
  if (counts.idsGenerated > 0)
    warnings.push('no id column: rows are identified by their line/row number (e.g. line12)');
  if (counts.massEstimated > 0) {
    warnings.push(
      `${counts.massEstimated} stellar mass(es) estimated from g − i with ${TAYLOR2011.reference}: no k-correction applied, ` +
        `calibrated for z ≲ ${TAYLOR2011.zMaxCalibrated} and H0 = 70 (from memory; distances here use Planck18), error floor 0.2 dex (team choice)`,
    );
  }
  if (counts.estimatedBeyondCalibration > 0) {
    warnings.push(
      `${counts.estimatedBeyondCalibration} estimated mass(es) at z > ${TAYLOR2011.zMaxCalibrated}, beyond the calibration of the colour relation`,
    );
  }
}
