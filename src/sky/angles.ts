import { DEG } from '../math/index.js';
import { checkDecDeg, checkRaDeg } from './validate.js';

/**
 * Great-circle separation [rad] between two points given in degrees, in the Vincenty form
 * (Vincenty 1975, Survey Review 23, 88; the special case of the sphere): the atan2 of the two
 * great-circle components. Unlike the spherical law of cosines it keeps full precision at 0, and
 * unlike the haversine form it keeps it near π as well. The haversine form quoted in physics.md §1
 * gives the same value to round-off for separations well below π.
 */
export function angularSeparationRad(
  ra1Deg: number,
  dec1Deg: number,
  ra2Deg: number,
  dec2Deg: number,
): number {
  checkRaDeg(ra1Deg, 'ra1Deg');
  checkDecDeg(dec1Deg, 'dec1Deg');
  checkRaDeg(ra2Deg, 'ra2Deg');
  checkDecDeg(dec2Deg, 'dec2Deg');
  return separationRad(ra1Deg * DEG, dec1Deg * DEG, ra2Deg * DEG, dec2Deg * DEG);
}

/** Vincenty separation on radians, no checks (for inner loops). */
export function separationRad(ra1: number, dec1: number, ra2: number, dec2: number): number {
  const dRa = ra2 - ra1;
  const sinD1 = Math.sin(dec1);
  const cosD1 = Math.cos(dec1);
  const sinD2 = Math.sin(dec2);
  const cosD2 = Math.cos(dec2);
  const cosDRa = Math.cos(dRa);
  const a = cosD2 * Math.sin(dRa);
  const b = cosD1 * sinD2 - sinD1 * cosD2 * cosDRa;
  const num = Math.sqrt(a * a + b * b);
  const den = sinD1 * sinD2 + cosD1 * cosD2 * cosDRa;
  return Math.atan2(num, den);
}

/** Great-circle separation [deg]. */
export function angularSeparationDeg(
  ra1Deg: number,
  dec1Deg: number,
  ra2Deg: number,
  dec2Deg: number,
): number {
  return angularSeparationRad(ra1Deg, dec1Deg, ra2Deg, dec2Deg) / DEG;
}

/** Great-circle separation [arcsec]. */
export function angularSeparationArcsec(
  ra1Deg: number,
  dec1Deg: number,
  ra2Deg: number,
  dec2Deg: number,
): number {
  return angularSeparationRad(ra1Deg, dec1Deg, ra2Deg, dec2Deg) / (DEG / 3600);
}

/**
 * Position angle [deg, in [0, 360)] of point 2 as seen from point 1, measured from north through
 * east (common practice; e.g. Green 1985, "Spherical Astronomy", §2): tan PA = sin Δα cos δ₂ /
 * (cos δ₁ sin δ₂ − sin δ₁ cos δ₂ cos Δα). Coincident points give 0.
 */
export function positionAngleDeg(ra1Deg: number, dec1Deg: number, ra2Deg: number, dec2Deg: number): number {
  checkRaDeg(ra1Deg, 'ra1Deg');
  checkDecDeg(dec1Deg, 'dec1Deg');
  checkRaDeg(ra2Deg, 'ra2Deg');
  checkDecDeg(dec2Deg, 'dec2Deg');
  const dRa = (ra2Deg - ra1Deg) * DEG;
  const d1 = dec1Deg * DEG;
  const d2 = dec2Deg * DEG;
  const y = Math.sin(dRa) * Math.cos(d2);
  const x = Math.cos(d1) * Math.sin(d2) - Math.sin(d1) * Math.cos(d2) * Math.cos(dRa);
  const pa = Math.atan2(y, x) / DEG;
  const wrapped = pa < 0 ? pa + 360 : pa;
  return wrapped >= 360 ? 0 : wrapped;
}
