import { readFileSync } from 'node:fs';
import type { BudgetRequest } from '../budget-request/index.js';
import { InputError } from '../errors.js';

/** The flags of `forehalo budget` as commander hands them over (strings, or string lists). */
export interface BudgetFlags {
  dmObs?: string;
  dmObsErr?: string;
  dmIsm?: string;
  dmIsmErr?: string;
  dmMwHalo?: string;
  dmMwHaloErr?: string;
  z?: string;
  zErr?: string;
  ra?: string;
  dec?: string;
  catalog?: string[];
  hostId?: string;
  model?: string;
  budgetModel?: string;
  draws?: string;
  seed?: string;
  json?: boolean;
}

function flagError(flag: string, reason: string): InputError {
  return new InputError('bad_flag', `${flag}: ${reason}`, { issues: [{ field: flag, reason }] });
}

/** A decimal number from a flag; anything else names the flag. */
export function numberFlag(flag: string, raw: string | undefined): number | undefined {
  if (raw === undefined) return undefined;
  const text = raw.trim();
  const v = Number(text);
  if (text === '' || !Number.isFinite(v)) throw flagError(flag, `'${raw}' is not a finite number`);
  return v;
}

function integerFlag(flag: string, raw: string | undefined): number | undefined {
  const v = numberFlag(flag, raw);
  if (v !== undefined && !Number.isInteger(v)) throw flagError(flag, `'${raw}' is not an integer`);
  return v;
}

/** A JSON object from a file named by a flag; unreadable files and bad JSON name the flag and file. */
export function jsonFileFlag(flag: string, path: string | undefined): Record<string, unknown> | undefined {
  if (path === undefined) return undefined;
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    throw flagError(
      flag,
      `cannot read ${path}: ${(err as NodeJS.ErrnoException).code ?? (err as Error).message}`,
    );
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (err) {
    throw flagError(flag, `${path} is not valid JSON: ${(err as Error).message}`);
  }
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    throw flagError(flag, `${path} must hold a JSON object of model keys`);
  }
  return value as Record<string, unknown>;
}

/**
 * Flags → the same request object POST /v1/budgets takes (validated later by the shared schema).
 * --draws and --seed set the budget's Monte Carlo, and the sightline's unless --model sets them.
 */
export function budgetRequestFromFlags(f: BudgetFlags): BudgetRequest {
  const draws = integerFlag('--draws', f.draws);
  const seed = integerFlag('--seed', f.seed);
  const budgetModel = { ...(jsonFileFlag('--budget-model', f.budgetModel) ?? {}) };
  if (draws !== undefined) budgetModel.draws = draws;
  if (seed !== undefined) budgetModel.seed = seed;

  const ra = numberFlag('--ra', f.ra);
  const dec = numberFlag('--dec', f.dec);
  const wantsSightline =
    ra !== undefined ||
    dec !== undefined ||
    f.catalog !== undefined ||
    f.hostId !== undefined ||
    f.model !== undefined ||
    f.zErr !== undefined;
  if (wantsSightline && (ra === undefined || dec === undefined)) {
    throw flagError(
      ra === undefined ? '--ra' : '--dec',
      'the foreground-halo sightline needs both --ra and --dec (--catalog, --host-id, --model and --z-err only apply to it)',
    );
  }

  const request: Record<string, unknown> = {
    dm_obs: numberFlag('--dm-obs', f.dmObs),
    dm_ism: numberFlag('--dm-ism', f.dmIsm),
  };
  const optional: [string, number | undefined][] = [
    ['dm_obs_err', numberFlag('--dm-obs-err', f.dmObsErr)],
    ['dm_ism_err', numberFlag('--dm-ism-err', f.dmIsmErr)],
    ['z_source', numberFlag('--z', f.z)],
  ];
  for (const [key, v] of optional) if (v !== undefined) request[key] = v;

  const mwHalo = numberFlag('--dm-mw-halo', f.dmMwHalo);
  const mwHaloErr = numberFlag('--dm-mw-halo-err', f.dmMwHaloErr);
  if (mwHaloErr !== undefined && mwHalo === undefined) {
    throw flagError(
      '--dm-mw-halo-err',
      'give --dm-mw-halo as well (without both, the budget model prior is used)',
    );
  }
  if (mwHalo !== undefined) request.dm_mw_halo = { mean: mwHalo, err: mwHaloErr ?? 0 };

  if (wantsSightline) {
    const model = { ...(jsonFileFlag('--model', f.model) ?? {}) };
    if (draws !== undefined && model.draws === undefined) model.draws = draws;
    if (seed !== undefined && model.seed === undefined) model.seed = seed;
    const zErr = numberFlag('--z-err', f.zErr);
    request.sightline = {
      ra,
      dec,
      ...(f.catalog ? { catalogs: f.catalog } : {}),
      ...(f.hostId !== undefined ? { host_id: f.hostId } : {}),
      ...(zErr !== undefined ? { z_source_err: zErr } : {}),
      ...(Object.keys(model).length > 0 ? { model } : {}),
    };
  }
  if (Object.keys(budgetModel).length > 0) request.budget_model = budgetModel;
  return request as BudgetRequest;
}

const FLAG_OF_KEY: [RegExp, string][] = [
  [/^dm_obs$/, '--dm-obs'],
  [/^dm_obs_err$/, '--dm-obs-err'],
  [/^dm_ism$/, '--dm-ism'],
  [/^dm_ism_err$/, '--dm-ism-err'],
  [/^dm_mw_halo\.mean$/, '--dm-mw-halo'],
  [/^dm_mw_halo\.err$/, '--dm-mw-halo-err'],
  [/^z_source$/, '--z'],
  [/^sightline\.ra$/, '--ra'],
  [/^sightline\.dec$/, '--dec'],
  [/^sightline\.catalogs/, '--catalog'],
  [/^sightline\.host_id$/, '--host-id'],
  [/^sightline\.z_source_err$/, '--z-err'],
  [/^sightline\.model\.(draws|seed)$/, '--draws/--seed or --model'],
  [/^sightline\.model/, '--model'],
  [/^budget_model\.draws$/, '--draws'],
  [/^budget_model\.seed$/, '--seed'],
  [/^budget_model/, '--budget-model'],
];

/** The flag that sets a request key, for error messages ('dm_obs' → '--dm-obs'). */
export function flagForKey(key: string): string {
  for (const [re, flag] of FLAG_OF_KEY) if (re.test(key)) return flag;
  return key;
}
