import { z } from 'zod';
import { modelSchema } from '../../src/model/index.js';
import { catalogName, decDeg, dmSummary, raDeg, redshift } from './primitives.js';

/** POST /v1/sightlines body. */
export const sightlineRequest = z
  .object({
    ra: raDeg,
    dec: decDeg,
    z_source: redshift.refine((z) => z > 0, 'z_source must be > 0 (the burst must lie beyond z = 0)'),
    z_source_err: z.number().min(0).max(5).optional().describe('1σ error of the source redshift'),
    catalogs: z
      .array(catalogName)
      .min(1)
      .max(50)
      .optional()
      .describe('Catalogues to search (default: all stored catalogues)'),
    host_id: z.string().min(1).max(200).optional().describe('Catalogue id of the host galaxy (excluded)'),
    model: modelSchema.optional().describe('Model choices; every key optional (defaults filled in)'),
    include_draws: z
      .boolean()
      .optional()
      .describe('Also return the total foreground DM of every draw (for histograms)'),
  })
  .strict();

export type SightlineRequest = z.output<typeof sightlineRequest>;

export const sightlineQuery = z.object({
  format: z.enum(['json', 'csv']).default('json').describe('csv returns the galaxy table only'),
});

const galaxy = z.looseObject({
  id: z.string(),
  catalog: z.string(),
  ra: z.number(),
  dec: z.number(),
  z: z.number(),
  z_err: z.number().nullable(),
  z_kind: z.string(),
  sep_arcsec: z.number(),
  b_kpc: z.number(),
  log_mstar: z.number().nullable(),
  log_mhalo: z.number().nullable(),
  r_halo_kpc: z.number().nullable(),
  b_over_rhalo: z.number().nullable(),
  concentration: z.number().nullable(),
  p_fg: z.number(),
  dm_central: z.number().nullable(),
  dm: dmSummary,
  p_contributes: z.number(),
  flags: z.array(z.string()),
});

/** POST /v1/sightlines reply (extra keys from the engine pass through). */
export const sightlineReply = z.looseObject({
  sightline: z.looseObject({}),
  model: z.looseObject({}),
  totals: z.looseObject({
    dm_halos: dmSummary,
    n_candidates: z.number().int(),
    n_intersected: z.number().int(),
    draws: z.number().int(),
    seed: z.number().int(),
  }),
  galaxies: z.array(galaxy),
  environment: z.array(z.looseObject({})),
  priorities: z.array(z.looseObject({})),
  warnings: z.array(z.unknown()),
  draws_dm: z.array(z.number()).optional().describe('Total foreground DM per draw (include_draws)'),
});
