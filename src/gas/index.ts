/** Hot-gas density profiles of haloes, normalised to a hot fraction of the cosmic baryon share. */
export { electronsPerCm3PerMsunKpc3, MU_E_DEFAULT } from './electrons.js';
export {
  createGasProfile,
  EXTENT_DEFAULT,
  F_HOT_DEFAULT,
  type GasHalo,
  type GasOptions,
  type GasProfile,
} from './profile.js';
export { type ProfileShape, profileShape } from './shapes.js';
export {
  MNFW_DEFAULT_ALPHA,
  MNFW_DEFAULT_Y0,
  PROFILE_KINDS,
  type ProfileKind,
  type ProfileSpec,
  profileSchema,
} from './spec.js';
