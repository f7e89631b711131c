import { DEG } from '../math/index.js';
import { separationRad } from '../sky/index.js';
import { type CentralHalo, centralHalo } from './central-halo.js';
import { resolveDuplicates } from './duplicates.js';
import { type HaloKit, haloRadiusFromDensity } from './kit.js';
import {
  type ConeWindow,
  estimateDensity,
  mergeWindows,
  probeShellIndex,
  QUERY_COST_ROWS,
} from './query-plan.js';
import { searchRedshiftRange, velocityWindowDz } from './redshift-range.js';
import type { CatalogRow, ConeSearchFn } from './types.js';

/** Where to look: the burst position [deg] and the highest source redshift considered. */
export interface SearchTarget {
  readonly raDeg: number;
  readonly decDeg: number;
  /** Upper end of the source redshift (z_s + k σ_s when z_s is uncertain). */
  readonly zSourceHi: number;
  readonly catalogs?: readonly string[];
}

/** One redshift shell of catalogued z and the cone radius that covers every halo it may hold. */
export interface SearchShell {
  readonly zLo: number;
  readonly zHi: number;
  readonly radiusDeg: number;
  /** True when the radius was cut to model.max_search_deg. */
  readonly capped: boolean;
  /**
   * For the wide cone of the massive tier only: rows with log M* below minLogMstar and a catalogued halo
   * mass below minLogMhalo (or none) cannot host a halo above TIER_LOG_MHALO, so a store may skip them.
   */
  readonly minLogMstar?: number;
  readonly minLogMhalo?: number;
}

/** A row that passed the exact selection, with the numbers computed on the way. */
export interface Candidate {
  readonly row: CatalogRow;
  readonly sepRad: number;
  readonly halo: CentralHalo;
  readonly zRange: { readonly zLo: number; readonly zHi: number; readonly truncated: boolean };
}

// Shell edges grow by at most ×1.6 in z and +0.1 in width, so that D_A, and with it the cone angle,
// changes by a modest factor across a shell (design choice, no source).
const SHELL_RATIO = 1.6;
const SHELL_MAX_WIDTH = 0.1;
// Radii are widened by this relative margin so round-off at the boundary never drops a row.
const RADIUS_MARGIN = 1e-9;
// Shells whose cone is at least this fraction of the previous (merged) cone join it (design choice).
const MERGE_RATIO = 0.8;

/** Highest catalogued z a row may have and still reach in front of, or into, the burst environment. */
export function queryZMax(kit: HaloKit, zSourceHi: number): number {
  const zFront = zSourceHi + velocityWindowDz(zSourceHi, kit.model.velocity_window_kms);
  const w = kit.model.photo_z_width;
  // A photometric row reaches down to z − w(1+z) ≤ zFront ⇔ z ≤ (zFront + w)/(1 − w).
  return Math.max(zFront, (zFront + w) / (1 - w));
}

/**
 * Two mass tiers: every row is searched out to the angle a halo of 10^TIER_LOG_MHALO M☉ needs; only rows
 * that could hold a larger halo (by stellar mass through the SHMR, or by catalogued halo mass) are searched
 * out to the ceiling's angle. TIER_MARGIN_DEX covers the change of mass definition (≲ 0.2 dex between
 * 200c, 200m and vir, physics.md §2.1) and the SHMR's z-evolution between grid points (design choices).
 */
const TIER_LOG_MHALO = 13;
const TIER_MARGIN_DEX = 0.5;

/** Largest angle [rad] at which a halo of at most 10^logM with z in [zLo, zHi] can be a candidate. */
function maxAngleRad(kit: HaloKit, zLo: number, zHi: number, logM = kit.model.log_mhalo_max): number {
  const m = kit.model;
  const rMax = haloRadiusFromDensity(10 ** logM, kit.haloDensityMsunKpc3(zLo));
  // D_A(z) rises then falls (single maximum), so its minimum over an interval is at an end.
  const dMin = Math.min(kit.angularDiameterDistanceKpc(zLo), kit.angularDiameterDistanceKpc(zHi));
  return (m.search * rMax) / dMin;
}

/**
 * Split catalogued redshift [z_min, zMax] into shells; each shell's cone is wide enough for the largest
 * allowed halo (model.log_mhalo_max) at the lowest redshift any of its rows may occupy (spectroscopic rows:
 * the shell's lower edge; photometric rows: z − w(1+z), not below photo_z_floor), at the smallest D_A
 * over the reachable interval; capped at model.max_search_deg. Consecutive shells whose radii differ by
 * less than MERGE_RATIO are merged into one query (the store returns every z ≤ zMax in a cone, so
 * repeating nearly equal cones only rescans the same rows). The shell edges do not depend on zMax
 * (only the last shell is cut there), so each kit keeps its full shells and reuses them.
 */
export function planShells(kit: HaloKit, zSourceHi: number): SearchShell[] {
  const m = kit.model;
  const zMax = queryZMax(kit, zSourceHi);
  if (!(m.z_min < zMax)) return [];
  const grid = shellGrid(kit, zMax);
  const all: SearchShell[] = [];
  const massive: SearchShell[] = [];
  for (const g of grid.shells) {
    if (g.hi > zMax) {
      // The last shell ends at zMax: computed afresh (zMax moves with every source redshift).
      const last = gridShell(kit, g.lo, zMax);
      all.push(last.all);
      if (last.massive) massive.push(last.massive);
      break;
    }
    all.push(g.all);
    if (g.massive) massive.push(g.massive);
    if (g.hi === zMax) break;
  }
  return [...mergeShells(all), ...mergeShells(massive)];
}

interface GridShell {
  readonly lo: number;
  readonly hi: number;
  readonly all: SearchShell;
  readonly massive?: SearchShell;
}

/** The full-width shells of one kit, in z order; extended on demand, kept with the kit (they never change). */
const gridCache = new WeakMap<HaloKit, { shells: GridShell[] }>();

function shellGrid(kit: HaloKit, zMax: number): { shells: GridShell[] } {
  let grid = gridCache.get(kit);
  if (!grid) {
    grid = { shells: [] };
    gridCache.set(kit, grid);
  }
  const shells = grid.shells;
  let lo = shells.length > 0 ? shells[shells.length - 1].hi : kit.model.z_min;
  // Extend until a full shell reaches past zMax (the last one is then recomputed to end at zMax).
  while (shells.length === 0 || shells[shells.length - 1].hi < zMax) {
    const hi = Math.min(lo * SHELL_RATIO, lo + SHELL_MAX_WIDTH);
    shells.push({ lo, hi, ...gridShell(kit, lo, hi) });
    lo = hi;
  }
  return grid;
}

/** Both tiers' cones of the shell [lo, hi]. */
function gridShell(kit: HaloKit, lo: number, hi: number): { all: SearchShell; massive?: SearchShell } {
  const m = kit.model;
  const tierLog = Math.min(TIER_LOG_MHALO, m.log_mhalo_max);
  const all = shellCone(kit, lo, hi, tierLog);
  if (!(tierLog < m.log_mhalo_max)) return { all };
  // Smallest log M* that maps to a native halo mass ≥ 10^(tier − margin) anywhere in [lo, hi].
  const native = tierLog - TIER_MARGIN_DEX;
  let minLogMstar = Number.POSITIVE_INFINITY;
  for (let k = 0; k <= 4; k++)
    minLogMstar = Math.min(minLogMstar, kit.shmrLogMstar(native, lo + ((hi - lo) * k) / 4));
  return {
    all,
    massive: {
      ...shellCone(kit, lo, hi, m.log_mhalo_max),
      minLogMstar: minLogMstar - 0.05,
      minLogMhalo: tierLog - TIER_MARGIN_DEX,
    },
  };
}

/** The cone of one shell for haloes up to 10^logM: spectroscopic and photometric reach, capped. */
function shellCone(kit: HaloKit, lo: number, hi: number, logM: number): SearchShell {
  const m = kit.model;
  const w = m.photo_z_width;
  const cap = m.max_search_deg * DEG;
  let theta = maxAngleRad(kit, lo, hi, logM);
  const photoLo = Math.max(m.z_min, m.photo_z_floor, lo - w * (1 + lo));
  const photoHi = hi + w * (1 + hi);
  if (photoLo <= photoHi) theta = Math.max(theta, maxAngleRad(kit, photoLo, photoHi, logM));
  theta *= 1 + RADIUS_MARGIN;
  return { zLo: lo, zHi: hi, radiusDeg: Math.min(theta, cap) / DEG, capped: theta > cap };
}

/** Merge consecutive shells whose cone is within MERGE_RATIO of the previous one (keeping the wider cone). */
function mergeShells(raw: readonly SearchShell[]): SearchShell[] {
  const merged: SearchShell[] = [];
  for (const s of raw) {
    const last = merged.at(-1);
    if (last && s.radiusDeg >= MERGE_RATIO * last.radiusDeg && s.radiusDeg <= last.radiusDeg) {
      merged[merged.length - 1] = {
        ...last,
        zHi: s.zHi,
        capped: last.capped || s.capped,
        ...(last.minLogMstar !== undefined
          ? { minLogMstar: Math.min(last.minLogMstar, s.minLogMstar!), minLogMhalo: last.minLogMhalo }
          : {}),
      };
    } else {
      merged.push(s);
    }
  }
  return merged;
}

/**
 * The exact selection rule, applied identically to rows found through the shells and in the
 * brute-force test: z ≥ z_min; separation ≤ max_search_deg; the row's redshift interval starts below
 * the top of the burst environment; and its impact parameter at the nearest point of that interval
 * (smallest D_A) is within search × r_halo, with r_halo from its central halo mass at the low end of
 * the interval (where r_halo is largest). Returns null for rows that are not candidates.
 */
export function selectCandidate(
  row: CatalogRow,
  target: SearchTarget,
  kit: HaloKit,
  zFrontMax: number,
): Candidate | null {
  const m = kit.model;
  if (!(row.z >= m.z_min)) return null;
  const zRange = searchRedshiftRange(row, m);
  if (zRange.zLo > zFrontMax || zRange.zLo > zRange.zHi) return null;
  const sepRad = separationRad(target.raDeg * DEG, target.decDeg * DEG, row.raDeg * DEG, row.decDeg * DEG);
  if (sepRad > m.max_search_deg * DEG) return null;
  const dMin = Math.min(
    kit.angularDiameterDistanceKpc(zRange.zLo),
    kit.angularDiameterDistanceKpc(zRange.zHi),
  );
  const bMin = sepRad * dMin;
  const density = kit.haloDensityMsunKpc3(zRange.zLo);
  // Cheap test with the ceiling mass first; the SHMR inversion only for rows that could pass.
  if (bMin > m.search * haloRadiusFromDensity(10 ** m.log_mhalo_max, density)) return null;
  const halo = centralHalo(row, kit);
  if (!halo) return null;
  if (bMin > m.search * haloRadiusFromDensity(10 ** halo.logMhalo, density)) return null;
  return { row, sepRad, halo, zRange };
}

export interface SearchResult {
  readonly candidates: Candidate[];
  readonly shells: SearchShell[];
  /** Store queries made (planned shells after merging, query-plan.ts). */
  readonly queries: number;
  /** Distinct rows returned by the store over all shells (before duplicates and the exact selection). */
  readonly rowsScanned: number;
  /** Rows in the cones that had neither a stellar nor a halo mass. */
  readonly rowsWithoutMass: number;
  /** For a kept row, the cross-catalogue duplicates it stands for. */
  readonly duplicates: Map<CatalogRow, CatalogRow[]>;
}

/** How findCandidates groups its store queries. */
export interface FetchOptions {
  /** Fixed cost of one query in returned rows (see QUERY_COST_ROWS); 0 keeps every planned shell apart. */
  readonly queryCostRows?: number;
}

/**
 * Query the store and return the distinct rows (by catalogue + id), each within the z range of the
 * query that returned it. The unhinted shell expected to hold most rows is queried first, as planned;
 * its rows estimate the surface density, from which the remaining shells are merged into fewer, wider
 * queries where that is cheaper (query-plan.ts). Every merged query covers its shells, so the rows
 * the exact selection keeps do not depend on the merging.
 */
export function fetchShells(
  coneSearch: ConeSearchFn,
  target: SearchTarget,
  shells: readonly SearchShell[],
  options: FetchOptions = {},
): { rows: CatalogRow[]; queries: number } {
  const seen = new Set<string>();
  const out: CatalogRow[] = [];
  const run = (w: ConeWindow): readonly CatalogRow[] => {
    const rows = coneSearch({
      raDeg: target.raDeg,
      decDeg: target.decDeg,
      radiusDeg: w.radiusDeg,
      catalogs: target.catalogs,
      zMin: w.zLo,
      zMax: w.zHi,
      ...(w.minLogMstar !== undefined ? { minLogMstar: w.minLogMstar, minLogMhalo: w.minLogMhalo } : {}),
    });
    for (const row of rows) {
      if (row.z < w.zLo || row.z > w.zHi) continue;
      const key = `${row.catalog}\u0000${row.objectId}`;
      if (seen.has(key)) continue;
      seen.add(key);
      out.push(row);
    }
    return rows;
  };
  const costRows = options.queryCostRows ?? QUERY_COST_ROWS;
  const probe = shells.length > 2 && costRows > 0 ? probeShellIndex(shells) : -1;
  if (probe < 0) {
    for (const s of shells) run(s);
    return { rows: out, queries: shells.length };
  }
  const estimate = estimateDensity(shells[probe], run(shells[probe]));
  const rest = mergeWindows(
    shells.filter((_, i) => i !== probe),
    estimate,
    costRows,
  );
  for (const w of rest) run(w);
  return { rows: out, queries: 1 + rest.length };
}

/**
 * Candidate search: plan the shells, query the store, keep one row per physical galaxy (before the
 * selection, so a spectroscopic redshift overrules its photometric twin), then apply selectCandidate.
 * A duplicate whose preferred twin lies outside every shell's redshift range is not seen and cannot
 * overrule (documented limitation).
 */
export function findCandidates(
  coneSearch: ConeSearchFn,
  kit: HaloKit,
  target: SearchTarget,
  options: FetchOptions = {},
): SearchResult {
  const shells = planShells(kit, target.zSourceHi);
  const zFrontMax = target.zSourceHi + velocityWindowDz(target.zSourceHi, kit.model.velocity_window_kms);
  const { rows, queries } = fetchShells(coneSearch, target, shells, options);
  const { kept, dropped } = resolveDuplicates(rows);
  const candidates: Candidate[] = [];
  let rowsWithoutMass = 0;
  for (const row of kept) {
    if (row.logMstar === null && (row.logMhalo === null || row.logMhalo === undefined)) {
      rowsWithoutMass++;
      continue;
    }
    const cand = selectCandidate(row, target, kit, zFrontMax);
    if (cand) candidates.push(cand);
  }
  return { candidates, shells, queries, rowsScanned: rows.length, rowsWithoutMass, duplicates: dropped };
}
