import type { BudgetModel } from '../budget/index.js';
import type { CosmologyModel } from '../cosmology/index.js';
import type { SightlineResponse } from '../sightline/index.js';
import type { HaloTerm } from './halo-term.js';
import type { ParsedBudgetRequest } from './request-schema.js';
import type { BudgetResponse, BudgetWarning } from './response-schema.js';

/** Sentences every budget reply states, whatever the analysis. */
export const GALACTIC_MODEL_NOTE =
  'forehalo ships no Galactic electron-density model: mw_ism is the value (± error) the caller took from the model of their choice';

/** The budget's plain-string warnings as coded entries, without repeats. */
export function budgetWarnings(messages: readonly string[]): BudgetWarning[] {
  return [...new Set(messages)].map((message) => ({ source: 'budget', code: 'budget', message }));
}

/** Warnings about the request itself, and the sightline's own (minus the one the budget restates). */
export function requestWarnings(
  req: ParsedBudgetRequest,
  sightline: SightlineResponse | undefined,
): BudgetWarning[] {
  const out: BudgetWarning[] = [];
  if (req.dm_ism_err === undefined) {
    out.push({
      source: 'request',
      code: 'dm_ism_err_missing',
      message:
        'dm_ism_err not given: the Milky Way ISM term is treated as exact; Galactic models can be off by a factor of ~2 on some sightlines',
    });
  }
  if (req.sightline?.z_source_err !== undefined && req.sightline.z_source_err > 0) {
    out.push({
      source: 'request',
      code: 'z_source_err_halos_only',
      message:
        'sightline.z_source_err enters the foreground-halo term only (P(foreground)); the cosmic term is evaluated at z_source',
    });
  }
  for (const w of sightline?.warnings ?? []) {
    // The budget states the cosmic double-counting convention itself (conventions, and a warning in 'full' mode).
    if (w.code === 'cosmic_double_counting') continue;
    out.push({ source: 'sightline', code: w.code, message: w.message });
  }
  return out;
}

/** Model-dependent inputs in words and numbers (the same keys with and without z_s). */
export function assumptionsFor(
  model: BudgetModel,
  mwHaloSource: string,
  cosmology: CosmologyModel,
  halo: HaloTerm,
): Record<string, string | number> {
  return {
    mw_ism: "caller's Galactic-model value ± error, normal, truncated at 0",
    mw_halo: mwHaloSource,
    halos: halo.description,
    f_d: model.f_d_table ? 'table (see model.budget.f_d_table)' : model.f_d,
    f_igm: model.f_igm,
    F: model.F,
    he_reion_z: model.he_reion_z,
    cosmology: cosmology.params.reference,
  };
}

/** The sightline part of the reply (null when the halo term did not come from a sightline). */
export function sightlineEcho(s: SightlineResponse | undefined): BudgetResponse['sightline'] {
  if (s === undefined) return null;
  return {
    ra: s.sightline.ra,
    dec: s.sightline.dec,
    z_source: s.sightline.z_source,
    z_source_err: s.sightline.z_source_err,
    catalogs: s.sightline.catalogs,
    host_id: s.sightline.host_id,
    dm_halos: s.totals.dm_halos,
    n_candidates: s.totals.n_candidates,
    n_intersected: s.totals.n_intersected,
    draws: s.totals.draws,
    seed: s.totals.seed,
  };
}

/** Drops undefined keys so the echo is identical however the body is serialised. */
export function plain<T>(value: T): Record<string, unknown> {
  return JSON.parse(JSON.stringify(value)) as Record<string, unknown>;
}
