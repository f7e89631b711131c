import { InputError } from '../../errors.js';

/** Multiplier from a coordinate column's unit to degrees; blank means decimal degrees. */
export function angleScaleToDeg(unit: string | undefined, column: string, isRa: boolean): number {
  const u = (unit ?? '').trim().toLowerCase();
  if (u === '' || u === 'deg' || u === 'degree' || u === 'degrees' || u === 'decimal degrees') return 1;
  if (u === 'rad' || u === 'radian' || u === 'radians') return 180 / Math.PI;
  if (isRa && (u === 'h' || u === 'hour' || u === 'hours' || u === 'hourangle' || u === 'hr')) return 15;
  if (u === 'arcsec' || u === 'arcmin') {
    throw new InputError(
      'bad_unit',
      `column '${column}' is in ${u}; forehalo needs absolute positions in degrees`,
      {
        column,
        unit,
      },
    );
  }
  if (u === 'h:m:s' || u === 'd:m:s' || u === '"h:m:s"' || u === '"d:m:s"') return 1; // text cells, parsed as sexagesimal
  throw new InputError(
    'bad_unit',
    `column '${column}' has unit '${unit}', which forehalo cannot read as an angle`,
    {
      column,
      unit,
    },
  );
}

export type MassUnit = 'log' | 'linear';

/** Stellar-mass unit from a FITS/VOTable unit string, if it says. */
export function massUnitFromString(unit: string | undefined): MassUnit | undefined {
  const u = (unit ?? '').trim().toLowerCase().replace(/\s/g, '');
  if (u === '') return undefined;
  if (u.includes('dex') || u.startsWith('log') || u.startsWith('[')) return 'log';
  if (u === 'solmass' || u === 'msun' || u === 'm_sun' || u === 'msol' || u === 'solarmass') return 'linear';
  return undefined;
}

/**
 * Guess the stellar-mass unit from values: log10 masses of galaxies lie around 6–13, linear ones
 * above ~10⁶. Values of mixed kinds cannot be guessed (the caller asks for an explicit unit).
 */
export function guessMassUnit(values: readonly number[]): MassUnit | 'mixed' | undefined {
  let small = 0;
  let large = 0;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v > 1e4) large++;
    else if (v < 30) small++;
  }
  if (small === 0 && large === 0) return undefined;
  if (small > 0 && large > 0) return 'mixed';
  return large > 0 ? 'linear' : 'log';
}
