import { behrooziShape } from './behroozi-f.js';
import type { StellarHaloRelation } from './types.js';

// Kravtsov, Vikhlinin & Meshcheryakov 2018, Astron. Lett. 44, 8, Table 3, M_200c row, fit without
// scatter: log M₁ = 11.39, log ε = −1.618, α = −1.795, δ = 4.345, γ = 0.619. Same f(x) as
// Behroozi et al. 2013; no redshift evolution (z ≈ 0 only). Values transcribed from a secondary
// source (physics.md §4.3). Scatter ≈ 0.2 dex (mem).
const LOG_M1 = 11.39;
const LOG_EPS = -1.618;
const ALPHA = -1.795;
const DELTA = 4.345;
const GAMMA = 0.619;
const F0 = behrooziShape(0, ALPHA, DELTA, GAMMA);

export function kravtsov2018LogMstar(logMh: number, _z: number): number {
  return LOG_EPS + LOG_M1 + behrooziShape(logMh - LOG_M1, ALPHA, DELTA, GAMMA) - F0;
}

export const kravtsov2018: StellarHaloRelation = {
  name: 'kravtsov2018',
  reference: 'Kravtsov, Vikhlinin & Meshcheryakov 2018, Astron. Lett. 44, 8, Table 3 (M200c)',
  nativeDefinition: '200c',
  // z ≈ 0 only; we flag anything beyond z = 0.1 as outside validity. Halo masses ~1e11–1e15 M☉ (mem).
  zRange: [0, 0.1],
  logMhRange: [11, 15],
  logMstar: kravtsov2018LogMstar,
  scatterDex: () => 0.2,
};
