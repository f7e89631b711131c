import type { MassDefinition } from '../halo/index.js';
import type { Model } from '../model/index.js';

/**
 * Everything the sightline engine needs from cosmology, haloes and gas for one model, behind one
 * small interface: `createHaloKit(model)` wires the real packages; unit tests of the engine's own
 * logic may pass a simpler kit. Masses in M☉, lengths in proper kpc, DM in pc cm⁻³ (rest frame).
 */
export interface HaloKit {
  readonly model: Model;
  /** The chosen halo mass definition (model.mass_definition). */
  readonly massDefinition: MassDefinition;
  /** Ω_b/Ω_m of the cosmology (normalises the gas). */
  readonly baryonFraction: number;
  /** Proper angular-diameter distance D_A(z) [kpc]. */
  angularDiameterDistanceKpc(z: number): number;
  /** Mean density inside the halo radius, Δ(z)·ρc(z) [M☉ kpc⁻³], for the chosen definition. */
  haloDensityMsunKpc3(z: number): number;
  /** D_A and Δρc from a fine z table (relative error ≲ 1e-5 for z ≥ 0.01), for Monte Carlo draws. */
  angularDiameterDistanceKpcFast(z: number): number;
  haloDensityMsunKpc3Fast(z: number): number;

  /** The SHMR's own mass definition, fitted ranges and forward relation log M*(log M_h, z). */
  readonly shmrNativeDefinition: MassDefinition;
  readonly shmrLogMhRange: readonly [number, number];
  readonly shmrZRange: readonly [number, number];
  shmrLogMstar(logMhNative: number, z: number): number;
  /** Mean-relation inversion log M* → log M_h (native definition) with its status. */
  shmrInvert(logMstar: number, z: number): { logMh: number; status: 'ok' | 'above-range' | 'below-range' };
  /** Scatter in log M* at fixed M_h [dex]: the model's value or the relation's published one. */
  shmrScatterDex(z: number): number;

  /** log M in the chosen definition of an NFW halo given as log M in definition `from` (mean c). */
  toModelLogMass(logM: number, from: MassDefinition, z: number): number;
  /** Mean concentration in the chosen definition and whether (M, z) is inside the relation's range. */
  concentration(massMsun: number, z: number): { c: number; inRange: boolean };
  /** σ(log₁₀ c) [dex]: the model's value or the relation's published one. */
  readonly concentrationScatterDex: number;

  /** Observer-frame DM through the halo by the exact path (quadrature or closed form), f_hot = model.f_hot. */
  dmObsExact(massMsun: number, radiusKpc: number, c: number, bKpc: number, z: number): number;
  /** Observer-frame DM by the fast table evaluator (Monte Carlo inner loop), for a given f_hot. */
  dmObsFast(massMsun: number, radiusKpc: number, c: number, bKpc: number, z: number, fHot: number): number;
}

/** r_Δ = [3M/(4π Δρc)]^(1/3) [proper kpc] given the kit's Δ(z)ρc(z) (physics.md §2). */
export function haloRadiusFromDensity(massMsun: number, haloDensityMsunKpc3: number): number {
  return Math.cbrt((3 * massMsun) / (4 * Math.PI * haloDensityMsunKpc3));
}
