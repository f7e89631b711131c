import { C_KM_S } from '../math/index.js';
import type { Model } from '../model/index.js';
import type { CatalogRow } from './types.js';

/**
 * Photo-z width assumed when a photometric row carries no error: σ = 0.05 (1+z), inside the usual
 * 0.01–0.06 (1+z) range of photometric surveys (physics.md §9, common practice). Such rows are flagged.
 */
export const PHOTO_Z_SIGMA0_FALLBACK = 0.05;

/** Half-width of the burst environment in redshift, Δz = (1 + z_s) v / c (common practice). */
export function velocityWindowDz(zSource: number, velocityKms: number): number {
  return ((1 + zSource) * velocityKms) / C_KM_S;
}

/** 1σ redshift width used for a row: its catalogued error, or the fallback for photometric rows. */
export function redshiftSigma(row: CatalogRow): number {
  if (row.zKind === 'spec') return 0;
  if (row.zErr !== null && row.zErr > 0) return row.zErr;
  return PHOTO_Z_SIGMA0_FALLBACK * (1 + row.z);
}

/**
 * Redshift interval a row may occupy for the search: [z, z] for spectroscopic rows and
 * z ± min(k σ, w (1 + z)) for photometric ones (k = model.photo_z_k, w = model.photo_z_width;
 * w = 0.15 is the usual catastrophic-outlier threshold, physics.md §9), floored at model.z_min and,
 * for photometric rows, at model.photo_z_floor. An empty interval (zLo > zHi) means the row cannot be used.
 * `truncated` is true when the k σ interval was cut by the w (1 + z) bound.
 */
export function searchRedshiftRange(
  row: CatalogRow,
  model: Pick<Model, 'photo_z_k' | 'photo_z_width' | 'z_min' | 'photo_z_floor'>,
): { zLo: number; zHi: number; truncated: boolean } {
  if (row.zKind === 'spec') return { zLo: row.z, zHi: row.z, truncated: false };
  const kSigma = model.photo_z_k * redshiftSigma(row);
  const bound = model.photo_z_width * (1 + row.z);
  const w = Math.min(kSigma, bound);
  return {
    zLo: Math.max(model.z_min, model.photo_z_floor, row.z - w),
    zHi: row.z + w,
    truncated: kSigma > bound,
  };
}
