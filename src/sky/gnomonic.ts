import { DEG } from '../math/index.js';
import { checkDecDeg, checkRaDeg, wrapRaDeg } from './validate.js';

/** Standard coordinates [rad] on the tangent plane: xi toward east (increasing RA), eta toward north. */
export interface StandardCoordinates {
  readonly xi: number;
  readonly eta: number;
}

/**
 * Gnomonic (tangent-plane) projection about (ra0, dec0) to standard coordinates (ξ, η) [rad]
 * (the TAN projection of Calabretta & Greisen 2002, A&A 395, 1077, §5.1.3; standard-coordinate form
 * as in Green 1985, "Spherical Astronomy", §13 (from memory)). Returns null when the point is 90° or
 * more from the tangent point (to within 1e-10 in cos c), where the projection is undefined.
 */
export function gnomonicProject(
  ra0Deg: number,
  dec0Deg: number,
  raDeg: number,
  decDeg: number,
): StandardCoordinates | null {
  checkRaDeg(ra0Deg, 'ra0Deg');
  checkDecDeg(dec0Deg, 'dec0Deg');
  checkRaDeg(raDeg, 'raDeg');
  checkDecDeg(decDeg, 'decDeg');
  const d0 = dec0Deg * DEG;
  const d = decDeg * DEG;
  const dRa = (raDeg - ra0Deg) * DEG;
  const cosC = Math.sin(d0) * Math.sin(d) + Math.cos(d0) * Math.cos(d) * Math.cos(dRa);
  // cos c ≤ 1e-10 (within ~2e-5″ of 90°, or beyond) counts as "not projectable": the exact 90° case
  // gives cos c ≈ 6e-17 from round-off rather than 0.
  if (!(cosC > 1e-10)) return null;
  const xi = (Math.cos(d) * Math.sin(dRa)) / cosC;
  const eta = (Math.cos(d0) * Math.sin(d) - Math.sin(d0) * Math.cos(d) * Math.cos(dRa)) / cosC;
  return { xi, eta };
}

/** Inverse gnomonic projection: standard coordinates (ξ, η) [rad] about (ra0, dec0) back to the sky [deg]. */
export function gnomonicInverse(
  ra0Deg: number,
  dec0Deg: number,
  xi: number,
  eta: number,
): { raDeg: number; decDeg: number } {
  checkRaDeg(ra0Deg, 'ra0Deg');
  checkDecDeg(dec0Deg, 'dec0Deg');
  const d0 = dec0Deg * DEG;
  const s0 = Math.sin(d0);
  const c0 = Math.cos(d0);
  const denom = c0 - eta * s0;
  const ra = ra0Deg + Math.atan2(xi, denom) / DEG;
  const dec = Math.atan2(s0 + eta * c0, Math.hypot(xi, denom)) / DEG;
  return { raDeg: wrapRaDeg(ra), decDeg: dec };
}
