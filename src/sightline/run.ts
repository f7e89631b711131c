import type { z } from 'zod';
import { InputError } from '../errors.js';
import { ARCSEC, C_KM_S } from '../math/index.js';
import { describeIssues, type Model, parseModel } from '../model/index.js';
import { classifyCandidates } from './classify.js';
import { haloRadiusFromDensity } from './kit.js';
import { createKitCache, type KitProvider } from './kit-cache.js';
import { runMonteCarlo } from './monte-carlo.js';
import { foregroundThreshold } from './p-foreground.js';
import { type PreparedGalaxy, prepareGalaxy } from './prepare.js';
import { sampleVariance, varianceReductionByBinning } from './priorities.js';
import { velocityWindowDz } from './redshift-range.js';
import {
  type EnvironmentEntry,
  type GalaxyResult,
  type PriorityEntry,
  type SightlineResponse,
  sightlineRequestSchema,
} from './schemas.js';
import { findCandidates } from './search.js';
import { fractionPositive, summarizeDraws } from './summarize.js';
import type { CatalogRow, ConeSearchFn } from './types.js';
import { sightlineWarnings } from './warnings.js';

export interface SightlineDeps {
  /** The catalogue cone search (the store's, or any function with the same contract). */
  readonly coneSearch: ConeSearchFn;
  /** Kit provider; default: a shared small LRU cache of real kits. */
  readonly kits?: KitProvider;
  /** If given, wall-clock milliseconds per phase are added to it (benchmarks). */
  readonly timings?: SightlineTimings;
  /** Fixed cost of one store query in returned rows (query-plan.ts; default QUERY_COST_ROWS; 0 = one query per shell). */
  readonly queryCostRows?: number;
}

/** Accumulated wall time per phase [ms]: candidate search (incl. the store), halo model, Monte Carlo, summaries. */
export interface SightlineTimings {
  search: number;
  /** Store queries made (not a time). */
  queries: number;
  halo: number;
  monteCarlo: number;
  summary: number;
}

const sharedKits = createKitCache();

/** Validate a request; InputError('bad_request') names every offending field. */
export function parseSightlineRequest(input: unknown) {
  const parsed = sightlineRequestSchema.safeParse(input);
  if (!parsed.success) {
    const issues = describeIssues(parsed.error.issues);
    throw new InputError(
      'bad_request',
      `invalid sightline request: ${issues.map((i) => `${i.key}: ${i.message}`).join('; ')}`,
      issues,
    );
  }
  return parsed.data;
}

function compareRows(a: CatalogRow, b: CatalogRow): number {
  if (a.objectId !== b.objectId) return a.objectId < b.objectId ? -1 : 1;
  return (
    a.z - b.z ||
    a.raDeg - b.raDeg ||
    a.decDeg - b.decDeg ||
    (a.catalog < b.catalog ? -1 : a.catalog > b.catalog ? 1 : 0)
  );
}

/** The fields that name a catalogue row and place it, first in every galaxy entry of a result. */
function rowIdentity(r: PreparedGalaxy['cand']['row']) {
  return {
    id: r.objectId,
    catalog: r.catalog,
    ra: r.raDeg,
    dec: r.decDeg,
    z: r.z,
    z_err: r.zErr,
    z_kind: r.zKind,
  };
}

function galaxyResult(g: PreparedGalaxy, perGalaxy: Float64Array): GalaxyResult {
  const r = g.cand.row;
  return {
    ...rowIdentity(r),
    sep_arcsec: g.sepRad / ARCSEC,
    b_kpc: g.bKpc,
    log_mstar: r.logMstar,
    log_mhalo: g.logMhalo,
    r_halo_kpc: g.rHaloKpc,
    b_over_rhalo: g.bKpc / g.rHaloKpc,
    concentration: g.concentration,
    p_fg: g.pFg,
    dm_central: g.dmCentral,
    dm: summarizeDraws(perGalaxy),
    p_contributes: fractionPositive(perGalaxy),
    flags: g.flags,
  };
}

/**
 * The main job: find the galaxies whose haloes the sightline passes through or near, estimate each
 * halo's DM with Monte Carlo uncertainties, sum them per draw, and rank the photometric neighbours by how
 * much a spectroscopic redshift would shrink the uncertainty of the sum. Deterministic for a given
 * request (seeded). Throws InputError for invalid requests.
 */
export function runSightline(deps: SightlineDeps, request: unknown): SightlineResponse {
  return runParsedSightline(deps, parseSightlineRequest(request));
}

/** A request as sightlineRequestSchema outputs it (defaults filled in, model keys checked). */
export type ParsedSightlineRequest = z.output<typeof sightlineRequestSchema>;

/**
 * runSightline for a request that already went through sightlineRequestSchema (the server's route
 * validation does that): saves parsing it, and its model, a second time.
 */
export function runParsedSightline(deps: SightlineDeps, req: ParsedSightlineRequest): SightlineResponse {
  const model = req.model ? (Object.freeze(req.model) as Model) : parseModel(undefined);
  const kit = (deps.kits ?? sharedKits)(model);
  const zSource = req.z_source;
  const zSourceErr = req.z_source_err ?? 0;
  const zSourceHi = zSource + model.photo_z_k * zSourceErr;
  const clock = deps.timings ? () => performance.now() : () => 0;
  let t0 = clock();
  const search = findCandidates(
    deps.coneSearch,
    kit,
    {
      raDeg: req.ra,
      decDeg: req.dec,
      zSourceHi,
      catalogs: req.catalogs,
    },
    { queryCostRows: deps.queryCostRows },
  );
  let t1 = clock();
  if (deps.timings) {
    deps.timings.search += t1 - t0;
    deps.timings.queries += search.queries;
  }
  t0 = t1;
  const cls = classifyCandidates(search.candidates, kit, zSource, zSourceErr, req.host_id);
  const ctx = { zSource, zSourceErr };
  // A canonical order (id, z, position) makes the per-draw sums independent of how the store ordered
  // or split the rows, to the last bit.
  const canonical = [...cls.foreground].sort((a, b) => compareRows(a.cand.row, b.cand.row));
  const prepared = canonical.map((f) => prepareGalaxy(f.cand, kit, ctx, f.countable));
  for (const g of prepared) {
    const dups = search.duplicates.get(g.cand.row);
    if (dups)
      g.flags.push(
        `duplicates_merged:${dups
          .map((d) => `${d.catalog}/${d.objectId}`)
          .sort()
          .join(',')}`,
      );
  }
  t1 = clock();
  if (deps.timings) deps.timings.halo += t1 - t0;
  t0 = t1;
  const mc = runMonteCarlo(kit, prepared, { draws: model.draws, seed: model.seed, zSource, zSourceErr });
  t1 = clock();
  if (deps.timings) deps.timings.monteCarlo += t1 - t0;
  t0 = t1;
  const n = mc.draws;
  const galaxies = prepared.map((g, i) => galaxyResult(g, mc.perGalaxy.subarray(i * n, (i + 1) * n)));

  const varTotal = sampleVariance(mc.total);
  const ranked: Omit<PriorityEntry, 'rank'>[] = [];
  prepared.forEach((g, i) => {
    if (!g.isPhoto || g.mode === 'none') return;
    // A galaxy that never contributes cannot change the total: its reduction is 0 without binning.
    const red =
      galaxies[i].p_contributes > 0
        ? varianceReductionByBinning(mc.zDrawn.subarray(i * n, (i + 1) * n), mc.total)
        : 0;
    const r = g.cand.row;
    ranked.push({
      id: r.objectId,
      catalog: r.catalog,
      z: r.z,
      z_err: r.zErr,
      p_fg: g.pFg,
      var_reduction_pc2_cm6: red,
      var_fraction: varTotal > 0 ? red / varTotal : 0,
    });
  });
  ranked.sort((a, b) => b.var_reduction_pc2_cm6 - a.var_reduction_pc2_cm6);
  const priorities = ranked.slice(0, model.priorities_top).map((p, k) => ({ rank: k + 1, ...p }));

  // Nearest first (then by id): the listing does not depend on how the store queries were grouped.
  const nearestFirst = [...cls.environment].sort(
    (a, b) => a.cand.sepRad - b.cand.sepRad || compareRows(a.cand.row, b.cand.row),
  );
  const environment: EnvironmentEntry[] = nearestFirst.map(({ cand, isHost }) => {
    const r = cand.row;
    const bKpc = cand.sepRad * kit.angularDiameterDistanceKpc(r.z);
    const rHalo = haloRadiusFromDensity(10 ** cand.halo.logMhalo, kit.haloDensityMsunKpc3(r.z));
    return {
      ...rowIdentity(r),
      sep_arcsec: cand.sepRad / ARCSEC,
      b_kpc: bKpc,
      dv_kms: (C_KM_S * (r.z - zSource)) / (1 + zSource),
      log_mstar: r.logMstar,
      log_mhalo: cand.halo.logMhalo,
      b_over_rhalo: bKpc / rHalo,
      is_host: isHost,
    };
  });

  const nIntersected = prepared.filter((g) => g.dmCentral > 0).length;
  const order = galaxies.map((_, i) => i).sort((a, b) => galaxies[b].dm.mean - galaxies[a].dm.mean || a - b);
  const response: SightlineResponse = {
    sightline: {
      ra: req.ra,
      dec: req.dec,
      z_source: zSource,
      z_source_err: zSourceErr,
      host_id: req.host_id ?? null,
      catalogs: req.catalogs ?? null,
      velocity_window_dz: velocityWindowDz(zSource, model.velocity_window_kms),
      z_foreground_max: foregroundThreshold(zSource, model.velocity_window_kms),
      shells: search.shells.length,
      max_cone_deg: Math.max(...search.shells.map((s) => s.radiusDeg)),
      rows_scanned: search.rowsScanned,
      n_behind: cls.behind,
    },
    model: model as unknown as Record<string, unknown>,
    totals: {
      dm_halos: summarizeDraws(mc.total),
      n_candidates: galaxies.length,
      n_intersected: nIntersected,
      draws: n,
      seed: model.seed,
    },
    galaxies: order.map((i) => galaxies[i]),
    environment,
    priorities,
    warnings: sightlineWarnings({
      galaxies: prepared,
      shells: search.shells,
      rowsWithoutMass: search.rowsWithoutMass,
      hostId: req.host_id,
      hostSeen: cls.hostSeen,
      maxSearchDeg: model.max_search_deg,
    }),
  };
  if (req.include_draws) response.draws_dm = Array.from(mc.total);
  if (deps.timings) deps.timings.summary += clock() - t0;
  return response;
}
