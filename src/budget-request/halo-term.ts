import { createRng, deriveSeed } from '../math/index.js';
import type { SightlineRequest, SightlineResponse } from '../sightline/index.js';
import type { ParsedBudgetRequest } from './request-schema.js';

/** The foreground-halo term as per-draw totals, with where it came from. */
export interface HaloTerm {
  draws: Float64Array | undefined;
  kind: 'sightline' | 'draws' | 'normal' | 'none';
  description: string;
  sightline: SightlineResponse | undefined;
}

/** Runs one sightline (the engine on a store, or the HTTP service's sightline runner). */
export type SightlineRunner = (request: SightlineRequest) => SightlineResponse | Promise<SightlineResponse>;

/** Stream index of the halo-term normal draws, apart from the budget's own streams 0–4. */
const HALO_NORMAL_STREAM = 16;

/** Normal draws truncated at zero by rejection (a DM cannot be negative); 0 if the mass below 0 is all. */
function truncatedNormalDraws(mean: number, err: number, n: number, seed: number): Float64Array {
  const rng = createRng(deriveSeed(seed, HALO_NORMAL_STREAM));
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let x = mean;
    if (err > 0) {
      x = 0;
      for (let k = 0; k < 1000; k++) {
        const t = mean + err * rng.normal();
        if (t >= 0) {
          x = t;
          break;
        }
      }
    }
    out[i] = x;
  }
  return out;
}

/**
 * The halo term of a budget request: the sightline engine's per-draw totals (include_draws), the
 * caller's own draws, draws from the caller's mean ± err, or nothing (the budget then warns).
 */
export async function resolveHaloTerm(
  runSightline: SightlineRunner,
  req: ParsedBudgetRequest,
  budgetDraws: number,
  budgetSeed: number,
): Promise<HaloTerm> {
  if (req.sightline !== undefined && req.z_source !== undefined) {
    const s = req.sightline;
    const result = await runSightline({
      ra: s.ra,
      dec: s.dec,
      z_source: req.z_source,
      ...(s.z_source_err !== undefined ? { z_source_err: s.z_source_err } : {}),
      ...(s.catalogs !== undefined ? { catalogs: s.catalogs } : {}),
      ...(s.host_id !== undefined ? { host_id: s.host_id } : {}),
      ...(s.model !== undefined ? { model: s.model } : {}),
      include_draws: true,
    });
    const t = result.totals;
    return {
      draws: Float64Array.from(result.draws_dm ?? []),
      kind: 'sightline',
      description:
        `sightline at RA ${s.ra}°, Dec ${s.dec}°: ${t.n_candidates} foreground candidates, ` +
        `${t.n_intersected} intersected; per-draw totals (${t.draws} draws, seed ${t.seed}) resampled`,
      sightline: result,
    };
  }
  const h = req.halos;
  if (h === undefined) {
    return {
      draws: undefined,
      kind: 'none',
      description: 'no foreground-halo term (0)',
      sightline: undefined,
    };
  }
  if ('draws' in h) {
    return {
      draws: Float64Array.from(h.draws),
      kind: 'draws',
      description: `caller's ${h.draws.length} per-draw foreground-halo totals, resampled with replacement`,
      sightline: undefined,
    };
  }
  return {
    draws: truncatedNormalDraws(h.mean, h.err, budgetDraws, budgetSeed),
    kind: 'normal',
    description: `caller's foreground-halo total ${h.mean} ± ${h.err} pc cm⁻³ (normal, truncated at 0)`,
    sightline: undefined,
  };
}
