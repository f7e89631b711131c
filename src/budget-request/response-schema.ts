import { z } from 'zod';

/**
 * The DM-budget reply: the body of POST /v1/budgets and exactly what `forehalo budget --json` prints.
 * Every DM is observer-frame pc cm⁻³ except host_rest (host rest frame). Fields that need a source
 * redshift are null without one; redshift_limit and redshift_posterior are null with one.
 */

export const componentSummarySchema = z
  .object({ mean: z.number(), p16: z.number(), p50: z.number(), p84: z.number() })
  .describe('Mean and 16th/50th/84th percentiles over the Monte Carlo draws [pc cm⁻³, observer frame]');

export const hostRestSummarySchema = z
  .object({
    mean: z.number(),
    p2_5: z.number(),
    p16: z.number(),
    p50: z.number(),
    p84: z.number(),
    p97_5: z.number(),
  })
  .describe('DM_host,rest = (DM_obs − MW ISM − MW halo − cosmic − haloes)(1 + z_s), never clipped [pc cm⁻³]');

export const budgetWarningSchema = z.object({
  source: z.enum(['budget', 'sightline', 'request']).describe('Which step raised it'),
  code: z.string(),
  message: z.string(),
});

export const redshiftLimitSchema = z
  .object({
    z_max: z
      .number()
      .nullable()
      .describe('Largest z_s with P(DM_host ≥ 0) ≥ confidence; null if even the lowest z fails'),
    z_upper: z
      .number()
      .nullable()
      .describe(
        'Conservative upper bound: largest z_s with P(DM_host ≥ 0) ≥ 1 − confidence (beyond it a ' +
          'non-negative host term is excluded at the chosen confidence); always ≥ z_max',
      ),
    confidence: z.number(),
    p_negative_at_limit: z.number().nullable(),
    bracketed: z.boolean().describe('false when the limit hit an end of the search range'),
  })
  .describe('Redshift at which the host term stops being non-negative at the chosen confidence');

export const redshiftPosteriorSchema = z
  .object({
    z: z.array(z.number()),
    density: z.array(z.number()).describe('Posterior density of z_s on the grid (trapezoid-normalised)'),
    median: z.number(),
    interval68: z.tuple([z.number(), z.number()]).describe('16th and 84th percentiles'),
    mode: z.number(),
    prior: z.string(),
    host_prior: z.object({ median_pc_cm3: z.number(), sigma_ln: z.number(), frame: z.string() }),
  })
  .describe('Posterior of z_s given DM_obs, the Galactic terms, the cosmic PDF and a host-DM prior');

export const halosSourceSchema = z.object({
  kind: z.enum(['sightline', 'draws', 'normal', 'none']),
  description: z.string(),
  draws_given: z.number().int().describe('Number of halo draws resampled (0 when there is no halo term)'),
});

export const sightlineEchoSchema = z.object({
  ra: z.number(),
  dec: z.number(),
  z_source: z.number(),
  z_source_err: z.number(),
  catalogs: z.array(z.string()).nullable(),
  host_id: z.string().nullable(),
  dm_halos: z.object({
    mean: z.number(),
    p2_5: z.number(),
    p16: z.number(),
    p50: z.number(),
    p84: z.number(),
    p97_5: z.number(),
  }),
  n_candidates: z.number().int(),
  n_intersected: z.number().int(),
  draws: z.number().int(),
  seed: z.number().int(),
});

export const budgetResponseSchema = z.object({
  z_source: z.number().nullable(),
  dm_obs: z.object({ value: z.number(), err: z.number() }),
  macquart_mean: z
    .number()
    .nullable()
    .describe(
      '⟨DM_cosmic⟩(z_s) of Macquart et al. 2020 for the cosmology and f_d in force, whatever cosmic_mode; null without z_s',
    ),
  cosmic_mean_in_force: z
    .number()
    .nullable()
    .describe("Mean of the cosmic term actually used (f_igm in 'diffuse' mode, f_d in 'full' mode)"),
  components: z.object({
    mw_ism: componentSummarySchema,
    mw_halo: componentSummarySchema,
    cosmic: componentSummarySchema.nullable().describe('null without z_s'),
    halos: componentSummarySchema,
  }),
  host_rest: hostRestSummarySchema.nullable().describe('null without z_s'),
  p_negative_host: z
    .number()
    .nullable()
    .describe('Fraction of draws with DM_host,rest < 0; null without z_s'),
  redshift_limit: redshiftLimitSchema.nullable().describe('Only without z_s'),
  redshift_posterior: redshiftPosteriorSchema.nullable().describe('Only without z_s'),
  halos_source: halosSourceSchema,
  sightline: sightlineEchoSchema.nullable().describe('The sightline that gave the halo term, if one ran'),
  draws: z.number().int(),
  seed: z.number().int(),
  model: z.object({
    budget: z.record(z.string(), z.unknown()).describe('Budget model with every default filled in'),
    sightline: z.record(z.string(), z.unknown()).nullable().describe('Sightline model, if a sightline ran'),
    cosmology: z.string().describe('Name of the cosmology used for the cosmic term'),
  }),
  conventions: z.array(z.string()).describe('The cosmic_mode choice and the frames, in words'),
  assumptions: z.record(z.string(), z.union([z.string(), z.number()])),
  warnings: z.array(budgetWarningSchema),
  cautions: z.array(z.string()),
  units: z.literal('pc cm⁻³'),
});

export type BudgetResponse = z.infer<typeof budgetResponseSchema>;
export type BudgetWarning = z.infer<typeof budgetWarningSchema>;
