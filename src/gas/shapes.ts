import { InputError } from '../errors.js';
import { nfwMu } from '../halo/index.js';
import { brentRoot, integrate } from '../math/index.js';
import { MNFW_DEFAULT_ALPHA, MNFW_DEFAULT_Y0, type ProfileSpec } from './spec.js';

/**
 * Dimensionless radial shape s(y; c) of a gas profile in y = r/r_s, with c = R_Δ/r_s.
 * ρ_gas(r) = A s(r/r_s; c) with A fixed by the gas mass inside R_Δ.
 */
export interface ProfileShape {
  readonly spec: Required<ProfileSpec>;
  density(y: number, c: number): number;
  /** K(Y; c) = ∫₀^Y y² s(y; c) dy, so M(<r) = 4π r_s³ A K(r/r_s; c). */
  enclosed(Y: number, c: number): number;
  /** Radius (in r_s) beyond which s ≡ 0 (Infinity when the profile never vanishes). */
  outerZero(c: number): number;
}

const nfwShape: ProfileShape = {
  spec: { kind: 'nfw', alpha: 0, y0: 0 },
  density: (y) => 1 / (y * (1 + y) * (1 + y)),
  enclosed: (Y) => nfwMu(Y),
  outerZero: () => Number.POSITIVE_INFINITY,
};

/**
 * Modified NFW (Mathews & Prochaska 2017, ApJL 846, L24 (mem)): s = 1/[y^(1−α) (y₀ + y)^(2+α)].
 * For α = 2, K(Y) = F(y₀+Y) − F(y₀) with F(u) = ln u + 3y₀/u − 3y₀²/(2u²) + y₀³/(3u³)
 * (expand y³/(y₀+y)⁴ in u = y₀ + y); otherwise K is integrated numerically.
 */
function mnfwShape(alpha: number, y0: number): ProfileShape {
  const density =
    alpha === 2
      ? (y: number) => y / (y0 + y) ** 4
      : (y: number) => y ** (alpha - 1) / (y0 + y) ** (2 + alpha);
  const F = (u: number) =>
    Math.log(u) + (3 * y0) / u - (3 * y0 * y0) / (2 * u * u) + (y0 * y0 * y0) / (3 * u * u * u);
  // For Y ≪ y₀ the difference F(y₀+Y) − F(y₀) cancels; use the binomial series of y³/(y₀+y)⁴ instead:
  // K = Σ_k C(k+3, 3) (−1)^k Y^(k+4) / ((k+4) y₀^(k+4)).
  const smallY = (Y: number) => {
    const t = Y / y0;
    let term = t ** 4;
    let sum = 0;
    for (let k = 0; k < 30; k++) {
      sum += (((k + 1) * (k + 2) * (k + 3)) / 6) * (k % 2 === 0 ? 1 : -1) * (term / (k + 4));
      term *= t;
    }
    return sum;
  };
  const enclosed =
    alpha === 2
      ? (Y: number) => (Y < 0.05 * y0 ? smallY(Y) : F(y0 + Y) - F(y0))
      : (Y: number) => integrate((y) => y * y * density(y), 0, Y, { rtol: 1e-12 });
  return {
    spec: { kind: 'mnfw', alpha, y0 },
    density,
    enclosed,
    outerZero: () => Number.POSITIVE_INFINITY,
  };
}

/**
 * Maller & Bullock 2004 (MNRAS 355, 694) cored profile of adiabatic (γ = 5/3) gas in hydrostatic
 * equilibrium in an NFW potential: s = [1 + (3.7/y) ln(1+y) − (3.7/c) ln(1+c)]^(3/2), s(c) = 1.
 * Origin of 3.7 (physics.md §5.3, consistent with the paper (mem)): k T = μ m_p V_max²/2 with
 * V_max² = 0.2162 V_vir² c/μ(c), and the hydrostatic solution for γ = 5/3 gives the coefficient
 * (4/5)/0.2162 = 3.700. Beyond R_Δ the bracket can reach 0 for low c; there the gas ends (s = 0).
 */
const MB04_COEFF = 3.7;
function lnRatio(y: number): number {
  return y < 1e-8 ? 1 - y / 2 : Math.log1p(y) / y;
}
const mb04Shape: ProfileShape = {
  spec: { kind: 'mb04', alpha: 0, y0: 0 },
  density(y, c) {
    const bracket = 1 + MB04_COEFF * (lnRatio(y) - lnRatio(c));
    return bracket > 0 ? bracket * Math.sqrt(bracket) : 0;
  },
  enclosed(Y, c) {
    const edge = Math.min(Y, mb04Shape.outerZero(c));
    return integrate((y) => y * y * mb04Shape.density(y, c), 0, edge, { rtol: 1e-12 });
  },
  outerZero(c) {
    // lnRatio decreases from 1 to 0; the bracket at infinity is 1 − 3.7 lnRatio(c).
    const limit = 1 - MB04_COEFF * lnRatio(c);
    if (limit >= 0) return Number.POSITIVE_INFINITY;
    const g = (lnY: number) => 1 + MB04_COEFF * (lnRatio(Math.exp(lnY)) - lnRatio(c));
    let hi = Math.log(c) + 1;
    while (g(hi) > 0) hi += 1;
    return Math.exp(brentRoot(g, Math.log(c), hi, { xtol: 1e-14 }));
  },
};

/** The dimensionless shape for a spec (defaults filled in). */
export function profileShape(spec: ProfileSpec): ProfileShape {
  switch (spec.kind) {
    case 'nfw':
      return nfwShape;
    case 'mnfw':
      return mnfwShape(spec.alpha ?? MNFW_DEFAULT_ALPHA, spec.y0 ?? MNFW_DEFAULT_Y0);
    case 'mb04':
      return mb04Shape;
    default:
      throw new InputError(
        'profile.kind',
        `unknown gas profile '${(spec as ProfileSpec).kind}'; use nfw, mnfw or mb04`,
      );
  }
}
