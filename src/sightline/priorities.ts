/**
 * Which photometric neighbour most needs a spectroscopic redshift: the expected reduction of the
 * variance of the summed DM if galaxy i's redshift were known exactly,
 *   R_i = Var(T) − E[Var(T | z_i)] = Var(E[T | z_i])   (law of total variance),
 * estimated from the Monte Carlo draws by sorting them on the galaxy's drawn z into B equal-count bins
 * and taking the between-bin part of a one-way analysis of variance, corrected for the spurious
 * between-bin spread that finite bins show even when T does not depend on z_i:
 *   R̂ = [SSB − (B − 1) · SSW/(n − B)] / n, floored at 0   (common practice: the ω²-type estimator).
 * B = clamp(⌊n/50⌋, 2, 20). The figure also captures whether the galaxy is in front at all.
 */
export function varianceReductionByBinning(zDrawn: Float64Array, total: Float64Array): number {
  const n = total.length;
  if (n < 20) return 0;
  const bins = Math.min(20, Math.max(2, Math.floor(n / 50)));
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((a, b) => zDrawn[a] - zDrawn[b]);
  let grand = 0;
  for (let i = 0; i < n; i++) grand += total[i];
  grand /= n;
  let ssb = 0;
  let ssw = 0;
  for (let k = 0; k < bins; k++) {
    const lo = Math.floor((k * n) / bins);
    const hi = Math.floor(((k + 1) * n) / bins);
    let mean = 0;
    for (let j = lo; j < hi; j++) mean += total[order[j]];
    mean /= hi - lo;
    for (let j = lo; j < hi; j++) {
      const dev = total[order[j]] - mean;
      ssw += dev * dev;
    }
    ssb += (hi - lo) * (mean - grand) * (mean - grand);
  }
  const r = (ssb - ((bins - 1) * ssw) / (n - bins)) / n;
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
