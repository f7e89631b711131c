export { type CentralHalo, centralHalo } from './central-halo.js';
export { classifyCandidates } from './classify.js';
export { createHaloKit } from './create-kit.js';
export { physicalKeyOf, resolveDuplicates } from './duplicates.js';
export { csvField, galaxyCsvHeader, galaxyCsvRows, galaxyTableCsv } from './galaxy-csv.js';
export { type HaloKit, haloRadiusFromDensity } from './kit.js';
export { createKitCache, type KitProvider } from './kit-cache.js';
export { type MonteCarloResult, runMonteCarlo } from './monte-carlo.js';
export {
  foregroundThreshold,
  probabilityForeground,
  truncatedNormalBelow,
} from './p-foreground.js';
export { B_FLOOR_KPC, type PreparedGalaxy, prepareGalaxy } from './prepare.js';
export { sampleVariance, varianceReductionByBinning } from './priorities.js';
export {
  type ConeWindow,
  type DensityEstimate,
  estimateDensity,
  expectedRows,
  mergeWindows,
  probeShellIndex,
  QUERY_COST_ROWS,
  unionWindow,
} from './query-plan.js';
export {
  PHOTO_Z_SIGMA0_FALLBACK,
  redshiftSigma,
  searchRedshiftRange,
  velocityWindowDz,
} from './redshift-range.js';
export {
  type ParsedSightlineRequest,
  parseSightlineRequest,
  runParsedSightline,
  runSightline,
  type SightlineDeps,
  type SightlineTimings,
} from './run.js';
export {
  dmSummarySchema,
  type EnvironmentEntry,
  environmentEntrySchema,
  type GalaxyResult,
  galaxyResultSchema,
  type PriorityEntry,
  priorityEntrySchema,
  type SightlineRequest,
  type SightlineResponse,
  type SightlineWarning,
  sightlineRequestSchema,
  sightlineResponseSchema,
  warningSchema,
} from './schemas.js';
export {
  type Candidate,
  type FetchOptions,
  fetchShells,
  findCandidates,
  planShells,
  queryZMax,
  type SearchResult,
  type SearchShell,
  type SearchTarget,
  selectCandidate,
} from './search.js';
export { type DmSummary, fractionPositive, summarizeDraws } from './summarize.js';
export { sightlineTextReport } from './text-report.js';
export type { CatalogRow, ConeQuery, ConeSearchFn } from './types.js';
