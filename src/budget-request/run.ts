import {
  BUDGET_CAUTIONS,
  type BudgetModel,
  type BudgetObservation,
  drawLocalTerms,
  hostPosterior,
  maxSourceRedshift,
  redshiftPosterior,
  resolveBudgetModel,
  summarise,
} from '../budget/index.js';
import type { CosmologyModel } from '../cosmology/index.js';
import { InputError } from '../errors.js';
import { describeIssues } from '../model/index.js';
import {
  assumptionsFor,
  budgetWarnings,
  GALACTIC_MODEL_NOTE,
  plain,
  requestWarnings,
  sightlineEcho,
} from './assemble.js';
import { createCosmologyCache } from './cosmology-cache.js';
import { type HaloTerm, resolveHaloTerm, type SightlineRunner } from './halo-term.js';
import { budgetRequestSchema, type ParsedBudgetRequest } from './request-schema.js';
import type { BudgetResponse } from './response-schema.js';

export interface BudgetDeps {
  /** Runs the sightline named in a request (include_draws is always set). */
  readonly runSightline: SightlineRunner;
  /** Cosmology provider; default: a shared small cache. */
  readonly cosmologies?: ReturnType<typeof createCosmologyCache>;
}

const sharedCosmologies = createCosmologyCache();

/** Validate a budget request; InputError('bad_request') names every offending field. */
export function parseBudgetRequest(input: unknown): ParsedBudgetRequest {
  const parsed = budgetRequestSchema.safeParse(input);
  if (!parsed.success) {
    const issues = describeIssues(parsed.error.issues);
    throw new InputError(
      'bad_request',
      `invalid budget request: ${issues.map((i) => `${i.key}: ${i.message}`).join('; ')}`,
      issues,
    );
  }
  return parsed.data;
}

function observation(req: ParsedBudgetRequest, halo: HaloTerm): BudgetObservation {
  return {
    dmObs: req.dm_obs,
    dmObsErr: req.dm_obs_err,
    dmIsm: req.dm_ism,
    dmIsmErr: req.dm_ism_err ?? 0,
    ...(req.dm_mw_halo ? { dmMwHalo: req.dm_mw_halo } : {}),
    ...(halo.draws ? { haloDraws: halo.draws } : {}),
  };
}

type Analysis = Pick<
  BudgetResponse,
  | 'macquart_mean'
  | 'cosmic_mean_in_force'
  | 'components'
  | 'host_rest'
  | 'p_negative_host'
  | 'redshift_limit'
  | 'redshift_posterior'
  | 'draws'
  | 'seed'
  | 'conventions'
> & { messages: string[]; mwHaloSource: string };

function withRedshift(
  req: ParsedBudgetRequest,
  zSource: number,
  model: BudgetModel,
  cosmology: CosmologyModel,
  halo: HaloTerm,
): Analysis {
  const hp = hostPosterior({ ...observation(req, halo), zSource, cosmology, budgetModel: model });
  const { dm_obs: _obs, ...components } = hp.components;
  return {
    macquart_mean: hp.macquart_mean,
    cosmic_mean_in_force: hp.cosmic_mean_in_force,
    components,
    host_rest: hp.host_rest,
    p_negative_host: hp.p_negative_host,
    redshift_limit: null,
    redshift_posterior: null,
    draws: hp.draws,
    seed: hp.seed,
    conventions: hp.conventions,
    messages: hp.warnings,
    mwHaloSource: String(hp.assumptions.mw_halo),
  };
}

function withoutRedshift(
  req: ParsedBudgetRequest,
  model: BudgetModel,
  cosmology: CosmologyModel,
  halo: HaloTerm,
): Analysis {
  const opts = req.without_redshift ?? { confidence: 0.95, z_prior: 'flat' as const, z_max: 3 };
  const obs = observation(req, halo);
  const local = drawLocalTerms(obs, model, model.draws, model.seed);
  const common = { ...obs, cosmology, budgetModel: model };
  const limit = maxSourceRedshift({ ...common, confidence: opts.confidence, zMax: opts.z_max });
  const post = redshiftPosterior({
    ...common,
    zPrior: opts.z_prior,
    zGrid: { min: 0.01, max: opts.z_max, n: 150 },
  });
  return {
    macquart_mean: null,
    cosmic_mean_in_force: null,
    components: {
      mw_ism: summarise(local.ism),
      mw_halo: summarise(local.mwHalo),
      cosmic: null,
      halos: summarise(local.halos),
    },
    host_rest: null,
    p_negative_host: null,
    redshift_limit: {
      z_max: limit.z_max,
      z_upper: limit.z_upper,
      confidence: limit.confidence,
      p_negative_at_limit: limit.p_negative_at_limit,
      bracketed: limit.bracketed,
    },
    redshift_posterior: {
      z: post.z,
      density: post.posterior,
      median: post.median,
      interval68: post.interval68,
      mode: post.mode,
      prior: post.prior,
      host_prior: post.host_prior,
    },
    draws: model.draws,
    seed: model.seed,
    conventions: [
      ...new Set([
        ...limit.conventions,
        ...post.conventions,
        `redshift_limit is the largest z_s at which P(DM_host ≥ 0) ≥ ${limit.confidence}; beyond it the host term is negative in more than ${((1 - limit.confidence) * 100).toFixed(1)} % of draws. It is not a bound enclosing ${(limit.confidence * 100).toFixed(1)} % of the redshift posterior`,
      ]),
    ],
    messages: [...local.warnings, ...limit.warnings, ...post.warnings],
    mwHaloSource: local.mwHaloSource,
  };
}

/**
 * Turn a DM-budget request into the reply body (the one function behind POST /v1/budgets and
 * `forehalo budget`). With z_source: the host rest-frame posterior (src/budget hostPosterior);
 * without: the redshift limit and the z_s posterior. The foreground-halo term comes from a sightline
 * run with include_draws, from the caller's own draws or mean ± err, or is absent (with a warning).
 * Deterministic for a given request (seeded). Throws InputError for invalid requests.
 */
export async function computeBudget(deps: BudgetDeps, input: unknown): Promise<BudgetResponse> {
  const req = parseBudgetRequest(input);
  const model = resolveBudgetModel(req.budget_model);
  const spec = req.sightline ? (req.sightline.model?.cosmology ?? 'planck18') : (req.cosmology ?? 'planck18');
  const cosmology = (deps.cosmologies ?? sharedCosmologies)(spec);
  const halo = await resolveHaloTerm(deps.runSightline, req, model.draws, model.seed);
  const a =
    req.z_source === undefined
      ? withoutRedshift(req, model, cosmology, halo)
      : withRedshift(req, req.z_source, model, cosmology, halo);
  const { messages, mwHaloSource, ...analysis } = a;
  return {
    z_source: req.z_source ?? null,
    dm_obs: { value: req.dm_obs, err: req.dm_obs_err },
    ...analysis,
    halos_source: { kind: halo.kind, description: halo.description, draws_given: halo.draws?.length ?? 0 },
    sightline: sightlineEcho(halo.sightline),
    model: {
      budget: plain(model),
      sightline: halo.sightline ? plain(halo.sightline.model) : null,
      cosmology: cosmology.params.reference,
    },
    conventions: [...analysis.conventions, GALACTIC_MODEL_NOTE],
    assumptions: assumptionsFor(model, mwHaloSource, cosmology, halo),
    warnings: [...requestWarnings(req, halo.sightline), ...budgetWarnings(messages)],
    cautions: [...BUDGET_CAUTIONS],
    units: 'pc cm⁻³',
  };
}
