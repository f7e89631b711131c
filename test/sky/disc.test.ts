import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { pixelCentreVector, pixelPointVector } from '../../src/sky/healpix-pixel.js';
import {
  ang2pixNest,
  coneToRanges,
  maxPixelRadiusRad,
  npixOf,
  type PixelRange,
  queryDiscInclusiveNest,
} from '../../src/sky/index.js';
import { healpy, offsetPoint } from './sky-fixtures.js';

const DEG = Math.PI / 180;
const ARCSEC = DEG / 3600;

function angle(a: readonly number[], b: readonly number[]): number {
  const cx = a[1] * b[2] - a[2] * b[1];
  const cy = a[2] * b[0] - a[0] * b[2];
  const cz = a[0] * b[1] - a[1] * b[0];
  return Math.atan2(Math.hypot(cx, cy, cz), a[0] * b[0] + a[1] * b[1] + a[2] * b[2]);
}

function inRanges(ranges: PixelRange[], p: number): boolean {
  return ranges.some(([lo, hi]) => p >= lo && p <= hi);
}

function expectSortedDisjoint(ranges: PixelRange[], order: number): void {
  for (let i = 0; i < ranges.length; i++) {
    const [lo, hi] = ranges[i];
    expect(Number.isInteger(lo) && Number.isInteger(hi)).toBe(true);
    expect(lo).toBeLessThanOrEqual(hi);
    expect(lo).toBeGreaterThanOrEqual(0);
    expect(hi).toBeLessThan(npixOf(order));
    if (i > 0) expect(lo).toBeGreaterThan(ranges[i - 1][1] + 1); // merged: no overlap, no adjacency
  }
}

/** Cone centres that stress the edge cases: poles, RA 0/360, the cap boundary, and anywhere. */
const coneCentre = fc.oneof(
  fc.tuple(
    fc.double({ min: 0, max: 360, noNaN: true, maxExcluded: true }),
    fc.double({ min: -90, max: 90, noNaN: true }),
  ),
  fc.tuple(fc.constantFrom(0, 359.9999, 0.0001, 90, 180), fc.double({ min: -90, max: 90, noNaN: true })),
  fc.tuple(
    fc.double({ min: 0, max: 360, noNaN: true, maxExcluded: true }),
    fc.constantFrom(90, -90, 89.99, -89.99, 41.81, 0),
  ),
);

describe('pixel radius bound', () => {
  it('bounds the distance from a pixel centre to every point on its edges (walked at 64 steps per edge)', () => {
    // Check of the bound used by the disc walk; pixels are sampled at each order, including the polar
    // pixels and those at the polar-cap/equatorial-belt transition where the distortion is largest.
    for (const order of [0, 1, 2, 3, 5, 8, 12, 15]) {
      const nside = 2 ** order;
      const bound = maxPixelRadiusRad(order);
      const npix = npixOf(order);
      const sample = new Set<number>([0, nside * nside - 1, npix - 1, 4 * nside * nside, npix / 3]);
      for (let k = 0; k < 60; k++) sample.add(Math.floor(((k * 0.6180339887) % 1) * npix));
      let worst = 0;
      for (const ipix of sample) {
        const c = pixelCentreVector(order, ipix);
        for (let s = 0; s <= 64; s++) {
          const t = s / 64;
          for (const [ne, nw] of [
            [t, 0],
            [t, 1],
            [0, t],
            [1, t],
          ]) {
            worst = Math.max(worst, angle(c, pixelPointVector(order, ipix, ne, nw)));
          }
        }
      }
      expect(worst, `order ${order}`).toBeLessThanOrEqual(bound);
    }
  });
});

describe('inclusive disc query', () => {
  it(`returns a superset of healpy ${healpy.library_versions.healpy} query_disc(inclusive=True, nest=True)`, () => {
    // Source: fixtures/reference/healpix_healpy.json: discs of 1″ to 120°, at the poles and across RA 0/360.
    for (const d of healpy.query_disc) {
      const mine = new Set(queryDiscInclusiveNest(d.order, d.raDeg, d.decDeg, d.radiusRad));
      const missing = d.pixels.filter((p) => !mine.has(p));
      expect(missing, `disc (${d.raDeg}, ${d.decDeg}, r=${d.radiusRad}) at order ${d.order}`).toEqual([]);
      // Over-inclusion stays moderate: at most 4× healpy's count plus a ring of 32 pixels.
      expect(mine.size).toBeLessThanOrEqual(4 * d.pixels.length + 32);
    }
  });

  it('returns the pixel of every point inside random discs, sorted and without repeats (property test)', () => {
    fc.assert(
      fc.property(
        coneCentre,
        fc.integer({ min: 0, max: 12 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.array(
          fc.tuple(
            fc.double({ min: 0, max: 1, noNaN: true }),
            fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
          ),
          {
            minLength: 20,
            maxLength: 20,
          },
        ),
        ([ra, dec], order, u, offsets) => {
          // radius from ~1 pixel down to 1/8 pixel at this order, capped to keep the lists small
          const radius = Math.min(0.3, ((0.125 + u) * Math.sqrt((4 * Math.PI) / npixOf(order))) / 1);
          const pixels = queryDiscInclusiveNest(order, ra, dec, radius);
          for (let i = 1; i < pixels.length; i++) expect(pixels[i]).toBeGreaterThan(pixels[i - 1]);
          const set = new Set(pixels);
          for (const [f, pa] of offsets) {
            const [pRa, pDec] = offsetPoint(ra, dec, f * radius, pa);
            expect(set.has(ang2pixNest(order, pRa, pDec))).toBe(true);
          }
        },
      ),
      { seed: 1501, numRuns: 400 },
    );
  });

  it('covers the whole sky for a radius of π and refuses lists that would be enormous', () => {
    expect(queryDiscInclusiveNest(2, 10, 10, Math.PI)).toEqual(Array.from({ length: 192 }, (_, i) => i));
    expect(() => queryDiscInclusiveNest(15, 10, 10, 0.1)).toThrow(/use a coarser order or coneToRanges/);
    expect(() => queryDiscInclusiveNest(5, 10, 10, -1)).toThrow(/radiusRad must be a finite angle ≥ 0/);
  });
});

describe('cone to storage-order ranges', () => {
  it('contains the storage pixel of every point inside random cones of 1″ to 180°, at poles and RA 0/360 (property test)', () => {
    fc.assert(
      fc.property(
        coneCentre,
        fc.double({ min: Math.log(ARCSEC), max: Math.log(Math.PI), noNaN: true }),
        fc.integer({ min: 6, max: 15 }),
        fc.array(
          fc.tuple(
            fc.double({ min: 0, max: 1, noNaN: true }),
            fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
          ),
          {
            minLength: 30,
            maxLength: 30,
          },
        ),
        ([ra, dec], logR, storageOrder, offsets) => {
          const radius = Math.exp(logR);
          const ranges = coneToRanges(storageOrder, ra, dec, radius);
          expectSortedDisjoint(ranges, storageOrder);
          expect(ranges.length).toBeLessThanOrEqual(24);
          // points spread over the disc, with extra weight at its rim (f close to 1)
          for (const [f, pa] of offsets) {
            const [pRa, pDec] = offsetPoint(ra, dec, Math.sqrt(f) * radius, pa);
            expect(inRanges(ranges, ang2pixNest(storageOrder, pRa, pDec))).toBe(true);
          }
        },
      ),
      { seed: 1601, numRuns: 600 },
    );
  });

  it('returns the whole sky as one range for a radius of 180°', () => {
    expect(coneToRanges(15, 212.4, -8.9, Math.PI)).toEqual([[0, npixOf(15) - 1]]);
    expect(coneToRanges(10, 0, 90, Math.PI - 1e-9)).toEqual([[0, npixOf(10) - 1]]);
  });

  it('keeps a 1″ cone at order 15 to a few storage pixels and a 0.5° cone to a small fraction of the sky', () => {
    const tiny = coneToRanges(15, 212.4, -8.9, ARCSEC);
    const tinyCount = tiny.reduce((n, [lo, hi]) => n + hi - lo + 1, 0);
    expect(tinyCount).toBeGreaterThanOrEqual(1);
    expect(tinyCount).toBeLessThanOrEqual(16);
    const half = coneToRanges(15, 212.4, -8.9, 0.5 * DEG);
    const halfCount = half.reduce((n, [lo, hi]) => n + hi - lo + 1, 0);
    const discPixels = (2 * Math.PI * (1 - Math.cos(0.5 * DEG))) / ((4 * Math.PI) / npixOf(15));
    expect(halfCount).toBeGreaterThanOrEqual(discPixels);
    expect(halfCount).toBeLessThan(4 * discPixels); // over-coverage factor below 4
  });

  it('respects maxRanges by falling back to coarser query orders', () => {
    const one = coneToRanges(15, 33.3, 12.1, 0.2 * DEG, { maxRanges: 4 });
    expect(one.length).toBeLessThanOrEqual(4);
    expect(() => coneToRanges(15, 0, 0, 0.1, { maxRanges: 0 })).toThrow(/maxRanges must be an integer ≥ 1/);
  });
});
