import { type HaloMassInversion, invertShmrExact, LOG_MH_MAX, LOG_MH_MIN, shmrSlope } from './invert.js';
import type { StellarHaloRelation } from './types.js';

/** Redshift spacing of the lazily built rows of the inverse table. */
const Z_STEP = 0.01;
/** log M_h spacing of the nodes in each row. */
const X_STEP = 0.02;
const N_X = Math.round((LOG_MH_MAX - LOG_MH_MIN) / X_STEP) + 1;

interface Row {
  /** log M* at the nodes (strictly increasing). */
  readonly y: Float64Array;
  /** d log M_h / d log M* at the nodes. */
  readonly dxdy: Float64Array;
}

export interface ShmrInverter {
  readonly relation: StellarHaloRelation;
  /** Writes log M_h and the status into `out` (no allocation); returns out.logMh. */
  invertInto(out: HaloMassInversion, logMstar: number, z: number): number;
}

/**
 * Fast M* → M_h inversion for Monte Carlo use. A per-relation table of log M*(log M_h) is built lazily
 * on a z grid (step 0.01); the guess is a cubic Hermite inverse in each of the two neighbouring rows,
 * blended linearly in z, and is then polished by chord-Newton iterations on the exact relation at the
 * exact z, so the result agrees with Brent's root to ~1e-11 dex. Falls back to Brent if polishing fails.
 */
export function createShmrInverter(rel: StellarHaloRelation): ShmrInverter {
  const rows = new Map<number, Row>();
  function row(k: number): Row {
    let r = rows.get(k);
    if (r) return r;
    const z = k * Z_STEP;
    const y = new Float64Array(N_X);
    const dxdy = new Float64Array(N_X);
    for (let i = 0; i < N_X; i++) {
      const x = LOG_MH_MIN + i * X_STEP;
      y[i] = rel.logMstar(x, z);
      dxdy[i] = 1 / shmrSlope(rel, x, z);
    }
    r = { y, dxdy };
    rows.set(k, r);
    return r;
  }
  function guessInRow(r: Row, target: number): number {
    const y = r.y;
    if (target <= y[0]) return LOG_MH_MIN;
    if (target >= y[N_X - 1]) return LOG_MH_MAX;
    let lo = 0;
    let hi = N_X - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (y[mid] <= target) lo = mid;
      else hi = mid;
    }
    const dy = y[hi] - y[lo];
    const t = (target - y[lo]) / dy;
    const t2 = t * t;
    const t3 = t2 * t;
    const x0 = LOG_MH_MIN + lo * X_STEP;
    return (
      (2 * t3 - 3 * t2 + 1) * x0 +
      (t3 - 2 * t2 + t) * dy * r.dxdy[lo] +
      (-2 * t3 + 3 * t2) * (x0 + X_STEP) +
      (t3 - t2) * dy * r.dxdy[hi]
    );
  }
  return {
    relation: rel,
    invertInto(out, logMstar, z) {
      const fLo = rel.logMstar(LOG_MH_MIN, z) - logMstar;
      if (fLo > 0) {
        out.status = 'below-range';
        out.logMh = LOG_MH_MIN;
        return LOG_MH_MIN;
      }
      const fHi = rel.logMstar(LOG_MH_MAX, z) - logMstar;
      if (fHi < 0) {
        out.status = 'above-range';
        out.logMh = LOG_MH_MAX;
        return LOG_MH_MAX;
      }
      const k = Math.floor(z / Z_STEP);
      const w = z / Z_STEP - k;
      let x = (1 - w) * guessInRow(row(k), logMstar) + w * guessInRow(row(k + 1), logMstar);
      const slope = shmrSlope(rel, x, z);
      let converged = false;
      for (let it = 0; it < 8; it++) {
        const dx = (rel.logMstar(x, z) - logMstar) / slope;
        x -= dx;
        if (Math.abs(dx) < 1e-12) {
          converged = true;
          break;
        }
      }
      if (!converged || !(x >= LOG_MH_MIN && x <= LOG_MH_MAX)) x = invertShmrExact(rel, logMstar, z).logMh;
      out.status = 'ok';
      out.logMh = x;
      return x;
    },
  };
}
