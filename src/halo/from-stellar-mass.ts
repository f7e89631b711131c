import { type ConcentrationRelationName, concentrationMass } from './concentration.js';
import { convertHaloMass, type HaloMass } from './convert.js';
import { type HaloCosmology, haloRadiusKpc, type MassDefinition } from './mass-definition.js';
import { type ShmrName, shmrSlope, shmrValidity, stellarHaloRelation } from './shmr/index.js';
import { type InversionStatus, invertShmrExact } from './shmr/invert.js';

export interface HaloFromStellarMassOptions {
  readonly shmr?: ShmrName;
  readonly massDefinition?: MassDefinition;
  readonly concentrationRelation?: ConcentrationRelationName;
}

export interface HaloFromStellarMass extends HaloMass {
  readonly massDefinition: MassDefinition;
  /** The halo in the SHMR's own definition before conversion. */
  readonly native: HaloMass & { readonly massDefinition: MassDefinition; readonly logMh: number };
  readonly inversion: InversionStatus;
  /** d log M* / d log M_h at the native halo mass (maps SHMR scatter to halo mass). */
  readonly slope: number;
  /** SHMR scatter in log M* at fixed M_h [dex]. */
  readonly shmrScatterDex: number;
  /** Concentration scatter σ(log₁₀ c) [dex]. */
  readonly concentrationScatterDex: number;
  /** Reasons this halo lies outside a model's stated range (empty when all apply). */
  readonly warnings: readonly string[];
}

/**
 * Mean-relation halo for a central galaxy of stellar mass 10^logMstar M☉ at redshift z:
 * invert the SHMR (in its native definition), take c from the c–M relation in that definition,
 * then convert the NFW halo to the requested definition. The inverse of the mean relation is not
 * ⟨log M_h | M*⟩ (Eddington bias), which matters most where the SHMR is flat (M* ≳ 10^10.8).
 */
export function haloFromStellarMass(
  logMstar: number,
  z: number,
  cosmo: HaloCosmology,
  opts: HaloFromStellarMassOptions = {},
): HaloFromStellarMass {
  const rel = stellarHaloRelation(opts.shmr ?? 'moster2013');
  const target = opts.massDefinition ?? '200c';
  const cmRelation = opts.concentrationRelation ?? 'dutton-maccio-2014';
  const warnings: string[] = [];
  const inv = invertShmrExact(rel, logMstar, z);
  if (inv.status !== 'ok') {
    warnings.push(
      `${rel.name}: log M* = ${logMstar} is ${inv.status} of the relation at z = ${z}; halo mass capped at 10^${inv.logMh}`,
    );
  }
  const validity = shmrValidity(rel, z);
  if (!validity.zInRange)
    warnings.push(`${rel.name}: z = ${z} outside its fitted range ${validity.zRange.join('–')}`);
  if (inv.logMh < rel.logMhRange[0] || inv.logMh > rel.logMhRange[1]) {
    warnings.push(
      `${rel.name}: log M_h = ${inv.logMh.toFixed(3)} outside its fitted range ${rel.logMhRange.join('–')}`,
    );
  }
  const nativeDef = rel.nativeDefinition;
  const mNative = 10 ** inv.logMh;
  const conc = concentrationMass(cmRelation, mNative, z, nativeDef, cosmo);
  if (!conc.inRange) warnings.push(`concentration outside validity: ${conc.validity}`);
  const native = {
    massMsun: mNative,
    concentration: conc.concentration,
    radiusKpc: haloRadiusKpc(mNative, z, nativeDef, cosmo),
    massDefinition: nativeDef,
    logMh: inv.logMh,
  };
  const converted = convertHaloMass(mNative, conc.concentration, nativeDef, target, z, cosmo);
  return {
    ...converted,
    massDefinition: target,
    native,
    inversion: inv.status,
    slope: shmrSlope(rel, inv.logMh, z),
    shmrScatterDex: rel.scatterDex(z),
    concentrationScatterDex: conc.scatterDex,
    warnings,
  };
}
