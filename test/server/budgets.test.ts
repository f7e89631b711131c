import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectClose } from '../helpers/expect-close.js';
import { DEMO_BURST, demoApp } from './demo-app.js';

/**
 * POST /v1/budgets on a temporary store holding the invented demo field (Kestrel Deep Field, burst
 * "Osprey"; scripts/demo/make-field.ts). External reference values come from
 * /work/shared/reference/physics.md §7 (computed there with astropy Planck18 and two independent
 * quadratures of the Macquart et al. 2020 PDF).
 */

// physics.md §7: ⟨DM_cosmic⟩(z = 0.5) for Planck18 with constant f_d = 0.844.
const MACQUART_Z05_FD0844 = 448.1578;
// physics.md §7, PDF table, F = 0.32, z = 0.5: 16th percentile, median, 84th percentile of Δ.
const DELTA_Z05 = { p16: 0.6726, p50: 0.8058, p84: 1.15 };
// physics.md §7: p(Δ) = A Δ^(−β) exp[−(Δ^(−α) − C₀)² / (2α²σ_DM²)], α = β = 3, with the table's
// A = 1.106170, C₀ = 2.154216, σ_DM = 0.45255 for F = 0.32, z = 0.5.
const pdfZ05 = (delta: number) =>
  1.10617 * delta ** -3 * Math.exp(-((delta ** -3 - 2.154216) ** 2) / (2 * 9 * 0.45255 ** 2));

describe('POST /v1/budgets', () => {
  let ctx: Awaited<ReturnType<typeof demoApp>>;
  beforeAll(async () => {
    ctx = await demoApp();
  });
  afterAll(async () => ctx.cleanup());

  const post = (body: unknown) =>
    ctx.app.inject({ method: 'POST', url: '/v1/budgets', payload: body as object });

  // Every non-cosmic term fixed, so DM_host,rest = (R − M Δ)(1 + z) maps the Δ quantiles linearly.
  const fixed = {
    dm_obs: 800,
    dm_obs_err: 0,
    dm_ism: 40,
    dm_ism_err: 0,
    dm_mw_halo: { mean: 50, err: 0 },
    halos: { mean: 30, err: 0 },
  };

  it('carries every contract field: macquart_mean, the four components, host_rest, p_negative_host, model and warnings', async () => {
    const res = await post({ ...fixed, z_source: 0.5, budget_model: { draws: 2000 } });
    expect(res.statusCode, res.body).toBe(200);
    const b = res.json();
    expect(Object.keys(b.components).sort()).toEqual(['cosmic', 'halos', 'mw_halo', 'mw_ism']);
    for (const c of Object.values(b.components))
      expect(Object.keys(c as object).sort()).toEqual(['mean', 'p16', 'p50', 'p84']);
    expect(Object.keys(b.host_rest).sort()).toEqual(['mean', 'p16', 'p2_5', 'p50', 'p84', 'p97_5']);
    expect(typeof b.macquart_mean).toBe('number');
    expect(b.p_negative_host).toBeGreaterThanOrEqual(0);
    expect(b.model.budget.f_d).toBe(0.844);
    expect(b.model.sightline).toBeNull();
    expect(Array.isArray(b.warnings)).toBe(true);
    expect(b.conventions.join(' ')).toMatch(/cosmic_mode 'diffuse'/);
    expect(b.conventions.join(' ')).toMatch(/no Galactic electron-density model/);
    expect(b.cautions.length).toBeGreaterThan(0);
    expect(b.redshift_limit).toBeNull();
    expect(b.redshift_posterior).toBeNull();
  });

  it('macquart_mean at z = 0.5 is the physics.md Planck18 value with f_d = 0.844, in both cosmic modes', async () => {
    for (const cosmic_mode of ['diffuse', 'full']) {
      const b = (await post({ ...fixed, z_source: 0.5, budget_model: { cosmic_mode, draws: 500 } })).json();
      // physics.md gives 7 significant figures; rtol 2e-6 covers its rounding.
      expectClose(b.macquart_mean, MACQUART_Z05_FD0844, { rtol: 2e-6 });
    }
  });

  it('host_rest quantiles are the Macquart PDF quantiles of physics.md mapped through (R − M Δ)(1 + z)', async () => {
    const n = 20_000;
    const b = (await post({ ...fixed, z_source: 0.5, budget_model: { draws: n, seed: 5 } })).json();
    // Diffuse mode: the cosmic mean scales linearly with the constant fraction, f_igm / f_d = 0.7 / 0.844.
    const M = (MACQUART_Z05_FD0844 * 0.7) / 0.844;
    expectClose(b.cosmic_mean_in_force, M, { rtol: 2e-6 });
    const R = 800 - 40 - 50 - 30;
    // Tolerance: 4 standard errors of a sample quantile, √(p(1−p)/n)/p(Δ_p) (asymptotic order-statistic
    // variance, common practice), with the density p(Δ) from the physics.md closed form and its A, C₀,
    // σ_DM for F = 0.32, z = 0.5; times M (1 + z); plus the 4-digit rounding of the physics.md quantiles.
    const tol = (p: number, delta: number) =>
      ((4 * Math.sqrt((p * (1 - p)) / n)) / pdfZ05(delta) + 1e-4) * M * 1.5;
    expect(Math.abs(b.host_rest.p50 - (R - M * DELTA_Z05.p50) * 1.5)).toBeLessThan(tol(0.5, DELTA_Z05.p50));
    expect(Math.abs(b.host_rest.p16 - (R - M * DELTA_Z05.p84) * 1.5)).toBeLessThan(tol(0.84, DELTA_Z05.p84));
    expect(Math.abs(b.host_rest.p84 - (R - M * DELTA_Z05.p16) * 1.5)).toBeLessThan(tol(0.16, DELTA_Z05.p16));
    expect(Math.abs(b.components.cosmic.p50 - M * DELTA_Z05.p50)).toBeLessThan(tol(0.5, DELTA_Z05.p50) / 1.5);
    expect(b.components.mw_ism).toEqual({ mean: 40, p16: 40, p50: 40, p84: 40 });
    expect(b.components.halos.p50).toBe(30);
  });

  it("'full' mode keeps macquart_mean and warns that listed haloes are counted twice", async () => {
    const b = (
      await post({ ...fixed, z_source: 0.5, budget_model: { cosmic_mode: 'full', draws: 500 } })
    ).json();
    expect(b.cosmic_mean_in_force).toBeCloseTo(b.macquart_mean, 9);
    expect(b.conventions[0]).toMatch(/cosmic_mode 'full'/);
    expect(b.warnings.map((w: { message: string }) => w.message).join(' ')).toMatch(/counted twice/);
  });

  it('takes the foreground term from the demo sightline: the halo component follows the sightline draws', async () => {
    const sightlineModel = { draws: 400, seed: 3 };
    const direct = (
      await ctx.app.inject({
        method: 'POST',
        url: '/v1/sightlines',
        payload: {
          ra: DEMO_BURST.raDeg,
          dec: DEMO_BURST.decDeg,
          z_source: DEMO_BURST.zSource,
          host_id: DEMO_BURST.hostId,
          model: sightlineModel,
          include_draws: true,
        },
      })
    ).json();
    const res = await post({
      dm_obs: DEMO_BURST.dmObs,
      dm_obs_err: DEMO_BURST.dmObsErr,
      dm_ism: DEMO_BURST.dmIsm,
      dm_ism_err: DEMO_BURST.dmIsmErr,
      z_source: DEMO_BURST.zSource,
      sightline: {
        ra: DEMO_BURST.raDeg,
        dec: DEMO_BURST.decDeg,
        host_id: DEMO_BURST.hostId,
        model: sightlineModel,
      },
      budget_model: { draws: 8000, seed: 2 },
    });
    expect(res.statusCode, res.body).toBe(200);
    const b = res.json();
    expect(b.halos_source.kind).toBe('sightline');
    expect(b.halos_source.draws_given).toBe(400);
    expect(b.sightline.dm_halos).toEqual(direct.totals.dm_halos);
    expect(b.sightline.n_candidates).toBe(direct.totals.n_candidates);
    expect(b.model.sightline.draws).toBe(400);
    // Resampling with replacement: the mean of 8000 resampled draws is within 4 standard errors of
    // the sightline's own mean (SE = sd/√8000).
    const d: number[] = direct.draws_dm;
    const mean = d.reduce((s, v) => s + v, 0) / d.length;
    const sd = Math.sqrt(d.reduce((s, v) => s + (v - mean) ** 2, 0) / (d.length - 1));
    expect(mean).toBeGreaterThan(0);
    expect(Math.abs(b.components.halos.mean - mean)).toBeLessThan(4 * (sd / Math.sqrt(8000)) + 1e-9);
    // The budget restates the cosmic double-counting convention itself; the sightline's version is dropped.
    expect(b.warnings.some((w: { code: string }) => w.code === 'cosmic_double_counting')).toBe(false);
    expect(b.warnings.some((w: { source: string }) => w.source === 'sightline')).toBe(true);
  });

  it('without z_source the redshift limit sits where the physics.md 84th percentile of Δ says', async () => {
    // With every term fixed, P(DM_host < 0 | z) = P(Δ > R/M(z)). Choosing R = Δ_84(0.5) M(0.5) and
    // confidence 0.84 puts the limit at z = 0.5 (physics.md §7 tables; M in diffuse mode = 0.7/0.844 of the table).
    const M05 = (MACQUART_Z05_FD0844 * 0.7) / 0.844;
    const R = DELTA_Z05.p84 * M05;
    const res = await post({
      dm_obs: 40 + 50 + R,
      dm_ism: 40,
      dm_ism_err: 0,
      dm_mw_halo: { mean: 50, err: 0 },
      budget_model: { draws: 200 },
      without_redshift: { confidence: 0.84 },
    });
    expect(res.statusCode, res.body).toBe(200);
    const b = res.json();
    expect(b.z_source).toBeNull();
    expect(b.host_rest).toBeNull();
    expect(b.macquart_mean).toBeNull();
    expect(b.components.cosmic).toBeNull();
    expect(b.redshift_limit.bracketed).toBe(true);
    // Tolerance: the 4-digit rounding of Δ_84 (≈ 1e-4 relative) moves z by < 1e-3.
    expect(Math.abs(b.redshift_limit.z_max - 0.5)).toBeLessThan(1e-3);
    const post68 = b.redshift_posterior;
    expect(post68.z.length).toBe(post68.density.length);
    let area = 0;
    for (let i = 1; i < post68.z.length; i++)
      area += 0.5 * (post68.density[i] + post68.density[i - 1]) * (post68.z[i] - post68.z[i - 1]);
    expectClose(area, 1, { rtol: 1e-9 });
    expect(post68.interval68[0]).toBeLessThan(post68.median);
    expect(post68.median).toBeLessThan(post68.interval68[1]);
  });

  it('rejects bad input with 4xx naming the field: dm_obs ≤ 0, z_source ≤ 0, sightline without z_source, unknown catalogue', async () => {
    const bad = [
      [{ dm_obs: 0, dm_ism: 30, z_source: 0.3 }, 'body.dm_obs'],
      [{ dm_obs: 500, dm_ism: 30, z_source: 0 }, 'body.z_source'],
      [{ dm_obs: 500, dm_ism: -1, z_source: 0.3 }, 'body.dm_ism'],
      [{ dm_obs: 500, dm_ism: 30, sightline: { ra: 10, dec: 0 } }, 'body.z_source'],
      [
        { dm_obs: 500, dm_ism: 30, z_source: 0.3, halos: { mean: 1, err: 1 }, sightline: { ra: 1, dec: 0 } },
        'body.halos',
      ],
      [{ dm_obs: 500, dm_ism: 30, z_source: 0.3, budget_model: { f_d: 2 } }, 'body.budget_model.f_d'],
      [{ dm_obs: 500, dm_ism: 30, z_source: 0.3, surprise: 1 }, 'body'],
    ] as const;
    for (const [body, field] of bad) {
      const res = await post(body);
      expect(res.statusCode, JSON.stringify(body)).toBe(400);
      const e = res.json().error;
      expect(e.code).toBe('invalid_request');
      expect(e.details.issues.map((i: { field: string }) => i.field)).toContain(field);
    }
    const unknown = await post({
      dm_obs: 500,
      dm_ism: 30,
      z_source: 0.3,
      sightline: { ra: DEMO_BURST.raDeg, dec: DEMO_BURST.decDeg, catalogs: ['no-such-catalogue'] },
    });
    expect(unknown.statusCode).toBeGreaterThanOrEqual(400);
    expect(unknown.statusCode).toBeLessThan(500);
    expect(unknown.json().error.message).toContain('no-such-catalogue');
  });

  it('refuses more draws than the server allows, naming the field', async () => {
    const res = await post({ ...fixed, z_source: 0.5, budget_model: { draws: 500_000 } });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.message).toContain('body.budget_model.draws');
  });

  it('is documented in the OpenAPI document with the contract fields of the reply', async () => {
    const doc = (await ctx.app.inject({ method: 'GET', url: '/v1/openapi.json' })).json();
    const op = doc.paths['/v1/budgets'].post;
    const reply = op.responses['200'].content['application/json'].schema;
    for (const key of ['macquart_mean', 'components', 'host_rest', 'p_negative_host', 'model', 'warnings'])
      expect(reply.properties).toHaveProperty(key);
    const body = op.requestBody.content['application/json'].schema;
    for (const key of ['dm_obs', 'dm_ism', 'z_source', 'sightline', 'halos', 'budget_model'])
      expect(body.properties).toHaveProperty(key);
  });
});
