import { describe, expect, it } from 'vitest';
import { createCosmicPdf, createMacquartMean, hostPosterior } from '../../src/budget/index.js';
import { createCosmology } from '../../src/cosmology/index.js';
import { InputError } from '../../src/errors.js';
import { expectClose } from '../helpers/expect-close.js';

const cosmology = createCosmology('planck18');
const base = { dmObs: 700, dmObsErr: 1, dmIsm: 45, dmIsmErr: 10, zSource: 0.45, cosmology };
const halos = Float64Array.from({ length: 300 }, (_, i) => 15 + (i % 40));

describe('host DM posterior', () => {
  it('sums exactly per draw: DM_obs = ISM + MW halo + cosmic + haloes + DM_host,rest/(1+z_s)', () => {
    const r = hostPosterior({ ...base, haloDraws: halos, draws: 5000, seed: 3, keepDraws: true });
    const d = r.perDraw!;
    for (let i = 0; i < 5000; i++) {
      const sum = d.ism[i] + d.mwHalo[i] + d.cosmic[i] + d.halos[i] + d.hostRest[i] / (1 + base.zSource);
      expectClose(sum, d.obs[i], { rtol: 1e-12 });
    }
    let neg = 0;
    for (const v of d.hostRest) if (v < 0) neg++;
    expect(r.p_negative_host).toBe(neg / 5000);
  });

  it('is reproducible for a seed and changes with it', () => {
    const a = hostPosterior({ ...base, seed: 11, draws: 2000 });
    const b = hostPosterior({ ...base, seed: 11, draws: 2000 });
    const c = hostPosterior({ ...base, seed: 12, draws: 2000 });
    expect(a).toEqual(b);
    expect(c.host_rest.p50).not.toBe(a.host_rest.p50);
    expect(a.seed).toBe(11);
    expect(a.draws).toBe(2000);
  });

  it('reports the Macquart mean with f_d = 0.844 whatever the cosmic mode, and f_igm/f_d scaling in diffuse mode', () => {
    const m = createMacquartMean(cosmology, { fd: 0.844 }).meanDmPcCm3(base.zSource);
    const diffuse = hostPosterior({ ...base, draws: 500 });
    const full = hostPosterior({ ...base, draws: 500, budgetModel: { cosmic_mode: 'full' } });
    expectClose(diffuse.macquart_mean, m, { rtol: 1e-12 });
    expectClose(full.macquart_mean, m, { rtol: 1e-12 });
    expectClose(full.cosmic_mean_in_force, m, { rtol: 1e-12 });
    // Constant f: the mean is linear in f, so the diffuse mean is (0.7/0.844) of the full one.
    expectClose(diffuse.cosmic_mean_in_force, (m * 0.7) / 0.844, { rtol: 1e-12 });
    expect(diffuse.conventions[0]).toMatch(/cosmic_mode 'diffuse'/);
    expect(full.conventions[0]).toMatch(/cosmic_mode 'full'/);
  });

  it('warns about double counting in full mode with haloes, and about a missing halo term', () => {
    const full = hostPosterior({
      ...base,
      draws: 500,
      haloDraws: halos,
      budgetModel: { cosmic_mode: 'full' },
    });
    expect(full.warnings.join(' ')).toMatch(/counted twice/);
    const none = hostPosterior({ ...base, draws: 500 });
    expect(none.warnings.join(' ')).toMatch(/no foreground-halo draws/);
    expect(none.components.halos.mean).toBe(0);
    expect(none.assumptions.mw_halo).toMatch(/common practice/);
  });

  it('reproduces the Macquart PDF quantiles in the host term when every other term is fixed', () => {
    // With exact ISM, MW halo and DM_obs, DM_host,rest = (R − M Δ)(1+z): its p16/p50/p84 are the
    // Δ quantiles p84/p50/p16 mapped linearly. Tolerance: 4 standard errors of a sample quantile,
    // SE = √(p(1−p)/n) / pdf(Δ_p) (asymptotic order-statistic variance, common practice).
    const n = 40_000;
    const fixed = { dmObs: 900, dmObsErr: 0, dmIsm: 40, dmIsmErr: 0, dmMwHalo: { mean: 50, err: 0 } };
    const r = hostPosterior({ ...fixed, zSource: 0.6, cosmology, draws: n, seed: 8 });
    const pdf = createCosmicPdf(0.32, 0.6);
    const M = r.cosmic_mean_in_force;
    const R = 900 - 40 - 50;
    for (const [p, got] of [
      [0.16, r.host_rest.p84],
      [0.5, r.host_rest.p50],
      [0.84, r.host_rest.p16],
    ] as const) {
      const delta = pdf.quantile(p);
      const se = (Math.sqrt((p * (1 - p)) / n) / pdf.density(delta)) * M * 1.6;
      expect(Math.abs(got - (R - M * delta) * 1.6)).toBeLessThan(4 * se);
    }
    expect(r.components.mw_halo.p16).toBe(50);
  });

  it('never clips a negative host DM and counts it', () => {
    const r = hostPosterior({ ...base, dmObs: 300, draws: 2000 });
    expect(r.host_rest.p50).toBeLessThan(0);
    expect(r.p_negative_host).toBeGreaterThan(0.5);
    expect(r.warnings.join(' ')).toMatch(/P\(DM_host < 0\)/);
  });

  it.each([
    [{ dmObs: -5 }, /dmObs: must be a finite number > 0/],
    [{ dmIsmErr: Number.NaN }, /dmIsmErr/],
    [{ dmMwHalo: { mean: -1, err: 1 } }, /dmMwHalo.mean/],
    [{ haloDraws: Float64Array.from([1, Number.NaN]) }, /haloDraws\[1\]/],
    [{ budgetModel: { f_igm: 2 } }, /f_igm: f_igm must be ≤ 1/],
    [{ budgetModel: { cosmic_mod: 'full' } }, /Unrecognized key/i],
    [{ zSource: 0 }, /zSource must be/],
  ])('rejects %j with a message naming the field', (bad, message) => {
    expect(() => hostPosterior({ ...base, draws: 200, ...(bad as object) })).toThrow(InputError);
    expect(() => hostPosterior({ ...base, draws: 200, ...(bad as object) })).toThrow(message);
  });
});
