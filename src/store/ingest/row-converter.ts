import { nsideOf } from '../../sky/healpix-order.js';
import { ang2pixNestUnchecked } from '../../sky/healpix-pixel.js';
import type { CellValue, ColumnInfo } from '../readers/types.js';
import { STORAGE_ORDER } from '../storage-order.js';
import { show, whyNotFinite } from './cells.js';
import type { Field } from './fields.js';
import type { ColumnMapping } from './mapping.js';
import type { ProblemLog } from './problems.js';
import { ArrayCells, type RowCells } from './row-cells.js';
import { parseSexagesimalDecDeg, parseSexagesimalRaDeg } from './sexagesimal.js';
import type { RowTarget } from './staged-batch.js';
import {
  absoluteMagnitude,
  ESTIMATED_LOG_MSTAR_ERR_FLOOR,
  logMstarTaylor2011,
  TAYLOR2011,
} from './taylor2011.js';
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
 * The values of one checked row, in the order of the galaxy columns (RowTarget.add takes the same):
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

const Z_KINDS = new Map<string, ZKind>(
  Object.entries({
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
  }) as [string, ZKind][],
);

const MHALO_DEFS = new Map<string, MhaloDef>(
  Object.entries({
    '200c': '200c',
    m200c: '200c',
    '200crit': '200c',
    '200m': '200m',
    m200m: '200m',
    '200mean': '200m',
    vir: 'vir',
    mvir: 'vir',
    virial: 'vir',
  }) as [string, MhaloDef][],
);

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

const STORAGE_NSIDE = nsideOf(STORAGE_ORDER);

/** Sentinel for "cell had a problem" (distinct from null = empty cell). */
const BAD = Symbol('bad');

/**
 * Checks and converts one source row, given as cells (see row-cells.ts) with its line/row number: a
 * good row goes to `target` (true), a bad one to the problem log (false).
 */
export type RowConverter = (cells: RowCells, position: number, target: RowTarget) => boolean;

/** Build the row converter for one file's columns, mapping, units and defaults. */
export function createRowConverter(ctx: ConverterContext): RowConverter {
  const { mapping, columns, positionKind, defaults, problems, counts } = ctx;
  const at = (f: Field) => mapping.index[f] ?? -1;
  const iId = at('id');
  const iRa = at('ra');
  const iDec = at('dec');
  const iZ = at('z');
  const iZs = at('z_spec');
  const iZp = at('z_phot');
  const iZe = at('z_err');
  const iZse = at('z_spec_err');
  const iZpe = at('z_phot_err');
  const iKind = at('z_kind');
  const iM = at('log_mstar');
  const iMe = at('log_mstar_err');
  const iG = at('g');
  const iI = at('i');
  const iH = at('log_mhalo');
  const iHe = at('log_mhalo_err');
  const iHd = at('mhalo_def');
  const iGrp = at('group_id');
  const names = columns.map((c) => c.name);
  const raScale = angleScaleToDeg(columns[iRa].unit, names[iRa], true);
  const decScale = angleScaleToDeg(columns[iDec].unit, names[iDec], false);
  const nColumns = columns.length;
  const zErrOver1pz = defaults.zErrKind === 'sigma_over_1pz';
  const linearMass = ctx.massUnit === 'linear';

  let position = 0;
  let bad = false;
  let cells: RowCells = new ArrayCells();
  function problem(i: number, field: string, reason: string, value?: CellValue): void {
    bad = true;
    problems.add({
      position,
      positionKind,
      column: i >= 0 ? names[i] : field,
      value: show(value ?? (i >= 0 ? cells.raw(i) : '')),
      reason,
    });
  }
  /** Number in column i: null if absent/empty, BAD (problem recorded) if unreadable or below min. */
  function num(i: number, min: number): number | null | typeof BAD {
    if (i < 0) return null;
    const x = cells.number(i);
    if (x === null) return null;
    if (!Number.isFinite(x)) {
      problem(i, '', whyNotFinite(x));
      return BAD;
    }
    if (x < min) {
      problem(i, '', `must be ≥ ${min}`);
      return BAD;
    }
    return x;
  }
  const ok = (x: number | null | typeof BAD): number | null => (x === BAD ? null : x);
  function angle(i: number, scale: number, isRa: boolean): number | null {
    const x = cells.number(i);
    if (x === null) {
      problem(i, '', 'is empty');
      return null;
    }
    const raw = Number.isNaN(x) ? cells.raw(i) : null;
    if (typeof raw === 'string') {
      const y = isRa ? parseSexagesimalRaDeg(raw) : parseSexagesimalDecDeg(raw);
      if (Number.isNaN(y)) {
        problem(
          i,
          '',
          `is neither decimal degrees nor sexagesimal (${isRa ? "'hh:mm:ss.s'" : "'±dd:mm:ss.s'"})`,
        );
        return null;
      }
      return y;
    }
    if (!Number.isFinite(x)) {
      problem(i, '', whyNotFinite(x));
      return null;
    }
    return x * scale;
  }
  function mag(i: number): number | null {
    return inRange(
      ok(num(i, Number.NEGATIVE_INFINITY)),
      i,
      LIMITS.mag[0],
      LIMITS.mag[1],
      "an apparent AB magnitude (is it a 'no data' sentinel?)",
    );
  }
  function inRange(x: number | null, i: number, lo: number, hi: number, what: string): number | null {
    if (x !== null && (x < lo || x > hi)) {
      problem(i, '', `${what} must be within ${lo}–${hi}`);
      return null;
    }
    return x;
  }

  const convertCells = (rowCells: RowCells, rowPosition: number, target: RowTarget): boolean => {
    cells = rowCells;
    position = rowPosition;
    bad = false;
    if (cells.count !== nColumns) {
      problem(
        -1,
        '(row)',
        `expected ${nColumns} fields as in the header, found ${cells.count} (wrong delimiter, or an unquoted delimiter inside a field?)`,
        '',
      );
      problems.badRows++;
      return false;
    }

    let id: string | null;
    if (iId < 0) {
      id = `${positionKind}${position}`;
      counts.idsGenerated++;
    } else {
      id = cells.text(iId);
      if (id === null) problem(iId, '', 'is empty; every row needs an identifier');
    }

    let raDeg = angle(iRa, raScale, true);
    if (raDeg !== null) {
      if (raDeg === 360) {
        raDeg = 0; // exactly 360° is the 0° meridian: stored as 0 and counted in the load warnings
        counts.raWrapped++;
      } else if (raDeg < 0 || raDeg > 360) {
        problem(iRa, '', 'must be in [0, 360) degrees');
        raDeg = null;
      }
    }
    let decDeg = angle(iDec, decScale, false);
    if (decDeg !== null && (decDeg < -90 || decDeg > 90)) {
      problem(iDec, '', 'must be in [-90, 90] degrees');
      decDeg = null;
    }

    // Redshift: a spectroscopic value wins, then a photometric one, then the generic column.
    let z: number | null = null;
    let zKind: ZKind | null = null;
    let zErr: number | null = null;
    const zSpec = num(iZs, 0);
    const zPhot = zSpec === null ? num(iZp, 0) : null;
    if (typeof zSpec === 'number') {
      z = zSpec;
      zKind = 'spec';
      zErr = ok(num(iZse, 0)) ?? ok(num(iZe, 0));
    } else if (typeof zPhot === 'number') {
      z = zPhot;
      zKind = 'photo';
      zErr = ok(num(iZpe, 0)) ?? ok(num(iZe, 0));
    } else if (iZ >= 0) {
      const zz = num(iZ, 0);
      if (zz === null) problem(iZ, '', 'is empty');
      z = ok(zz);
      zErr = ok(num(iZe, 0));
      const kindText = iKind < 0 ? null : cells.text(iKind);
      if (kindText !== null) {
        zKind = Z_KINDS.get(kindText) ?? Z_KINDS.get(kindText.toLowerCase().replace(/[^a-z]/g, '')) ?? null;
        if (zKind === null) problem(iKind, '', "must be 'spec' or 'photo'");
      } else if (defaults.zKind) {
        zKind = defaults.zKind;
      } else {
        problem(
          iKind,
          'z_kind',
          "is unknown: the file gives no z_kind; say whether z is 'spec' or 'photo' (z-kind option)",
          '',
        );
      }
    } else if (!bad) {
      problem(-1, 'z', 'no redshift in any redshift column', '');
    }
    if (zErr === null && defaults.zErr !== undefined) zErr = defaults.zErr;
    if (z !== null && zKind === 'photo') {
      if (zErr === null) {
        problem(
          iZe,
          'z_err',
          'a photometric redshift needs an error: add a z_err column or a default z error',
          '',
        );
      } else if (zErrOver1pz) {
        zErr *= 1 + z;
      }
    }

    // Stellar mass, photometry, halo mass
    let logMstar = ok(num(iM, Number.NEGATIVE_INFINITY));
    let logMstarErr = ok(num(iMe, 0));
    if (logMstar !== null && linearMass) {
      if (logMstar <= 0) {
        problem(iM, '', 'a linear stellar mass must be > 0');
        logMstar = null;
      } else {
        if (logMstarErr !== null) logMstarErr = logMstarErr / (logMstar * Math.LN10);
        logMstar = Math.log10(logMstar);
      }
    }
    logMstar = inRange(logMstar, iM, LIMITS.logMstar[0], LIMITS.logMstar[1], 'log10(M* / M☉)');
    const gMag = iG < 0 ? null : mag(iG);
    const iMag = iI < 0 ? null : mag(iI);
    let logMhalo: number | null = null;
    let logMhaloErr: number | null = null;
    let mhaloDef: MhaloDef | null = null;
    if (iH >= 0) {
      logMhalo = inRange(
        ok(num(iH, Number.NEGATIVE_INFINITY)),
        iH,
        LIMITS.logMhalo[0],
        LIMITS.logMhalo[1],
        'log10(M_halo / M☉)',
      );
      logMhaloErr = ok(num(iHe, 0));
      if (logMhalo !== null) {
        const defText = iHd < 0 ? null : cells.text(iHd);
        if (defText !== null) {
          mhaloDef =
            MHALO_DEFS.get(defText) ??
            MHALO_DEFS.get(defText.toLowerCase().replace(/[^a-z0-9]/g, '')) ??
            null;
          if (mhaloDef === null) problem(iHd, '', "must be '200c', '200m' or 'vir'");
        } else if (defaults.mhaloDef) {
          mhaloDef = defaults.mhaloDef;
        } else {
          problem(
            iHd,
            'mhalo_def',
            'is unknown: give an mhalo_def column or a default halo mass definition',
            '',
          );
        }
      }
    }

    let massEstimated: 0 | 1 = 0;
    if (!bad && logMstar === null) {
      if (gMag !== null && iMag !== null && z !== null) {
        if (z <= 0) {
          problem(iZ >= 0 ? iZ : -1, 'z', 'a colour-based stellar mass needs z > 0 (a luminosity distance)');
        } else {
          const est = logMstarTaylor2011(gMag - iMag, absoluteMagnitude(iMag, ctx.luminosityDistanceMpc(z)));
          if (est < LIMITS.logMstar[0] || est > LIMITS.logMstar[1]) {
            problem(
              -1,
              'log_mstar',
              `stellar mass estimated from g − i is ${est.toFixed(2)}, outside ${LIMITS.logMstar[0]}–${LIMITS.logMstar[1]}`,
              '',
            );
          } else {
            logMstar = est;
            logMstarErr = Math.max(logMstarErr ?? 0, ESTIMATED_LOG_MSTAR_ERR_FLOOR);
            massEstimated = 1;
            counts.massEstimated++;
            if (z > TAYLOR2011.zMaxCalibrated) counts.estimatedBeyondCalibration++;
          }
        }
      } else if (logMhalo === null) {
        problem(iM, 'log_mstar', 'the row needs a stellar mass, both g and i magnitudes, or a halo mass', '');
      }
    }

    if (bad || id === null || raDeg === null || decDeg === null || z === null || zKind === null) {
      problems.badRows++;
      return false;
    }
    target.add(
      ang2pixNestUnchecked(STORAGE_NSIDE, raDeg, decDeg),
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
      iGrp < 0 ? null : cells.text(iGrp),
      position,
    );
    return true;
  };
  return convertCells;
}
