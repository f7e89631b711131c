import type { GasProfile, ProfileShape } from '../gas/index.js';
import { integrate } from '../math/index.js';

/**
 * Dimensionless projection P(X) = 2∫₀^L s(√(X² + λ²)) dλ, L = √(Y_edge² − X²), all lengths in r_s.
 * The substitution λ = X sinh t (r = X cosh t) turns it into 2∫₀^T s(X cosh t) X cosh t dt,
 * T = arccosh(Y_edge/X), whose integrand stays bounded as X → 0 even for a 1/r cusp. X = 0 is
 * integrated directly in r (and is infinite for a 1/r cusp such as NFW).
 */
export function projectedShape(
  shape: ProfileShape,
  X: number,
  c: number,
  yEdge: number,
  rtol = 1e-11,
): number {
  const edge = Math.min(yEdge, shape.outerZero(c));
  if (X >= edge) return 0;
  if (X === 0) {
    const centre = 2 * integrate((y) => shape.density(y, c), 0, edge, { rtol });
    return Number.isFinite(centre) ? centre : Number.POSITIVE_INFINITY;
  }
  // T = arccosh(edge/X) and r = X cosh t, written with ln X so that even a denormal X neither
  // overflows edge/X nor cosh t. Everything inside r ≲ e⁻³⁰ edge sits in [0, T − 30], integrated apart
  // so the adaptive rule resolves the outer part (where cored profiles have all their weight).
  const ratio = edge / X;
  const T = ratio < 1e8 ? Math.acosh(ratio) : Math.log(2 * edge) - Math.log(X);
  const lnX = Math.log(X);
  const integrand = (t: number) => {
    const r = 0.5 * (Math.exp(lnX + t) + Math.exp(lnX - t));
    return shape.density(r, c) * r;
  };
  const split = Math.max(0, T - 30);
  const inner = split > 0 ? integrate(integrand, 0, split, { rtol }) : 0;
  return 2 * (inner + integrate(integrand, split, T, { rtol }));
}

/**
 * Rest-frame DM [pc cm⁻³] of a sightline at impact parameter b [proper kpc] through a gas halo,
 * by adaptive Gauss–Kronrod quadrature out to r_max. Observer frame: divide by (1 + z).
 */
export function dmRestExact(profile: GasProfile, bKpc: number): number {
  // Compare in kpc before scaling so that b = r_max gives exactly 0 despite rounding.
  if (bKpc >= profile.rMaxKpc) return 0;
  const c = profile.halo.concentration;
  const X = bKpc / profile.rsKpc;
  const P = projectedShape(profile.shape, X, c, profile.rMaxKpc / profile.rsKpc);
  return profile.electronScaleCm3 * profile.rsKpc * 1000 * P;
}
