import { z } from 'zod';
import { budgetModelSchema } from '../budget/index.js';
import { cosmologySpecSchema } from '../cosmology/index.js';
import { sightlineRequestSchema } from '../sightline/index.js';

/**
 * The DM-budget request, shared by POST /v1/budgets and `forehalo budget` (the server builds its
 * OpenAPI document from it). Every DM is observer-frame pc cm⁻³.
 */

/** Said when dm_ism is missing: forehalo has no Galactic model to fall back on. */
const GALACTIC_HINT =
  'forehalo ships no Galactic electron-density model; give the value from the model of your choice';

const dmValue = (field: string, min: 'positive' | 'nonnegative', missingHint?: string) => {
  const base = z
    .number({
      error: (issue) =>
        issue.input === undefined
          ? `${field} is required [pc cm⁻³]${missingHint ? `: ${missingHint}` : ''}`
          : `${field} must be a number [pc cm⁻³]`,
    })
    .finite();
  const bounded =
    min === 'positive'
      ? base.gt(0, `${field} must be > 0 pc cm⁻³`)
      : base.gte(0, `${field} must be ≥ 0 pc cm⁻³`);
  return bounded.lte(100_000, `${field} must be ≤ 100000 pc cm⁻³`);
};

const halfNormal = z.strictObject({
  mean: dmValue('mean', 'nonnegative').describe('Central value [pc cm⁻³]'),
  err: dmValue('err', 'nonnegative').describe('1σ error [pc cm⁻³]; the term is drawn normal, truncated at 0'),
});

/** Where the foreground-halo term comes from when the caller has their own (a pipeline's result). */
export const haloTermSchema = z.union([
  z
    .strictObject({
      draws: z
        .array(dmValue('halos.draws[]', 'nonnegative'))
        .min(1, 'halos.draws needs at least one value')
        .max(1_000_000, 'halos.draws holds at most 1,000,000 values'),
    })
    .describe('Per-draw foreground-halo totals [pc cm⁻³], resampled with replacement'),
  halfNormal.describe('Foreground-halo total as mean ± 1σ [pc cm⁻³] (normal, truncated at 0)'),
]);

/** Which sightline to take the foreground term from: the sightline engine's own request keys. */
export const budgetSightlineSchema = sightlineRequestSchema
  .pick({ ra: true, dec: true, catalogs: true, host_id: true, z_source_err: true, model: true })
  .strict()
  .describe(
    'Run the sightline engine at this position (with z_source from the budget request) and use its ' +
      'per-draw foreground-halo totals as the halo term',
  );

/** Options of the two analyses made when z_source is omitted. */
export const withoutRedshiftSchema = z.strictObject({
  confidence: z
    .number()
    .gt(0, 'confidence must be > 0')
    .lt(1, 'confidence must be < 1')
    .default(0.95)
    .describe('redshift_limit: P(DM_host ≥ 0) required at the limit'),
  z_prior: z
    .enum(['flat', 'comoving_volume'])
    .default('flat')
    .describe('redshift_posterior: prior on z_s (flat in z, or ∝ comoving volume)'),
  z_max: z
    .number()
    .gt(0.05, 'z_max must be > 0.05')
    .lte(10, 'z_max must be ≤ 10')
    .default(3)
    .describe('Upper end of the redshift grid and of the limit search'),
});

export const budgetRequestSchema = z
  .strictObject({
    dm_obs: dmValue('dm_obs', 'positive').describe('Observed DM of the burst [pc cm⁻³]'),
    dm_obs_err: dmValue('dm_obs_err', 'nonnegative').default(0).describe('1σ error of dm_obs [pc cm⁻³]'),
    dm_ism: dmValue('dm_ism', 'nonnegative', GALACTIC_HINT).describe(
      'Milky Way ISM DM towards the burst from the Galactic electron-density model of your choice ' +
        '[pc cm⁻³]; forehalo ships no Galactic model and uses this value as given',
    ),
    dm_ism_err: dmValue('dm_ism_err', 'nonnegative')
      .optional()
      .describe('1σ error of dm_ism [pc cm⁻³]; omitted → 0 with a warning (models can be off by ~2×)'),
    dm_mw_halo: halfNormal
      .optional()
      .describe('Milky Way halo DM ± 1σ [pc cm⁻³]; omitted → the budget model prior (mw_halo)'),
    z_source: z
      .number({ error: 'z_source must be a number' })
      .gt(0, 'z_source must be > 0')
      .lte(10, 'z_source must be ≤ 10')
      .optional()
      .describe(
        'Burst (host) redshift; omitted → redshift_limit and redshift_posterior instead of host_rest',
      ),
    cosmology: cosmologySpecSchema
      .optional()
      .describe(
        "Cosmology ('planck18' or flat ΛCDM parameters) without a sightline; with one, use sightline.model.cosmology",
      ),
    sightline: budgetSightlineSchema.optional(),
    halos: haloTermSchema.optional(),
    budget_model: budgetModelSchema.optional().describe('Budget model keys; every key optional'),
    without_redshift: withoutRedshiftSchema.optional().describe('Options used only when z_source is omitted'),
  })
  .superRefine((r, ctx) => {
    if (r.sightline !== undefined && r.z_source === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['z_source'],
        message: 'z_source is required with sightline (the halo search needs the burst redshift)',
      });
    }
    if (r.sightline !== undefined && r.halos !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['halos'],
        message: 'give either sightline or halos as the foreground-halo term, not both',
      });
    }
    if (r.sightline !== undefined && r.cosmology !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['cosmology'],
        message:
          'with sightline, give the cosmology as sightline.model.cosmology (one cosmology for both terms)',
      });
    }
    if (r.without_redshift !== undefined && r.z_source !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['without_redshift'],
        message: 'without_redshift applies only when z_source is omitted',
      });
    }
  });

export type BudgetRequest = z.input<typeof budgetRequestSchema>;
export type ParsedBudgetRequest = z.output<typeof budgetRequestSchema>;
