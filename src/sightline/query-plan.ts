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
  /** Fraction of rows a mass hint keeps (estimated on the probe's rows). */
  passFraction(w: ConeWindow): number;
}

const areaDeg2 = (w: ConeWindow) => Math.PI * w.radiusDeg * w.radiusDeg;
const hinted = (w: ConeWindow) => w.minLogMstar !== undefined;

/** Expected number of rows a window returns under the estimate (flat in z inside the window). */
export function expectedRows(w: ConeWindow, est: DensityEstimate): number {
  return est.rowsPerDeg2PerZ * areaDeg2(w) * (w.zHi - w.zLo) * (hinted(w) ? est.passFraction(w) : 1);
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
  const cost = (w: ConeWindow) => queryCostRows + expectedRows(w, est);
  for (;;) {
    let best = 0;
    let bi = -1;
    let bj = -1;
    let bw: ConeWindow | undefined;
    for (let i = 0; i < out.length; i++) {
      for (let j = i + 1; j < out.length; j++) {
        const u = unionWindow(out[i], out[j]);
        const saving = cost(out[i]) + cost(out[j]) - cost(u);
        if (saving > best) {
          best = saving;
          bi = i;
          bj = j;
          bw = u;
        }
      }
    }
    if (!bw) return out;
    out[bi] = bw;
    out.splice(bj, 1);
  }
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
  return {
    rowsPerDeg2PerZ: (n + 1) / volume,
    passFraction(w) {
      let k = 0;
      for (const r of inWindow) {
        const byStar = r.logMstar !== null && r.logMstar >= w.minLogMstar!;
        const byHalo = r.logMhalo != null && r.logMhalo >= (w.minLogMhalo ?? Number.POSITIVE_INFINITY);
        if (byStar || byHalo || (r.logMstar === null && r.logMhalo == null)) k++;
      }
      return (k + 1) / (n + 2);
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
