import { describe, expect, it } from 'vitest';
import { budgetBodyJson, budgetResponseSchema, computeBudget } from '../../src/budget-request/index.js';
import { InputError } from '../../src/errors.js';
import type { SightlineResponse } from '../../src/sightline/index.js';
import { expectClose } from '../helpers/expect-close.js';

const noSightline = { runSightline: () => Promise.reject(new Error('no sightline expected')) };
const exact = { dm_obs: 900, dm_ism: 40, dm_ism_err: 0, dm_mw_halo: { mean: 50, err: 0 } };

// physics.md §7: K = 3cH0Ω_b/(8πG m_p) = 1115.4744 pc cm⁻³ for H0 = 67.66, Ω_b = 0.04897; K ∝ H0 Ω_b.
const K_PLANCK18 = 1115.4744;

describe('computeBudget', () => {
  it('honours a custom cosmology: Einstein–de Sitter ⟨DM⟩ = K f_d χ_e · 2(√(1+z) − 1) (closed form)', async () => {
    // Om0 = 1, no radiation: E = (1+z)^{3/2}, ∫₀ᶻ (1+z')/E dz' = 2(√(1+z) − 1); χ_e = 0.875 below z = 3 (physics.md §7).
    const b = await computeBudget(noSightline, {
      ...exact,
      z_source: 0.5,
      cosmology: { H0: 67.66, Om0: 1, Ob0: 0.04897, Tcmb0: 0 },
      budget_model: { draws: 200 },
    });
    const expected = K_PLANCK18 * 0.844 * 0.875 * 2 * (Math.sqrt(1.5) - 1);
    // physics.md quotes K to 8 significant figures.
    expectClose(b.macquart_mean as number, expected, { rtol: 1e-6 });
    expect(b.model.cosmology).toMatch(/custom flat ΛCDM/);
  });

  it('a halo term given as mean ± err is a normal truncated at 0, whose mean has the closed form μ + σ φ(α)/(1 − Φ(α))', async () => {
    // α = −μ/σ = −0.5; φ(0.5) = e^{−1/8}/√(2π); Φ(0.5) = 0.691462 (standard normal table).
    const mu = 10;
    const sigma = 20;
    const n = 40_000;
    const b = await computeBudget(noSightline, {
      ...exact,
      z_source: 0.5,
      halos: { mean: mu, err: sigma },
      budget_model: { draws: n, seed: 3 },
    });
    const phi = Math.exp(-0.125) / Math.sqrt(2 * Math.PI);
    const truncatedMean = mu + (sigma * phi) / 0.691462;
    // The variance of the truncated normal is below σ², so σ/√n bounds the standard error; allow 4 of them.
    expect(Math.abs(b.components.halos.mean - truncatedMean)).toBeLessThan((4 * sigma) / Math.sqrt(n));
    expect(b.components.halos.p16).toBeGreaterThanOrEqual(0);
    expect(b.halos_source).toEqual({
      kind: 'normal',
      description: expect.stringContaining('truncated at 0'),
      draws_given: n,
    });
  });

  it('resamples a constant halo draw array to exactly that value, and sums per draw into host_rest', async () => {
    const b = await computeBudget(noSightline, {
      ...exact,
      dm_obs_err: 0,
      z_source: 0.5,
      halos: { draws: [25, 25, 25] },
      budget_model: { draws: 500 },
    });
    expect(b.components.halos).toEqual({ mean: 25, p16: 25, p50: 25, p84: 25 });
    // Everything but the cosmic term is exact, so host_rest = (900 − 40 − 50 − 25 − cosmic)(1 + z) quantile by quantile.
    expectClose(b.host_rest?.p50 as number, (785 - b.components.cosmic!.p50) * 1.5, { rtol: 1e-9 });
  });

  it('takes the halo term from the sightline runner with include_draws, the budget z_s and the sightline keys', async () => {
    const seen: unknown[] = [];
    const fake = {
      runSightline: async (r: unknown) => {
        seen.push(r);
        return {
          sightline: { ra: 10, dec: 20, z_source: 0.3, z_source_err: 0, host_id: null, catalogs: ['a'] },
          model: { draws: 4, seed: 1 },
          totals: {
            dm_halos: { mean: 1, p2_5: 1, p16: 1, p50: 1, p84: 1, p97_5: 1 },
            n_candidates: 2,
            n_intersected: 1,
            draws: 4,
            seed: 1,
          },
          warnings: [
            { code: 'cosmic_double_counting', message: 'x' },
            { code: 'photo_z', message: 'y' },
          ],
          draws_dm: [10, 10, 10, 10],
        } as unknown as SightlineResponse;
      },
    };
    const b = await computeBudget(fake, {
      ...exact,
      z_source: 0.3,
      sightline: { ra: 10, dec: 20, catalogs: ['a'], z_source_err: 0.01 },
      budget_model: { draws: 300 },
    });
    expect(seen).toEqual([
      { ra: 10, dec: 20, z_source: 0.3, z_source_err: 0.01, catalogs: ['a'], include_draws: true },
    ]);
    expect(b.components.halos.p50).toBe(10);
    expect(b.halos_source.kind).toBe('sightline');
    expect(b.warnings.map((w) => `${w.source}/${w.code}`)).toEqual([
      'request/z_source_err_halos_only',
      'sightline/photo_z',
    ]);
  });

  it('is deterministic for a request and its body round-trips through the response schema unchanged', async () => {
    const req = { ...exact, dm_ism_err: 5, z_source: 0.8, budget_model: { draws: 400, seed: 7 } };
    const a = await computeBudget(noSightline, req);
    const b = await computeBudget(noSightline, req);
    expect(b).toEqual(a);
    expect(budgetResponseSchema.parse(a)).toEqual(a);
    expect(JSON.parse(budgetBodyJson(a))).toEqual(JSON.parse(JSON.stringify(a)));
  });

  it('rejects bad requests with InputError naming each field', async () => {
    const cases: [unknown, string][] = [
      [{ dm_obs: 0, dm_ism: 1 }, 'dm_obs'],
      [{ dm_obs: 100, dm_ism: 1, z_source: -1 }, 'z_source'],
      [{ dm_obs: 100 }, 'dm_ism'],
      [{ dm_obs: 100, dm_ism: 1, halos: { draws: [] } }, 'halos.draws'],
      [{ dm_obs: 100, dm_ism: 1, z_source: 0.2, without_redshift: {} }, 'without_redshift'],
      [
        { dm_obs: 100, dm_ism: 1, z_source: 0.2, cosmology: 'planck18', sightline: { ra: 1, dec: 1 } },
        'cosmology',
      ],
      [{ dm_obs: 100, dm_ism: 1, z_source: 0.2, sightline: { ra: 360, dec: 1 } }, 'sightline.ra'],
    ];
    for (const [body, key] of cases) {
      const err = await computeBudget(noSightline, body).catch((e: unknown) => e);
      expect(err, JSON.stringify(body)).toBeInstanceOf(InputError);
      expect((err as InputError).details as { key: string }[]).toEqual(
        expect.arrayContaining([expect.objectContaining({ key })]),
      );
    }
    const missing = await computeBudget(noSightline, { dm_obs: 100 }).catch((e: InputError) => e);
    expect((missing as InputError).message).toMatch(/ships no Galactic electron-density model/);
  });
});
