export { type CentralHalo, centralHalo } from './central-halo.js';
export { createHaloKit } from './create-kit.js';
export { physicalKeyOf, resolveDuplicates } from './duplicates.js';
export { type HaloKit, haloRadiusFromDensity } from './kit.js';
export {
  foregroundThreshold,
  probabilityForeground,
  truncatedNormalBelow,
} from './p-foreground.js';
export {
  PHOTO_Z_SIGMA0_FALLBACK,
  redshiftSigma,
  searchRedshiftRange,
  velocityWindowDz,
} from './redshift-range.js';
export {
  type Candidate,
  fetchShells,
  findCandidates,
  planShells,
  queryZMax,
  type SearchResult,
  type SearchShell,
  type SearchTarget,
  selectCandidate,
} from './search.js';
export type { CatalogRow, ConeQuery, ConeSearchFn } from './types.js';
