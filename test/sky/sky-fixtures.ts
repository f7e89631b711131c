import { readFileSync } from 'node:fs';

/** Reference values written by scripts/fixtures/healpix_healpy.py and scripts/fixtures/sky_astropy.py. */
function load<T>(name: string): T {
  return JSON.parse(readFileSync(new URL(`../../fixtures/reference/${name}`, import.meta.url), 'utf8')) as T;
}

export interface HealpyFixture {
  library_versions: { healpy: string };
  points: { raDeg: number; decDeg: number }[];
  ang2pix: Record<string, number[]>;
  pix2ang: Record<string, { ipix: number; raDeg: number; decDeg: number }[]>;
  query_disc: { raDeg: number; decDeg: number; radiusRad: number; order: number; pixels: number[] }[];
}

export interface AstropySkyFixture {
  library_versions: { astropy: string };
  separations: {
    ra1Deg: number;
    dec1Deg: number;
    ra2Deg: number;
    dec2Deg: number;
    separationRad: number;
    positionAngleDeg: number;
  }[];
  gnomonic: { ra0Deg: number; dec0Deg: number; raDeg: number; decDeg: number; xi: number; eta: number }[];
}

export const healpy = load<HealpyFixture>('healpix_healpy.json');
export const astropySky = load<AstropySkyFixture>('sky_astropy.json');

const DEG = Math.PI / 180;

/** The point at angular distance rRad and position angle paRad from (raDeg, decDeg) (spherical trigonometry). */
export function offsetPoint(raDeg: number, decDeg: number, rRad: number, paRad: number): [number, number] {
  const d1 = decDeg * DEG;
  const sinD2 = Math.sin(d1) * Math.cos(rRad) + Math.cos(d1) * Math.sin(rRad) * Math.cos(paRad);
  const d2 = Math.asin(Math.max(-1, Math.min(1, sinD2)));
  const dRa = Math.atan2(
    Math.sin(paRad) * Math.sin(rRad) * Math.cos(d1),
    Math.cos(rRad) - Math.sin(d1) * sinD2,
  );
  let ra = (raDeg + dRa / DEG) % 360;
  if (ra < 0) ra += 360;
  return [ra, Math.max(-90, Math.min(90, d2 / DEG))];
}
