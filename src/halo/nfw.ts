import { brentRoot } from '../math/index.js';

/**
 * NFW enclosed-mass function μ(x) = ln(1+x) − x/(1+x) (Navarro, Frenk & White 1997, ApJ 490, 493):
 * M(<r) = 4π ρ_s r_s³ μ(r/r_s). A series is used for x < 1e-4 to avoid cancellation.
 */
export function nfwMu(x: number): number {
  if (x < 1e-4) return x * x * (0.5 - x * (2 / 3 - x * 0.75));
  return Math.log1p(x) - x / (1 + x);
}

export interface NfwConversion {
  /** Mass in the target definition [M☉]. */
  readonly massMsun: number;
  /** Concentration r_Δ₂ / r_s in the target definition. */
  readonly concentration: number;
  /** Ratio of target to source radius r_Δ₂ / r_Δ₁. */
  readonly radiusRatio: number;
}

/**
 * Exact conversion of an NFW halo between two overdensities (both relative to ρc at the same z),
 * keeping r_s: solve Δ₂ c₂³/μ(c₂) = Δ₁ c₁³/μ(c₁) for c₂ by Brent's method, then M₂ = M₁ μ(c₂)/μ(c₁).
 * The left side increases monotonically with c₂, so the root is unique.
 */
export function convertNfwOverdensity(
  massMsun: number,
  concentration: number,
  deltaFrom: number,
  deltaTo: number,
): NfwConversion {
  const c1 = concentration;
  if (deltaFrom === deltaTo) return { massMsun, concentration: c1, radiusRatio: 1 };
  // Work with logs: the target is ln(Δ₂) + 3 ln c₂ − ln μ(c₂) = ln(Δ₁) + 3 ln c₁ − ln μ(c₁).
  const target = Math.log(deltaFrom) + 3 * Math.log(c1) - Math.log(nfwMu(c1));
  const g = (lnC2: number) => {
    const c2 = Math.exp(lnC2);
    return Math.log(deltaTo) + 3 * lnC2 - Math.log(nfwMu(c2)) - target;
  };
  // Bracket c₂ ∈ [0.05 c₁, 20 c₁] (physics.md §2.1), widened if the Δ ratio is extreme.
  let lo = Math.log(0.05 * c1);
  let hi = Math.log(20 * c1);
  while (g(lo) > 0) lo -= 2;
  while (g(hi) < 0) hi += 2;
  const c2 = Math.exp(brentRoot(g, lo, hi, { xtol: 1e-15 }));
  return {
    massMsun: (massMsun * nfwMu(c2)) / nfwMu(c1),
    concentration: c2,
    radiusRatio: c2 / c1,
  };
}
