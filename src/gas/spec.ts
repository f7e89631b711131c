import { z } from 'zod';

export type ProfileKind = 'nfw' | 'mnfw' | 'mb04';
export const PROFILE_KINDS: readonly ProfileKind[] = ['nfw', 'mnfw', 'mb04'];

/** A hot-gas profile choice as it appears in the public model object (`profile: {...}`). */
export interface ProfileSpec {
  readonly kind: ProfileKind;
  /** mNFW inner slope parameter α (default 2). */
  readonly alpha?: number;
  /** mNFW scale offset y₀ (default 2). */
  readonly y0?: number;
}

/** Defaults for the modified NFW of Mathews & Prochaska 2017, ApJL 846, L24 (attribution (mem)). */
export const MNFW_DEFAULT_ALPHA = 2;
export const MNFW_DEFAULT_Y0 = 2;

/**
 * zod 4 schema of a profile spec. α is limited to (0, 10]: α ≤ 0 would make the centre at least as
 * steep as NFW's 1/r cusp, which the mNFW form is meant to soften.
 */
export const profileSchema = z
  .object({
    kind: z.enum(['nfw', 'mnfw', 'mb04']).describe('hot-gas density profile'),
    alpha: z.number().gt(0).lte(10).optional().describe('mNFW α (default 2); only for kind mnfw'),
    y0: z.number().gt(0).lte(100).optional().describe('mNFW y₀ (default 2); only for kind mnfw'),
  })
  .strict()
  .superRefine((spec, ctx) => {
    if (spec.kind !== 'mnfw') {
      for (const key of ['alpha', 'y0'] as const) {
        if (spec[key] !== undefined) {
          ctx.addIssue({
            code: 'custom',
            path: [key],
            message: `${key} applies only to profile kind 'mnfw', not '${spec.kind}'`,
          });
        }
      }
    }
  });
