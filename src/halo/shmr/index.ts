import { InputError } from '../../errors.js';
import { behroozi2013 } from './behroozi2013.js';
import { kravtsov2018 } from './kravtsov2018.js';
import { moster2013 } from './moster2013.js';
import { SHMR_NAMES, type ShmrName, type StellarHaloRelation } from './types.js';

export { behrooziShape } from './behroozi-f.js';
export { behroozi2013, behroozi2013LogMstar } from './behroozi2013.js';
export { createShmrInverter, type ShmrInverter } from './fast-invert.js';
export {
  type HaloMassInversion,
  type InversionStatus,
  invertShmrExact,
  LOG_MH_MAX,
  LOG_MH_MIN,
  shmrSlope,
} from './invert.js';
export { kravtsov2018, kravtsov2018LogMstar } from './kravtsov2018.js';
export { moster2013, moster2013LogMstar } from './moster2013.js';
export { SHMR_NAMES, type ShmrName, type StellarHaloRelation } from './types.js';

const BY_NAME: Record<ShmrName, StellarHaloRelation> = {
  moster2013,
  behroozi2013,
  kravtsov2018,
};

/** Look up a stellar-to-halo mass relation by name. */
export function stellarHaloRelation(name: ShmrName): StellarHaloRelation {
  const rel = BY_NAME[name];
  if (!rel) throw new InputError('shmr', `unknown SHMR '${name}'; use ${SHMR_NAMES.join(', ')}`);
  return rel;
}

export interface ShmrValidity {
  readonly zRange: readonly [number, number];
  readonly logMhRange: readonly [number, number];
  /** Stellar-mass range reached by the fitted halo-mass range at this z, log₁₀ M* [M☉]. */
  readonly logMstarRange: readonly [number, number];
  readonly zInRange: boolean;
}

/** Validity of a relation at redshift z, including the stellar-mass range it maps onto. */
export function shmrValidity(rel: StellarHaloRelation, z: number): ShmrValidity {
  return {
    zRange: rel.zRange,
    logMhRange: rel.logMhRange,
    logMstarRange: [rel.logMstar(rel.logMhRange[0], z), rel.logMstar(rel.logMhRange[1], z)],
    zInRange: z >= rel.zRange[0] && z <= rel.zRange[1],
  };
}
