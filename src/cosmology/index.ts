export { type CosmologyModel, createCosmology } from './create.js';
export {
  type CumulativeTable,
  type CumulativeTableOptions,
  createCumulativeTable,
} from './cumulative-table.js';
export { createExpansion, type Expansion } from './expansion.js';
export {
  type CosmologySpec,
  cosmologySpecSchema,
  customCosmologySchema,
  PLANCK18_PARAMS,
  resolveCosmologyParams,
} from './params.js';
export type { Cosmology, CosmologyParams } from './types.js';
