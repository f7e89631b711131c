import { createCumulativeTable } from '../cosmology/index.js';
import { DomainError } from '../errors.js';
import { brentRoot, integrate, type Rng } from '../math/index.js';

/**
 * PDF of Δ = DM_cosmic/⟨DM_cosmic⟩ (Macquart et al. 2020, Nature 581, 391, Methods):
 *   p(Δ) = A Δ^(−β) exp[−(Δ^(−α) − C0)² / (2α²σ²)],  α = β = 3,  σ = F z^(−1/2).
 * A and C0 are solved numerically so that ∫p dΔ = 1 and ⟨Δ⟩ = 1.
 *
 * Numerics: with v = 1/Δ (so u = Δ^(−3) = v³, the substitution of physics.md §7) the density of v is
 * q(v) = A v exp[−(v³ − C0)²/(2s²)], s = 3σ, which is smooth on [0, ∞); the two conditions become
 * ∫ v e dv = ∫ e dv = 1/A. No truncation in Δ is made (that would bias C0); v only runs over
 * |v³ − C0| ≤ 20 s, outside which the Gaussian factor is below e^(−200).
 * The CDF of v is tabulated once (cubic Hermite with the exact density as derivative) and sampling
 * inverts it by Newton's method, accurate to ~1e-10 in probability.
 */
export const MACQUART_ALPHA = 3;
export const MACQUART_BETA = 3;
/**
 * Default feedback parameter F ≈ 0.32 — Macquart et al. 2020 best fit (from memory, not re-read;
 * physics.md flags it "(mem)"). A configurable parameter, not a constant of nature.
 */
export const MACQUART_F_DEFAULT = 0.32;

const SPAN = 20;

export interface CosmicPdf {
  readonly F: number;
  readonly z: number;
  /** σ_DM = F z^(−1/2): a width parameter, not the standard deviation (the Δ⁻³ tail makes it diverge). */
  readonly sigmaDM: number;
  readonly C0: number;
  readonly A: number;
  /** Most probable Δ (closed form: u² − C0 u − 9σ² = 0, Δ = u^(−1/3)). */
  readonly mode: number;
  density(delta: number): number;
  cdf(delta: number): number;
  quantile(p: number): number;
  sample(rng: Rng): number;
}

function vRange(C0: number, s: number): [number, number] {
  const hi = C0 + SPAN * s;
  if (!(hi > 0)) return [0, 0];
  return [Math.cbrt(Math.max(0, C0 - SPAN * s)), Math.cbrt(hi)];
}

function gaussFactor(v: number, C0: number, s: number): number {
  const d = (v * v * v - C0) / s;
  return Math.exp(-0.5 * d * d);
}

/** C0 and A for given σ_DM: root of ∫ (v − 1) e dv = 0, then A = 1/∫ e dv. */
export function solveMacquartShape(sigmaDM: number): { C0: number; A: number } {
  if (!(sigmaDM > 0 && Number.isFinite(sigmaDM))) {
    throw new DomainError('sigma_dm_invalid', `σ_DM must be a finite number > 0, got ${sigmaDM}`);
  }
  const s = MACQUART_ALPHA * sigmaDM;
  const moment = (C0: number, k: 0 | 1) => {
    const [lo, hi] = vRange(C0, s);
    if (hi <= lo) return 0;
    return integrate((v) => (k === 1 ? v : 1) * gaussFactor(v, C0, s), lo, hi, { rtol: 1e-13 });
  };
  // g rises with C0: a larger C0 moves weight to v > 1 (Δ < 1).
  const g = (C0: number) => moment(C0, 1) - moment(C0, 0);
  let lo = 0;
  let hi = 2 + 2 * s;
  while (g(hi) < 0) hi *= 2;
  while (g(lo) > 0) lo -= 2 * s;
  const C0 = brentRoot(g, lo, hi, { xtol: 1e-13 });
  return { C0, A: 1 / moment(C0, 0) };
}

/** σ_DM = F z^(−1/2); z must be > 0. */
export function macquartSigma(F: number, z: number): number {
  if (!(z > 0 && Number.isFinite(z))) {
    throw new DomainError('z_invalid', `the cosmic DM PDF needs a source redshift z > 0, got ${z}`);
  }
  if (!(F > 0 && Number.isFinite(F)))
    throw new DomainError('F_invalid', `F must be a finite number > 0, got ${F}`);
  return F / Math.sqrt(z);
}

export function createCosmicPdf(F: number, z: number): CosmicPdf {
  const sigmaDM = macquartSigma(F, z);
  const { C0, A } = solveMacquartShape(sigmaDM);
  const s = MACQUART_ALPHA * sigmaDM;
  const [vLo, vHi] = vRange(C0, s);
  const q = (v: number) => A * v * gaussFactor(v, C0, s);
  // Table of the CDF of v over [vLo, vHi], in the shifted variable w = v − vLo ≥ 0.
  const table = createCumulativeTable((w) => q(w + vLo), { zMax: vHi - vLo, stepLn: 0.0006 });
  const total = table.value(vHi - vLo);
  const cdfV = (v: number) => (v <= vLo ? 0 : v >= vHi ? 1 : table.value(v - vLo) / total);
  const invCdfV = (p: number) => vLo + table.inverse(p * total);
  const uMode = 0.5 * (C0 + Math.sqrt(C0 * C0 + 36 * sigmaDM * sigmaDM));
  return Object.freeze({
    F,
    z,
    sigmaDM,
    C0,
    A,
    mode: uMode ** (-1 / 3),
    density(delta: number) {
      if (!(delta > 0)) return 0;
      const v = 1 / delta;
      return A * v * v * v * gaussFactor(v, C0, s);
    },
    cdf(delta: number) {
      if (!(delta > 0)) return 0;
      return 1 - cdfV(1 / delta);
    },
    quantile(p: number) {
      if (!(p >= 0 && p <= 1))
        throw new DomainError('probability_invalid', `quantile needs p in [0, 1], got ${p}`);
      if (p === 0) return 0;
      if (p === 1) return Number.POSITIVE_INFINITY;
      return 1 / invCdfV(1 - p);
    },
    sample(rng: Rng) {
      for (;;) {
        const v = invCdfV(rng.uniform());
        if (v > 0) return 1 / v;
      }
    },
  });
}
