import { z } from 'zod';
import { modelSchema } from '../model/index.js';

/**
 * The sightline request and response as zod schemas, shared by the engine, the CLI and the server
 * (the server builds its OpenAPI from them). Angles in degrees, DM in pc cm⁻³, b and radii in proper kpc.
 */
export const sightlineRequestSchema = z
  .object({
    ra: z.number().min(0).lt(360).describe('Burst right ascension [deg], ICRS, in [0, 360)'),
    dec: z.number().min(-90).max(90).describe('Burst declination [deg], ICRS'),
    z_source: z.number().gt(0).max(10).describe('Burst (host) redshift'),
    z_source_err: z.number().min(0).max(5).optional().describe('1σ error of the burst redshift (Gaussian)'),
    catalogs: z.array(z.string().min(1).max(200)).min(1).max(50).optional().describe('Catalogues to search'),
    host_id: z.string().min(1).max(200).optional().describe('Catalogue id of the host (never foreground)'),
    model: modelSchema.optional().describe('Model choices; every key optional'),
    include_draws: z.boolean().optional().describe('Also return the summed halo DM of every draw'),
  })
  .strict();

export type SightlineRequest = z.input<typeof sightlineRequestSchema>;

export const dmSummarySchema = z.object({
  mean: z.number(),
  p2_5: z.number(),
  p16: z.number(),
  p50: z.number(),
  p84: z.number(),
  p97_5: z.number(),
});

export const galaxyResultSchema = z.object({
  id: z.string(),
  catalog: z.string(),
  ra: z.number(),
  dec: z.number(),
  z: z.number(),
  z_err: z.number().nullable(),
  z_kind: z.enum(['spec', 'photo']),
  sep_arcsec: z.number(),
  b_kpc: z.number().describe('Proper impact parameter at the catalogued z [kpc]'),
  log_mstar: z.number().nullable(),
  log_mhalo: z.number().describe('Central halo mass, log₁₀ M☉ in the model mass definition'),
  r_halo_kpc: z.number(),
  b_over_rhalo: z.number(),
  concentration: z.number(),
  p_fg: z.number().describe('P(z < z_s − Δz)'),
  dm_central: z.number().describe('Observer-frame DM with every input at its central value [pc cm⁻³]'),
  dm: dmSummarySchema,
  p_contributes: z.number().describe('Fraction of draws in which the halo is in front and intersected'),
  flags: z.array(z.string()),
});

export const environmentEntrySchema = z.object({
  id: z.string(),
  catalog: z.string(),
  ra: z.number(),
  dec: z.number(),
  z: z.number(),
  z_err: z.number().nullable(),
  z_kind: z.enum(['spec', 'photo']),
  sep_arcsec: z.number(),
  b_kpc: z.number(),
  dv_kms: z.number().describe('Line-of-sight velocity offset from the burst c(z − z_s)/(1 + z_s) [km s⁻¹]'),
  log_mstar: z.number().nullable(),
  log_mhalo: z.number(),
  b_over_rhalo: z.number(),
  is_host: z.boolean(),
});

export const priorityEntrySchema = z.object({
  rank: z.number().int(),
  id: z.string(),
  catalog: z.string(),
  z: z.number(),
  z_err: z.number().nullable(),
  p_fg: z.number(),
  var_reduction_pc2_cm6: z.number().describe('Expected drop of Var(total) if z were known exactly'),
  var_fraction: z.number().describe('The same as a fraction of Var(total)'),
});

export const warningSchema = z.object({ code: z.string(), message: z.string() });

export const sightlineResponseSchema = z.object({
  sightline: z.object({
    ra: z.number(),
    dec: z.number(),
    z_source: z.number(),
    z_source_err: z.number(),
    host_id: z.string().nullable(),
    catalogs: z.array(z.string()).nullable(),
    velocity_window_dz: z.number(),
    z_foreground_max: z.number(),
    shells: z.number().int(),
    max_cone_deg: z.number().describe('Widest cone queried [deg]'),
    rows_scanned: z.number().int(),
    n_behind: z.number().int(),
  }),
  model: z.record(z.string(), z.unknown()),
  totals: z.object({
    dm_halos: dmSummarySchema,
    n_candidates: z.number().int(),
    n_intersected: z.number().int(),
    draws: z.number().int(),
    seed: z.number().int(),
  }),
  galaxies: z.array(galaxyResultSchema),
  environment: z.array(environmentEntrySchema),
  priorities: z.array(priorityEntrySchema),
  warnings: z.array(warningSchema),
  draws_dm: z.array(z.number()).optional().describe('Summed halo DM of every draw (include_draws)'),
});

export type SightlineResponse = z.infer<typeof sightlineResponseSchema>;
export type GalaxyResult = z.infer<typeof galaxyResultSchema>;
export type EnvironmentEntry = z.infer<typeof environmentEntrySchema>;
export type PriorityEntry = z.infer<typeof priorityEntrySchema>;
export type SightlineWarning = z.infer<typeof warningSchema>;
