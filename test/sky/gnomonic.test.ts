import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { angularSeparationRad, gnomonicInverse, gnomonicProject } from '../../src/sky/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { astropySky } from './sky-fixtures.js';

describe('gnomonic projection', () => {
  it('matches the astropy.wcs TAN projection (ξ east, η north) about five tangent points', () => {
    // Source: fixtures/reference/sky_astropy.json (astropy 5.2.1, wcslib TAN; Calabretta & Greisen 2002).
    // wcslib works in degrees with its own trigonometry; 1e-12 rad absolute is ~0.2 µas.
    for (const g of astropySky.gnomonic) {
      const p = gnomonicProject(g.ra0Deg, g.dec0Deg, g.raDeg, g.decDeg);
      expect(p).not.toBeNull();
      expectClose(p!.xi, g.xi, { rtol: 1e-10, atol: 1e-12 });
      expectClose(p!.eta, g.eta, { rtol: 1e-10, atol: 1e-12 });
    }
  });

  it('returns null for points 90° or more from the tangent point', () => {
    expect(gnomonicProject(0, 0, 90, 0)).toBeNull();
    expect(gnomonicProject(0, 0, 180, 0)).toBeNull();
    expect(gnomonicProject(10, 80, 10, -20)).toBeNull();
    expect(gnomonicProject(0, 0, 89.9, 0)).not.toBeNull();
  });

  it('has tan(separation) as the radial standard coordinate (closed form)', () => {
    const p = gnomonicProject(30, 40, 31, 41)!;
    const theta = angularSeparationRad(30, 40, 31, 41);
    expectClose(Math.hypot(p.xi, p.eta), Math.tan(theta), { rtol: 1e-13 });
  });

  it('round-trips sky → plane → sky within 1e-9 arcsec, across RA 0/360 and near the poles (property test)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 360, noNaN: true, maxExcluded: true }),
        fc.double({ min: -89.99, max: 89.99, noNaN: true }),
        fc.double({ min: -0.3, max: 0.3, noNaN: true }),
        fc.double({ min: -0.3, max: 0.3, noNaN: true }),
        (ra0, dec0, xi, eta) => {
          const sky = gnomonicInverse(ra0, dec0, xi, eta);
          expect(sky.raDeg).toBeGreaterThanOrEqual(0);
          expect(sky.raDeg).toBeLessThan(360);
          const back = gnomonicProject(ra0, dec0, sky.raDeg, sky.decDeg)!;
          expectClose(back.xi, xi, { atol: 5e-15 });
          expectClose(back.eta, eta, { atol: 5e-15 });
        },
      ),
      { seed: 1301, numRuns: 2000 },
    );
  });
});
