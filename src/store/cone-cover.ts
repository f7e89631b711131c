import { mergeRanges, type PixelRange, pixelSizeRad, queryDiscInclusiveNest } from '../sky/index.js';

/**
 * Orders finer than the "one pixel ≥ the radius" order at which the cone is covered. Measured on
 * the 10-million-row all-sky mock of bench/sightline.ts (store time per sightline, 2 cores): 0 →
 * 2.9 ms (cover too loose: rows outside the cone are scanned), 1 → 1.8 ms, 2 → 1.7 ms (0.54 ms of
 * it the tree walk), while sky's coneToRanges (three orders, ≤ 48 ranges) spends 0.9 ms walking.
 */
const REFINE_ORDERS = 2;

/**
 * Sorted, disjoint, inclusive storage-order index ranges whose union holds every storage pixel that
 * overlaps the disc of radiusRad around (raDeg, decDeg): the inclusive disc cover
 * (queryDiscInclusiveNest) at a query order about as fine as the radius, each pixel replaced by the
 * block of its storage-order descendants (nested scheme, Górski et al. 2005, ApJ 622, 759, §4).
 */
export function coneCoverRanges(
  storageOrder: number,
  raDeg: number,
  decDeg: number,
  radiusRad: number,
): PixelRange[] {
  if (radiusRad >= Math.PI) return [[0, 12 * 4 ** storageOrder - 1]];
  const ratio = pixelSizeRad(0) / Math.max(radiusRad, 1e-300);
  const k0 = Math.max(0, Math.min(storageOrder, Math.floor(Math.log2(ratio))));
  const order = Math.min(storageOrder, k0 + REFINE_ORDERS);
  const span = 4 ** (storageOrder - order);
  const pixels = queryDiscInclusiveNest(order, raDeg, decDeg, radiusRad);
  const ranges: PixelRange[] = [];
  for (const p of pixels) {
    const last = ranges[ranges.length - 1];
    if (last !== undefined && p * span === last[1] + 1) last[1] = (p + 1) * span - 1;
    else ranges.push([p * span, (p + 1) * span - 1]);
  }
  // queryDiscInclusiveNest returns pixels sorted ascending; merge again in case that ever changes.
  return mergeRanges(ranges);
}
