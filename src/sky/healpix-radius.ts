import * as hp from '@hscmap/healpix';
import { nsideOf } from './healpix-order.js';

/**
 * Safety factor on the largest centre-to-corner distance. HEALPix pixel edges are not great circles,
 * so a point on an edge could in principle lie farther than the farthest corner. Walking every edge
 * of every pixel at orders 0–4 (200 steps per edge) found none beyond the corner bound (largest ratio
 * 1 − 1e-12); test/sky/disc.test.ts re-checks sampled pixels up to order 15. 2 % more is margin;
 * over-estimating only makes disc queries include a few more pixels.
 */
const SAFETY = 1.02;

const cache: number[] = [];

/**
 * An upper bound [rad] on the angular distance from any pixel's centre to any point of that pixel
 * at this order: the largest centre-to-corner distance (attained at the polar-cap/equatorial-belt
 * transition, as in Healpix C++ max_pixrad; computed by @hscmap/healpix `max_pixrad`) times SAFETY.
 */
export function maxPixelRadiusRad(order: number): number {
  let r = cache[order];
  if (r === undefined) {
    r = hp.max_pixrad(nsideOf(order)) * SAFETY + 1e-12;
    cache[order] = r;
  }
  return r;
}
