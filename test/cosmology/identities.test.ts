import { describe, expect, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import { createRng, integrate } from '../../src/math/index.js';
import { expectClose } from '../helpers/expect-close.js';

describe('distance identities and limits', () => {
  const planck = createCosmology('planck18');

  it('luminosity distance equals (1+z)² times angular-diameter distance (Etherington relation)', () => {
    for (const z of [0.01, 0.3, 1.7, 6, 25]) {
      expectClose(planck.luminosityDistanceMpc(z), (1 + z) ** 2 * planck.angularDiameterDistanceMpc(z), {
        rtol: 1e-14,
      });
    }
  });

  it('comoving distance matches the Einstein–de Sitter closed form 2 D_H (1 − 1/√(1+z))', () => {
    // Om0 = 1, no radiation: E = (1+z)^{3/2} (textbook closed form, e.g. Hogg 1999, astro-ph/9905116, eq. 15–16 (from memory)).
    const eds = createCosmology({ H0: 70, Om0: 1, Ob0: 0.05 });
    for (const z of [0, 0.001, 0.1, 1, 3, 10, 19.9, 50, 1000]) {
      const expected = 2 * eds.hubbleDistanceMpc * (1 - 1 / Math.sqrt(1 + z));
      expectClose(eds.comovingDistanceMpc(z), expected, { rtol: 1e-9, atol: 1e-12 });
      // Lookback time: t_L = (2/3) t_H (1 − (1+z)^{-3/2}).
      expectClose(eds.lookbackTimeGyr(z), (2 / 3) * eds.hubbleTimeGyr * (1 - (1 + z) ** -1.5), {
        rtol: 1e-9,
        atol: 1e-12,
      });
    }
    expectClose(eds.Ode0, 0, { atol: 1e-15 });
  });

  it('the table agrees with direct quadrature to 1e-7 relative on a dense random sample', () => {
    const rng = createRng(20240611);
    let worst = 0;
    for (let k = 0; k < 3000; k++) {
      // log-uniform from 1e-4 to 30, so both the low-z start and the tail beyond the table are hit
      const z = 10 ** (-4 + rng.uniform() * Math.log10(30 / 1e-4));
      const direct = planck.hubbleDistanceMpc * integrate((x) => 1 / planck.E(x), 0, z, { rtol: 1e-13 });
      const rel = Math.abs(planck.comovingDistanceMpc(z) / direct - 1);
      worst = Math.max(worst, rel);
      const lbDirect =
        planck.hubbleTimeGyr * integrate((x) => 1 / ((1 + x) * planck.E(x)), 0, z, { rtol: 1e-13 });
      worst = Math.max(worst, Math.abs(planck.lookbackTimeGyr(z) / lbDirect - 1));
    }
    expect(worst).toBeLessThanOrEqual(1e-7);
  });

  it('z → comoving distance → z round-trips to 1e-10 inside and beyond the table', () => {
    for (const z of [1e-6, 1e-3, 0.05, 0.7, 2, 9.99, 19.999, 20, 35, 200]) {
      const d = planck.comovingDistanceMpc(z);
      expectClose(planck.zAtComovingDistance(d), z, { rtol: 1e-10 });
    }
  });

  it('every quantity has its exact value at z = 0', () => {
    expect(planck.comovingDistanceMpc(0)).toBe(0);
    expect(planck.angularDiameterDistanceMpc(0)).toBe(0);
    expect(planck.luminosityDistanceMpc(0)).toBe(0);
    expect(planck.lookbackTimeGyr(0)).toBe(0);
    expect(planck.zAtComovingDistance(0)).toBe(0);
    expectClose(planck.E(0), 1, { rtol: 1e-15 });
    expectClose(planck.omegaM(0), planck.params.Om0, { rtol: 1e-15 });
    // At small z, D_C ≈ D_H z (first-order Taylor term, common practice).
    expectClose(planck.comovingDistanceMpc(1e-7), planck.hubbleDistanceMpc * 1e-7, { rtol: 1e-6 });
  });

  it('rejects negative or non-finite redshifts and distances with a domain error', () => {
    expect(() => planck.comovingDistanceMpc(-0.1)).toThrow(/redshift must be/);
    expect(() => planck.comovingDistanceMpc(Number.NaN)).toThrow(/redshift must be/);
    expect(() => planck.criticalDensityMsunKpc3(Number.POSITIVE_INFINITY)).toThrow(/redshift/);
    expect(() => planck.zAtComovingDistance(-1)).toThrow(/comoving distance must be/);
    // Beyond the particle horizon (≈ 14,000 Mpc for Planck18) no redshift exists.
    expect(() => planck.zAtComovingDistance(20000)).toThrow(/beyond the horizon/);
  });
});
