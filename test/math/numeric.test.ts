import { describe, expect, it } from 'vitest';
import {
  brentRoot,
  compensatedSum,
  createRng,
  erf,
  integrate,
  normalCdf,
  normalQuantile,
  quantileSorted,
} from '../../src/math/index.js';
import { expectClose } from '../helpers/expect-close.js';

describe('numeric toolbox', () => {
  it('integrates a polynomial exactly and a Gaussian to its closed form', () => {
    expectClose(
      integrate((x) => 3 * x * x, 0, 2),
      8,
      { rtol: 1e-14 },
    );
    // ∫_{-∞}^{∞} e^{-x²} dx = √π (closed form); the tails beyond ±10 are < 1e-43.
    expectClose(
      integrate((x) => Math.exp(-x * x), -10, 10),
      Math.sqrt(Math.PI),
      { rtol: 1e-12 },
    );
  });

  it('integrates an end-point singularity 1/√x on [0,1] to 2', () => {
    expectClose(
      integrate((x) => 1 / Math.sqrt(x), 0, 1, { rtol: 1e-10 }),
      2,
      { rtol: 1e-8 },
    );
  });

  it('finds the root of cos x − x (Dottie number 0.7390851332151607, common practice)', () => {
    expectClose(
      brentRoot((x) => Math.cos(x) - x, 0, 1),
      0.7390851332151607,
      { rtol: 1e-14 },
    );
  });

  it('erf and the normal CDF match tabulated values (Abramowitz & Stegun 1964, Table 7.1 and 26.1)', () => {
    expectClose(erf(0.5), 0.5204998778130465, { rtol: 1e-13 });
    expectClose(erf(1), 0.8427007929497149, { rtol: 1e-13 });
    expectClose(normalCdf(1), 0.8413447460685429, { rtol: 1e-13 });
    expectClose(normalCdf(-3), 0.0013498980316301, { rtol: 1e-11 });
    expectClose(normalCdf(-8), 6.22096057427178e-16, { rtol: 1e-9 });
  });

  it('normal quantile inverts the CDF', () => {
    for (const p of [1e-10, 0.001, 0.16, 0.5, 0.84, 0.975, 1 - 1e-9]) {
      expectClose(normalCdf(normalQuantile(p)), p, { rtol: 1e-10 });
    }
    expectClose(normalQuantile(0.975), 1.959963984540054, { rtol: 1e-12 });
  });

  it('compensated sum survives catastrophic cancellation', () => {
    expect(compensatedSum([1e100, 1, -1e100])).toBe(1);
  });

  it('quantiles follow the linear (type 7) convention', () => {
    expect(quantileSorted([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantileSorted([1, 2, 3, 4], 0)).toBe(1);
    expect(quantileSorted([1, 2, 3, 4], 1)).toBe(4);
  });

  it('the seeded generator is reproducible and has the right first two moments', () => {
    const a = createRng(42);
    const b = createRng(42);
    for (let i = 0; i < 10; i++) expect(a.uniform()).toBe(b.uniform());
    const rng = createRng(7);
    const n = 200_000;
    let s = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const x = rng.normal();
      s += x;
      s2 += x * x;
    }
    // Standard error of the mean is 1/√n ≈ 0.0022; allow 5 standard errors.
    expect(Math.abs(s / n)).toBeLessThan(5 / Math.sqrt(n));
    expect(Math.abs(s2 / n - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
  });
});
