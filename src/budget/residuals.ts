import type { Cosmology } from '../cosmology/index.js';
import { BUDGET_CAUTIONS } from './cautions.js';
import { type BudgetObservation, drawLocalTerms, validateObservation } from './local-draws.js';
import type { BudgetModel, BudgetModelInput } from './model.js';
import { cosmicConvention, resolveBudgetModel } from './resolve.js';

/** Inputs shared by the two "no source redshift" analyses. */
export interface RedshiftFreeInput extends BudgetObservation {
  cosmology: Cosmology;
  budgetModel?: BudgetModelInput | BudgetModel;
  draws?: number;
  seed?: number;
}

/**
 * Draws of R = DM_obs − DM_MW,ISM − DM_MW,halo − DM_haloes [pc cm⁻³]: what is left for the
 * cosmic and host terms. Without z_s there is no foreground-halo term other than the caller's draws.
 */
export function residualDraws(input: RedshiftFreeInput): {
  model: BudgetModel;
  residual: Float64Array;
  warnings: string[];
  mwHaloSource: string;
} {
  const base = resolveBudgetModel(input.budgetModel);
  validateObservation(input);
  const model = resolveBudgetModel({
    ...base,
    draws: input.draws ?? base.draws,
    seed: input.seed ?? base.seed,
  });
  const local = drawLocalTerms(input, model, model.draws, model.seed);
  const residual = new Float64Array(model.draws);
  for (let i = 0; i < residual.length; i++)
    residual[i] = local.obs[i] - local.ism[i] - local.mwHalo[i] - local.halos[i];
  return { model, residual, warnings: local.warnings, mwHaloSource: local.mwHaloSource };
}

/** The closing fields of both "no source redshift" results: seed, conventions, warnings, cautions. */
export function redshiftFreeTrailer(model: BudgetModel, warnings: string[]) {
  return {
    seed: model.seed,
    cosmic_mode: model.cosmic_mode,
    conventions: [
      cosmicConvention(model),
      'no foreground-halo term is included without a source redshift other than the haloDraws the caller passed',
    ],
    warnings,
    cautions: BUDGET_CAUTIONS,
  };
}
