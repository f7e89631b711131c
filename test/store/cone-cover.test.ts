import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEG } from '../../src/math/index.js';
import { ang2pixNest, npixOf } from '../../src/sky/index.js';
import { coneCoverRanges } from '../../src/store/cone-cover.js';

/** The point at separation sepRad and position angle paRad from (raDeg, decDeg), on the sphere. */
function offset(raDeg: number, decDeg: number, sepRad: number, paRad: number): [number, number] {
  const d0 = decDeg * DEG;
  const sinD = Math.sin(d0) * Math.cos(sepRad) + Math.cos(d0) * Math.sin(sepRad) * Math.cos(paRad);
  const d = Math.asin(Math.max(-1, Math.min(1, sinD)));
  const dRa = Math.atan2(
    Math.sin(paRad) * Math.sin(sepRad) * Math.cos(d0),
    Math.cos(sepRad) - Math.sin(d0) * sinD,
  );
  const ra = ((((raDeg * DEG + dRa) / DEG) % 360) + 360) % 360;
  return [ra >= 360 ? 0 : ra, d / DEG];
}

describe('coneCoverRanges', () => {
  it('covers the storage pixel of every point inside the cone, up to its edge', () => {
    // Points placed with the spherical direct formula (common practice) at separations up to the
    // radius; ang2pixNest gives their order-13 pixels, which must fall in one of the ranges.
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 359.999, noNaN: true }),
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.double({ min: 1e-4, max: 3, noNaN: true }),
        (raDeg, decDeg, radiusDeg) => {
          const ranges = coneCoverRanges(13, raDeg, decDeg, radiusDeg * DEG);
          for (let k = 1; k < ranges.length; k++) expect(ranges[k][0]).toBeGreaterThan(ranges[k - 1][1] + 1);
          for (let j = 0; j < 64; j++) {
            const sep = radiusDeg * DEG * (j % 8 === 0 ? 0.999999 : Math.sqrt((j + 0.5) / 64));
            const [ra, dec] = offset(raDeg, decDeg, sep, (2 * Math.PI * j) / 64 + 0.1);
            const pix = ang2pixNest(13, ra, dec);
            expect(ranges.some(([lo, hi]) => pix >= lo && pix <= hi)).toBe(true);
          }
        },
      ),
      { numRuns: 200, seed: 20261202 },
    );
  });

  it('returns the whole sky for a radius of π or more, and few ranges for a sightline cone', () => {
    expect(coneCoverRanges(13, 10, 10, Math.PI)).toEqual([[0, npixOf(13) - 1]]);
    const ranges = coneCoverRanges(13, 150, 2, 0.5 * DEG);
    expect(ranges.length).toBeGreaterThan(0);
    expect(ranges.length).toBeLessThan(64);
  });
});
