import { createCosmology } from '../../cosmology/index.js';
import { InputError } from '../../errors.js';
import type { ColumnInfo, SourceRow } from '../readers/types.js';
import { type Field, normaliseName } from './fields.js';
import { type ColumnMapping, resolveMapping } from './mapping.js';
import { openTable, type SourceFormat } from './open-table.js';
import { MAX_REPORTED_PROBLEMS, ProblemLog, type RowProblem } from './problems.js';
import { createRowConverter, type IngestDefaults, type StagedRow } from './row-converter.js';
import { createBatchBuilder, type StagedBatch } from './staged-batch.js';
import { guessMassUnit, type MassUnit, massUnitFromString } from './units.js';

/** Source rows read and converted per slice (see convertFile and READ_CHUNK_BYTES in readers/csv.ts). */
const READ_ROWS = 1000;

/** Everything needed to turn a catalogue file into staged rows (plain data: it crosses to a worker). */
export interface ConvertInput {
  path: string;
  fileName: string;
  format?: SourceFormat;
  delimiter?: string;
  explicitMap: Partial<Record<Field, string>>;
  defaults: IngestDefaults;
  batchSize: number;
  skipInvalid: boolean;
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
export async function convertFile(input: ConvertInput, sink: ConvertSink): Promise<ConvertEnd> {
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
  try {
    const mapping = resolveMapping(table.columns, input.explicitMap);
    const cosmology = createCosmology('planck18');
    let convert: ((row: SourceRow) => StagedRow | null) | undefined;
    // Rows are read in small slices and converted at once, so the parsed cells die young in the
    // V8 heap; converted rows collect in columns and go to the sink batchSize source rows at a time.
    const rows = table.batches(Math.min(READ_ROWS, input.batchSize))[Symbol.asyncIterator]();
    try {
      // The mass unit is guessed from the first batchSize rows, as they come.
      const first: SourceRow[] = [];
      let ended = false;
      while (first.length < input.batchSize) {
        const next = await rows.next();
        if (next.done) {
          ended = true;
          break;
        }
        for (const row of next.value) first.push(row);
      }
      if (first.length > 0) {
        const warnings: string[] = [];
        const { massUnit, massUnitHow } = chooseMassUnit(
          input.defaults.massUnit,
          mapping.index.log_mstar,
          table.columns,
          first,
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
          luminosityDistanceMpc: (z) => cosmology.luminosityDistanceMpc(z),
          problems: log,
          counts,
        });
      }
      const good = createBatchBuilder(input.batchSize);
      let readSinceFlush = 0;
      /** Hand the batch to the sink; true when reading should stop (problems and no skipInvalid). */
      const flush = async (): Promise<boolean> => {
        const rejecting = log.count > 0 && !input.skipInvalid;
        const batch = good.take();
        readSinceFlush = 0;
        await sink.batch(rejecting ? createBatchBuilder(0).take() : batch, rowsRead);
        return rejecting && log.problems.length >= MAX_REPORTED_PROBLEMS;
      };
      const convertSlice = async (slice: readonly SourceRow[]): Promise<boolean> => {
        for (const row of slice) {
          const r = convert!(row);
          if (r) good.push(r);
          rowsRead++;
          if (++readSinceFlush === input.batchSize && (await flush())) return true;
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
  return { problems: log.problems, problemCount: log.count, badRows: log.badRows, counts, rowsRead, stopped };
}

function chooseMassUnit(
  option: MassUnit | undefined,
  massIndex: number | undefined,
  columns: readonly ColumnInfo[],
  firstBatch: SourceRow[],
  warnings: string[],
): { massUnit: MassUnit; massUnitHow: string } {
  if (option) return { massUnit: option, massUnitHow: 'option' };
  if (massIndex === undefined) return { massUnit: 'log', massUnitHow: 'no stellar-mass column' };
  const fromUnit = massUnitFromString(columns[massIndex].unit);
  if (fromUnit) return { massUnit: fromUnit, massUnitHow: `column unit '${columns[massIndex].unit}'` };
  const values = firstBatch.map((r) => Number(r.values[massIndex] ?? Number.NaN));
  const guess = guessMassUnit(values);
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
