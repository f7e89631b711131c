import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createRng } from '../../src/math/index.js';
import {
  ang2pixNest,
  MAX_ORDER,
  npixOf,
  pix2angNest,
  pixelAreaSr,
  pixelRangeAtOrder,
} from '../../src/sky/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { healpy } from './sky-fixtures.js';

describe('HEALPix resolution (Górski et al. 2005, ApJ 622, 759, §4)', () => {
  it('has 12·Nside² pixels of equal area 4π/Npix at every order', () => {
    for (let order = 0; order <= MAX_ORDER; order++) {
      const nside = 2 ** order;
      expect(npixOf(order)).toBe(12 * nside * nside);
      expectClose(pixelAreaSr(order) * npixOf(order), 4 * Math.PI, { rtol: 1e-15 });
    }
    expect(npixOf(15)).toBe(12884901888); // 12·4^15, an exact integer well below 2^53
  });

  it('puts equal numbers of uniformly scattered points into every order-1 pixel (equal areas, 5σ)', () => {
    // Equal-area property (Górski et al. 2005, §1): for N points uniform on the sphere each of the 48 pixels
    // receives Binomial(N, 1/48) points; every count must lie within 5σ of N/48.
    const rng = createRng(4242);
    const n = 240_000;
    const counts = new Array<number>(48).fill(0);
    for (let i = 0; i < n; i++) {
      const ra = 360 * rng.uniform();
      const dec = (Math.asin(2 * rng.uniform() - 1) * 180) / Math.PI;
      counts[ang2pixNest(1, ra, dec)]++;
    }
    const mean = n / 48;
    const sigma = Math.sqrt(n * (1 / 48) * (47 / 48));
    for (const c of counts) expect(Math.abs(c - mean)).toBeLessThan(5 * sigma);
  });

  it('lays out the 12 base pixels as in Górski et al. 2005, Fig. 4: 0–3 north, 4–7 equator, 8–11 south', () => {
    // Base-pixel centres: z = 2/3 at φ = 45°, 135°, 225°, 315° (pixels 0–3); z = 0 at φ = 0°, 90°, 180°, 270°
    // (4–7); z = −2/3 at φ = 45°… (8–11). asin(2/3) = 41.8103149°.
    const capDec = (Math.asin(2 / 3) * 180) / Math.PI;
    for (let k = 0; k < 4; k++) {
      expect(ang2pixNest(0, 45 + 90 * k, capDec)).toBe(k);
      expect(ang2pixNest(0, 90 * k, 0)).toBe(4 + k);
      expect(ang2pixNest(0, 45 + 90 * k, -capDec)).toBe(8 + k);
      const c = pix2angNest(0, k);
      expectClose(c.raDeg, 45 + 90 * k, { rtol: 1e-14 });
      expectClose(c.decDeg, capDec, { rtol: 1e-14 });
    }
    expect(pix2angNest(0, 4)).toEqual({ raDeg: 0, decDeg: 0 });
    // The poles lie in the polar base pixels: the north pole in 0–3 and the south pole in 8–11.
    expect(ang2pixNest(0, 10, 90)).toBeLessThan(4);
    expect(ang2pixNest(0, 10, -90)).toBeGreaterThanOrEqual(8);
  });
});

describe('ang2pix and pix2ang in the nested scheme against healpy', () => {
  it(`assign every reference point to the same pixel as healpy ${healpy.library_versions.healpy} at orders 0–15`, () => {
    // Source: fixtures/reference/healpix_healpy.json (healpy.ang2pix, nest=True, lonlat=True): random points,
    // the poles, RA 0 and 360 − 1e-9, the equator and the polar-cap boundary. Pixel indices must agree exactly.
    for (const [orderText, pixels] of Object.entries(healpy.ang2pix)) {
      const order = Number(orderText);
      healpy.points.forEach((p, i) => {
        expect(
          ang2pixNest(order, p.raDeg, p.decDeg),
          `order ${order}, point ${i} (${p.raDeg}, ${p.decDeg})`,
        ).toBe(pixels[i]);
      });
    }
  });

  it('place pixel centres where healpy does (to 1e-10 degree)', () => {
    // Source: fixtures/reference/healpix_healpy.json (healpy.pix2ang, nest=True, lonlat=True).
    for (const [orderText, rows] of Object.entries(healpy.pix2ang)) {
      const order = Number(orderText);
      for (const r of rows) {
        const c = pix2angNest(order, r.ipix);
        expectClose(c.decDeg, r.decDeg, { atol: 1e-10 });
        const dRa = Math.abs(((c.raDeg - r.raDeg + 540) % 360) - 180);
        expect(dRa * Math.cos((r.decDeg * Math.PI) / 180)).toBeLessThan(1e-10);
      }
    }
  });

  it('treats RA 360 as RA 0 and any RA modulo 360', () => {
    expect(ang2pixNest(12, 360, 10)).toBe(ang2pixNest(12, 0, 10));
    expect(ang2pixNest(12, -30, 10)).toBe(ang2pixNest(12, 330, 10));
    expect(ang2pixNest(12, 725, -10)).toBe(ang2pixNest(12, 5, -10));
  });

  it('round-trips pixel → centre → pixel at every order (property test)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: MAX_ORDER }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (order, u) => {
          const ipix = Math.min(npixOf(order) - 1, Math.floor(u * npixOf(order)));
          const c = pix2angNest(order, ipix);
          expect(ang2pixNest(order, c.raDeg, c.decDeg)).toBe(ipix);
        },
      ),
      { seed: 1401, numRuns: 3000 },
    );
  });

  it('keeps a point in the parent of its pixel when the order drops by one (nested hierarchy)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: MAX_ORDER }),
        fc.double({ min: 0, max: 360, noNaN: true, maxExcluded: true }),
        fc.double({ min: -90, max: 90, noNaN: true }),
        (order, ra, dec) => {
          expect(Math.floor(ang2pixNest(order, ra, dec) / 4)).toBe(ang2pixNest(order - 1, ra, dec));
        },
      ),
      { seed: 1402, numRuns: 3000 },
    );
  });

  it('rejects orders above 15, fractional pixels and declinations beyond the poles', () => {
    expect(() => ang2pixNest(16, 0, 0)).toThrow(/order must be an integer HEALPix order in \[0, 15\]/);
    expect(() => pix2angNest(2, 192)).toThrow(/ipix must be an integer in \[0, 191\]/);
    expect(() => pix2angNest(2, 1.5)).toThrow(/ipix/);
    expect(() => ang2pixNest(3, 0, -90.5)).toThrow(/decDeg must be in \[-90, 90\]/);
  });
});

describe('pixel ranges across orders', () => {
  it('gives the children of a pixel as ipix·4^Δ … (ipix+1)·4^Δ − 1', () => {
    expect(pixelRangeAtOrder(0, 0, 0)).toEqual([0, 0]);
    expect(pixelRangeAtOrder(0, 5, 1)).toEqual([20, 23]);
    expect(pixelRangeAtOrder(2, 7, 4)).toEqual([112, 127]);
    expect(pixelRangeAtOrder(0, 11, 15)).toEqual([11 * 4 ** 15, 12 * 4 ** 15 - 1]);
  });

  it('contains the fine-order pixel of every point whose coarse pixel is ipix (property test)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 10 }),
        fc.integer({ min: 0, max: 5 }),
        fc.double({ min: 0, max: 360, noNaN: true, maxExcluded: true }),
        fc.double({ min: -90, max: 90, noNaN: true }),
        (coarse, delta, ra, dec) => {
          const [lo, hi] = pixelRangeAtOrder(coarse, ang2pixNest(coarse, ra, dec), coarse + delta);
          const fine = ang2pixNest(coarse + delta, ra, dec);
          expect(fine).toBeGreaterThanOrEqual(lo);
          expect(fine).toBeLessThanOrEqual(hi);
        },
      ),
      { seed: 1403, numRuns: 2000 },
    );
  });

  it('refuses a fine order coarser than the coarse order', () => {
    expect(() => pixelRangeAtOrder(5, 0, 4)).toThrow(/fineOrder \(4\) must be ≥ coarseOrder \(5\)/);
  });
});
