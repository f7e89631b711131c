import type { Cosmology } from '../cosmology/index.js';
import { createCumulativeTable } from '../cosmology/index.js';
import { C_CM_S, G_CGS, KM_S_MPC_IN_S, M_P_G, PC_CM } from '../math/index.js';
import { createDiffuseFraction, type DiffuseFractionSpec } from './diffuse-fraction.js';
import { electronsPerBaryon, HE_REION_Z_DEFAULT } from './ionisation.js';

/**
 * Mean cosmic DM (Macquart et al. 2020, Nature 581, 391, Methods):
 *   ⟨DM_cosmic⟩(z) = K ∫₀ᶻ f_d(z′) χ_e(z′) (1+z′)/E(z′) dz′,  K = 3 c H0 Ω_b / (8π G m_p).
 * Observer-frame pc cm⁻³. Tabulated once (cubic Hermite, breakpoints at He II reionisation and
 * the f_d table nodes) and inverted by the same table.
 */
export interface MacquartMean {
  /** K = 3 c H0 Ω_b/(8π G m_p) [pc cm⁻³] (1115.4744 for Planck18, physics.md §7). */
  readonly K: number;
  readonly heReionZ: number;
  readonly fdDescription: string;
  fd(z: number): number;
  chiE(z: number): number;
  /** ⟨DM_cosmic⟩(z) [pc cm⁻³]. */
  meanDmPcCm3(z: number): number;
  /** The z with ⟨DM_cosmic⟩(z) = dm (monotone inverse). */
  zAtMeanDm(dmPcCm3: number): number;
}

export interface MacquartMeanOptions {
  /** Diffuse baryon fraction: constant (default 0.844) or [[z, f_d], ...]. */
  fd?: DiffuseFractionSpec;
  /** He II reionisation redshift (default 3.0). */
  heReionZ?: number;
}

export function macquartK(cosmology: Cosmology): number {
  const H0s = cosmology.params.H0 * KM_S_MPC_IN_S;
  return (3 * C_CM_S * H0s * cosmology.params.Ob0) / (8 * Math.PI * G_CGS * M_P_G) / PC_CM;
}

export function createMacquartMean(cosmology: Cosmology, opts: MacquartMeanOptions = {}): MacquartMean {
  const fd = createDiffuseFraction(opts.fd ?? 0.844);
  const heReionZ = opts.heReionZ ?? HE_REION_Z_DEFAULT;
  const K = macquartK(cosmology);
  const chiE = (z: number) => electronsPerBaryon(z, heReionZ);
  const table = createCumulativeTable((z) => (fd(z) * chiE(z) * (1 + z)) / cosmology.E(z), {
    zMax: 20,
    breakpoints: [heReionZ, ...fd.breakpoints],
  });
  return Object.freeze({
    K,
    heReionZ,
    fdDescription: fd.description,
    fd: (z: number) => fd(z),
    chiE,
    meanDmPcCm3: (z: number) => K * table.value(z),
    zAtMeanDm: (dm: number) => table.inverse(dm / K),
  });
}
