import { ang2pixNest } from '../../sky/index.js';
import type { CellValue, ColumnInfo, SourceRow } from '../readers/types.js';
import { STORAGE_ORDER } from '../storage-order.js';
import { cellNumber, cellText, show, whyNotFinite } from './cells.js';
import type { Field } from './fields.js';
import type { ColumnMapping } from './mapping.js';
import type { ProblemLog } from './problems.js';
import { parseSexagesimalDecDeg, parseSexagesimalRaDeg } from './sexagesimal.js';
import { absoluteMagnitude, ESTIMATED_LOG_MSTAR_ERR_FLOOR, logMstarTaylor2011 } from './taylor2011.js';
import { angleScaleToDeg, type MassUnit } from './units.js';

export type ZKind = 'spec' | 'photo';
export type MhaloDef = '200c' | '200m' | 'vir';

/** Per-catalogue choices for what the file does not say. */
export interface IngestDefaults {
  /** Kind of redshift when the file has no z_kind column and the column name does not tell. */
  zKind?: ZKind;
  /** Redshift error when the file has none (same convention as zErrKind). */
  zErr?: number;
  /** Photometric-redshift errors given as σ (default) or as σ/(1+z). Spectroscopic ones are σ. */
  zErrKind?: 'sigma' | 'sigma_over_1pz';
  /** Stellar masses as log10(M* / M☉) or linear M☉; guessed from the values when absent. */
  massUnit?: MassUnit;
  /** Mass definition of a log_mhalo column without an mhalo_def column. */
  mhaloDef?: MhaloDef;
}

/** Valid ranges checked on every row (inclusive). */
export const LIMITS = Object.freeze({
  logMstar: [6, 13] as const,
  logMhalo: [9, 16] as const,
  /** Apparent AB magnitudes outside this are taken as sentinels or unit mistakes. */
  mag: [5, 40] as const,
});

/**
 * The parameter list of one staged row, in the column order of the staging table:
 * hpx, object_id, ra_deg, dec_deg, z, z_err, z_kind, log_mstar, log_mstar_err, mass_estimated,
 * g_mag, i_mag, log_mhalo, mhalo_def, log_mhalo_err, group_id, source_position.
 */
export type StagedRow = [
  number,
  string,
  number,
  number,
  number,
  number | null,
  ZKind,
  number | null,
  number | null,
  0 | 1,
  number | null,
  number | null,
  number | null,
  MhaloDef | null,
  number | null,
  string | null,
  number,
];

const Z_KINDS: Record<string, ZKind> = {
  spec: 'spec',
  s: 'spec',
  spectroscopic: 'spec',
  specz: 'spec',
  zspec: 'spec',
  photo: 'photo',
  phot: 'photo',
  p: 'photo',
  photometric: 'photo',
  photoz: 'photo',
  zphot: 'photo',
};

const MHALO_DEFS: Record<string, MhaloDef> = {
  '200c': '200c',
  m200c: '200c',
  '200crit': '200c',
  '200m': '200m',
  m200m: '200m',
  '200mean': '200m',
  vir: 'vir',
  mvir: 'vir',
  virial: 'vir',
};

export interface ConverterContext {
  mapping: ColumnMapping;
  columns: readonly ColumnInfo[];
  positionKind: 'line' | 'row';
  defaults: IngestDefaults;
  massUnit: MassUnit;
  luminosityDistanceMpc: (z: number) => number;
  problems: ProblemLog;
  /** Counters the load summary reports as warnings. */
  counts: {
    raWrapped: number;
    massEstimated: number;
    estimatedBeyondCalibration: number;
    idsGenerated: number;
  };
}

/** Build the function that checks and converts one source row (null when the row has problems). */
export function createRowConverter(ctx: ConverterContext): (row: SourceRow) => StagedRow | null {
  const { mapping, columns, positionKind, defaults, problems, counts } = ctx;
  const ix = mapping.index;
  const colName = (f: Field) => mapping.column[f] ?? f;
  const raScale = angleScaleToDeg(columns[ix.ra!].unit, colName('ra'), true);
  const decScale = angleScaleToDeg(columns[ix.dec!].unit, colName('dec'), false);
  const nColumns = columns.length;
  const zErrOver1pz = defaults.zErrKind === 'sigma_over_1pz';

  return (row: SourceRow): StagedRow | null => {
    const v = row.values;
    const position = row.position;
    let bad = false;
    const problem = (f: Field | string, value: CellValue | undefined, reason: string) => {
      bad = true;
      problems.add({ position, positionKind, column: colName(f as Field), value: show(value), reason });
    };
    if (v.length !== nColumns) {
      problems.add({
        position,
        positionKind,
        column: '(row)',
        value: '',
        reason: `expected ${nColumns} fields as in the header, found ${v.length} (wrong delimiter or unquoted delimiter in a field?)`,
      });
      problems.badRows++;
      return null;
    }
    const get = (f: Field): CellValue | undefined => (ix[f] === undefined ? undefined : v[ix[f]!]);

    /** A finite number ≥ min (or null if empty); records a problem otherwise. */
    const num = (f: Field, opts: { min?: number; required?: boolean } = {}): number | null => {
      const raw = get(f);
      const x = cellNumber(raw);
      if (x === null) {
        if (opts.required) problem(f, raw, 'is empty');
        return null;
      }
      if (!Number.isFinite(x)) {
        problem(f, raw, whyNotFinite(x));
        return null;
      }
      if (opts.min !== undefined && x < opts.min) {
        problem(f, raw, `must be ≥ ${opts.min}`);
        return null;
      }
      return x;
    };

    // Identifier
    let id: string | null;
    if (ix.id === undefined) {
      id = `${positionKind}${position}`;
      counts.idsGenerated++;
    } else {
      id = cellText(get('id'));
      if (id === null) problem('id', get('id'), 'is empty; every row needs an identifier');
    }

    // Position
    const angle = (f: 'ra' | 'dec', scale: number): number | null => {
      const raw = get(f);
      let x = cellNumber(raw);
      if (x === null) {
        problem(f, raw, 'is empty');
        return null;
      }
      if (Number.isNaN(x) && typeof raw === 'string') {
        x = f === 'ra' ? parseSexagesimalRaDeg(raw) : parseSexagesimalDecDeg(raw);
        if (Number.isNaN(x)) {
          problem(
            f,
            raw,
            `is neither decimal degrees nor sexagesimal (${f === 'ra' ? "'hh:mm:ss.s'" : "'±dd:mm:ss.s'"})`,
          );
          return null;
        }
        return x;
      }
      if (!Number.isFinite(x)) {
        problem(f, raw, whyNotFinite(x));
        return null;
      }
      return x * scale;
    };
    let raDeg = angle('ra', raScale);
    if (raDeg !== null) {
      if (raDeg === 360) {
        raDeg = 0; // exactly 360° is the same meridian as 0°; stored as 0 and counted in the warnings
        counts.raWrapped++;
      } else if (raDeg < 0 || raDeg > 360) {
        problem('ra', get('ra'), 'must be in [0, 360) degrees');
        raDeg = null;
      }
    }
    let decDeg = angle('dec', decScale);
    if (decDeg !== null && (decDeg < -90 || decDeg > 90)) {
      problem('dec', get('dec'), 'must be in [-90, 90] degrees');
      decDeg = null;
    }

    // Redshift: a spectroscopic value wins, then a photometric one, then the generic column.
    let z: number | null = null;
    let zKind: ZKind | null = null;
    let zErr: number | null = null;
    const zSpec = num('z_spec', { min: 0 });
    const zPhot = zSpec === null ? num('z_phot', { min: 0 }) : null;
    if (zSpec !== null) {
      z = zSpec;
      zKind = 'spec';
      zErr = num('z_spec_err', { min: 0 }) ?? num('z_err', { min: 0 });
    } else if (zPhot !== null) {
      z = zPhot;
      zKind = 'photo';
      zErr = num('z_phot_err', { min: 0 }) ?? num('z_err', { min: 0 });
    } else if (ix.z !== undefined) {
      z = num('z', { min: 0, required: true });
      zErr = num('z_err', { min: 0 });
      const kindText = cellText(get('z_kind'));
      if (kindText !== null) {
        zKind = Z_KINDS[kindText.toLowerCase().replace(/[^a-z]/g, '')] ?? null;
        if (zKind === null) problem('z_kind', kindText, "must be 'spec' or 'photo'");
      } else if (defaults.zKind) {
        zKind = defaults.zKind;
      } else {
        problem(
          'z_kind',
          '',
          "is unknown: the file gives no z_kind; say whether z is 'spec' or 'photo' (z-kind option)",
        );
      }
    } else if (!bad) {
      problem('z', '', 'no redshift in any redshift column');
    }
    if (zErr === null && defaults.zErr !== undefined) zErr = defaults.zErr;
    if (z !== null && zKind === 'photo' && zErr === null) {
      problem('z_err', '', 'a photometric redshift needs an error: add a z_err column or a default z error');
    }
    if (z !== null && zErr !== null && zKind === 'photo' && zErrOver1pz) zErr *= 1 + z;

    // Masses and photometry
    let logMstar = num('log_mstar');
    let logMstarErr = num('log_mstar_err', { min: 0 });
    if (logMstar !== null && ctx.massUnit === 'linear') {
      if (logMstar <= 0) {
        problem('log_mstar', get('log_mstar'), 'a linear stellar mass must be > 0');
        logMstar = null;
      } else {
        if (logMstarErr !== null) logMstarErr = logMstarErr / (logMstar * Math.LN10);
        logMstar = Math.log10(logMstar);
      }
    }
    if (logMstar !== null && (logMstar < LIMITS.logMstar[0] || logMstar > LIMITS.logMstar[1])) {
      problem(
        'log_mstar',
        get('log_mstar'),
        `log10(M* / M☉) must be within ${LIMITS.logMstar[0]}–${LIMITS.logMstar[1]}`,
      );
    }
    const mag = (f: 'g' | 'i') => {
      const m = num(f);
      if (m !== null && (m < LIMITS.mag[0] || m > LIMITS.mag[1])) {
        problem(
          f,
          get(f),
          `apparent AB magnitude outside ${LIMITS.mag[0]}–${LIMITS.mag[1]} (a 'no data' sentinel?)`,
        );
        return null;
      }
      return m;
    };
    const gMag = mag('g');
    const iMag = mag('i');
    const logMhalo = num('log_mhalo');
    if (logMhalo !== null && (logMhalo < LIMITS.logMhalo[0] || logMhalo > LIMITS.logMhalo[1])) {
      problem(
        'log_mhalo',
        get('log_mhalo'),
        `log10(M_halo/M☉) must be within ${LIMITS.logMhalo[0]}–${LIMITS.logMhalo[1]}`,
      );
    }
    const logMhaloErr = num('log_mhalo_err', { min: 0 });
    let mhaloDef: MhaloDef | null = null;
    if (logMhalo !== null) {
      const defText = cellText(get('mhalo_def'));
      if (defText !== null) {
        mhaloDef = MHALO_DEFS[defText.toLowerCase().replace(/[^a-z0-9]/g, '')] ?? null;
        if (mhaloDef === null) problem('mhalo_def', defText, "must be '200c', '200m' or 'vir'");
      } else if (defaults.mhaloDef) {
        mhaloDef = defaults.mhaloDef;
      } else {
        problem('mhalo_def', '', 'is unknown: give an mhalo_def column or a default halo mass definition');
      }
    }

    let massEstimated: 0 | 1 = 0;
    if (!bad && logMstar === null) {
      if (gMag !== null && iMag !== null) {
        if (z === null || z <= 0) {
          problem('z', get('z'), 'a colour-based stellar mass needs z > 0 (a luminosity distance)');
        } else {
          const absI = absoluteMagnitude(iMag, ctx.luminosityDistanceMpc(z));
          logMstar = logMstarTaylor2011(gMag - iMag, absI);
          logMstarErr = Math.max(logMstarErr ?? 0, ESTIMATED_LOG_MSTAR_ERR_FLOOR);
          massEstimated = 1;
          if (logMstar < LIMITS.logMstar[0] || logMstar > LIMITS.logMstar[1]) {
            problem(
              'log_mstar',
              '',
              `stellar mass estimated from g − i is ${logMstar.toFixed(2)}, outside ${LIMITS.logMstar[0]}–${LIMITS.logMstar[1]}`,
            );
          } else {
            counts.massEstimated++;
            if (z > 0.4) counts.estimatedBeyondCalibration++;
          }
        }
      } else if (logMhalo === null) {
        problem('log_mstar', '', 'the row needs a stellar mass, both g and i magnitudes, or a halo mass');
      }
    }

    if (bad || id === null || raDeg === null || decDeg === null || z === null || zKind === null) {
      problems.badRows++;
      return null;
    }
    return [
      ang2pixNest(STORAGE_ORDER, raDeg, decDeg),
      id,
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
      cellText(get('group_id')),
      position,
    ];
  };
}
