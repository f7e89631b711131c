/**
 * Free electrons per baryon (in units of m_p) for the Macquart relation, physics.md §7:
 * χ_e(z) = Y_H χ_e,H + ½ Y_He χ_e,He with primordial mass fractions Y_H = 0.75, Y_He = 0.25
 * (common practice). Hydrogen is fully ionised at all z considered; helium is fully ionised below
 * the helium II reionisation redshift (χ_e = 0.875) and singly ionised above it (χ_e = 0.8125).
 * The sharp step is a modelling choice; He II reionisation near z ≈ 3 is common practice.
 */
export const Y_H = 0.75;
export const Y_HE = 0.25;
/** Default helium II reionisation redshift (common practice). */
export const HE_REION_Z_DEFAULT = 3.0;

export const CHI_E_HE_DOUBLY = Y_H + 0.5 * Y_HE * 1;
export const CHI_E_HE_SINGLY = Y_H + 0.5 * Y_HE * 0.5;

export function electronsPerBaryon(z: number, heReionZ: number): number {
  return z < heReionZ ? CHI_E_HE_DOUBLY : CHI_E_HE_SINGLY;
}
