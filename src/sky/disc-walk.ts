import { pixelCentreVector } from './healpix-pixel.js';
import { maxPixelRadiusRad } from './healpix-radius.js';

export type Vec3 = readonly [number, number, number];

/** Angle [rad] between two unit vectors, atan2(|a×b|, a·b): precise at 0 and near π. */
export function vectorAngle(a: Vec3, b: Vec3): number {
  const cx = a[1] * b[2] - a[2] * b[1];
  const cy = a[2] * b[0] - a[0] * b[2];
  const cz = a[0] * b[1] - a[1] * b[0];
  return Math.atan2(Math.sqrt(cx * cx + cy * cy + cz * cz), a[0] * b[0] + a[1] * b[1] + a[2] * b[2]);
}

/**
 * Walk the nested HEALPix tree from the 12 base pixels down to `order`, visiting every pixel that
 * may overlap the disc of `radiusRad` around the unit vector `centre`. A pixel whose centre lies
 * farther than radius + (its maximal radius) cannot overlap and is pruned; a pixel whose centre lies
 * within radius − (its maximal radius) is wholly inside and reported at its own (coarser) level with
 * `whole = true`, so its descendants need no visit; pixels still undecided at `order` are reported
 * with `whole = false`. Every pixel at `order` that overlaps the disc is therefore a descendant of
 * (or equal to) a reported pixel — the walk is inclusive by construction, and may over-include.
 */
export function walkDisc(
  order: number,
  centre: Vec3,
  radiusRad: number,
  report: (level: number, ipix: number, whole: boolean) => void,
): void {
  const stackLevel: number[] = [];
  const stackPix: number[] = [];
  for (let f = 11; f >= 0; f--) {
    stackLevel.push(0);
    stackPix.push(f);
  }
  while (stackPix.length > 0) {
    const level = stackLevel.pop()!;
    const ipix = stackPix.pop()!;
    const theta = vectorAngle(pixelCentreVector(level, ipix), centre);
    const pixRad = maxPixelRadiusRad(level);
    if (theta - pixRad > radiusRad) continue;
    if (theta + pixRad <= radiusRad) {
      report(level, ipix, true);
    } else if (level === order) {
      report(level, ipix, false);
    } else {
      // Children pushed in reverse so they pop in ascending index order.
      for (let c = 3; c >= 0; c--) {
        stackLevel.push(level + 1);
        stackPix.push(4 * ipix + c);
      }
    }
  }
}
