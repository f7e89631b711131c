export { BUDGET_CAUTIONS } from './cautions.js';
export {
  type CosmicPdf,
  createCosmicPdf,
  MACQUART_ALPHA,
  MACQUART_BETA,
  MACQUART_F_DEFAULT,
  macquartSigma,
  solveMacquartShape,
} from './cosmic-pdf.js';
export { cosmicPdf } from './cosmic-pdf-cache.js';
export { createDiffuseFraction, type DiffuseFraction, type DiffuseFractionSpec } from './diffuse-fraction.js';
export {
  type BudgetDraws,
  type HostPosterior,
  type HostPosteriorInput,
  hostPosterior,
} from './host-posterior.js';
export {
  CHI_E_HE_DOUBLY,
  CHI_E_HE_SINGLY,
  electronsPerBaryon,
  HE_REION_Z_DEFAULT,
  Y_H,
  Y_HE,
} from './ionisation.js';
export {
  type BudgetObservation,
  drawLocalTerms,
  type LocalDraws,
  validateObservation,
} from './local-draws.js';
export {
  createMacquartMean,
  type MacquartMean,
  type MacquartMeanOptions,
  macquartK,
} from './macquart-mean.js';
export { type BudgetModel, type BudgetModelInput, budgetModelSchema } from './model.js';
export { maxSourceRedshift, type RedshiftLimit, type RedshiftLimitInput } from './redshift-limit.js';
export {
  type RedshiftPosterior,
  type RedshiftPosteriorInput,
  redshiftPosterior,
} from './redshift-posterior.js';
export { cosmicMeanInForce, macquartMeanFor, resolveBudgetModel } from './resolve.js';
export { type Summary, summarise, summariseWide, type WideSummary } from './summary.js';
