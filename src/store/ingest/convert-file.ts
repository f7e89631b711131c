import { createCosmology } from '../../cosmology/index.js';
import { InputError } from '../../errors.js';
import type { ColumnInfo, SourceRow } from '../readers/types.js';
import { type Field, normaliseName } from './fields.js';
import { type ColumnMapping, resolveMapping } from './mapping.js';
import { openTable, type SourceFormat } from './open-table.js';
import { MAX_REPORTED_PROBLEMS, ProblemLog, type RowProblem } from './problems.js';
import { createRowConverter, type IngestDefaults, type StagedRow } from './row-converter.js';
import { guessMassUnit, type MassUnit, massUnitFromString } from './units.js';

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
  /** Good rows of one batch (empty once problems are found without skipInvalid). */
  batch(rows: StagedRow[], rowsRead: number): void | Promise<void>;
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
    for await (const batch of table.batches(input.batchSize)) {
      if (!convert) {
        const warnings: string[] = [];
        const { massUnit, massUnitHow } = chooseMassUnit(
          input.defaults.massUnit,
          mapping.index.log_mstar,
          table.columns,
          batch,
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
      const good: StagedRow[] = [];
      for (const row of batch) {
        const r = convert(row);
        if (r) good.push(r);
      }
      rowsRead += batch.length;
      const rejecting = log.count > 0 && !input.skipInvalid;
      await sink.batch(rejecting ? [] : good, rowsRead);
      if (rejecting && log.problems.length >= MAX_REPORTED_PROBLEMS) {
        stopped = true;
        break;
      }
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
