import type { SearchShell } from './search.js';
import type { CatalogRow } from './types.js';

/**
 * Cost of one store query in units of returned rows: a cone query has a fixed cost (HEALPix cover,
 * statement, catalogue lookup; ≈ 0.1 ms measured with bench/sightline.ts and bench/http.ts) about
 * equal to building and selecting this many returned rows (≈ 3–4 µs each). Design choice.
 */
export const QUERY_COST_ROWS = 30;

/** Store queries of one sightline: the planned shells after merging, each a superset of its members. */
export interface ConeWindow {
  readonly radiusDeg: number;
  readonly zLo: number;
  readonly zHi: number;
  readonly minLogMstar?: number;
  readonly minLogMhalo?: number;
}

/** What the probe query taught about the catalogue around this sightline. */
export interface DensityEstimate {
  /** Rows per deg² per unit redshift (all masses). */
  readonly rowsPerDeg2PerZ: number;
  /** Fraction of rows a mass hint (log M* ≥ minLogMstar or log M_h ≥ minLogMhalo) keeps, from the probe's rows. */
  passFraction(minLogMstar: number, minLogMhalo: number | undefined): number;
}

const areaDeg2 = (w: ConeWindow) => Math.PI * w.radiusDeg * w.radiusDeg;
const hinted = (w: ConeWindow) => w.minLogMstar !== undefined;

/** Expected number of rows a window returns under the estimate (flat in z inside the window). */
export function expectedRows(w: ConeWindow, est: DensityEstimate): number {
  const pass = hinted(w) ? est.passFraction(w.minLogMstar!, w.minLogMhalo) : 1;
  return est.rowsPerDeg2PerZ * areaDeg2(w) * (w.zHi - w.zLo) * pass;
}

/** The smallest window that returns every row either window returns (wider cone, z hull, weaker hint). */
export function unionWindow(a: ConeWindow, b: ConeWindow): ConeWindow {
  const base = {
    radiusDeg: Math.max(a.radiusDeg, b.radiusDeg),
    zLo: Math.min(a.zLo, b.zLo),
    zHi: Math.max(a.zHi, b.zHi),
  };
  if (!hinted(a) || !hinted(b)) return base;
  return {
    ...base,
    minLogMstar: Math.min(a.minLogMstar!, b.minLogMstar!),
    // planShells sets both bounds on every hinted shell; a missing one is carried as missing.
    ...(a.minLogMhalo !== undefined && b.minLogMhalo !== undefined
      ? { minLogMhalo: Math.min(a.minLogMhalo, b.minLogMhalo) }
      : {}),
  };
}

/**
 * Greedy merging: while some pair of windows costs more as two queries than as their union
 * (cost = queryCostRows + expected rows), merge the pair that saves most. At low surface density this
 * folds a dozen shells into one or two queries; at high density it keeps the narrow shells apart.
 * Whatever it returns covers every input window, so the candidate set cannot change.
 */
export function mergeWindows(
  windows: readonly ConeWindow[],
  est: DensityEstimate,
  queryCostRows = QUERY_COST_ROWS,
): ConeWindow[] {
  const out = [...windows];
  const cost = out.map((w) => queryCostRows + expectedRows(w, est));
  for (;;) {
    let best = 0;
    let bi = -1;
    let bj = -1;
    for (let i = 0; i < out.length; i++) {
      for (let j = i + 1; j < out.length; j++) {
        const saving = cost[i] + cost[j] - queryCostRows - unionRows(out[i], out[j], est);
        if (saving > best) {
          best = saving;
          bi = i;
          bj = j;
        }
      }
    }
    if (bi < 0) return out;
    out[bi] = unionWindow(out[bi], out[bj]);
    cost[bi] = queryCostRows + expectedRows(out[bi], est);
    out.splice(bj, 1);
    cost.splice(bj, 1);
  }
}

/** expectedRows(unionWindow(a, b)) without building the window (the inner loop of mergeWindows). */
function unionRows(a: ConeWindow, b: ConeWindow, est: DensityEstimate): number {
  const r = Math.max(a.radiusDeg, b.radiusDeg);
  const dz = Math.max(a.zHi, b.zHi) - Math.min(a.zLo, b.zLo);
  const base = est.rowsPerDeg2PerZ * Math.PI * r * r * dz;
  if (!hinted(a) || !hinted(b)) return base;
  const halo =
    a.minLogMhalo !== undefined && b.minLogMhalo !== undefined
      ? Math.min(a.minLogMhalo, b.minLogMhalo)
      : undefined;
  return base * est.passFraction(Math.min(a.minLogMstar!, b.minLogMstar!), halo);
}

/**
 * Density estimate from the rows a probe window returned: (n + 1)/(area · Δz), so an empty probe does
 * not claim an empty sky; the hint pass fraction is (k + 1)/(n + 2) over the probe's rows (Laplace's
 * rule of succession, common practice).
 */
export function estimateDensity(probe: ConeWindow, rows: readonly CatalogRow[]): DensityEstimate {
  const inWindow = rows.filter((r) => r.z >= probe.zLo && r.z <= probe.zHi);
  const n = inWindow.length;
  const volume = Math.max(areaDeg2(probe) * (probe.zHi - probe.zLo), 1e-12);
  // Hints take only a few distinct values (the shells' and their minima): remember each answer.
  const known: number[] = [];
  return {
    rowsPerDeg2PerZ: (n + 1) / volume,
    passFraction(minLogMstar, minLogMhalo) {
      const halo = minLogMhalo ?? Number.POSITIVE_INFINITY;
      for (let i = 0; i < known.length; i += 3) {
        if (known[i] === minLogMstar && known[i + 1] === halo) return known[i + 2];
      }
      let k = 0;
      for (const r of inWindow) {
        const byStar = r.logMstar !== null && r.logMstar >= minLogMstar;
        const byHalo = r.logMhalo != null && r.logMhalo >= halo;
        if (byStar || byHalo || (r.logMstar === null && r.logMhalo == null)) k++;
      }
      const f = (k + 1) / (n + 2);
      known.push(minLogMstar, halo, f);
      return f;
    },
  };
}

/** The probe: the unhinted shell expected to hold most rows (largest area × Δz); it is queried as planned. */
export function probeShellIndex(shells: readonly SearchShell[]): number {
  let best = -1;
  let bestVolume = -1;
  shells.forEach((s, i) => {
    if (hinted(s)) return;
    const v = areaDeg2(s) * (s.zHi - s.zLo);
    if (v > bestVolume) {
      bestVolume = v;
      best = i;
    }
  });
  return best;
}
