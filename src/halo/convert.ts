import {
  type HaloCosmology,
  haloRadiusKpc,
  type MassDefinition,
  overdensityCrit,
} from './mass-definition.js';
import { convertNfwOverdensity } from './nfw.js';

/** A halo described in one mass definition. */
export interface HaloMass {
  readonly massMsun: number;
  readonly concentration: number;
  /** Halo radius r_Δ [proper kpc]. */
  readonly radiusKpc: number;
}

/** Convert an NFW halo (mass, concentration) at redshift z from one mass definition to another. */
export function convertHaloMass(
  massMsun: number,
  concentration: number,
  from: MassDefinition,
  to: MassDefinition,
  z: number,
  cosmo: HaloCosmology,
): HaloMass {
  const conv = convertNfwOverdensity(
    massMsun,
    concentration,
    overdensityCrit(from, z, cosmo),
    overdensityCrit(to, z, cosmo),
  );
  return {
    massMsun: conv.massMsun,
    concentration: conv.concentration,
    radiusKpc: haloRadiusKpc(conv.massMsun, z, to, cosmo),
  };
}
