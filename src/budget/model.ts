import { z } from 'zod';
import { MACQUART_F_DEFAULT } from './cosmic-pdf.js';
import { HE_REION_Z_DEFAULT } from './ionisation.js';

/**
 * The DM-budget model: every key, its default and why. Shared by the HTTP and CLI layers.
 *
 * - f_d 0.844: diffuse ionised baryon fraction used with the Macquart relation at low z
 *   (physics.md §7; the value quoted with Macquart et al. 2020 (from memory)).
 * - cosmic_mode 'diffuse' (default): the cosmic term uses f_igm, the fraction of baryons in the
 *   diffuse IGM *outside* haloes, so explicitly listed foreground haloes are not counted twice.
 *   'full' uses f_d, which already contains the average halo gas; outputs then warn of double counting.
 * - f_igm 0.7: team assumption, not a fit. Reasoning: f_d ≈ 0.84 minus the share of baryons bound
 *   in galaxy/group haloes' hot gas, which censuses put at roughly 0.1–0.2 of all baryons
 *   (e.g. Prochaska & Zheng 2019, MNRAS 485, 648 (from memory)). Change it to test the assumption.
 * - F 0.32: Macquart et al. 2020 feedback parameter (from memory); σ_DM = F z^(−1/2).
 * - he_reion_z 3.0: helium II reionisation redshift (common practice).
 * - mw_halo uniform 25–80 pc cm⁻³: the commonly quoted few tens of pc cm⁻³ (common practice;
 *   published estimates range from under 10 to ~100).
 * - host log-normal median 100 pc cm⁻³, σ_ln 1.0 (rest frame): team assumption for the redshift
 *   posterior only; survey fits differ and should replace it.
 */
export const budgetModelSchema = z.strictObject({
  f_d: z.number().gt(0, 'f_d must be > 0').lte(1, 'f_d must be ≤ 1').default(0.844),
  f_d_table: z
    .array(
      z.tuple([
        z.number().finite().gte(0, 'z in f_d_table must be ≥ 0'),
        z.number().gt(0, 'f_d in f_d_table must be > 0').lte(1, 'f_d in f_d_table must be ≤ 1'),
      ]),
    )
    .min(2, 'f_d_table needs at least 2 rows [z, f_d]')
    .refine(
      (rows) => rows.every((r, i) => i === 0 || r[0] > rows[i - 1][0]),
      'z in f_d_table must increase strictly',
    )
    .optional(),
  cosmic_mode: z.enum(['diffuse', 'full']).default('diffuse'),
  f_igm: z.number().gt(0, 'f_igm must be > 0').lte(1, 'f_igm must be ≤ 1').default(0.7),
  F: z.number().gt(0, 'F must be > 0').lte(10, 'F must be ≤ 10').default(MACQUART_F_DEFAULT),
  he_reion_z: z
    .number()
    .gte(0, 'he_reion_z must be ≥ 0')
    .lte(20, 'he_reion_z must be ≤ 20')
    .default(HE_REION_Z_DEFAULT),
  mw_halo: z
    .discriminatedUnion('kind', [
      z
        .strictObject({
          kind: z.literal('uniform'),
          min: z.number().gte(0, 'mw_halo.min must be ≥ 0'),
          max: z.number().gte(0, 'mw_halo.max must be ≥ 0'),
        })
        .refine((p) => p.max > p.min, { message: 'mw_halo.max must exceed mw_halo.min', path: ['max'] }),
      z.strictObject({
        kind: z.literal('normal'),
        mean: z.number().gte(0, 'mw_halo.mean must be ≥ 0'),
        sd: z.number().gte(0, 'mw_halo.sd must be ≥ 0'),
      }),
    ])
    .default({ kind: 'uniform', min: 25, max: 80 }),
  host: z
    .strictObject({
      median_pc_cm3: z.number().gt(0, 'host.median_pc_cm3 must be > 0').default(100),
      sigma_ln: z.number().gt(0, 'host.sigma_ln must be > 0').lte(5, 'host.sigma_ln must be ≤ 5').default(1),
    })
    .default({ median_pc_cm3: 100, sigma_ln: 1 }),
  draws: z.int().gte(100, 'draws must be ≥ 100').lte(1_000_000, 'draws must be ≤ 1,000,000').default(10_000),
  seed: z.int().gte(0, 'seed must be ≥ 0').lte(0xffffffff, 'seed must be < 2^32').default(1),
});

export type BudgetModel = z.output<typeof budgetModelSchema>;
export type BudgetModelInput = z.input<typeof budgetModelSchema>;
