/**
 * Sky geometry and HEALPix indexing: plain numbers in, plain numbers out, no I/O.
 * Degrees at the boundary, radians inside.
 */
export {
  angularSeparationArcsec,
  angularSeparationDeg,
  angularSeparationRad,
  positionAngleDeg,
  separationRad,
} from './angles.js';
export { checkRadiusRad, MAX_LISTED_PIXELS, queryDiscInclusiveNest, unitVector } from './disc-query.js';
export { gnomonicInverse, gnomonicProject, type StandardCoordinates } from './gnomonic.js';
export { MAX_ORDER, npixOf, nsideOf, pixelAreaSr, pixelSizeRad } from './healpix-order.js';
export { ang2pixNest, ang2pixNestUnchecked, pix2angNest } from './healpix-pixel.js';
export { maxPixelRadiusRad } from './healpix-radius.js';
export {
  type ConeRangeOptions,
  coneToRanges,
  mergeRanges,
  type PixelRange,
  pixelRangeAtOrder,
} from './ranges.js';
export { checkDecDeg, checkRaDeg, wrapRaDeg } from './validate.js';
