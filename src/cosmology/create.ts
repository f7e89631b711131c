import { DomainError } from '../errors.js';
import { ARCSEC, C_KM_S, GYR_S, KM_S_MPC_IN_S } from '../math/index.js';
import { type CumulativeTable, createCumulativeTable } from './cumulative-table.js';
import { createExpansion } from './expansion.js';
import { type CosmologySpec, resolveCosmologyParams } from './params.js';
import type { Cosmology } from './types.js';

/** The Cosmology contract plus the derived densities that createCosmology also knows. */
export interface CosmologyModel extends Cosmology {
  /** Photon density today (0 when Tcmb0 = 0). */
  readonly Ogamma0: number;
  /** Neutrino density today (massive ones through the Komatsu et al. 2011 fit, astropy convention). */
  readonly Onu0: number;
  /** Dark energy density today, 1 − Om0 − Ogamma0 − Onu0 (flat). */
  readonly Ode0: number;
  /** Hubble time 1/H0 [Gyr]. */
  readonly hubbleTimeGyr: number;
  /** Redshift up to which distances come from the interpolation table (quadrature beyond). */
  readonly tableZMax: number;
}

/** Redshift range of the distance tables; beyond it every call integrates directly. */
const TABLE_Z_MAX = 20;

function checkZ(z: number): void {
  if (!(z >= 0) || !Number.isFinite(z)) {
    throw new DomainError('z_invalid', `redshift must be a finite number ≥ 0, got ${z}`);
  }
}

/**
 * Build a flat ΛCDM cosmology: 'planck18' (PLANCK18_PARAMS) or a custom {H0, Om0, Ob0, Tcmb0?, Neff?, m_nu?}.
 * E(z) and ρc(z) are closed forms; comoving distance and lookback time are tabulated on first use
 * (relative error < 1e-10 against direct quadrature up to z = 20) and integrated directly beyond.
 * Throws InputError for invalid parameters.
 */
export function createCosmology(spec: CosmologySpec): CosmologyModel {
  const params = resolveCosmologyParams(spec);
  const exp = createExpansion(params);
  const { E } = exp;
  const hubbleDistanceMpc = C_KM_S / params.H0;
  const hubbleTimeGyr = 1 / (params.H0 * KM_S_MPC_IN_S) / GYR_S;
  let dc: CumulativeTable | undefined;
  let lb: CumulativeTable | undefined;
  const dcTable = () => {
    dc ??= createCumulativeTable((z) => 1 / E(z), { zMax: TABLE_Z_MAX });
    return dc;
  };
  const lbTable = () => {
    lb ??= createCumulativeTable((z) => 1 / ((1 + z) * E(z)), { zMax: TABLE_Z_MAX });
    return lb;
  };
  const comovingDistanceMpc = (z: number) => hubbleDistanceMpc * dcTable().value(z);
  const angularDiameterDistanceMpc = (z: number) => comovingDistanceMpc(z) / (1 + z);
  const rho0 = exp.rhoCrit0MsunKpc3;
  return Object.freeze({
    params,
    h: params.H0 / 100,
    hubbleDistanceMpc,
    hubbleTimeGyr,
    baryonFraction: params.Ob0 / params.Om0,
    Ogamma0: exp.Ogamma0,
    Onu0: exp.Onu0,
    Ode0: exp.Ode0,
    tableZMax: TABLE_Z_MAX,
    E(z: number) {
      if (!(z > -1)) throw new DomainError('z_invalid', `E(z) needs z > −1, got ${z}`);
      return E(z);
    },
    comovingDistanceMpc,
    angularDiameterDistanceMpc,
    luminosityDistanceMpc: (z: number) => comovingDistanceMpc(z) * (1 + z),
    criticalDensityMsunKpc3(z: number) {
      checkZ(z);
      const e = E(z);
      return rho0 * e * e;
    },
    omegaM(z: number) {
      checkZ(z);
      const e = E(z);
      const a = 1 + z;
      return (params.Om0 * a * a * a) / (e * e);
    },
    lookbackTimeGyr: (z: number) => hubbleTimeGyr * lbTable().value(z),
    kpcProperPerArcsec: (z: number) => angularDiameterDistanceMpc(z) * 1e3 * ARCSEC,
    zAtComovingDistance(dMpc: number) {
      if (!(dMpc >= 0) || !Number.isFinite(dMpc)) {
        throw new DomainError(
          'distance_invalid',
          `comoving distance must be a finite number ≥ 0 Mpc, got ${dMpc}`,
        );
      }
      return dcTable().inverse(dMpc / hubbleDistanceMpc);
    },
  });
}
