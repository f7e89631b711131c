import { M_P_G, MSUN_PER_KPC3_IN_G_CM3 } from '../math/index.js';

/**
 * Mean mass per electron in units of m_p for fully ionised hydrogen and helium with mass fractions
 * X = 0.75, Y = 0.25 (metals ignored, m_He ≈ 4 m_p):
 *   n_e = n_H + 2 n_He = Xρ/m_p + 2·Yρ/(4 m_p) = (X + Y/2) ρ/m_p
 *   μ_e = ρ/(m_p n_e) = 1/(X + Y/2) = 1/(0.75 + 0.125) = 8/7.
 */
export const MU_E_DEFAULT = 8 / 7;

/** Factor turning a gas density in M☉ kpc⁻³ into n_e in cm⁻³: n_e = ρ × factor. */
export function electronsPerCm3PerMsunKpc3(muE: number = MU_E_DEFAULT): number {
  return MSUN_PER_KPC3_IN_G_CM3 / (muE * M_P_G);
}
