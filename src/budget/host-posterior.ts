import type { Cosmology } from '../cosmology/index.js';
import { DomainError } from '../errors.js';
import { createRng, deriveSeed } from '../math/index.js';
import { BUDGET_CAUTIONS } from './cautions.js';
import { cosmicPdf } from './cosmic-pdf-cache.js';
import { type BudgetObservation, drawLocalTerms, validateObservation } from './local-draws.js';
import type { BudgetModel, BudgetModelInput } from './model.js';
import {
  cosmicConvention,
  cosmicMeanInForce,
  DOUBLE_COUNT_WARNING,
  macquartMeanFor,
  resolveBudgetModel,
} from './resolve.js';
import { type Summary, summarise, summariseWide, type WideSummary } from './summary.js';

export interface HostPosteriorInput extends BudgetObservation {
  /** Source (burst) redshift, > 0. */
  zSource: number;
  cosmology: Cosmology;
  /** Budget model keys (defaults filled in by budgetModelSchema). */
  budgetModel?: BudgetModelInput | BudgetModel;
  /** Override the model's draws / seed. */
  draws?: number;
  seed?: number;
  /** Return the per-draw arrays as well (for checks and plots). */
  keepDraws?: boolean;
}

/** Per-draw values [pc cm⁻³]; every term observer frame except hostRest. */
export interface BudgetDraws {
  obs: Float64Array;
  ism: Float64Array;
  mwHalo: Float64Array;
  cosmic: Float64Array;
  halos: Float64Array;
  hostRest: Float64Array;
}

export interface HostPosterior {
  z_source: number;
  draws: number;
  seed: number;
  cosmic_mode: 'diffuse' | 'full';
  /** ⟨DM_cosmic⟩(z_s) with the f_d in force (default 0.844), whatever cosmic_mode [pc cm⁻³]. */
  macquart_mean: number;
  /** Mean of the cosmic term actually used (f_igm in 'diffuse' mode) [pc cm⁻³]. */
  cosmic_mean_in_force: number;
  components: {
    dm_obs: Summary;
    mw_ism: Summary;
    mw_halo: Summary;
    cosmic: Summary;
    halos: Summary;
  };
  /** DM_host,rest = (DM_obs − MW ISM − MW halo − cosmic − haloes)(1 + z_s), never clipped. */
  host_rest: WideSummary;
  /** Fraction of draws with DM_host,rest < 0. */
  p_negative_host: number;
  conventions: string[];
  assumptions: Record<string, string | number>;
  warnings: string[];
  cautions: readonly string[];
  units: string;
  perDraw?: BudgetDraws;
}

/**
 * Monte Carlo posterior of the host's rest-frame DM given a source redshift (physics.md §7.1):
 * DM_obs = DM_MW,ISM + DM_MW,halo + DM_cosmic + DM_haloes + DM_host,rest/(1+z_s).
 * Per draw: DM_obs ~ N(dmObs, dmObsErr); MW ISM ~ N(dmIsm, dmIsmErr) truncated at 0; MW halo from
 * the user's value ± error or the model prior; cosmic = ⟨DM⟩_in force(z_s) × Δ with Δ from the
 * Macquart et al. 2020 PDF; haloes resampled from haloDraws (0 with a warning when absent).
 */
export function hostPosterior(input: HostPosteriorInput): HostPosterior {
  const model = resolveBudgetModel(input.budgetModel);
  validateObservation(input);
  const z = input.zSource;
  if (!(Number.isFinite(z) && z > 0 && z <= 20)) {
    throw new DomainError('z_source_invalid', `zSource must be a number in (0, 20], got ${z}`);
  }
  const overrides = resolveBudgetModel({
    ...model,
    draws: input.draws ?? model.draws,
    seed: input.seed ?? model.seed,
  });
  const { draws, seed } = overrides;

  const local = drawLocalTerms(input, model, draws, seed);
  const meanInForce = cosmicMeanInForce(input.cosmology, model).meanDmPcCm3(z);
  const macquart = macquartMeanFor(input.cosmology, model).meanDmPcCm3(z);
  const pdf = cosmicPdf(model.F, z);
  const rngCosmic = createRng(deriveSeed(seed, 4));
  const cosmic = new Float64Array(draws);
  const hostRest = new Float64Array(draws);
  let negative = 0;
  for (let i = 0; i < draws; i++) {
    cosmic[i] = meanInForce * pdf.sample(rngCosmic);
    hostRest[i] = (local.obs[i] - local.ism[i] - local.mwHalo[i] - cosmic[i] - local.halos[i]) * (1 + z);
    if (hostRest[i] < 0) negative++;
  }

  const warnings = [...local.warnings];
  if (model.cosmic_mode === 'full' && input.haloDraws !== undefined) warnings.push(DOUBLE_COUNT_WARNING);
  if (z < 0.05) {
    warnings.push(
      'z_s < 0.05: the cosmic-DM PDF is very broad here (σ_DM ∝ z^(−1/2)) and the Macquart fit is poorly constrained',
    );
  }
  const pNeg = negative / draws;
  if (pNeg > 0.05) {
    warnings.push(
      `P(DM_host < 0) = ${pNeg.toFixed(3)}: the other terms already account for the observed DM; check the inputs`,
    );
  }
  return {
    z_source: z,
    draws,
    seed,
    cosmic_mode: model.cosmic_mode,
    macquart_mean: macquart,
    cosmic_mean_in_force: meanInForce,
    components: {
      dm_obs: summarise(local.obs),
      mw_ism: summarise(local.ism),
      mw_halo: summarise(local.mwHalo),
      cosmic: summarise(cosmic),
      halos: summarise(local.halos),
    },
    host_rest: summariseWide(hostRest),
    p_negative_host: pNeg,
    conventions: [
      cosmicConvention(model),
      'all components are observer-frame pc cm⁻³; host_rest is in the host rest frame (× (1 + z_s)); host values are never clipped',
    ],
    assumptions: {
      mw_halo: local.mwHaloSource,
      mw_ism: 'normal, truncated at 0',
      f_d: model.f_d_table ? 'table (see model)' : model.f_d,
      f_igm: model.f_igm,
      F: model.F,
      he_reion_z: model.he_reion_z,
      cosmology: input.cosmology.params.name,
    },
    warnings,
    cautions: BUDGET_CAUTIONS,
    units: 'pc cm⁻³',
    ...(input.keepDraws
      ? {
          perDraw: {
            obs: local.obs,
            ism: local.ism,
            mwHalo: local.mwHalo,
            cosmic,
            halos: local.halos,
            hostRest,
          },
        }
      : {}),
  };
}
