import type { StellarHaloRelation } from './types.js';

// Moster, Naab & White 2013, MNRAS 428, 3121, eq. 2 with the redshift scaling of eqs 11–14 and the
// best-fit parameters of Table 1: log M₁ = M10 + M11 s, N = N10 + N11 s, β = β10 + β11 s,
// γ = γ10 + γ11 s, with s = z/(1+z).
const M10 = 11.59;
const M11 = 1.195;
const N10 = 0.0351;
const N11 = -0.0247;
const BETA10 = 1.376;
const BETA11 = -0.826;
const GAMMA10 = 0.608;
const GAMMA11 = 0.329;
/** Scatter 0.15 dex in log M* at fixed M_h (mem). */
const SCATTER_DEX = 0.15;

/** M* = 2 N M_h [(M_h/M₁)^(−β) + (M_h/M₁)^γ]⁻¹, returned as log₁₀ M* [M☉]. */
export function moster2013LogMstar(logMh: number, z: number): number {
  const s = z / (1 + z);
  const logM1 = M10 + M11 * s;
  const N = N10 + N11 * s;
  const beta = BETA10 + BETA11 * s;
  const gamma = GAMMA10 + GAMMA11 * s;
  const u = logMh - logM1;
  // exp(ln10·x) instead of 10 ** x: same value to round-off, several times faster in V8.
  return (
    Math.log10(2 * N) + logMh - Math.log10(Math.exp(-beta * u * Math.LN10) + Math.exp(gamma * u * Math.LN10))
  );
}

export const moster2013: StellarHaloRelation = {
  name: 'moster2013',
  reference: 'Moster, Naab & White 2013, MNRAS 428, 3121, eq. 2 and Table 1',
  // Halo mass M_200c (mem); fitted for 0 ≤ z ≤ 4 and roughly 1e10.5–1e15 M☉ (approximate).
  nativeDefinition: '200c',
  zRange: [0, 4],
  logMhRange: [10.5, 15],
  logMstar: moster2013LogMstar,
  scatterDex: () => SCATTER_DEX,
};
