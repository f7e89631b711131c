/**
 * Closed-form line-of-sight integrals DM(b) = 2∫₀^L n(√(b²+l²)) dl through spherical density laws,
 * used as exact references and for the NFW fast path. Lengths in kpc, densities in cm⁻³,
 * results in pc cm⁻³ (factor 1000 pc per kpc).
 */
const PC_PER_KPC = 1000;

/** Uniform sphere n₀ of radius R: DM = 2 n₀ √(R² − b²). */
export function dmUniformSphere(n0Cm3: number, radiusKpc: number, bKpc: number): number {
  if (bKpc >= radiusKpc) return 0;
  return 2 * n0Cm3 * Math.sqrt(radiusKpc * radiusKpc - bKpc * bKpc) * PC_PER_KPC;
}

/**
 * Singular isothermal sphere n = n₀ (r₀/r)²: untruncated DM = π n₀ r₀²/b; truncated at R:
 * DM = (2 n₀ r₀²/b) arctan(√(R² − b²)/b).
 */
export function dmSingularIsothermal(
  n0Cm3: number,
  r0Kpc: number,
  bKpc: number,
  radiusKpc: number = Number.POSITIVE_INFINITY,
): number {
  if (bKpc >= radiusKpc) return 0;
  const k = (n0Cm3 * r0Kpc * r0Kpc * PC_PER_KPC) / bKpc;
  if (!Number.isFinite(radiusKpc)) return Math.PI * k;
  return 2 * k * Math.atan(Math.sqrt(radiusKpc * radiusKpc - bKpc * bKpc) / bKpc);
}

/**
 * Untruncated NFW projection (Bartelmann 1996, A&A 313, 697; Wright & Brainerd 2000, ApJ 534, 34):
 * Σ(b) = 2 ρ_s r_s F(X), X = b/r_s. Near X = 1 the two branches cancel; within 1e-4 of 1 a Taylor
 * expansion F ≈ 1/3 − 0.4 (X − 1) + (13/35)(X − 1)² is used (error < 1e-12).
 */
export function nfwProjectionF(X: number): number {
  const d = X - 1;
  if (Math.abs(d) < 1e-4) return 1 / 3 - 0.4 * d + (13 / 35) * d * d;
  const X2m1 = X * X - 1;
  if (X < 1) return (1 - (2 / Math.sqrt(-X2m1)) * Math.atanh(Math.sqrt((1 - X) / (1 + X)))) / X2m1;
  return (1 - (2 / Math.sqrt(X2m1)) * Math.atan(Math.sqrt((X - 1) / (1 + X)))) / X2m1;
}

function nfwTruncatedRaw(X: number, C: number): number {
  const oneMinusX2 = 1 - X * X;
  const s = Math.sqrt(C * C - X * X);
  const arg = (X * X + C) / (X * (1 + C));
  if (X < 1) return -s / (oneMinusX2 * (1 + C)) + Math.acosh(arg) / oneMinusX2 ** 1.5;
  if (X === 1) return (Math.sqrt(C * C - 1) / (3 * (1 + C))) * (1 + 1 / (1 + C));
  return -s / (oneMinusX2 * (1 + C)) - Math.acos(Math.min(1, arg)) / (-oneMinusX2) ** 1.5;
}

/**
 * NFW projection truncated at r_max = C r_s (same form as Takada & Jain 2003, MNRAS 340, 580 (mem);
 * checked against quadrature in physics.md §6.1): Σ(b) = 2 ρ_s r_s G(X, C), G = 0 for X ≥ C.
 * Within 1e-3 of X = 1 (where the branches cancel) a quadratic through X = 1 ± 1e-3 and the exact
 * X = 1 value is used (relative error ~1e-8).
 */
export function nfwTruncatedProjectionG(X: number, C: number): number {
  if (X >= C) return 0;
  const d = X - 1;
  if (Math.abs(d) < 1e-3 && C > 1.01) {
    const h = 1e-3;
    const gm = nfwTruncatedRaw(1 - h, C);
    const g0 = nfwTruncatedRaw(1, C);
    const gp = nfwTruncatedRaw(1 + h, C);
    const t = d / h;
    return g0 + 0.5 * t * (gp - gm) + 0.5 * t * t * (gp - 2 * g0 + gm);
  }
  return nfwTruncatedRaw(X, C);
}
