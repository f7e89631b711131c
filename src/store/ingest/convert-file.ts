import type { CosmologyModel } from '../../cosmology/index.js';
import { InputError } from '../../errors.js';
import { type DelimitedRecord, recordValues } from '../readers/delimited-records.js';
import type { ColumnInfo, SourceRow } from '../readers/types.js';
import { type Field, normaliseName } from './fields.js';
import { createIdFilter } from './id-filter.js';
import { type ColumnMapping, resolveMapping } from './mapping.js';
import { openTable, type SourceFormat } from './open-table.js';
import { type RemovedTwin, sortPart } from './part-sort.js';
import { MAX_REPORTED_PROBLEMS, ProblemLog, type RowProblem } from './problems.js';
import { ArrayCells, LineCells, type RowCells } from './row-cells.js';
import { createRowConverter, type IngestDefaults, type RowConverter } from './row-converter.js';
import { createBatchBuilder, type StagedBatch } from './staged-batch.js';
import { guessMassUnit, type MassUnit, massUnitFromString } from './units.js';

/** Source rows read and converted per slice (see convertFile and READ_CHUNK_BYTES in readers/csv.ts). */
const READ_ROWS = 1000;
/** Rows whose stellar-mass values decide a log/linear guess (see chooseMassUnit). */
const MASS_GUESS_ROWS = 10_000;
/** Rows of the first part (later parts have batchSize rows). */
const FIRST_PART_ROWS = 4096;
/** What a reader yields: decoded rows, or (CSV/TSV) records with unquoted lines kept whole. */
type SourceItem = SourceRow | DelimitedRecord;

/** Exact twins listed by position (enough for any report; the count is always complete). */
const MAX_LISTED_TWINS = 10_000;

/** Everything needed to turn a catalogue file into staged rows (plain data: it crosses to a worker). */
export interface ConvertInput {
  path: string;
  fileName: string;
  format?: SourceFormat;
  delimiter?: string;
  explicitMap: Partial<Record<Field, string>>;
  defaults: IngestDefaults;
  /** Source rows per part: each part is sorted into storage order and handed over as one batch. */
  batchSize: number;
  skipInvalid: boolean;
  /** Rough number of rows in the file (sizes the duplicate-id filter; see id-filter.ts). */
  expectedRows?: number;
  /** Also compute the file's SHA-256 (the parsing worker does it alongside, off the loading thread). */
  hashFile?: boolean;
}

export interface ConvertHeader {
  format: SourceFormat;
  positionKind: 'line' | 'row';
  columns: ColumnInfo[];
  mapping: ColumnMapping;
  massUnit: MassUnit;
  massUnitHow: string;
  warnings: string[];
}

export interface ConvertCounts {
  raWrapped: number;
  massEstimated: number;
  estimatedBeyondCalibration: number;
  idsGenerated: number;
}

export interface ConvertEnd {
  problems: RowProblem[];
  problemCount: number;
  badRows: number;
  counts: ConvertCounts;
  rowsRead: number;
  /** Reading stopped early: problems were found, skipInvalid is off, and the report is full. */
  stopped: boolean;
  /** Ids that may occur more than once (a superset of the repeated ids, settled by the caller). */
  idCandidates: string[];
  /** Too many candidates to list: the caller must check all ids of the load. */
  idCheckAll: boolean;
  /** Rows left out of their part as exact twins (same pixel and id) of an earlier row (first 10,000). */
  removedTwins: RemovedTwin[];
  /** Number of such rows (all of them). */
  removedTwinCount: number;
  /** The file's SHA-256 (hex) when hashFile was asked for and the parsing worker computed it. */
  sha256?: string;
}

export interface ConvertSink {
  header(h: ConvertHeader): void;
  /** Good rows of one batch (empty once problems are found without skipInvalid); the sink owns it. */
  batch(rows: StagedBatch, rowsRead: number): void | Promise<void>;
}

/**
 * Read, check and convert a catalogue file batch by batch. No SQL here, so the same code runs in the
 * loading thread or in a worker thread that parses while the main thread writes.
 */
export async function convertFile(
  input: ConvertInput,
  sink: ConvertSink,
  signal?: AbortSignal,
): Promise<ConvertEnd> {
  const table = await openTable(input.path, input.fileName, input.format, input.delimiter);
  const log = new ProblemLog();
  const counts: ConvertCounts = {
    raWrapped: 0,
    massEstimated: 0,
    estimatedBeyondCalibration: 0,
    idsGenerated: 0,
  };
  let rowsRead = 0;
  let stopped = false;
  const ids = createIdFilter(input.expectedRows ?? 100_000);
  const removedTwins: RemovedTwin[] = [];
  let removedTwinCount = 0;
  try {
    const mapping = resolveMapping(table.columns, input.explicitMap);
    // Distances are needed only to estimate masses from g and i; the cosmology module (and zod,
    // which it loads) is imported only then, which saves the parsing worker ~0.1 s of start-up.
    let cosmology: CosmologyModel | undefined;
    if (mapping.index.g !== undefined && mapping.index.i !== undefined) {
      const { createCosmology } = await import('../../cosmology/index.js');
      cosmology = createCosmology('planck18');
    }
    let convert: RowConverter | undefined;
    // Rows are read in small slices and converted at once, so the parsed cells die young in the
    // V8 heap; converted rows collect in columns and go to the sink batchSize source rows at a time.
    // A CSV/TSV file is read as records whose unquoted lines are decoded in place (row-cells.ts).
    const rows = (
      table.delimited ? table.delimited.records() : table.batches(Math.min(READ_ROWS, input.batchSize))
    )[Symbol.asyncIterator]();
    const delimiter = table.delimited?.delimiter ?? ',';
    const lineCells = new LineCells(delimiter);
    const arrayCells = new ArrayCells();
    // Cells come in reused objects: read them before asking for the next item's.
    const recordCells = (rec: DelimitedRecord): RowCells =>
      rec.text !== undefined ? lineCells.reset(rec.text) : arrayCells.reset(recordValues(rec, delimiter));
    const cellsOf = (item: SourceItem): RowCells =>
      'values' in item ? arrayCells.reset(item.values) : recordCells(item);
    try {
      // The mass unit is guessed from the first rows (up to MASS_GUESS_ROWS), as they come.
      const first: SourceItem[] = [];
      let ended = false;
      while (first.length < Math.min(input.batchSize, MASS_GUESS_ROWS)) {
        const next = await rows.next();
        if (next.done) {
          ended = true;
          break;
        }
        for (const row of next.value) first.push(row);
      }
      if (first.length > 0) {
        const warnings: string[] = [];
        const massIndex = mapping.index.log_mstar;
        const { massUnit, massUnitHow } = chooseMassUnit(
          input.defaults.massUnit,
          massIndex,
          table.columns,
          () => first.map((item) => Number(cellsOf(item).raw(massIndex!) ?? Number.NaN)),
          warnings,
        );
        sink.header({
          format: table.format,
          positionKind: table.positionKind,
          columns: [...table.columns],
          mapping,
          massUnit,
          massUnitHow,
          warnings,
        });
        convert = createRowConverter({
          mapping,
          columns: table.columns,
          positionKind: table.positionKind,
          defaults: input.defaults,
          massUnit,
          luminosityDistanceMpc: (z) => cosmology!.luminosityDistanceMpc(z),
          problems: log,
          counts,
        });
      }
      const good = createBatchBuilder(input.batchSize);
      let readSinceFlush = 0;
      // The first part is small, so the loading thread starts writing while the worker reads on.
      let partRows = Math.min(input.batchSize, FIRST_PART_ROWS);
      /** Hand the batch to the sink; true when reading should stop (problems and no skipInvalid). */
      const flush = async (): Promise<boolean> => {
        const rejecting = log.count > 0 && !input.skipInvalid;
        const batch = good.take();
        readSinceFlush = 0;
        partRows = input.batchSize;
        if (rejecting) {
          await sink.batch(createBatchBuilder(0).take(), rowsRead);
        } else {
          const { part, removed } = sortPart(batch);
          removedTwinCount += removed.length;
          for (const r of removed) if (removedTwins.length < MAX_LISTED_TWINS) removedTwins.push(r);
          await sink.batch(part, rowsRead);
        }
        return rejecting && log.problems.length >= MAX_REPORTED_PROBLEMS;
      };
      const convertSlice = async (slice: readonly SourceItem[]): Promise<boolean> => {
        signal?.throwIfAborted();
        for (const item of slice) {
          const kept =
            'values' in item
              ? convert!(arrayCells.reset(item.values), item.position, good)
              : convert!(recordCells(item), item.line, good);
          if (kept) ids.add(good.lastId());
          rowsRead++;
          if (++readSinceFlush === partRows && (await flush())) return true;
        }
        return false;
      };
      stopped = convert !== undefined && (await convertSlice(first));
      first.length = 0;
      while (!stopped && !ended) {
        const next = await rows.next();
        if (next.done) break;
        stopped = await convertSlice(next.value);
      }
      if (!stopped && readSinceFlush > 0) await flush();
    } finally {
      await rows.return?.();
    }
    if (!convert) {
      // Header but no rows: still tell the caller what the header meant.
      sink.header({
        format: table.format,
        positionKind: table.positionKind,
        columns: [...table.columns],
        mapping,
        massUnit: 'log',
        massUnitHow: 'no rows',
        warnings: [],
      });
    }
  } finally {
    await table.close();
  }
  return {
    problems: log.problems,
    problemCount: log.count,
    badRows: log.badRows,
    counts,
    rowsRead,
    stopped,
    idCandidates: [...ids.candidates],
    idCheckAll: ids.overflowed,
    removedTwins,
    removedTwinCount,
  };
}

function chooseMassUnit(
  option: MassUnit | undefined,
  massIndex: number | undefined,
  columns: readonly ColumnInfo[],
  /** The mass column's values in the first rows, as numbers (called only when they are needed). */
  firstValues: () => number[],
  warnings: string[],
): { massUnit: MassUnit; massUnitHow: string } {
  if (option) return { massUnit: option, massUnitHow: 'option' };
  if (massIndex === undefined) return { massUnit: 'log', massUnitHow: 'no stellar-mass column' };
  const fromUnit = massUnitFromString(columns[massIndex].unit);
  if (fromUnit) return { massUnit: fromUnit, massUnitHow: `column unit '${columns[massIndex].unit}'` };
  const guess = guessMassUnit(firstValues());
  const name = columns[massIndex].name;
  if (/^(log|lmass|lmstar)/.test(normaliseName(name))) {
    if (guess === 'linear' || guess === 'mixed') {
      throw new InputError(
        'ambiguous_mass_unit',
        `column '${name}' is named as a log10 stellar mass but holds values above 10⁴; say which with the mass-unit option`,
        { column: name },
      );
    }
    return { massUnit: 'log', massUnitHow: `column name '${name}'` };
  }
  if (guess === 'mixed') {
    throw new InputError(
      'ambiguous_mass_unit',
      `stellar-mass column '${name}' mixes log10-like (< 30) and linear-like (> 10⁴) values; say which with the mass-unit option`,
      { column: name },
    );
  }
  const unit = guess ?? 'log';
  warnings.push(
    `stellar-mass column '${name}' read as ${unit === 'log' ? 'log10(M* / M☉)' : 'linear M☉ (converted to log10)'}, guessed from the values of the first rows; use the mass-unit option to override`,
  );
  return { massUnit: unit, massUnitHow: 'guessed from values' };
}
