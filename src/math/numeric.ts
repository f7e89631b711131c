/** Small numerical toolbox shared by the science modules: pure functions, no I/O. */

/** acos clamped to [-1, 1] so round-off never yields NaN. */
export function clampedAcos(x: number): number {
  return Math.acos(Math.min(1, Math.max(-1, x)));
}

/** asin clamped to [-1, 1] so round-off never yields NaN. */
export function clampedAsin(x: number): number {
  return Math.asin(Math.min(1, Math.max(-1, x)));
}

/** Neumaier (improved Kahan) compensated sum. */
export function compensatedSum(values: ArrayLike<number>): number {
  let sum = 0;
  let c = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    const t = sum + v;
    if (Math.abs(sum) >= Math.abs(v)) c += sum - t + v;
    else c += v - t + sum;
    sum = t;
  }
  return sum + c;
}

export class RootNotBracketedError extends Error {
  constructor(
    readonly a: number,
    readonly b: number,
    readonly fa: number,
    readonly fb: number,
  ) {
    super(`root not bracketed: f(${a}) = ${fa}, f(${b}) = ${fb} have the same sign`);
    this.name = 'RootNotBracketedError';
  }
}

/**
 * Brent's method (Brent 1973, "Algorithms for Minimization without Derivatives", ch. 4) for a root
 * of f in [a, b]; f(a) and f(b) must differ in sign. Converges to |Δx| ≤ 2·eps·|x| + xtol.
 */
export function brentRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  opts: { xtol?: number; maxIter?: number } = {},
): number {
  const xtol = opts.xtol ?? 1e-14;
  const maxIter = opts.maxIter ?? 200;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) throw new RootNotBracketedError(a, b, fa, fb);
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIter; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xtol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}

// Gauss–Kronrod 7/15 nodes and weights (Piessens et al. 1983, QUADPACK; values as in QUADPACK's qk15).
const XGK = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851,
  0.864864423359769072789712788640926, 0.741531185599394439863864773280788,
  0.58608723546769113029414483825873, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0.0,
];
const WGK = [
  0.02293532201052922496373200805897, 0.063092092629978553290700663189204,
  0.104790010322250183839876322541518, 0.140653259715525918745189590510238,
  0.16900472663926790282658342659855, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
const WG = [
  0.129484966168869693270611432679082, 0.27970539148927666790146777142378,
  0.381830050505118944950369775488975, 0.417959183673469387755102040816327,
];

function gk15(f: (x: number) => number, a: number, b: number): { value: number; error: number } {
  const center = 0.5 * (a + b);
  const half = 0.5 * (b - a);
  const fc = f(center);
  let resK = fc * WGK[7];
  let resG = fc * WG[3];
  for (let j = 0; j < 7; j++) {
    const dx = half * XGK[j];
    const f1 = f(center - dx);
    const f2 = f(center + dx);
    resK += WGK[j] * (f1 + f2);
    if (j % 2 === 1) resG += WG[(j - 1) / 2] * (f1 + f2);
  }
  return { value: resK * half, error: Math.abs((resK - resG) * half) };
}

/**
 * Adaptive Gauss–Kronrod (7/15) quadrature of f over [a, b] by global bisection of the interval
 * with the largest error estimate. Stops when the summed error ≤ max(atol, rtol·|I|).
 * The integrand is never evaluated at the end points, so integrable end-point singularities are fine.
 */
export function integrate(
  f: (x: number) => number,
  a: number,
  b: number,
  opts: { rtol?: number; atol?: number; maxIntervals?: number } = {},
): number {
  if (a === b) return 0;
  if (b < a) return -integrate(f, b, a, opts);
  const rtol = opts.rtol ?? 1e-10;
  const atol = opts.atol ?? 0;
  const maxIntervals = opts.maxIntervals ?? 2000;
  type Piece = { a: number; b: number; value: number; error: number };
  const first = gk15(f, a, b);
  const pieces: Piece[] = [{ a, b, ...first }];
  let total = first.value;
  let totalErr = first.error;
  while (totalErr > Math.max(atol, rtol * Math.abs(total)) && pieces.length < maxIntervals) {
    let worst = 0;
    for (let i = 1; i < pieces.length; i++) if (pieces[i].error > pieces[worst].error) worst = i;
    const p = pieces[worst];
    const mid = 0.5 * (p.a + p.b);
    const left = gk15(f, p.a, mid);
    const right = gk15(f, mid, p.b);
    pieces[worst] = { a: p.a, b: mid, ...left };
    pieces.push({ a: mid, b: p.b, ...right });
    total = 0;
    totalErr = 0;
    for (const q of pieces) {
      total += q.value;
      totalErr += q.error;
    }
  }
  return total;
}

/** Error function, |error| < 1.2e-7 would be too coarse: uses erfc continued with Chebyshev fit (Numerical Recipes 3rd ed., erfc Chebyshev, ~1e-16 relative). */
export function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 2 / (2 + z);
  const ty = 4 * t - 2;
  let d = 0;
  let dd = 0;
  for (let j = ERFC_COF.length - 1; j > 0; j--) {
    const tmp = d;
    d = ty * d - dd + ERFC_COF[j];
    dd = tmp;
  }
  const res = t * Math.exp(-z * z + 0.5 * (ERFC_COF[0] + ty * d) - dd);
  return x >= 0 ? res : 2 - res;
}
// Chebyshev coefficients for erfc (Press et al. 2007, Numerical Recipes 3rd ed., §6.2.2).
const ERFC_COF = [
  -1.3026537197817094, 6.4196979235649026e-1, 1.9476473204185836e-2, -9.561514786808631e-3,
  -9.46595344482036e-4, 3.66839497852761e-4, 4.2523324806907e-5, -2.0278578112534e-5, -1.624290004647e-6,
  1.30365583558e-6, 1.5626441722e-8, -8.5238095915e-8, 6.529054439e-9, 5.059343495e-9, -9.91364156e-10,
  -2.27365122e-10, 9.6467911e-11, 2.394038e-12, -6.886027e-12, 8.94487e-13, 3.13092e-13, -1.12708e-13,
  3.81e-16, 7.106e-15, -1.523e-15, -9.4e-17, 1.21e-16, -2.8e-17,
];

export function erf(x: number): number {
  return 1 - erfc(x);
}

/** Standard normal CDF Φ(t) = ½ erfc(−t/√2), accurate in both tails. */
export function normalCdf(t: number): number {
  return 0.5 * erfc(-t / Math.SQRT2);
}

/**
 * Standard normal quantile Φ⁻¹(p) (Acklam's rational approximation, |rel err| < 1.15e-9,
 * refined by one Halley step against normalCdf to ~1e-15).
 */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) {
    if (p === 0) return -Infinity;
    if (p === 1) return Infinity;
    return Number.NaN;
  }
  const a = [
    -39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716,
    2.506628277459239,
  ];
  const b = [
    -54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572,
  ];
  const c = [
    -0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968,
    2.938163982698783,
  ];
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];
  const plow = 0.02425;
  let x: number;
  if (p < plow) {
    const q = Math.sqrt(-2 * Math.log(p));
    x =
      (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
      ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  } else if (p <= 1 - plow) {
    const q = p - 0.5;
    const r = q * q;
    x =
      ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) /
      (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1);
  } else {
    const q = Math.sqrt(-2 * Math.log(1 - p));
    x =
      -(((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
      ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  }
  const e = normalCdf(x) - p;
  const u = e * Math.sqrt(2 * Math.PI) * Math.exp((x * x) / 2);
  return x - u / (1 + (x * u) / 2);
}

/** Linear-interpolated quantile of a sorted array (type 7, the default of numpy and R). */
export function quantileSorted(sorted: ArrayLike<number>, q: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const h = (n - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}
