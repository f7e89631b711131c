import { z } from 'zod';

/** Shared building blocks for every request and response schema (OpenAPI is generated from these). */

/** Right ascension, ICRS degrees, in [0, 360). */
export const raDeg = z.number().min(0).lt(360).describe('Right ascension (ICRS) [deg], 0 ≤ ra < 360');

/** Declination, ICRS degrees, in [−90, 90]. */
export const decDeg = z.number().min(-90).max(90).describe('Declination (ICRS) [deg], −90 ≤ dec ≤ 90');

/** A redshift, z ≥ 0. */
export const redshift = z.number().min(0).max(20).describe('Redshift, 0 ≤ z ≤ 20');

/** Catalogue name as used in URLs: letters, digits, dot, dash, underscore; starts with a letter or digit. */
export const catalogName = z
  .string()
  .min(1)
  .max(64)
  .regex(
    /^[A-Za-z0-9][A-Za-z0-9._-]*$/,
    'use letters, digits, ".", "-" or "_" (start with a letter or digit)',
  )
  .describe('Catalogue name');

/** Percentile summary of a Monte Carlo distribution, pc cm⁻³. */
export const dmSummary = z
  .object({
    mean: z.number(),
    p2_5: z.number(),
    p16: z.number(),
    p50: z.number(),
    p84: z.number(),
    p97_5: z.number(),
  })
  .describe('Observer-frame DM summary over the Monte Carlo draws [pc cm⁻³]');

/** The one error body every 4xx/5xx reply uses. */
export const errorBody = z
  .object({
    error: z.object({
      code: z.string().describe('Stable machine-readable code, e.g. invalid_request'),
      message: z.string().describe('What is wrong and what to change'),
      details: z.unknown().optional().describe('Field-level issues, where known'),
    }),
  })
  .describe('Error reply');

/** Query-string booleans: "true"/"false"/"1"/"0". */
export const queryBoolean = z
  .enum(['true', 'false', '1', '0'])
  .transform((v) => v === 'true' || v === '1')
  .describe('true/false');
