import { behrooziShape } from './behroozi-f.js';
import type { StellarHaloRelation } from './types.js';

// Behroozi, Wechsler & Conroy 2013, ApJ 770, 57: eq. 3 with the redshift scaling of Sect. 5
// (equation placement (mem)), a = 1/(1+z), ν = exp(−4a²):
//   log M₁ = 11.514 + [−1.793(a−1) − 0.251 z] ν
//   log ε  = −1.777 + [−0.006(a−1) − 0.000 z] ν − 0.119(a−1)
//   α = −1.412 + 0.731(a−1) ν
//   δ = 3.508 + [2.608(a−1) − 0.043 z] ν
//   γ = 0.316 + [1.319(a−1) + 0.279 z] ν
//   intrinsic scatter ξ = 0.218 − 0.023(a−1) dex.
// The systematic offset μ (true → observed M*) is not applied.
function params(z: number) {
  const a = 1 / (1 + z);
  const nu = Math.exp(-4 * a * a);
  return {
    logM1: 11.514 + (-1.793 * (a - 1) - 0.251 * z) * nu,
    logEps: -1.777 + (-0.006 * (a - 1) - 0 * z) * nu - 0.119 * (a - 1),
    alpha: -1.412 + 0.731 * (a - 1) * nu,
    delta: 3.508 + (2.608 * (a - 1) - 0.043 * z) * nu,
    gamma: 0.316 + (1.319 * (a - 1) + 0.279 * z) * nu,
  };
}

/** log₁₀ M* = log₁₀(ε M₁) + f(log₁₀(M_h/M₁)) − f(0). */
export function behroozi2013LogMstar(logMh: number, z: number): number {
  const p = params(z);
  return (
    p.logEps +
    p.logM1 +
    behrooziShape(logMh - p.logM1, p.alpha, p.delta, p.gamma) -
    behrooziShape(0, p.alpha, p.delta, p.gamma)
  );
}

export const behroozi2013: StellarHaloRelation = {
  name: 'behroozi2013',
  reference: 'Behroozi, Wechsler & Conroy 2013, ApJ 770, 57, eq. 3 and Sect. 5',
  // Halo mass M_vir (Bryan & Norman), Bolshoi cosmology (mem); valid 0 ≤ z ≤ 8, ~1e10–1e15 M☉ (mem).
  nativeDefinition: 'vir',
  zRange: [0, 8],
  logMhRange: [10, 15],
  logMstar: behroozi2013LogMstar,
  scatterDex: (z) => 0.218 - 0.023 * (1 / (1 + z) - 1),
};
