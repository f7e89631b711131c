import type { Cosmology } from '../cosmology/index.js';
import { InputError } from '../errors.js';
import { createMacquartMean, type MacquartMean } from './macquart-mean.js';
import { type BudgetModel, type BudgetModelInput, budgetModelSchema } from './model.js';

/** Parse a budget model (defaults filled in); InputError names each bad key and the reason. */
export function resolveBudgetModel(input: BudgetModelInput | undefined): BudgetModel {
  const parsed = budgetModelSchema.safeParse(input ?? {});
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => `${i.path.join('.') || 'budget model'}: ${i.message}`);
    throw new InputError('budget_model_invalid', `invalid budget model: ${issues.join('; ')}`, {
      issues: parsed.error.issues,
    });
  }
  return parsed.data;
}

const means = new WeakMap<Cosmology, Map<string, MacquartMean>>();

function cachedMean(cosmology: Cosmology, fd: number | [number, number][], heReionZ: number): MacquartMean {
  let byKey = means.get(cosmology);
  if (byKey === undefined) {
    byKey = new Map();
    means.set(cosmology, byKey);
  }
  const key = JSON.stringify([fd, heReionZ]);
  let m = byKey.get(key);
  if (m === undefined) {
    m = createMacquartMean(cosmology, { fd, heReionZ });
    byKey.set(key, m);
  }
  return m;
}

/** The Macquart mean with the model's f_d (or f_d table): the published relation, whatever cosmic_mode. */
export function macquartMeanFor(cosmology: Cosmology, model: BudgetModel): MacquartMean {
  return cachedMean(cosmology, model.f_d_table ?? model.f_d, model.he_reion_z);
}

/** The mean cosmic DM actually used for the cosmic term: f_igm in 'diffuse' mode, f_d in 'full' mode. */
export function cosmicMeanInForce(cosmology: Cosmology, model: BudgetModel): MacquartMean {
  return model.cosmic_mode === 'diffuse'
    ? cachedMean(cosmology, model.f_igm, model.he_reion_z)
    : macquartMeanFor(cosmology, model);
}

/** One sentence stating the cosmic-term convention, for every output. */
export function cosmicConvention(model: BudgetModel): string {
  return model.cosmic_mode === 'diffuse'
    ? `cosmic_mode 'diffuse': the cosmic term is the Macquart mean with f_igm = ${model.f_igm} (diffuse IGM outside haloes, a team assumption); listed foreground haloes are added separately`
    : `cosmic_mode 'full': the cosmic term is the Macquart mean with f_d = ${model.f_d_table ? 'table' : model.f_d}, which already contains the average gas in haloes`;
}

export const DOUBLE_COUNT_WARNING =
  "cosmic_mode 'full' includes the mean gas in haloes, so explicitly added foreground haloes are counted twice on average";
