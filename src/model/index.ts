export { defaultModel, describeIssues, type ModelIssue, parseModel } from './parse.js';
export {
  CONCENTRATION_NAMES,
  fHotPriorSchema,
  MASS_DEFINITION_NAMES,
  MAX_DRAWS,
  type Model,
  type ModelInput,
  modelCosmologySchema,
  modelProfileSchema,
  modelSchema,
  type ProfileSpec,
  SHMR_NAMES,
} from './schema.js';
