/**
 * A per-galaxy table of the chosen SHMR around the galaxy's central halo mass, used by the Monte Carlo
 * to turn a drawn stellar mass into a halo mass without root finding. Nodes are uniform in native
 * log M_h; log M* is strictly increasing along them (all SHMRs here are, physics.md §4.5), so the
 * inverse is a binary search plus linear interpolation. The model-definition mass and log c are
 * tabulated on the same nodes so a draw needs no NFW conversion either.
 */
export interface ShmrTable {
  readonly x0: number;
  readonly dx: number;
  readonly n: number;
  /** log M* at the nodes. */
  readonly yStar: Float64Array;
  /** log M_h in the model's definition at the nodes. */
  readonly xModel: Float64Array;
  /** log₁₀ c (mean relation, model definition) at the nodes. */
  readonly logC: Float64Array;
}

/** Node spacing [dex] and half-width [dex] of the table (linear interpolation error ≲ 1e-3 dex). */
export const SHMR_TABLE_STEP = 0.05;
export const SHMR_TABLE_HALF_WIDTH = 3;

export function buildShmrTable(
  centreNative: number,
  bounds: readonly [number, number],
  fns: { yStar(x: number): number; xModel(x: number): number; logC(xModel: number): number },
): ShmrTable {
  const lo = Math.max(bounds[0], centreNative - SHMR_TABLE_HALF_WIDTH);
  const hi = Math.min(bounds[1], centreNative + SHMR_TABLE_HALF_WIDTH);
  const n = Math.max(2, Math.ceil((hi - lo) / SHMR_TABLE_STEP) + 1);
  const dx = (hi - lo) / (n - 1);
  const yStar = new Float64Array(n);
  const xModel = new Float64Array(n);
  const logC = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = lo + i * dx;
    yStar[i] = fns.yStar(x);
    xModel[i] = fns.xModel(x);
    logC[i] = fns.logC(xModel[i]);
  }
  return { x0: lo, dx, n, yStar, xModel, logC };
}

/** Position (fractional node index) of log M* = y on the table, clamped to the ends. */
export function positionOfStellarMass(t: ShmrTable, y: number): number {
  const ys = t.yStar;
  if (y <= ys[0]) return 0;
  if (y >= ys[t.n - 1]) return t.n - 1;
  let lo = 0;
  let hi = t.n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (ys[mid] <= y) lo = mid;
    else hi = mid;
  }
  return lo + (y - ys[lo]) / (ys[hi] - ys[lo]);
}

/** Local slope d log M* / d log M_h at a fractional node position (segment slope). */
export function slopeAt(t: ShmrTable, pos: number): number {
  const i = Math.min(Math.max(Math.floor(pos), 0), t.n - 2);
  return (t.yStar[i + 1] - t.yStar[i]) / t.dx;
}

/** Linear interpolation of a node array at a fractional position (clamped). */
export function interpolateAt(values: Float64Array, pos: number): number {
  const n = values.length;
  if (pos <= 0) return values[0];
  if (pos >= n - 1) return values[n - 1];
  const i = Math.floor(pos);
  const f = pos - i;
  return values[i] + f * (values[i + 1] - values[i]);
}
