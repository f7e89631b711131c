import { describe, expect, it } from 'vitest';
import { budgetModelSchema, resolveBudgetModel } from '../../src/budget/index.js';

describe('budget model schema', () => {
  it('fills every documented default', () => {
    expect(budgetModelSchema.parse({})).toEqual({
      f_d: 0.844,
      cosmic_mode: 'diffuse',
      f_igm: 0.7,
      F: 0.32,
      he_reion_z: 3,
      mw_halo: { kind: 'uniform', min: 25, max: 80 },
      host: { median_pc_cm3: 100, sigma_ln: 1 },
      draws: 10_000,
      seed: 1,
    });
  });

  it('accepts an f_d table and a normal Milky Way halo prior', () => {
    const m = resolveBudgetModel({
      f_d_table: [
        [0, 0.8],
        [2, 0.9],
      ],
      mw_halo: { kind: 'normal', mean: 40, sd: 10 },
    });
    expect(m.f_d_table).toHaveLength(2);
    expect(m.mw_halo).toEqual({ kind: 'normal', mean: 40, sd: 10 });
  });

  it.each([
    [
      {
        f_d_table: [
          [1, 0.8],
          [0.5, 0.9],
        ],
      },
      /f_d_table: z in f_d_table must increase strictly/,
    ],
    [{ mw_halo: { kind: 'uniform', min: 50, max: 20 } }, /mw_halo.max: mw_halo.max must exceed/],
    [{ draws: 10.5 }, /draws/],
    [{ seed: -1 }, /seed: seed must be ≥ 0/],
    [{ cosmic_mode: 'both' }, /cosmic_mode/],
  ])('rejects %j naming the key', (bad, message) => {
    expect(() => resolveBudgetModel(bad as never)).toThrow(message);
  });
});
