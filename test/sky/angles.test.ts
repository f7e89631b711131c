import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  angularSeparationArcsec,
  angularSeparationDeg,
  angularSeparationRad,
  positionAngleDeg,
} from '../../src/sky/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { astropySky } from './sky-fixtures.js';

const DEG = Math.PI / 180;
const ra = fc.double({ min: 0, max: 360, noNaN: true, maxExcluded: true });
const dec = fc.double({ min: -90, max: 90, noNaN: true });

describe('angular separation', () => {
  it('gives 50.896106″ for (150°, +2°)–(150.01°, +2.01°), the check value in physics.md §1', () => {
    // physics.md §1 [calc] value, quoted to 8 significant figures.
    expectClose(angularSeparationArcsec(150, 2, 150.01, 2.01), 50.896106, { rtol: 1e-8 });
  });

  it('matches astropy SkyCoord.separation, including zero, 3 µas, RA wrap, poles and near-antipodal pairs', () => {
    // Source: fixtures/reference/sky_astropy.json (astropy 5.2.1, Vincenty formula). Both evaluate the same
    // closed form in double precision, so agreement is to a few ulp; 1e-13 rad absolute covers round-off
    // of the 1e-9-degree pair and of π.
    for (const s of astropySky.separations) {
      const got = angularSeparationRad(s.ra1Deg, s.dec1Deg, s.ra2Deg, s.dec2Deg);
      expectClose(got, s.separationRad, { rtol: 1e-12, atol: 1e-13 });
    }
  });

  it('converts between radians, degrees and arcseconds consistently', () => {
    const r = angularSeparationRad(10, 20, 11, 21);
    expectClose(angularSeparationDeg(10, 20, 11, 21), (r * 180) / Math.PI, { rtol: 1e-15 });
    expectClose(angularSeparationArcsec(10, 20, 11, 21), (r * 180 * 3600) / Math.PI, { rtol: 1e-15 });
  });

  it('is π for antipodes and 0 for the same point given as RA 0 and RA 360', () => {
    expectClose(angularSeparationRad(0, 0, 180, 0), Math.PI, { rtol: 1e-15 });
    expectClose(angularSeparationRad(0, 30, 360, 30), 0, { atol: 1e-15 });
    expectClose(angularSeparationRad(17, 90, 200, 90), 0, { atol: 1e-15 });
  });

  it('is symmetric, lies in [0, π] and obeys the triangle inequality (property test)', () => {
    fc.assert(
      fc.property(ra, dec, ra, dec, ra, dec, (a1, d1, a2, d2, a3, d3) => {
        const ab = angularSeparationRad(a1, d1, a2, d2);
        const ba = angularSeparationRad(a2, d2, a1, d1);
        const bc = angularSeparationRad(a2, d2, a3, d3);
        const ac = angularSeparationRad(a1, d1, a3, d3);
        expect(ab).toBeGreaterThanOrEqual(0);
        expect(ab).toBeLessThanOrEqual(Math.PI);
        expect(Math.abs(ab - ba)).toBeLessThanOrEqual(1e-15);
        expect(ac).toBeLessThanOrEqual(ab + bc + 1e-12);
      }),
      { seed: 1201, numRuns: 2000 },
    );
  });

  it('rejects a declination outside [-90, 90] and a non-finite RA, naming the field', () => {
    expect(() => angularSeparationRad(0, 91, 0, 0)).toThrow(/dec1Deg must be in \[-90, 90\]/);
    expect(() => angularSeparationRad(Number.NaN, 0, 0, 0)).toThrow(/ra1Deg must be a finite/);
  });
});

describe('position angle', () => {
  it('matches astropy SkyCoord.position_angle (east of north)', () => {
    // Source: fixtures/reference/sky_astropy.json. Coincident and antipodal pairs have no defined angle;
    // both codes return atan2 of round-off there, so those are skipped.
    for (const s of astropySky.separations) {
      if (s.separationRad < 1e-12 || Math.PI - s.separationRad < 1e-5) continue;
      const got = positionAngleDeg(s.ra1Deg, s.dec1Deg, s.ra2Deg, s.dec2Deg);
      const diff = Math.abs(((got - s.positionAngleDeg + 540) % 360) - 180);
      expect(diff).toBeLessThan(1e-8);
    }
  });

  it('is 0° due north, 90° due east, 180° due south and 270° due west', () => {
    expectClose(positionAngleDeg(212.4, -8.9, 212.4, -8.8), 0, { atol: 1e-12 });
    // Two points on one parallel: PA = 90° − atan(sin δ · tan(Δα/2)) (isosceles triangle with the pole;
    // Napier's analogies, common practice). At the equator it is exactly 90°.
    const expectedEast = 90 - Math.atan(Math.sin(-8.9 * DEG) * Math.tan(0.05 * DEG)) / DEG;
    expectClose(positionAngleDeg(212.4, -8.9, 212.5, -8.9), expectedEast, { atol: 1e-10 });
    expectClose(positionAngleDeg(212.4, 0, 212.5, 0), 90, { atol: 1e-12 });
    expectClose(positionAngleDeg(212.4, -8.9, 212.4, -9.0), 180, { atol: 1e-12 });
    expectClose(positionAngleDeg(212.4, -8.9, 212.3, -8.9), 360 - expectedEast, { atol: 1e-10 });
  });

  it('stays in [0, 360) across RA 0/360 (property test)', () => {
    fc.assert(
      fc.property(ra, dec, ra, dec, (a1, d1, a2, d2) => {
        const pa = positionAngleDeg(a1, d1, a2, d2);
        expect(pa).toBeGreaterThanOrEqual(0);
        expect(pa).toBeLessThan(360);
      }),
      { seed: 1202, numRuns: 1000 },
    );
  });
});
