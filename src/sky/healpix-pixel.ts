import * as hp from '@hscmap/healpix';
import { DEG } from '../math/index.js';
import { nestToVector, thetaPhiToNest } from './healpix-nest.js';
import { checkOrder, checkPixel, nsideOf } from './healpix-order.js';
import { checkDecDeg, checkRaDeg, wrapRaDeg } from './validate.js';

/**
 * Nested-scheme pixel of a sky position (Górski et al. 2005, ApJ 622, 759), by our own
 * thetaPhiToNest. Colatitude θ = π/2 − δ and longitude φ = α, as healpy does with lonlat=True, so
 * points on pixel edges fall the same way. Pixel centres are our own nestToVector; points inside
 * a pixel (pixelPointVector, used by tests) come from @hscmap/healpix (MIT). All checked against
 * healpy in test/sky.
 */
export function ang2pixNest(order: number, raDeg: number, decDeg: number): number {
  checkOrder(order);
  checkRaDeg(raDeg);
  checkDecDeg(decDeg);
  return ang2pixNestUnchecked(nsideOf(order), raDeg, decDeg);
}

/**
 * ang2pixNest for a position already known to be valid (dec in [−90, 90], finite RA) and a given
 * Nside: the same arithmetic without the argument checks, for loops over checked catalogue rows.
 */
export function ang2pixNestUnchecked(nside: number, raDeg: number, decDeg: number): number {
  const theta = Math.PI / 2 - decDeg * DEG;
  const phi = wrapRaDeg(raDeg) * DEG;
  return thetaPhiToNest(nside, theta, phi);
}

/** Centre [deg] of a nested-scheme pixel. */
export function pix2angNest(order: number, ipix: number): { raDeg: number; decDeg: number } {
  checkOrder(order);
  checkPixel(order, ipix);
  const [x, y, z] = nestToVector(nsideOf(order), ipix);
  const raDeg = Math.atan2(y, x) / DEG;
  return { raDeg: wrapRaDeg(raDeg), decDeg: Math.atan2(z, Math.hypot(x, y)) / DEG };
}

/** Unit vector of a pixel centre, no checks (for inner loops). */
export function pixelCentreVector(order: number, ipix: number): [number, number, number] {
  return nestToVector(nsideOf(order), ipix);
}

/**
 * A point inside a pixel given by its fractional position (ne, nw) ∈ [0,1]² along the pixel's
 * north-east and north-west edges from its south corner; (0.5, 0.5) is the centre. Used by tests to
 * walk pixel boundaries.
 */
export function pixelPointVector(
  order: number,
  ipix: number,
  ne: number,
  nw: number,
): [number, number, number] {
  return hp.pixcoord2vec_nest(nsideOf(order), ipix, ne, nw);
}
