import type { Readable } from 'node:stream';
import { ConflictError, InputError } from '../../errors.js';
import { matchCatalog, rebuildPhysicalLinks } from '../duplicates.js';
import type { Store } from '../open.js';
import { STORAGE_ORDER } from '../storage-order.js';
import {
  type ConvertEnd,
  type ConvertHeader,
  type ConvertInput,
  type ConvertSink,
  convertFile,
} from './convert-file.js';
import { convertInWorker, WorkerUnavailableError } from './convert-in-worker.js';
import type { Field } from './fields.js';
import { parseMapSpec } from './mapping.js';
import type { SourceFormat } from './open-table.js';
import { ProblemLog, type RowProblem } from './problems.js';
import type { IngestDefaults } from './row-converter.js';
import { resolveSource } from './source-file.js';
import { createStage } from './stage.js';
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
  /** Rows per staged batch (default 10,000: small batches die young in the V8 heap, keeping memory flat). */
  batchSize?: number;
  /**
   * Parse and check in a worker thread while this thread writes (default true; falls back to this
   * thread where a worker cannot start, e.g. under a test runner that cannot load .ts in workers).
   */
  parseInWorker?: boolean;
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

/**
 * Load a catalogue file into the store as one atomic step. Rows stream through the reader, are
 * checked and converted (positions to degrees, masses to log10 M☉, σ/(1+z) to σ, colour-based
 * masses where needed), staged in a private temp table, and copied into the clustered galaxy table
 * in one final transaction together with the catalogue row and the duplicate links. Until that
 * commit nothing of the load is visible; a crash at any point leaves the previous state.
 */
export async function loadCatalog(store: Store, options: LoadOptions): Promise<LoadSummary> {
  const { db, statements } = store;
  const mode = options.mode ?? 'create';
  checkCatalogName(options.name);
  const defaults = options.defaults ?? {};
  if (defaults.zErr !== undefined && !(Number.isFinite(defaults.zErr) && defaults.zErr >= 0)) {
    throw new InputError('bad_option', `default z error must be a finite number ≥ 0, got ${defaults.zErr}`, {
      field: 'zErr',
    });
  }
  const explicitMap = typeof options.map === 'string' ? parseMapSpec(options.map) : (options.map ?? {});

  const src = await resolveSource(options.source, options.fileName);
  const warnings: string[] = [];
  try {
    const existing = statements.catalogByName.get(options.name);
    if (existing && existing.source_sha256 === src.sha256 && mode !== 'replace') {
      return unchanged(store, options.name, src.sha256, existing.format, mode);
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

    const input: ConvertInput = {
      path: src.path,
      fileName: src.fileName,
      format: options.format,
      delimiter: options.delimiter,
      explicitMap,
      defaults,
      batchSize: options.batchSize ?? 10_000,
      skipInvalid: options.skipInvalid ?? false,
    };
    const skipInvalid = input.skipInvalid;
    const stage = createStage(db);
    try {
      let header: ConvertHeader | undefined;
      const sink: ConvertSink = {
        header: (h) => {
          header = h;
          warnings.push(...h.warnings);
        },
        batch: (rows, rowsRead) => {
          if (rows.length > 0) stage.insertMany(rows);
          options.onProgress?.(rowsRead);
        },
      };
      let end: ConvertEnd;
      let parsedInWorker = false;
      if (options.parseInWorker ?? true) {
        try {
          end = await convertInWorker(input, sink);
          parsedInWorker = true;
        } catch (err) {
          if (!(err instanceof WorkerUnavailableError)) throw err;
          end = await convertFile(input, sink);
        }
      } else {
        end = await convertFile(input, sink);
      }
      const table = header!;
      const mapping = table.mapping;
      const log = new ProblemLog();
      for (const p of end.problems) log.add(p);
      log.count = end.problemCount;
      log.badRows = end.badRows;
      const counts = end.counts;
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
      addWarnings(warnings, counts);

      // Ids must be unique within the file (and so within the catalogue, since an append replaces
      // rows by id). Checked on the staged rows with one GROUP BY before anything is committed.
      const duplicateIds = stage.duplicateIds();
      if (duplicateIds.length > 0) {
        for (const d of duplicateIds) {
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
        log.badRows += stage.dropLaterDuplicates();
      }
      const result = commit(store, {
        name: options.name,
        description: options.description,
        mode: existing ? mode : 'create',
        fileName: src.fileName,
        sha256: src.sha256,
        format: table.format,
        stage: stage.table,
        mapping: mappingRecord,
        report: {
          problemCount: log.count,
          problems: log.problems,
          skippedRows: log.badRows,
          duplicateIds,
          warnings,
        },
      });
      const outcome = !existing ? 'loaded' : mode === 'replace' ? 'replaced' : 'appended';
      return {
        name: options.name,
        outcome,
        rows: result.stored,
        totalRows: result.total,
        skipped: log.badRows,
        sha256: src.sha256,
        format: table.format,
        warnings,
        report: { problemCount: log.count, problems: log.problems, skippedRows: log.badRows, duplicateIds },
        mapping: mappingRecord,
        duplicatePairs: result.pairs,
        message: `${outcome} catalogue '${options.name}': ${result.stored} rows stored${log.badRows ? `, ${log.badRows} skipped` : ''}, ${result.total} in total`,
      };
    } finally {
      stage.drop();
    }
  } finally {
    src.dispose();
  }
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

interface CommitInput {
  name: string;
  description?: string;
  mode: LoadMode;
  fileName: string;
  sha256: string;
  format: SourceFormat;
  stage: string;
  mapping: Record<string, unknown>;
  report: LoadReport & { warnings: string[] };
}

const GALAXY_COLS =
  'hpx, object_id, ra_deg, dec_deg, z, z_err, z_kind, log_mstar, log_mstar_err, mass_estimated, g_mag, i_mag, log_mhalo, mhalo_def, log_mhalo_err, group_id, source_position';

/** The one transaction that makes a load visible (or changes nothing if it throws). */
function commit(store: Store, c: CommitInput): { stored: number; total: number; pairs: number } {
  const { db, statements } = store;
  return db
    .transaction(() => {
      const old = statements.catalogByName.get(c.name);
      const now = new Date().toISOString();
      const mappingJson = JSON.stringify(c.mapping);
      const reportJson = JSON.stringify(c.report);
      let catalogId: number;
      let stored: number;
      if (old && c.mode === 'append') {
        catalogId = old.catalog_id;
        db.prepare(
          `DELETE FROM galaxy WHERE catalog_id = ? AND object_id IN (SELECT object_id FROM ${c.stage})`,
        ).run(catalogId);
        stored = db
          .prepare(
            `INSERT INTO galaxy (catalog_id, ${GALAXY_COLS}) SELECT ?, ${GALAXY_COLS} FROM ${c.stage} ORDER BY hpx, object_id`,
          )
          .run(catalogId).changes;
        const total = (
          db.prepare('SELECT COUNT(*) AS n FROM galaxy WHERE catalog_id = ?').get(catalogId) as { n: number }
        ).n;
        db.prepare(
          `UPDATE catalog SET source_file = ?, source_sha256 = ?, format = ?, row_count = ?, rows_skipped = rows_skipped + ?,
             loaded_at = ?, mapping_json = ?, report_json = ?, description = coalesce(?, description) WHERE catalog_id = ?`,
        ).run(
          c.fileName,
          c.sha256,
          c.format,
          total,
          c.report.skippedRows,
          now,
          mappingJson,
          reportJson,
          c.description ?? null,
          catalogId,
        );
      } else {
        if (old) statements.deleteCatalog.run(old.catalog_id);
        catalogId = Number(
          statements.insertCatalog.run(
            c.name,
            c.description ?? old?.description ?? '',
            c.fileName,
            c.sha256,
            c.format,
            0,
            c.report.skippedRows,
            now,
            mappingJson,
            reportJson,
          ).lastInsertRowid,
        );
        stored = db
          .prepare(
            `INSERT INTO galaxy (catalog_id, ${GALAXY_COLS}) SELECT ?, ${GALAXY_COLS} FROM ${c.stage} ORDER BY hpx, object_id`,
          )
          .run(catalogId).changes;
        db.prepare('UPDATE catalog SET row_count = ? WHERE catalog_id = ?').run(stored, catalogId);
      }
      const total = (
        db.prepare('SELECT row_count AS n FROM catalog WHERE catalog_id = ?').get(catalogId) as { n: number }
      ).n;
      const pairs = matchCatalog(store, catalogId);
      rebuildPhysicalLinks(store);
      return { stored, total, pairs };
    })
    .immediate();
}
