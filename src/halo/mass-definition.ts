import type { Cosmology } from '../cosmology/types.js';
import { InputError } from '../errors.js';

/** Spherical-overdensity mass definitions supported throughout forehalo. */
export type MassDefinition = '200c' | '200m' | 'vir';
export const MASS_DEFINITIONS: readonly MassDefinition[] = ['200c', '200m', 'vir'];

/** The part of a Cosmology the halo code needs; tests may pass a plain object. */
export type HaloCosmology = Pick<Cosmology, 'h' | 'criticalDensityMsunKpc3' | 'omegaM'>;

/**
 * Virial overdensity relative to the critical density for a flat universe with Λ
 * (Bryan & Norman 1998, ApJ 495, 80, eq. 6): Δ_vir = 18π² + 82x − 39x², x = Ωm(z) − 1.
 */
export function deltaVirBryanNorman(OmZ: number): number {
  const x = OmZ - 1;
  return 18 * Math.PI * Math.PI + 82 * x - 39 * x * x;
}

/** Overdensity Δ of a mass definition, always relative to ρc(z) (200m → 200 Ωm(z)). */
export function overdensityCrit(def: MassDefinition, z: number, cosmo: HaloCosmology): number {
  switch (def) {
    case '200c':
      return 200;
    case '200m':
      return 200 * cosmo.omegaM(z);
    case 'vir':
      return deltaVirBryanNorman(cosmo.omegaM(z));
    default:
      throw new InputError('mass_definition', `unknown mass definition '${def}'; use 200c, 200m or vir`);
  }
}

/** r_Δ = [3 M /(4π Δ ρc(z))]^(1/3) [proper kpc] for M in M☉. */
export function haloRadiusKpc(
  massMsun: number,
  z: number,
  def: MassDefinition,
  cosmo: HaloCosmology,
): number {
  const rhoMsunKpc3 = overdensityCrit(def, z, cosmo) * cosmo.criticalDensityMsunKpc3(z);
  return Math.cbrt((3 * massMsun) / (4 * Math.PI * rhoMsunKpc3));
}

/** M_Δ = (4π/3) Δ ρc(z) r³ [M☉] for r in proper kpc. */
export function haloMassFromRadius(
  radiusKpc: number,
  z: number,
  def: MassDefinition,
  cosmo: HaloCosmology,
): number {
  const rhoMsunKpc3 = overdensityCrit(def, z, cosmo) * cosmo.criticalDensityMsunKpc3(z);
  return ((4 * Math.PI) / 3) * rhoMsunKpc3 * radiusKpc ** 3;
}
