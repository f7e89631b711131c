import { DomainError } from '../errors.js';
import { brentRoot } from '../math/index.js';
import { cosmicPdf } from './cosmic-pdf-cache.js';
import { type RedshiftFreeInput, redshiftFreeTrailer, residualDraws } from './residuals.js';
import { cosmicMeanInForce } from './resolve.js';

export interface RedshiftLimitInput extends RedshiftFreeInput {
  /** Confidence that DM_host ≥ 0 at the limit (default 0.95). */
  confidence?: number;
  /** Search range for z_s (default 0.001–10). */
  zMin?: number;
  zMax?: number;
}

export interface RedshiftLimit {
  /** Largest z_s with P(DM_host ≥ 0) ≥ confidence; null if even zMin fails; zMax if never reached. */
  z_max: number | null;
  confidence: number;
  /**
   * Conservative upper bound: the largest z_s with P(DM_host ≥ 0) ≥ 1 − confidence, i.e. beyond it the
   * observed DM cannot be made up with a non-negative host term at the chosen confidence. null if even
   * zMin fails; zMax if never reached. Always ≥ z_max.
   */
  z_upper: number | null;
  /** P(DM_host < 0) at z_max (should equal 1 − confidence when bracketed). */
  p_negative_at_limit: number | null;
  bracketed: boolean;
  draws: number;
  seed: number;
  cosmic_mode: 'diffuse' | 'full';
  conventions: string[];
  warnings: string[];
  cautions: readonly string[];
}

/**
 * Upper limit on the source redshift from the requirement DM_host ≥ 0 (a "Macquart-relation"
 * redshift bound, common practice). With residual draws R_i (observed minus MW and caller-given
 * halo terms), P(DM_host < 0 | z) = (1/N) Σ_i P(DM_cosmic(z) > R_i) = (1/N) Σ_i [1 − CDF_Δ(R_i / ⟨DM⟩(z))],
 * evaluated exactly in Δ for each draw (smooth in z); its root at 1 − confidence is found by Brent.
 */
export function maxSourceRedshift(input: RedshiftLimitInput): RedshiftLimit {
  const confidence = input.confidence ?? 0.95;
  if (!(confidence > 0 && confidence < 1)) {
    throw new DomainError('confidence_invalid', `confidence must be in (0, 1), got ${confidence}`);
  }
  const zMin = input.zMin ?? 0.001;
  const zMax = input.zMax ?? 10;
  if (!(zMin > 0 && zMax > zMin && zMax <= 20)) {
    throw new DomainError('z_range_invalid', `need 0 < zMin < zMax ≤ 20, got zMin = ${zMin}, zMax = ${zMax}`);
  }
  const { model, residual, warnings } = residualDraws(input);
  const mean = cosmicMeanInForce(input.cosmology, model);
  const pNegative = (z: number): number => {
    const pdf = cosmicPdf(model.F, z);
    const m = mean.meanDmPcCm3(z);
    let s = 0;
    for (let i = 0; i < residual.length; i++) s += residual[i] <= 0 ? 1 : 1 - pdf.cdf(residual[i] / m);
    return s / residual.length;
  };
  /** Largest z in [zMin, zMax] with P(DM_host < 0) ≤ target (P rises with z), by Brent. */
  const solve = (target: number): { z: number | null; bracketed: boolean; pLo: number } => {
    const pLo = pNegative(zMin);
    if (pLo > target) return { z: null, bracketed: false, pLo };
    if (pNegative(zMax) < target) return { z: zMax, bracketed: false, pLo };
    return { z: brentRoot((z) => pNegative(z) - target, zMin, zMax, { xtol: 1e-6 }), bracketed: true, pLo };
  };
  const alpha = 1 - confidence;
  const lower = solve(alpha);
  const zLimit = lower.z;
  const bracketed = lower.bracketed;
  if (zLimit === null) {
    warnings.push(
      `P(DM_host < 0) = ${lower.pLo.toFixed(3)} already at z = ${zMin}: the Galactic and halo terms leave no room for a cosmic term at this confidence`,
    );
  } else if (!bracketed) {
    warnings.push(
      `DM_host ≥ 0 holds at ${confidence} confidence up to the search limit z = ${zMax}; the true bound is higher`,
    );
  }
  const upper = solve(confidence);
  return {
    z_max: zLimit,
    z_upper: upper.z,
    confidence,
    p_negative_at_limit: zLimit === null ? null : pNegative(zLimit),
    bracketed,
    draws: model.draws,
    ...redshiftFreeTrailer(model, warnings),
  };
}
