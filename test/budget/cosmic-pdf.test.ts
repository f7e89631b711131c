import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createCosmicPdf } from '../../src/budget/index.js';
import { createRng, integrate } from '../../src/math/index.js';
import { expectClose } from '../helpers/expect-close.js';

// Sources: physics.md §7 check table [calc] (printed to 4–7 digits), and the independent scipy solve in
// scripts/fixtures/macquart_scipy.py → fixtures/reference/macquart.json (quad in u = Δ^-3, brentq).
interface PdfRef {
  F: number;
  z: number;
  sigma_DM: number;
  C0: number;
  A: number;
  mode: number;
  quantiles: Record<string, number>;
}
const ref = JSON.parse(
  readFileSync(new URL('../../fixtures/reference/macquart.json', import.meta.url), 'utf8'),
) as {
  pdf: PdfRef[];
};

describe('Macquart et al. 2020 PDF of Δ = DM_cosmic/⟨DM_cosmic⟩', () => {
  it.each([
    [0.32, 0.1, 1.01193, 2.537554, 0.638985, 0.6031, 0.7403, 0.5756, 1.2211],
    [0.32, 0.5, 0.45255, 2.154216, 1.10617, 0.7086, 0.8058, 0.6726, 1.15],
    [0.32, 1.0, 0.32, 1.835021, 1.455872, 0.7637, 0.845, 0.7235, 1.1269],
    [0.2, 0.5, 0.28284, 1.725743, 1.610807, 0.7843, 0.8601, 0.7426, 1.121],
    [0.2, 1.0, 0.2, 1.449826, 2.157319, 0.8436, 0.9043, 0.7982, 1.1105],
  ])('matches physics.md §7 for F = %s, z = %s', (F, z, sigma, C0, A, mode, median, p16, p84) => {
    const pdf = createCosmicPdf(F, z);
    expectClose(pdf.sigmaDM, sigma, { rtol: 0, atol: 5e-6 });
    expectClose(pdf.C0, C0, { rtol: 0, atol: 5e-7 });
    expectClose(pdf.A, A, { rtol: 0, atol: 5e-6 });
    expectClose(pdf.mode, mode, { rtol: 0, atol: 5e-5 });
    expectClose(pdf.quantile(0.5), median, { rtol: 0, atol: 5e-5 });
    expectClose(pdf.quantile(0.16), p16, { rtol: 0, atol: 5e-5 });
    expectClose(pdf.quantile(0.84), p84, { rtol: 0, atol: 5e-5 });
  });

  it.each(ref.pdf.map((r) => [r.F, r.z, r]))(
    'matches the scipy solve to 1e-8 for F = %s, z = %s',
    (_F, _z, r) => {
      const pdf = createCosmicPdf(r.F, r.z);
      expectClose(pdf.C0, r.C0, { rtol: 1e-8, atol: 1e-10 });
      expectClose(pdf.A, r.A, { rtol: 1e-8 });
      expectClose(pdf.mode, r.mode, { rtol: 1e-10 });
      for (const [p, q] of Object.entries(r.quantiles))
        expectClose(pdf.quantile(Number(p)), q, { rtol: 1e-8 });
    },
  );

  it('is normalised and has ⟨Δ⟩ = 1 by direct integration in Δ with the analytic Δ⁻³ tail', () => {
    for (const [F, z] of [
      [0.32, 0.1],
      [0.32, 1],
      [0.2, 3],
    ]) {
      const pdf = createCosmicPdf(F, z);
      const X = 1e3;
      // For Δ > X, p ≈ A Δ⁻³ e^{−C0²/(2·9σ²)}: tail mass A e/(2X²), tail mean A e/X.
      const tailFactor = pdf.A * Math.exp(-(pdf.C0 ** 2) / (18 * pdf.sigmaDM ** 2));
      const breaks = [1e-3, 0.3, 0.6, 1, 1.5, 3, 10, 100, X];
      let mass = tailFactor / (2 * X * X);
      let first = tailFactor / X;
      for (let k = 0; k + 1 < breaks.length; k++) {
        mass += integrate(pdf.density, breaks[k], breaks[k + 1], { rtol: 1e-12 });
        first += integrate((d) => d * pdf.density(d), breaks[k], breaks[k + 1], { rtol: 1e-12 });
      }
      expectClose(mass, 1, { rtol: 1e-8 });
      expectClose(first, 1, { rtol: 1e-6 });
    }
  });

  it('has σ_DM ∝ z^(−1/2)', () => {
    const a = createCosmicPdf(0.32, 0.25);
    const b = createCosmicPdf(0.32, 1);
    expectClose(a.sigmaDM / b.sigmaDM, 2, { rtol: 1e-14 });
    expectClose(b.sigmaDM, 0.32, { rtol: 1e-14 });
  });

  it('has a CDF consistent with its density and its quantile function', () => {
    const pdf = createCosmicPdf(0.32, 0.5);
    for (const d of [0.4, 0.8, 1.3, 3]) {
      expectClose(pdf.cdf(d) - pdf.cdf(0.2), integrate(pdf.density, 0.2, d, { rtol: 1e-12 }), {
        rtol: 1e-8,
        atol: 1e-14,
      });
    }
    for (const p of [0.001, 0.16, 0.5, 0.84, 0.999]) expectClose(pdf.cdf(pdf.quantile(p)), p, { rtol: 1e-9 });
  });

  it('draws samples whose empirical CDF agrees with the numerical CDF within 4 standard errors', () => {
    const n = 200_000;
    for (const [F, z] of [
      [0.32, 0.2],
      [0.2, 2],
    ]) {
      const pdf = createCosmicPdf(F, z);
      const rng = createRng(99);
      const xs = new Float64Array(n);
      for (let i = 0; i < n; i++) xs[i] = pdf.sample(rng);
      for (const p of [0.01, 0.1, 0.3, 0.5, 0.7, 0.9, 0.99]) {
        const x = pdf.quantile(p);
        let below = 0;
        for (let i = 0; i < n; i++) if (xs[i] <= x) below++;
        const se = Math.sqrt((p * (1 - p)) / n);
        expect(Math.abs(below / n - p)).toBeLessThan(4 * se);
      }
    }
  });

  it('gives the same samples for the same seed', () => {
    const pdf = createCosmicPdf(0.32, 0.7);
    const a = createRng(5);
    const b = createRng(5);
    for (let i = 0; i < 100; i++) expect(pdf.sample(a)).toBe(pdf.sample(b));
  });

  it('refuses z ≤ 0 and F ≤ 0', () => {
    expect(() => createCosmicPdf(0.32, 0)).toThrow(/z > 0/);
    expect(() => createCosmicPdf(0, 1)).toThrow(/F must be/);
  });
});
