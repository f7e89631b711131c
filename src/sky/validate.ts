import { InputError } from '../errors.js';

/** RA may be any finite number of degrees (it is wrapped where needed); NaN/∞ are rejected. */
export function checkRaDeg(raDeg: number, name = 'raDeg'): void {
  if (!Number.isFinite(raDeg)) {
    throw new InputError('bad_coordinate', `${name} must be a finite number of degrees, got ${raDeg}`, {
      field: name,
    });
  }
}

/** Dec must lie in [−90, 90] degrees. */
export function checkDecDeg(decDeg: number, name = 'decDeg'): void {
  if (!Number.isFinite(decDeg) || decDeg < -90 || decDeg > 90) {
    throw new InputError('bad_coordinate', `${name} must be in [-90, 90] degrees, got ${decDeg}`, {
      field: name,
    });
  }
}

/** Wrap RA into [0, 360). */
export function wrapRaDeg(raDeg: number): number {
  const r = raDeg % 360;
  const w = r < 0 ? r + 360 : r;
  return w >= 360 ? 0 : w;
}
