import { describe, expect, it } from 'vitest';
import {
  createCosmicPdf,
  createMacquartMean,
  hostPosterior,
  maxSourceRedshift,
  redshiftPosterior,
} from '../../src/budget/index.js';
import { createCosmology } from '../../src/cosmology/index.js';
import { expectClose } from '../helpers/expect-close.js';

const cosmology = createCosmology('planck18');
const obs = { dmObs: 650, dmObsErr: 0.5, dmIsm: 40, dmIsmErr: 8, cosmology };

describe('largest source redshift with DM_host ≥ 0', () => {
  it('puts P(DM_host < 0) at 1 − confidence, confirmed by an independent Monte Carlo budget at that z', () => {
    const lim = maxSourceRedshift({ ...obs, confidence: 0.95, draws: 20_000, seed: 4 });
    expect(lim.bracketed).toBe(true);
    expectClose(lim.p_negative_at_limit!, 0.05, { rtol: 1e-4 });
    const mc = hostPosterior({ ...obs, zSource: lim.z_max!, draws: 40_000, seed: 77 });
    // Standard error of a fraction: √(p(1−p)/n) for each of the two independent samples.
    const se = Math.sqrt(0.05 * 0.95 * (1 / 40_000 + 1 / 20_000));
    expect(Math.abs(mc.p_negative_host - 0.05)).toBeLessThan(4 * se);
  });

  it('moves as expected: higher confidence or a smaller DM give a lower bound', () => {
    const a = maxSourceRedshift({ ...obs, confidence: 0.9 }).z_max!;
    const b = maxSourceRedshift({ ...obs, confidence: 0.99 }).z_max!;
    const c = maxSourceRedshift({ ...obs, dmObs: 400 }).z_max!;
    expect(b).toBeLessThan(a);
    expect(c).toBeLessThan(a);
  });

  it('with every other term fixed, puts exactly 5 % of the Macquart PDF beyond the residual DM at the limit', () => {
    // With fixed ISM, MW halo and DM_obs the only randomness is Δ, so at the bound
    // P(⟨DM⟩(z) Δ > R) = 0.05 with R = 650 − 40 − 50 = 560 pc cm⁻³.
    const fixed = {
      dmObs: 650,
      dmObsErr: 0,
      dmIsm: 40,
      dmIsmErr: 0,
      dmMwHalo: { mean: 50, err: 0 },
      cosmology,
    };
    const lim = maxSourceRedshift({ ...fixed, budgetModel: { cosmic_mode: 'full' } }).z_max!;
    const mean = createMacquartMean(cosmology, { fd: 0.844 });
    const pdf = createCosmicPdf(0.32, lim);
    // At the limit, P(Δ > R/M) = 0.05 exactly (no other randomness).
    expectClose(1 - pdf.cdf(560 / mean.meanDmPcCm3(lim)), 0.05, { rtol: 1e-6 });
  });

  it('gives a conservative upper bound where exactly 5 % of the Macquart PDF still fits under the residual', () => {
    // Same fixed terms as above: at z_upper, P(⟨DM⟩(z) Δ ≤ R) = 0.05, i.e. P(DM_host ≥ 0) = 1 − 0.95.
    const fixed = {
      dmObs: 650,
      dmObsErr: 0,
      dmIsm: 40,
      dmIsmErr: 0,
      dmMwHalo: { mean: 50, err: 0 },
      cosmology,
    };
    const lim = maxSourceRedshift({ ...fixed, budgetModel: { cosmic_mode: 'full' } });
    const mean = createMacquartMean(cosmology, { fd: 0.844 });
    const zUpper = lim.z_upper!;
    expect(zUpper).toBeGreaterThan(lim.z_max!);
    expectClose(createCosmicPdf(0.32, zUpper).cdf(560 / mean.meanDmPcCm3(zUpper)), 0.05, { rtol: 1e-6 });
  });

  it('returns null with a warning when the Galactic terms alone exceed the observed DM', () => {
    const lim = maxSourceRedshift({ ...obs, dmObs: 60 });
    expect(lim.z_max).toBeNull();
    expect(lim.warnings.join(' ')).toMatch(/no room for a cosmic term/);
  });
});

describe('source-redshift posterior without a measured z_s', () => {
  it('is normalised on its grid and its median lies inside the 68 % interval', () => {
    const post = redshiftPosterior({ ...obs, draws: 4000 });
    let area = 0;
    for (let i = 1; i < post.z.length; i++)
      area += 0.5 * (post.posterior[i] + post.posterior[i - 1]) * (post.z[i] - post.z[i - 1]);
    expectClose(area, 1, { rtol: 1e-12 });
    expect(post.interval68[0]).toBeLessThan(post.median);
    expect(post.median).toBeLessThan(post.interval68[1]);
    expect(post.prior).toMatch(/flat in z/);
  });

  it('reduces to the density of DM_cosmic at R when the host term is negligible', () => {
    // Host prior narrow at 0.01 pc cm⁻³ and fixed other terms: p(z) ∝ p_Δ(R/M(z)) / M(z) (change of
    // variables from Δ to DM_cosmic). Compared at the 0.5 % level, the quadrature granularity.
    const fixed = {
      dmObs: 650,
      dmObsErr: 0,
      dmIsm: 40,
      dmIsmErr: 0,
      dmMwHalo: { mean: 50, err: 0 },
      cosmology,
    };
    const zs = Array.from({ length: 60 }, (_, i) => 0.2 + i * 0.01);
    const post = redshiftPosterior({
      ...fixed,
      zGrid: zs,
      draws: 200,
      residualNodes: 16,
      hostNodes: 64,
      budgetModel: { cosmic_mode: 'full', host: { median_pc_cm3: 0.01, sigma_ln: 0.05 } },
    });
    const mean = createMacquartMean(cosmology, { fd: 0.844 });
    const expected = zs.map(
      (z) => createCosmicPdf(0.32, z).density(560 / mean.meanDmPcCm3(z)) / mean.meanDmPcCm3(z),
    );
    let area = 0;
    for (let i = 1; i < zs.length; i++) area += 0.5 * (expected[i] + expected[i - 1]) * (zs[i] - zs[i - 1]);
    const iPeak = expected.indexOf(Math.max(...expected));
    for (const i of [iPeak, 10, 45]) expectClose(post.posterior[i], expected[i] / area, { rtol: 0.005 });
  });

  it('converges as the quadrature nodes are refined', () => {
    const coarse = redshiftPosterior({ ...obs, draws: 4000 });
    const fine = redshiftPosterior({ ...obs, draws: 4000, residualNodes: 800, hostNodes: 640 });
    expectClose(coarse.median, fine.median, { rtol: 2e-3 });
  });

  it('shifts to higher z under a comoving-volume prior', () => {
    const flat = redshiftPosterior({ ...obs, draws: 2000 });
    const vol = redshiftPosterior({ ...obs, draws: 2000, zPrior: 'comoving_volume' });
    expect(vol.median).toBeGreaterThan(flat.median);
  });
});
