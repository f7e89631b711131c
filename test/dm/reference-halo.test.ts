import { describe, expect, it } from 'vitest';
import { createHaloDmEvaluator, dmRestExact } from '../../src/dm/index.js';
import { createGasProfile, type ProfileSpec } from '../../src/gas/index.js';
import { haloFromStellarMass } from '../../src/halo/index.js';
import { haloReference, planck18BaryonFraction, planck18Fixture } from '../halo/planck18-fixture.js';
import { expectClose } from '../helpers/expect-close.js';

// physics.md §6.2 reference halo: 1e12 M☉ M200c, z = 0.1, c = 8.078366, R200 = 204.224048 kpc,
// f_hot = 0.75, Ω_b/Ω_m = Ob0/Om0 (astropy Planck18, full precision), μ_e = 8/7.
const halo = { massMsun: 1e12, radiusKpc: 204.224048, concentration: 8.078366 };
const fb = planck18BaryonFraction;
const X_OVER_R = [0.01, 0.1, 0.5, 1.0, 1.5];
const columns: [string, ProfileSpec, number, (number | null)[]][] = [
  ['NFW, r_max = R200', { kind: 'nfw' }, 1, [1768.81941, 333.75695, 28.80722, 0, 0]],
  ['NFW, r_max = 2 R200', { kind: 'nfw' }, 2, [1772.62168, 337.57092, 32.94865, 8.63017, 3.09173]],
  ['mNFW, r_max = R200', { kind: 'mnfw' }, 1, [122.21038, 120.82054, 43.02858, 0, 0]],
  ['mNFW, r_max = 2 R200', { kind: 'mnfw' }, 2, [131.49594, 130.13378, 53.11446, 20.12559, 8.29369]],
  ['MB04, r_max = R200', { kind: 'mb04' }, 1, [null, 73.7571, 43.23342, 0, null]],
];

describe('reference halo DM table (physics.md §6.2)', () => {
  for (const [label, spec, extent, values] of columns) {
    it(`quadrature and table paths reproduce ${label}`, () => {
      const profile = createGasProfile(spec, halo, { fHot: 0.75, baryonFraction: fb, extent });
      const fast = createHaloDmEvaluator(spec, { extent });
      values.forEach((expected, i) => {
        if (expected === null) return;
        const b = X_OVER_R[i] * halo.radiusKpc;
        // Sheet values have 5 decimals (≥ 7 significant figures here): 1e-6 relative, 1e-5 absolute at 0.
        expectClose(dmRestExact(profile, b), expected, { rtol: 1e-6, atol: 1e-5 });
        // Fast path: the 1e-4 relative requirement of the table evaluator.
        const obs = fast(halo.massMsun, halo.radiusKpc, halo.concentration, b, 0.1, 0.75, fb);
        expectClose(obs * 1.1, expected, { rtol: 1e-4, atol: 1e-5 });
      });
    });
  }

  it('gives the observer-frame examples DM_rest/(1+z) for NFW, r_max = R200', () => {
    const fast = createHaloDmEvaluator({ kind: 'nfw' });
    const at = (x: number) => fast(1e12, 204.224048, 8.078366, x * 204.224048, 0.1, 0.75, fb);
    expectClose(at(0.1), 303.41541, { rtol: 1e-6 });
    expectClose(at(0.5), 26.18838, { rtol: 1e-6 });
  });
});

describe('virial-radius variant (physics.md §6.3)', () => {
  const vir = { massMsun: 1e12, radiusKpc: 248.5135, concentration: 10.29817 };
  it('normalises mNFW inside R_vir and reproduces ρ₀ and the DM values', () => {
    const p1 = createGasProfile({ kind: 'mnfw' }, vir, { fHot: 0.75, baryonFraction: fb });
    const p2 = createGasProfile({ kind: 'mnfw' }, vir, { fHot: 0.75, baryonFraction: fb, extent: 2 });
    expectClose(p1.densityScaleMsunKpc3, 1.552494e6, { rtol: 1e-6 });
    const x = [0.1, 0.5, 1.0];
    const d1 = [97.8829, 28.03257, 0];
    const d2 = [103.27394, 33.8749, 11.78805];
    // R_vir and c_vir are given to 7 significant figures → 2e-6 relative.
    x.forEach((xi, i) => {
      expectClose(dmRestExact(p1, xi * vir.radiusKpc), d1[i], { rtol: 2e-6, atol: 1e-5 });
      expectClose(dmRestExact(p2, xi * vir.radiusKpc), d2[i], { rtol: 2e-6 });
    });
  });
});

describe('end-to-end chain Moster13 → DM14 200c → gas (physics.md §6.4)', () => {
  const rows: [number, number, number, number, number][] = [
    // log M*, z, b [kpc], mNFW DM_obs, NFW DM_obs
    [10.5, 0.1, 50, 76.0228, 86.416],
    [11.0, 0.3, 150, 120.9322, 110.9329],
    [10.0, 0.05, 30, 64.5877, 83.1075],
  ];
  const mnfw = createHaloDmEvaluator({ kind: 'mnfw' });
  const nfw = createHaloDmEvaluator({ kind: 'nfw' });
  for (const [logMs, z, b, dmM, dmN] of rows) {
    it(`reproduces DM_obs for log M* = ${logMs}, z = ${z}, b = ${b} kpc`, () => {
      const h = haloFromStellarMass(logMs, z, planck18Fixture);
      const args = [h.massMsun, h.radiusKpc, h.concentration, b, z, 0.75, fb] as const;
      // 4 decimals printed (≥ 6 significant figures) → 2e-6 relative.
      expectClose(mnfw(...args), dmM, { rtol: 2e-6 });
      expectClose(nfw(...args), dmN, { rtol: 2e-6 });
    });
  }
});

describe('profiles outside physics.md against scipy.integrate.quad (fixtures/reference/halo-reference.json)', () => {
  const xs: number[] = haloReference.x_over_R;
  const h = haloReference.halo;
  const cases: [string, ProfileSpec][] = [
    ['mnfw_alpha1_y0_3_extent2', { kind: 'mnfw', alpha: 1, y0: 3 }],
    ['mb04_extent2', { kind: 'mb04' }],
  ];
  for (const [key, spec] of cases) {
    it(`matches scipy for ${key}`, () => {
      const values: number[] = haloReference.dm_rest[key];
      const profile = createGasProfile(spec, h, {
        fHot: h.fHot,
        baryonFraction: h.baryonFraction,
        extent: 2,
      });
      const fast = createHaloDmEvaluator(spec, { extent: 2 });
      xs.forEach((x, i) => {
        const b = x * h.radiusKpc;
        // scipy quad at epsrel 1e-12 vs our Gauss–Kronrod at 1e-11: agree to 1e-9.
        expectClose(dmRestExact(profile, b), values[i], { rtol: 1e-9 });
        const obs = fast(h.massMsun, h.radiusKpc, h.concentration, b, 0, h.fHot, h.baryonFraction);
        expectClose(obs, values[i], { rtol: 1e-4 });
      });
      expect(values[values.length - 1]).toBeGreaterThan(0);
    });
  }
});
