import { InputError } from '../errors.js';
import { checkRadiusRad, unitVector } from './disc-query.js';
import { walkDisc } from './disc-walk.js';
import { checkOrder, checkPixel, npixOf, pixelSizeRad } from './healpix-order.js';
import { checkDecDeg, checkRaDeg } from './validate.js';

/** An inclusive range [lo, hi] of nested pixel indices at one order. */
export type PixelRange = [number, number];

/**
 * The descendants of `ipix` (at coarseOrder) at fineOrder form one contiguous block in the nested
 * scheme (Górski et al. 2005, ApJ 622, 759, §4): ipix·4^Δ … (ipix+1)·4^Δ − 1, with Δ = fine − coarse.
 */
export function pixelRangeAtOrder(coarseOrder: number, ipix: number, fineOrder: number): PixelRange {
  checkOrder(coarseOrder, 'coarseOrder');
  checkOrder(fineOrder, 'fineOrder');
  checkPixel(coarseOrder, ipix);
  if (fineOrder < coarseOrder) {
    throw new InputError(
      'bad_order',
      `fineOrder (${fineOrder}) must be ≥ coarseOrder (${coarseOrder}) for a descendant range`,
      { field: 'fineOrder' },
    );
  }
  const span = 4 ** (fineOrder - coarseOrder);
  return [ipix * span, (ipix + 1) * span - 1];
}

/** Sort and merge overlapping or adjacent inclusive ranges. */
export function mergeRanges(ranges: PixelRange[]): PixelRange[] {
  const sorted = ranges.slice().sort((a, b) => a[0] - b[0]);
  const out: PixelRange[] = [];
  for (const [lo, hi] of sorted) {
    const last = out[out.length - 1];
    if (last !== undefined && lo <= last[1] + 1) {
      if (hi > last[1]) last[1] = hi;
    } else {
      out.push([lo, hi]);
    }
  }
  return out;
}

export interface ConeRangeOptions {
  /** Most ranges the caller wants (default 24). The finest query order that stays within it is used. */
  readonly maxRanges?: number;
}

/** How many orders finer than the "pixel ≥ radius" order the cover is refined to. */
const REFINE_ORDERS = 3;

/**
 * Storage-order ranges of a disc cover coarsened to `queryOrder`: every reported pixel finer than
 * queryOrder is replaced by its ancestor there (still a cover, since an ancestor contains its
 * descendants); pixels reported at or above queryOrder are kept as they are.
 */
function rangesAtQueryOrder(
  storageOrder: number,
  queryOrder: number,
  levels: readonly number[],
  pixels: readonly number[],
): PixelRange[] {
  const raw: PixelRange[] = [];
  for (let i = 0; i < pixels.length; i++) {
    let level = levels[i];
    let ipix = pixels[i];
    if (level > queryOrder) {
      ipix = Math.floor(ipix / 4 ** (level - queryOrder));
      level = queryOrder;
    }
    const span = 4 ** (storageOrder - level);
    raw.push([ipix * span, (ipix + 1) * span - 1]);
  }
  return mergeRanges(raw);
}

/**
 * Sorted, disjoint, inclusive index ranges at `storageOrder` whose union holds every storage pixel
 * overlapping the disc of `radiusRad` around (raDeg, decDeg). The query order starts where pixels
 * are about as large as the radius (so a handful of pixels suffice) and is refined by up to three
 * orders for a tighter cover, then coarsened again while the merged ranges exceed `maxRanges`; each
 * covering pixel becomes the block of its storage-order descendants. A radius ≥ π covers the whole
 * sky.
 */
export function coneToRanges(
  storageOrder: number,
  raDeg: number,
  decDeg: number,
  radiusRad: number,
  { maxRanges = 24 }: ConeRangeOptions = {},
): PixelRange[] {
  checkOrder(storageOrder, 'storageOrder');
  checkRaDeg(raDeg);
  checkDecDeg(decDeg);
  checkRadiusRad(radiusRad);
  if (!Number.isInteger(maxRanges) || maxRanges < 1) {
    throw new InputError('bad_option', `maxRanges must be an integer ≥ 1, got ${maxRanges}`, {
      field: 'maxRanges',
    });
  }
  if (radiusRad >= Math.PI) return [[0, npixOf(storageOrder) - 1]];
  const centre = unitVector(raDeg, decDeg);
  // Coarsest order whose pixel size (√(4π/Npix)) is still ≥ the radius.
  const ratio = pixelSizeRad(0) / Math.max(radiusRad, 1e-300);
  const k0 = Math.max(0, Math.min(storageOrder, Math.floor(Math.log2(ratio))));
  const finest = Math.min(storageOrder, k0 + REFINE_ORDERS);
  const levels: number[] = [];
  const pixels: number[] = [];
  walkDisc(finest, centre, radiusRad, (level, ipix) => {
    levels.push(level);
    pixels.push(ipix);
  });
  let ranges = rangesAtQueryOrder(storageOrder, finest, levels, pixels);
  // Coarsen until the caller's range budget is met (order 0 gives at most 12 ranges).
  for (let k = finest - 1; ranges.length > maxRanges && k >= 0; k--) {
    ranges = rangesAtQueryOrder(storageOrder, k, levels, pixels);
  }
  return ranges;
}
