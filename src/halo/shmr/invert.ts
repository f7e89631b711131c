import { brentRoot } from '../../math/index.js';
import type { StellarHaloRelation } from './types.js';

/** Bracket of the inversion, log₁₀ M_h [M☉] (physics.md §4.5). */
export const LOG_MH_MIN = 9;
export const LOG_MH_MAX = 16;

/**
 * 'ok': a root exists in the bracket. 'above-range': the stellar mass exceeds what the relation reaches
 * by 1e16 M☉ (e.g. Behroozi 2013 saturates) — the halo mass is capped at 1e16. 'below-range': below
 * the value at 1e9 M☉ — capped at 1e9. Capped values are never extrapolations.
 */
export type InversionStatus = 'ok' | 'above-range' | 'below-range';

export interface HaloMassInversion {
  logMh: number;
  status: InversionStatus;
}

/** Local slope d log M* / d log M_h by a central difference (step 1e-4 dex, error ~1e-9). */
export function shmrSlope(rel: StellarHaloRelation, logMh: number, z: number): number {
  const h = 1e-4;
  return (rel.logMstar(logMh + h, z) - rel.logMstar(logMh - h, z)) / (2 * h);
}

/** Reference inversion: Brent's method on log M*(log M_h, z) − log M* over [9, 16]. */
export function invertShmrExact(rel: StellarHaloRelation, logMstar: number, z: number): HaloMassInversion {
  const lo = rel.logMstar(LOG_MH_MIN, z) - logMstar;
  const hi = rel.logMstar(LOG_MH_MAX, z) - logMstar;
  if (lo > 0) return { logMh: LOG_MH_MIN, status: 'below-range' };
  if (hi < 0) return { logMh: LOG_MH_MAX, status: 'above-range' };
  const logMh = brentRoot((x) => rel.logMstar(x, z) - logMstar, LOG_MH_MIN, LOG_MH_MAX, { xtol: 1e-13 });
  return { logMh, status: 'ok' };
}
