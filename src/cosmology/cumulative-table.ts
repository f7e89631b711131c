import { DomainError } from '../errors.js';
import { brentRoot, integrate } from '../math/index.js';

/**
 * A running integral I(z) = ∫₀ᶻ g(z′) dz′ of a positive integrand, computed once by adaptive
 * Gauss–Kronrod quadrature on each interval of a grid (uniform in ln(1+z), plus any breakpoints
 * where g jumps or kinks) and then read back by cubic Hermite interpolation with the exact
 * derivatives g(z) at the nodes (the first interval is split geometrically towards z = 0 so the
 * relative error stays small where I ∝ z). Beyond zMax it falls back to direct quadrature.
 */
export interface CumulativeTable {
  readonly zMax: number;
  /** I(z) for z ≥ 0. */
  value(z: number): number;
  /** The z ≥ 0 with I(z) = target (I is strictly increasing). */
  inverse(target: number): number;
}

export interface CumulativeTableOptions {
  /** Upper end of the table (default 20). */
  zMax?: number;
  /** Grid step in ln(1+z) (default 0.004). */
  stepLn?: number;
  /** Redshifts where g is discontinuous or has a kink; they become nodes. */
  breakpoints?: readonly number[];
}

function nodesFor(zMax: number, stepLn: number, breakpoints: readonly number[]): Float64Array {
  const xMax = Math.log1p(zMax);
  const n = Math.ceil(xMax / stepLn);
  const zs: number[] = [];
  for (let i = 0; i <= n; i++) zs.push(i === n ? zMax : Math.expm1((i * xMax) / n));
  for (const b of breakpoints) if (b > 0 && b < zMax) zs.push(b);
  // Geometric refinement towards z = 0 keeps the *relative* error small where I(z) ∝ z.
  for (let k = 1; k <= 40; k++) zs.push(zs[1] * 2 ** -k);
  zs.sort((a, b) => a - b);
  const out: number[] = [];
  for (const z of zs) if (out.length === 0 || z - out[out.length - 1] > 1e-9 * (1 + z)) out.push(z);
  return Float64Array.from(out);
}

export function createCumulativeTable(
  g: (z: number) => number,
  opts: CumulativeTableOptions = {},
): CumulativeTable {
  const zMax = opts.zMax ?? 20;
  const zs = nodesFor(zMax, opts.stepLn ?? 0.004, opts.breakpoints ?? []);
  const n = zs.length;
  const I = new Float64Array(n);
  const dLeft = new Float64Array(n);
  const dRight = new Float64Array(n);
  let sum = 0;
  let comp = 0;
  for (let i = 0; i < n; i++) {
    const z = zs[i];
    const eps = 1e-12 * (1 + z);
    dRight[i] = g(z + eps);
    dLeft[i] = i === 0 ? dRight[i] : g(z - eps);
    if (i > 0) {
      const piece = integrate(g, zs[i - 1], z, { rtol: 1e-14 });
      const t = sum + piece;
      comp += Math.abs(sum) >= Math.abs(piece) ? sum - t + piece : piece - t + sum;
      sum = t;
      I[i] = sum + comp;
    }
  }
  const IMax = I[n - 1];

  const locate = (z: number): number => {
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (zs[mid] <= z) lo = mid;
      else hi = mid;
    }
    return lo;
  };

  const hermite = (i: number, t: number): number => {
    const h = zs[i + 1] - zs[i];
    const s = 1 - t;
    return (
      (1 + 2 * t) * s * s * I[i] +
      t * s * s * h * dRight[i] +
      t * t * (3 - 2 * t) * I[i + 1] -
      t * t * s * h * dLeft[i + 1]
    );
  };

  const tail = (z: number): number =>
    IMax +
    integrate(
      (x) => {
        const zz = Math.expm1(x);
        return g(zz) * (1 + zz);
      },
      Math.log1p(zMax),
      Math.log1p(z),
      { rtol: 1e-12 },
    );

  const value = (z: number): number => {
    if (!(z >= 0)) throw new DomainError('z_invalid', `redshift must be a finite number ≥ 0, got ${z}`);
    if (z >= zMax) {
      if (z === zMax) return IMax;
      if (!Number.isFinite(z)) throw new DomainError('z_invalid', `redshift must be finite, got ${z}`);
      return tail(z);
    }
    const i = locate(z);
    return hermite(i, (z - zs[i]) / (zs[i + 1] - zs[i]));
  };

  const inverse = (target: number): number => {
    if (!(target >= 0) || !Number.isFinite(target)) {
      throw new DomainError('inverse_invalid', `value to invert must be a finite number ≥ 0, got ${target}`);
    }
    if (target === 0) return 0;
    if (target > IMax) {
      let zHi = 2 * zMax;
      while (tail(zHi) < target) {
        zHi *= 4;
        if (zHi > 1e9) {
          throw new DomainError('inverse_out_of_range', `no redshift reaches ${target} (beyond the horizon)`);
        }
      }
      return brentRoot((z) => tail(z) - target, zMax, zHi, { xtol: 1e-13 * zHi });
    }
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (I[mid] <= target) lo = mid;
      else hi = mid;
    }
    // Newton on the monotone Hermite cubic of this interval, kept inside [0, 1] by bisection.
    const h = zs[lo + 1] - zs[lo];
    let a = 0;
    let b = 1;
    let t = (target - I[lo]) / (I[lo + 1] - I[lo]);
    for (let k = 0; k < 60; k++) {
      const f = hermite(lo, t) - target;
      if (f > 0) b = t;
      else a = t;
      const s = 1 - t;
      const dfdt =
        6 * t * s * (I[lo + 1] - I[lo]) +
        h * (s * (1 - 3 * t) * dRight[lo] + t * (3 * t - 2) * dLeft[lo + 1]);
      let next = t - f / dfdt;
      if (!(next > a && next < b)) next = 0.5 * (a + b);
      if (Math.abs(next - t) < 1e-13) {
        t = next;
        break;
      }
      t = next;
    }
    return zs[lo] + t * h;
  };

  return { zMax, value, inverse };
}
