import { C_KM_S, integrate, normalCdf } from '../math/index.js';

/**
 * Redshift below which a galaxy is in front of the burst environment: z_s − Δz with
 * Δz = (1 + z_s) v / c, i.e. T(z_s) = z_s (1 − β) − β with β = v/c (linear in z_s).
 */
export function foregroundThreshold(zSource: number, velocityKms: number): number {
  const beta = velocityKms / C_KM_S;
  return zSource * (1 - beta) - beta;
}

/**
 * P(z < T) for a Gaussian photo-z N(zPhot, σ) truncated to z > 0 (physics.md §9):
 * [Φ((T − z_p)/σ) − Φ(−z_p/σ)] / [1 − Φ(−z_p/σ)].
 */
export function truncatedNormalBelow(threshold: number, zPhot: number, sigma: number): number {
  if (sigma === 0) return zPhot < threshold ? 1 : 0;
  if (threshold <= 0) return 0;
  const lo = normalCdf(-zPhot / sigma);
  return (normalCdf((threshold - zPhot) / sigma) - lo) / (1 - lo);
}

/**
 * Probability that a galaxy is in front of the burst environment.
 * Spectroscopic galaxies: z fixed (σ = 0). Photometric: Gaussian N(z_p, σ) truncated at z > 0
 * (physics.md §9). An uncertain source redshift N(z_s, σ_s) moves the threshold T by σ_s(1 − β);
 * P is then averaged over it by quadrature (for an untruncated photo-z this equals physics.md §9's
 * Φ((T − z_p)/√(σ² + σ_T²))).
 */
export function probabilityForeground(
  z: number,
  sigmaZ: number,
  zSource: number,
  zSourceErr: number,
  velocityKms: number,
): number {
  const t0 = foregroundThreshold(zSource, velocityKms);
  if (zSourceErr === 0) return truncatedNormalBelow(t0, z, sigmaZ);
  const sigmaT = zSourceErr * (1 - velocityKms / C_KM_S);
  if (sigmaZ === 0) return normalCdf((t0 - z) / sigmaT);
  const phi = (t: number) => Math.exp(-0.5 * t * t) / Math.sqrt(2 * Math.PI);
  return integrate((t) => phi(t) * truncatedNormalBelow(t0 + sigmaT * t, z, sigmaZ), -9, 9, {
    rtol: 1e-10,
    atol: 1e-13,
  });
}
