import { InputError } from '../errors.js';

/**
 * HEALPix resolution bookkeeping (Górski et al. 2005, ApJ 622, 759, §4): Nside = 2^order,
 * Npix = 12·Nside², every pixel has the area 4π/Npix sr. The nested scheme numbers the children of
 * pixel p at the next order 4p … 4p+3 (ibid., §4, Fig. 3 and eq. nesting rule).
 */

/** Highest order supported: @hscmap/healpix works up to order 15 (its README); indices stay < 2^53. */
export const MAX_ORDER = 15;

export function nsideOf(order: number): number {
  return 2 ** order;
}

/** Number of pixels on the sphere at this order: 12·4^order. */
export function npixOf(order: number): number {
  return 12 * 4 ** order;
}

/** Pixel area [sr] at this order: 4π / Npix. */
export function pixelAreaSr(order: number): number {
  return (4 * Math.PI) / npixOf(order);
}

/** Typical pixel size [rad]: the square root of the pixel area. */
export function pixelSizeRad(order: number): number {
  return Math.sqrt(pixelAreaSr(order));
}

export function checkOrder(order: number, name = 'order'): void {
  if (!Number.isInteger(order) || order < 0 || order > MAX_ORDER) {
    throw new InputError(
      'bad_order',
      `${name} must be an integer HEALPix order in [0, ${MAX_ORDER}], got ${order}`,
      {
        field: name,
      },
    );
  }
}

export function checkPixel(order: number, ipix: number, name = 'ipix'): void {
  if (!Number.isInteger(ipix) || ipix < 0 || ipix >= npixOf(order)) {
    throw new InputError(
      'bad_pixel',
      `${name} must be an integer in [0, ${npixOf(order) - 1}] at order ${order}, got ${ipix}`,
      { field: name },
    );
  }
}
