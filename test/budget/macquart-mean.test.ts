import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createMacquartMean, macquartK } from '../../src/budget/index.js';
import { createCosmology } from '../../src/cosmology/index.js';
import { InputError } from '../../src/errors.js';
import { integrate } from '../../src/math/index.js';
import { expectClose } from '../helpers/expect-close.js';

// Source: scripts/fixtures/macquart_scipy.py → fixtures/reference/macquart.json (astropy Planck18 E(z)
// and constants, scipy quad at 1e-12; versions inside). 1e-6 relative is the quadrature-level bound.
const ref = JSON.parse(
  readFileSync(new URL('../../fixtures/reference/macquart.json', import.meta.url), 'utf8'),
) as {
  K: number;
  mean_dm: { z: number; dm: number }[];
  mean_dm_fd1: { z: number; dm: number }[];
};

describe('mean cosmic DM (Macquart et al. 2020)', () => {
  const planck = createCosmology('planck18');
  const mean = createMacquartMean(planck, { fd: 0.844 });

  it('has K = 3cH0Ωb/(8πG m_p) = 1115.4744 pc cm⁻³ for Planck18 (physics.md §7 and scipy fixture)', () => {
    expectClose(macquartK(planck), 1115.4744, { rtol: 0, atol: 5e-5 });
    expectClose(mean.K, ref.K, { rtol: 1e-12 });
  });

  it('matches the astropy + scipy values for f_d = 0.844 at z = 0.01 … 6, across the He II step', () => {
    for (const { z, dm } of ref.mean_dm) expectClose(mean.meanDmPcCm3(z), dm, { rtol: 1e-6 });
  });

  it('matches the astropy + scipy values for f_d = 1', () => {
    const full = createMacquartMean(planck, { fd: 1 });
    for (const { z, dm } of ref.mean_dm_fd1) expectClose(full.meanDmPcCm3(z), dm, { rtol: 1e-6 });
  });

  it.each([
    [0.1, 84.41, 100.0118],
    [0.5, 448.1578, 530.9926],
    [1.0, 916.2808, 1085.6408],
    [2.0, 1789.6552, 2120.4445],
  ])('matches the physics.md §7 table at z = %s', (z, dm844, dm1) => {
    expectClose(mean.meanDmPcCm3(z), dm844, { rtol: 0, atol: 5e-5 });
    expectClose(createMacquartMean(planck, { fd: 1 }).meanDmPcCm3(z), dm1, { rtol: 0, atol: 5e-5 });
  });

  it('rises by roughly 900–1000 pc cm⁻³ per unit redshift at low z (common practice)', () => {
    const slope = mean.meanDmPcCm3(0.01) / 0.01;
    expect(slope).toBeGreaterThan(800);
    expect(slope).toBeLessThan(1000);
    // Exact low-z limit: dDM/dz at z = 0 is K f_d χ_e = 823.77782 pc cm⁻³ (physics.md §7 prefactor).
    expectClose(mean.meanDmPcCm3(1e-6) / 1e-6, 823.77782, { rtol: 1e-5 });
  });

  it('uses χ_e = 0.875 below and 0.8125 above the helium II reionisation redshift', () => {
    expect(mean.chiE(2.99)).toBe(0.875);
    expect(mean.chiE(3.01)).toBe(0.8125);
    const late = createMacquartMean(planck, { fd: 0.844, heReionZ: 6 });
    // Above z = 3 the default model has fewer electrons, so its mean falls behind.
    expect(late.meanDmPcCm3(5)).toBeGreaterThan(mean.meanDmPcCm3(5));
    expectClose(late.meanDmPcCm3(2.5), mean.meanDmPcCm3(2.5), { rtol: 1e-12 });
  });

  it('inverts monotonically: DM → z → DM round-trips at 1e-9', () => {
    let last = -1;
    for (let dm = 1; dm < 8000; dm *= 1.37) {
      const z = mean.zAtMeanDm(dm);
      expect(z).toBeGreaterThan(last);
      last = z;
      expectClose(mean.meanDmPcCm3(z), dm, { rtol: 1e-9 });
    }
    expect(mean.zAtMeanDm(0)).toBe(0);
  });

  it('interpolates an f_d table linearly and agrees with direct quadrature', () => {
    const table: [number, number][] = [
      [0, 0.8],
      [1, 0.85],
      [3, 0.9],
    ];
    const m = createMacquartMean(planck, { fd: table });
    const direct = (z: number) =>
      m.K *
      integrate(
        (x) => {
          const fd = x < 1 ? 0.8 + 0.05 * x : x < 3 ? 0.85 + 0.025 * (x - 1) : 0.9;
          return (fd * (x < 3 ? 0.875 : 0.8125) * (1 + x)) / planck.E(x);
        },
        0,
        z,
        { rtol: 1e-12 },
      );
    for (const z of [0.3, 1, 2.2, 4]) expectClose(m.meanDmPcCm3(z), direct(z), { rtol: 1e-8 });
    expect(m.fd(0.5)).toBeCloseTo(0.825, 14);
    expect(m.fd(10)).toBe(0.9);
  });

  it('rejects a bad f_d table naming the row and the reason', () => {
    expect(() => createMacquartMean(planck, { fd: [[0, 0.8]] })).toThrow(InputError);
    expect(() =>
      createMacquartMean(planck, {
        fd: [
          [0, 0.8],
          [0, 0.9],
        ],
      }),
    ).toThrow(/row 1: z must increase strictly/);
    expect(() =>
      createMacquartMean(planck, {
        fd: [
          [0, 0.8],
          [1, 1.2],
        ],
      }),
    ).toThrow(/row 1: f_d must be in \(0, 1\]/);
  });
});
