/**
 * HEALPix order at which galaxy rows are indexed (nested scheme, Górski et al. 2005, ApJ 622, 759).
 *
 * Order 13: Nside = 8192, 805,306,368 pixels of ≈ 25.8″ on a side (√(4π/Npix)). Why this order:
 * - The smallest cone the store serves is the 1″ duplicate match; at 25.8″ pixels it touches one to
 *   four pixels, i.e. one to four index ranges.
 * - Sightline cones (arcminutes, up to ~1°) become a handful of ranges once coneToRanges merges
 *   neighbouring pixels, and each range is one contiguous key-range scan per run, because rows are
 *   keyed by (run, hpx) (see runs.ts).
 * - Indices stay below 2³⁰, so they fit SQLite's 4-byte integer encoding and JS small integers
 *   (order 15, the highest @hscmap/healpix supports, would need 6 bytes per key for no gain here).
 * Indices below 2³⁰ also leave room in a galaxy key for the run (15 bits) and the rank within a
 * pixel (18 bits). Changing the order needs a migration that rebuilds every key.
 */
export const STORAGE_ORDER = 13;
