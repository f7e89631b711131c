/** Dispersion measure of sightlines through hot-gas haloes: closed forms, quadrature and a fast table path. */
export {
  dmSingularIsothermal,
  dmUniformSphere,
  nfwProjectionF,
  nfwTruncatedProjectionG,
} from './closed-forms.js';
export { createHaloDmEvaluator, type HaloDmEvaluator, type HaloDmEvaluatorOptions } from './evaluator.js';
export { dmRestExact, projectedShape } from './line-integral.js';
export {
  buildProjectionTable,
  type ProjectionTable,
  readProjectionTable,
  TABLE_C_MAX,
  TABLE_C_MIN,
  TABLE_X_MIN_OVER_EXTENT,
} from './projection-table.js';
