/** Dark-matter haloes: mass definitions, NFW conversions, concentration–mass and stellar-to-halo mass relations. */
export {
  CONCENTRATION_RELATIONS,
  type ConcentrationRelationName,
  type ConcentrationResult,
  concentrationMass,
} from './concentration.js';
export { convertHaloMass, type HaloMass } from './convert.js';
export {
  type HaloFromStellarMass,
  type HaloFromStellarMassOptions,
  haloFromStellarMass,
} from './from-stellar-mass.js';
export {
  deltaVirBryanNorman,
  type HaloCosmology,
  haloMassFromRadius,
  haloRadiusKpc,
  MASS_DEFINITIONS,
  type MassDefinition,
  overdensityCrit,
} from './mass-definition.js';
export { convertNfwOverdensity, type NfwConversion, nfwMu } from './nfw.js';
export * from './shmr/index.js';
