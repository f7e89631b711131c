import { InputError } from '../errors.js';
import { createRng, deriveSeed, type Rng } from '../math/index.js';
import type { BudgetModel } from './model.js';

/** What the caller measured or assumed for the non-cosmic terms (all pc cm⁻³, observer frame). */
export interface BudgetObservation {
  /** Observed DM and its 1σ error. */
  dmObs: number;
  dmObsErr: number;
  /** Milky Way ISM DM from a Galactic electron-density model, with 1σ error. */
  dmIsm: number;
  dmIsmErr: number;
  /** Milky Way halo DM ± 1σ; when absent the budget model's mw_halo prior is used. */
  dmMwHalo?: { mean: number; err: number };
  /** Per-draw totals of foreground-halo DM (observer frame), resampled with replacement. */
  haloDraws?: Float64Array;
}

export interface LocalDraws {
  obs: Float64Array;
  ism: Float64Array;
  mwHalo: Float64Array;
  halos: Float64Array;
  mwHaloSource: string;
  warnings: string[];
}

function need(ok: boolean, field: string, reason: string): void {
  if (!ok) throw new InputError('budget_input_invalid', `${field}: ${reason}`, { field });
}

export function validateObservation(o: BudgetObservation): void {
  const finite = (v: unknown) => typeof v === 'number' && Number.isFinite(v);
  need(finite(o.dmObs) && o.dmObs > 0, 'dmObs', `must be a finite number > 0 pc cm⁻³, got ${o.dmObs}`);
  need(finite(o.dmObsErr) && o.dmObsErr >= 0, 'dmObsErr', `must be a finite number ≥ 0, got ${o.dmObsErr}`);
  need(finite(o.dmIsm) && o.dmIsm >= 0, 'dmIsm', `must be a finite number ≥ 0 pc cm⁻³, got ${o.dmIsm}`);
  need(finite(o.dmIsmErr) && o.dmIsmErr >= 0, 'dmIsmErr', `must be a finite number ≥ 0, got ${o.dmIsmErr}`);
  if (o.dmMwHalo !== undefined) {
    need(
      finite(o.dmMwHalo.mean) && o.dmMwHalo.mean >= 0,
      'dmMwHalo.mean',
      `must be ≥ 0, got ${o.dmMwHalo.mean}`,
    );
    need(finite(o.dmMwHalo.err) && o.dmMwHalo.err >= 0, 'dmMwHalo.err', `must be ≥ 0, got ${o.dmMwHalo.err}`);
  }
  if (o.haloDraws !== undefined) {
    need(o.haloDraws.length > 0, 'haloDraws', 'must hold at least one draw (or be omitted)');
    for (let i = 0; i < o.haloDraws.length; i++) {
      const v = o.haloDraws[i];
      need(Number.isFinite(v) && v >= 0, `haloDraws[${i}]`, `must be a finite number ≥ 0, got ${v}`);
    }
  }
}

/** A normal draw truncated at zero (DM terms cannot be negative), by rejection. */
function positiveNormal(rng: Rng, mean: number, sd: number): number {
  if (sd === 0) return mean;
  for (let k = 0; k < 1000; k++) {
    const x = mean + sd * rng.normal();
    if (x >= 0) return x;
  }
  return 0;
}

/**
 * Draw the observed DM and the non-cosmic terms. Each term has its own random stream
 * (deriveSeed(seed, k)), so changing one input leaves the other terms' draws unchanged.
 * MW ISM and MW halo normals are truncated at zero; the observed DM is not.
 */
export function drawLocalTerms(
  o: BudgetObservation,
  model: BudgetModel,
  draws: number,
  seed: number,
): LocalDraws {
  const rngObs = createRng(deriveSeed(seed, 0));
  const rngIsm = createRng(deriveSeed(seed, 1));
  const rngMw = createRng(deriveSeed(seed, 2));
  const rngHalo = createRng(deriveSeed(seed, 3));
  const obs = new Float64Array(draws);
  const ism = new Float64Array(draws);
  const mwHalo = new Float64Array(draws);
  const halos = new Float64Array(draws);
  const warnings: string[] = [];
  const prior = model.mw_halo;
  let mwHaloSource: string;
  if (o.dmMwHalo)
    mwHaloSource = `user value ${o.dmMwHalo.mean} ± ${o.dmMwHalo.err} pc cm⁻³ (normal, truncated at 0)`;
  else if (prior.kind === 'uniform')
    mwHaloSource = `default prior uniform ${prior.min}–${prior.max} pc cm⁻³ (common practice: a few tens of pc cm⁻³)`;
  else mwHaloSource = `prior normal ${prior.mean} ± ${prior.sd} pc cm⁻³ (truncated at 0)`;
  for (let i = 0; i < draws; i++) {
    obs[i] = o.dmObs + o.dmObsErr * rngObs.normal();
    ism[i] = positiveNormal(rngIsm, o.dmIsm, o.dmIsmErr);
    if (o.dmMwHalo) mwHalo[i] = positiveNormal(rngMw, o.dmMwHalo.mean, o.dmMwHalo.err);
    else if (prior.kind === 'uniform') mwHalo[i] = prior.min + (prior.max - prior.min) * rngMw.uniform();
    else mwHalo[i] = positiveNormal(rngMw, prior.mean, prior.sd);
  }
  const hd = o.haloDraws;
  if (hd === undefined) {
    warnings.push('no foreground-halo draws given: the foreground-halo term is 0');
  } else {
    for (let i = 0; i < draws; i++) halos[i] = hd[Math.floor(rngHalo.uniform() * hd.length)];
  }
  return { obs, ism, mwHalo, halos, mwHaloSource, warnings };
}
