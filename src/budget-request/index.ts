export { GALACTIC_MODEL_NOTE } from './assemble.js';
export { createCosmologyCache } from './cosmology-cache.js';
export { type HaloTerm, resolveHaloTerm, type SightlineRunner } from './halo-term.js';
export {
  type BudgetRequest,
  budgetRequestSchema,
  budgetSightlineSchema,
  haloTermSchema,
  type ParsedBudgetRequest,
  withoutRedshiftSchema,
} from './request-schema.js';
export {
  type BudgetResponse,
  type BudgetWarning,
  budgetResponseSchema,
  budgetWarningSchema,
  componentSummarySchema,
  hostRestSummarySchema,
  redshiftLimitSchema,
  redshiftPosteriorSchema,
} from './response-schema.js';
export { type BudgetDeps, computeBudget, parseBudgetRequest } from './run.js';
export { budgetBodyJson } from './serialize.js';
