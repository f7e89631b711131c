/**
 * Which photometric neighbour most needs a spectroscopic redshift: the expected reduction of the
 * variance of the summed DM if galaxy i's redshift were known exactly,
 *   R_i = Var(T) − E[Var(T | z_i)] = Var(E[T | z_i])   (law of total variance),
 * estimated from the Monte Carlo draws by sorting them on the galaxy's drawn z into B equal-count bins
 * and taking the between-bin part of a one-way analysis of variance, corrected for the spurious
 * between-bin spread that finite bins show even when T does not depend on z_i:
 *   R̂ = [SSB − (B − 1) · SSW/(n − B)] / n, floored at 0   (common practice: the ω²-type estimator).
 * B = clamp(⌊n/50⌋, 2, 20) (empty bins, e.g. from tied draws, are dropped). The figure also captures
 * whether the galaxy is in front at all.
 */
export function varianceReductionByBinning(zDrawn: Float64Array, total: Float64Array): number {
  const n = total.length;
  if (n < 20) return 0;
  const bins = Math.min(20, Math.max(2, Math.floor(n / 50)));
  // Bin edges at the equal-count quantiles of the drawn z (native numeric sort, then binary search).
  const sorted = Float64Array.from(zDrawn).sort();
  const edges = new Float64Array(bins - 1);
  for (let k = 1; k < bins; k++) edges[k - 1] = sorted[Math.floor((k * n) / bins)];
  const count = new Float64Array(bins);
  const sum = new Float64Array(bins);
  const sumSq = new Float64Array(bins);
  let grand = 0;
  for (let i = 0; i < n; i++) {
    const z = zDrawn[i];
    let lo = 0;
    let hi = bins - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (z < edges[mid]) hi = mid;
      else lo = mid + 1;
    }
    const t = total[i];
    count[lo]++;
    sum[lo] += t;
    sumSq[lo] += t * t;
    grand += t;
  }
  grand /= n;
  let ssb = 0;
  let ssw = 0;
  let used = 0;
  for (let k = 0; k < bins; k++) {
    if (count[k] === 0) continue;
    used++;
    const mean = sum[k] / count[k];
    ssw += Math.max(0, sumSq[k] - count[k] * mean * mean);
    ssb += count[k] * (mean - grand) * (mean - grand);
  }
  if (used < 2) return 0;
  const r = (ssb - ((used - 1) * ssw) / (n - used)) / n;
  return Math.max(r, 0);
}

/** Sample variance (n − 1) of draws. */
export function sampleVariance(values: Float64Array): number {
  const n = values.length;
  if (n < 2) return 0;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += values[i];
  mean /= n;
  let s = 0;
  for (let i = 0; i < n; i++) s += (values[i] - mean) * (values[i] - mean);
  return s / (n - 1);
}
