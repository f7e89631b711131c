/**
 * The shape function of Behroozi, Wechsler & Conroy 2013 (ApJ 770, 57, eq. 3), also used by
 * Kravtsov, Vikhlinin & Meshcheryakov 2018:
 * f(x) = −log₁₀(10^(αx) + 1) + δ [log₁₀(1 + eˣ)]^γ / (1 + exp(10^(−x))).
 * exp(10^(−x)) overflows for x ≲ −2.5; the second term then tends to 0 and is set to 0.
 */
export function behrooziShape(x: number, alpha: number, delta: number, gamma: number): number {
  // exp(ln10·x) stands for 10^x (faster than ** in V8, equal to round-off).
  const first = -Math.log10(Math.exp(alpha * x * Math.LN10) + 1);
  const e = Math.exp(Math.exp(-x * Math.LN10));
  if (!Number.isFinite(e)) return first;
  return first + (delta * Math.log10(1 + Math.exp(x)) ** gamma) / (1 + e);
}
