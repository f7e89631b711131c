import { z } from 'zod';
import { cosmologySpecSchema } from '../cosmology/index.js';
import { profileSchema as gasProfileSchema, MNFW_DEFAULT_ALPHA, MNFW_DEFAULT_Y0 } from '../gas/index.js';
import {
  CONCENTRATION_RELATIONS,
  type ConcentrationRelationName,
  MASS_DEFINITIONS,
  type MassDefinition,
  SHMR_NAMES as SHMR_REGISTRY,
  type ShmrName,
} from '../halo/index.js';

/**
 * The model object: every physical and numerical choice behind a sightline result, with its default.
 * The server, the CLI and the engine all parse through this one schema, and every result echoes the
 * parsed (defaults filled in) object so a number can always be traced to the choices that made it.
 */

const enumWithMessage = <T extends readonly [string, ...string[]]>(key: string, values: T) =>
  z.enum(values, { error: () => `${key} must be one of ${values.join(', ')}` });

/** Keys of the stellar-to-halo mass relations (registry in src/halo/shmr). */
export const SHMR_NAMES = SHMR_REGISTRY as unknown as readonly [ShmrName, ...ShmrName[]];
/** Spherical-overdensity mass definitions (physics.md §2). */
export const MASS_DEFINITION_NAMES = MASS_DEFINITIONS as unknown as readonly [
  MassDefinition,
  ...MassDefinition[],
];
/** Concentration–mass relations (registry in src/halo/concentration.ts). */
export const CONCENTRATION_NAMES = CONCENTRATION_RELATIONS as unknown as readonly [
  ConcentrationRelationName,
  ...ConcentrationRelationName[],
];

/** 'planck18' or a custom flat ΛCDM set (the cosmology package's own schema). */
export const modelCosmologySchema = cosmologySpecSchema;

/**
 * Gas profile (the gas package's schema), with the mNFW shape parameters filled in so the echo is
 * complete: Mathews & Prochaska 2017, ApJL 846, L24 (attribution (mem)) α = 2, y₀ = 2.
 */
export const modelProfileSchema = gasProfileSchema.transform((p) =>
  p.kind === 'mnfw'
    ? { kind: 'mnfw' as const, alpha: p.alpha ?? MNFW_DEFAULT_ALPHA, y0: p.y0 ?? MNFW_DEFAULT_Y0 }
    : { kind: p.kind },
);

/** A scatter either taken from the chosen published relation ('published') or given in dex. */
const scatterDex = z.union([z.literal('published'), z.number().min(0).max(2)]);

export const fHotPriorSchema = z
  .object({ kind: z.literal('uniform'), min: z.number().min(0).max(1), max: z.number().min(0).max(1) })
  .strict()
  .refine((p) => p.min <= p.max, { message: 'f_hot_prior.min must not exceed max', path: ['min'] });

export const MAX_DRAWS = 100_000;

export const modelSchema = z
  .object({
    cosmology: modelCosmologySchema.default('planck18'),
    shmr: enumWithMessage('shmr', SHMR_NAMES).default('moster2013'),
    mass_definition: enumWithMessage('mass_definition', MASS_DEFINITION_NAMES).default('200c'),
    concentration: enumWithMessage('concentration', CONCENTRATION_NAMES).default('dutton-maccio-2014'),
    profile: modelProfileSchema.default({ kind: 'mnfw', alpha: MNFW_DEFAULT_ALPHA, y0: MNFW_DEFAULT_Y0 }),
    /** Fraction of the cosmic baryon share of the halo mass in hot gas inside r_halo (common practice 0.75). */
    f_hot: z.number().gt(0).max(1).default(0.75),
    /** Optional prior on f_hot sampled per draw (uniform); null keeps f_hot fixed. */
    f_hot_prior: fHotPriorSchema.nullable().default(null),
    /** Gas truncation radius in units of r_halo (the line-of-sight integral stops at extent·r_halo). */
    extent: z.number().gt(0).max(10).default(1),
    /** Candidate radius in units of r_halo: galaxies with b ≤ search·r_halo are listed. */
    search: z.number().gt(0).max(20).default(2),
    /** Mean mass per electron in proton masses (physics.md §5.4: 8/7 for X = 0.75, Y = 0.25). */
    mu_e: z
      .number()
      .min(1)
      .max(2)
      .default(8 / 7),
    scatter: z
      .object({
        shmr_dex: scatterDex.default('published'),
        concentration_dex: scatterDex.default('published'),
      })
      .strict()
      .default({ shmr_dex: 'published', concentration_dex: 'published' }),
    /** Half-width of the burst environment in velocity [km s⁻¹]: Δz = (1+z_s)·v/c. */
    velocity_window_kms: z.number().min(0).max(10_000).default(1000),
    draws: z.number().int().min(1).max(MAX_DRAWS).default(1000),
    seed: z.number().int().min(0).max(0xffffffff).default(1),
    /** Ceiling on halo masses, log₁₀ M☉ in the chosen definition (sampled and catalogued). */
    log_mhalo_max: z.number().min(12).max(16).default(15.5),
    /** log M* error assumed where a catalogue gives none [dex] (physics.md §10: 0.1–0.2). */
    log_mstar_err_default: z.number().min(0).max(1).default(0.15),
    /** Galaxies below this redshift are ignored (caps the search angle as z → 0). */
    z_min: z.number().min(1e-4).max(0.1).default(0.001),
    /**
     * Largest search angle [deg] (caps the cone for very nearby massive haloes): at z = 0.02 one degree
     * is 1.5 Mpc proper, 2 r_200c of a 10^14 M☉ halo. A warning says when a shell was capped.
     */
    max_search_deg: z.number().gt(0).max(30).default(1),
    /**
     * Photometric galaxies are never placed below this redshift: the search assumes it and draws below it
     * are moved up to it (photo-z of very nearby galaxies are unreliable; give those spectroscopic redshifts).
     */
    photo_z_floor: z.number().min(0).max(0.5).default(0.02),
    /**
     * Photometric galaxies are searched over z ± min(k σ, w(1+z)) with k = photo_z_k and
     * w = photo_z_width (0.15 is the usual catastrophic-outlier threshold, physics.md §9).
     */
    photo_z_k: z.number().min(0).max(10).default(3),
    photo_z_width: z.number().min(0).max(0.5).default(0.15),
    /** Galaxies with P(foreground) below this are not listed as foreground candidates. */
    p_fg_min: z.number().min(0).max(0.5).default(1e-3),
    /** Number of photometric neighbours returned in priorities[]. */
    priorities_top: z.number().int().min(0).max(100).default(5),
  })
  .strict()
  .refine((m) => m.search >= m.extent, {
    message: 'search must be at least extent, or intersected haloes would be missed',
    path: ['search'],
  });

/** The model as sent (every key optional). */
export type ModelInput = z.input<typeof modelSchema>;
/** The model with every default filled in: what the engine uses and every result echoes. */
export type Model = z.output<typeof modelSchema>;
export type ProfileSpec = Model['profile'];
