import { DomainError } from '../errors.js';
import { C_CM_S, EV_ERG, G_CGS, K_B_CGS, KM_S_MPC_IN_S, MSUN_PER_KPC3_IN_G_CM3 } from '../math/index.js';
import type { CosmologyParams } from './types.js';

/** Stefan–Boltzmann constant [erg cm⁻² s⁻¹ K⁻⁴] (CODATA 2018, exact from h, k, c). */
const SIGMA_SB_CGS = 5.670374419e-5;
/** 7/8 (4/11)^(4/3): neutrino-to-photon energy density per species (astropy's constant). */
const NU_PREFACTOR = 0.22710731766;
/** T_ν0 / T_cmb0 = (4/11)^(1/3) (instantaneous decoupling). */
const TNU_OVER_TCMB = (4 / 11) ** (1 / 3);
/** Komatsu et al. 2011, ApJS 192, 18, eq. 26: massive-neutrino fitting function constants. */
const KOMATSU_P = 1.83;
const KOMATSU_K = 0.3173;

/** Density parameters today and a closed-form E(z) for a flat ΛCDM model with photons and neutrinos. */
export interface Expansion {
  readonly Ogamma0: number;
  readonly Onu0: number;
  readonly Ode0: number;
  /** ρc0 [M☉ kpc⁻³, physical]. */
  readonly rhoCrit0MsunKpc3: number;
  E(z: number): number;
}

export function createExpansion(p: CosmologyParams): Expansion {
  const H0s = p.H0 * KM_S_MPC_IN_S;
  const rhoCrit0G = (3 * H0s * H0s) / (8 * Math.PI * G_CGS);
  // Photon density from T_cmb (astropy: a_B c⁻² = 4σ/c³).
  const Ogamma0 = p.Tcmb0 > 0 ? (((4 * SIGMA_SB_CGS) / C_CM_S ** 3) * p.Tcmb0 ** 4) / rhoCrit0G : 0;
  const nNu = Math.floor(p.Neff);
  const massive = p.Tcmb0 > 0 ? p.m_nu.filter((m) => m > 0) : [];
  const nMassless = nNu - massive.length;
  const TNu0 = TNU_OVER_TCMB * p.Tcmb0;
  const y = massive.map((m) => (m * EV_ERG) / (K_B_CGS * TNu0));
  const neffPerNu = nNu > 0 ? p.Neff / nNu : 0;
  // R_ν(z) of physics.md §1: neutrino density relative to photons (massless limit: 0.2271 Neff).
  const nuRelative =
    y.length === 0
      ? () => NU_PREFACTOR * p.Neff
      : (z: number) => {
          let s = nMassless;
          for (const yi of y) s += (1 + ((KOMATSU_K * yi) / (1 + z)) ** KOMATSU_P) ** (1 / KOMATSU_P);
          return NU_PREFACTOR * neffPerNu * s;
        };
  const Onu0 = Ogamma0 * nuRelative(0);
  const Ode0 = 1 - p.Om0 - Ogamma0 - Onu0;
  if (Ode0 < -1e-12) {
    throw new DomainError(
      'cosmology_negative_lambda',
      `Om0 + radiation = ${(1 - Ode0).toPrecision(6)} exceeds 1; a flat model would need ΩΛ < 0 (lower Om0 or Tcmb0)`,
    );
  }
  const { Om0 } = p;
  const OL = Math.max(0, Ode0);
  const E =
    Ogamma0 === 0
      ? (z: number) => {
          const a = 1 + z;
          return Math.sqrt(Om0 * a * a * a + OL);
        }
      : y.length === 0
        ? (z: number) => {
            const a = 1 + z;
            const a3 = a * a * a;
            return Math.sqrt(Om0 * a3 + (Ogamma0 + Onu0) * a3 * a + OL);
          }
        : (z: number) => {
            const a = 1 + z;
            const a3 = a * a * a;
            return Math.sqrt(Om0 * a3 + Ogamma0 * (1 + nuRelative(z)) * a3 * a + OL);
          };
  return { Ogamma0, Onu0, Ode0: OL, rhoCrit0MsunKpc3: rhoCrit0G / MSUN_PER_KPC3_IN_G_CM3, E };
}
