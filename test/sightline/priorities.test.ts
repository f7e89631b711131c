import { describe, expect, it } from 'vitest';
import { createRng } from '../../src/math/index.js';
import { sampleVariance, varianceReductionByBinning } from '../../src/sightline/index.js';

describe('spectroscopy priority estimator', () => {
  it('recovers Var(E[T|z]) = a²p(1−p) when T jumps by a at a redshift threshold (law of total variance)', () => {
    // Common practice: the law of total variance, Var(T) = E[Var(T|z)] + Var(E[T|z]).
    const rng = createRng(11);
    const n = 20_000;
    const z = new Float64Array(n);
    const t = new Float64Array(n);
    const a = 40;
    const p = 0.3;
    for (let i = 0; i < n; i++) {
      z[i] = rng.uniform();
      t[i] = (z[i] < p ? a : 0) + 10 * rng.normal();
    }
    const expected = a * a * p * (1 - p);
    const r = varianceReductionByBinning(z, t);
    // 20 bins: the threshold falls on a bin edge (0.3 = 6/20), so binning loses nothing; 4 % covers sampling.
    expect(Math.abs(r - expected) / expected).toBeLessThan(0.04);
    expect(r).toBeLessThan(sampleVariance(t));
  });

  it('gives about zero when the total does not depend on the galaxy', () => {
    const rng = createRng(12);
    const n = 1000;
    const z = new Float64Array(n);
    const t = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      z[i] = rng.uniform();
      t[i] = 50 + 10 * rng.normal();
    }
    // Without the finite-bin correction the between-bin part would be ≈ (B−1)/n · Var = 1.9 % of Var.
    expect(varianceReductionByBinning(z, t)).toBeLessThan(0.01 * sampleVariance(t));
  });
});
