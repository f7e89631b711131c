import type { MassDefinition } from '../mass-definition.js';

export type ShmrName = 'moster2013' | 'behroozi2013' | 'kravtsov2018';
export const SHMR_NAMES: readonly ShmrName[] = ['moster2013', 'behroozi2013', 'kravtsov2018'];

/**
 * A stellar-to-halo mass relation: mean log₁₀ M* [M☉] of central galaxies at fixed halo mass
 * log₁₀ M_h [M☉] in the relation's native mass definition.
 */
export interface StellarHaloRelation {
  readonly name: ShmrName;
  readonly reference: string;
  readonly nativeDefinition: MassDefinition;
  /** Redshift range of the fit [z_min, z_max]. */
  readonly zRange: readonly [number, number];
  /** Halo-mass range of the fit, log₁₀ M_h [M☉]. */
  readonly logMhRange: readonly [number, number];
  logMstar(logMh: number, z: number): number;
  /** Intrinsic scatter in log₁₀ M* at fixed M_h [dex]. */
  scatterDex(z: number): number;
}
