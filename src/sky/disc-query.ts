import { InputError } from '../errors.js';
import { DEG } from '../math/index.js';
import { walkDisc } from './disc-walk.js';
import { checkOrder, npixOf, pixelAreaSr } from './healpix-order.js';
import { checkDecDeg, checkRaDeg } from './validate.js';

/** Refuse to enumerate more pixels than this; wide discs at fine orders should use coneToRanges. */
export const MAX_LISTED_PIXELS = 5_000_000;

export function checkRadiusRad(radiusRad: number): void {
  if (!Number.isFinite(radiusRad) || radiusRad < 0) {
    throw new InputError('bad_radius', `radiusRad must be a finite angle ≥ 0 [rad], got ${radiusRad}`, {
      field: 'radiusRad',
    });
  }
}

/** Unit vector of (raDeg, decDeg). */
export function unitVector(raDeg: number, decDeg: number): [number, number, number] {
  const a = raDeg * DEG;
  const d = decDeg * DEG;
  const c = Math.cos(d);
  return [c * Math.cos(a), c * Math.sin(a), Math.sin(d)];
}

/**
 * Every nested pixel at `order` that overlaps the disc of `radiusRad` around (raDeg, decDeg),
 * sorted ascending. Inclusive: no overlapping pixel is missed (pixels merely near the edge may be
 * included too). Works for any radius: ≥ π returns the whole sky.
 */
export function queryDiscInclusiveNest(
  order: number,
  raDeg: number,
  decDeg: number,
  radiusRad: number,
): number[] {
  checkOrder(order);
  checkRaDeg(raDeg);
  checkDecDeg(decDeg);
  checkRadiusRad(radiusRad);
  const capArea = 2 * Math.PI * (1 - Math.cos(Math.min(radiusRad, Math.PI)));
  const estimate = capArea / pixelAreaSr(order);
  if (estimate > MAX_LISTED_PIXELS) {
    throw new InputError(
      'too_many_pixels',
      `a disc of ${radiusRad} rad holds about ${Math.round(estimate)} pixels at order ${order} ` +
        `(limit ${MAX_LISTED_PIXELS}); use a coarser order or coneToRanges`,
      { field: 'radiusRad' },
    );
  }
  const out: number[] = [];
  walkDisc(order, unitVector(raDeg, decDeg), radiusRad, (level, ipix, whole) => {
    if (!whole || level === order) {
      out.push(ipix);
      return;
    }
    const span = 4 ** (order - level);
    for (let p = ipix * span, end = (ipix + 1) * span; p < end; p++) out.push(p);
  });
  // The depth-first walk visits pixels in ascending nested order already; sort defensively.
  out.sort((a, b) => a - b);
  if (out.length > npixOf(order)) throw new Error('internal: disc walk reported a pixel twice');
  return out;
}
