import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createRng } from '../../src/math/index.js';
import {
  type ConeQuery,
  coneSearch,
  coneSearchBruteForce,
  loadCatalog,
  openStore,
  type Store,
} from '../../src/store/index.js';

let dir: string;
let store: Store;

/** Invented sky: uniform galaxies plus dense patches at both poles and across RA = 0/360. */
function syntheticSky(seed: number, n: number): string {
  const rng = createRng(seed);
  const lines = ['id,ra,dec,z,z_err,z_kind,log_mstar'];
  for (let k = 0; k < n; k++) {
    let ra: number;
    let dec: number;
    const kind = k % 4;
    if (kind === 0) {
      ra = 360 * rng.uniform();
      dec = (Math.asin(2 * rng.uniform() - 1) * 180) / Math.PI;
    } else if (kind === 1) {
      ra = 360 * rng.uniform();
      dec = (k % 8 === 1 ? 1 : -1) * (90 - 2 * rng.uniform() ** 2);
    } else {
      ra = (360 + 1.5 * rng.normal()) % 360;
      dec = 20 * rng.normal();
      dec = Math.max(-90, Math.min(90, dec));
    }
    lines.push(`s${k},${ra.toFixed(7)},${dec.toFixed(7)},${(0.01 + rng.uniform()).toFixed(4)},0.001,spec,10`);
  }
  lines.push(
    'pole-n,0,90,0.1,0.001,spec,10',
    'pole-s,123,-90,0.1,0.001,spec,10',
    'ra-zero,0,0,0.1,0.001,spec,10',
  );
  return `${lines.join('\n')}\n`;
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'forehalo-cone-'));
  store = openStore(join(dir, 'cone.db'));
  writeFileSync(join(dir, 'a.csv'), syntheticSky(11, 4000));
  writeFileSync(join(dir, 'b.csv'), syntheticSky(12, 1500));
  await loadCatalog(store, { source: join(dir, 'a.csv'), name: 'sky-a' });
  await loadCatalog(store, { source: join(dir, 'b.csv'), name: 'sky-b' });
});

afterAll(() => {
  store.close();
  rmSync(dir, { recursive: true, force: true });
});

const ids = (rows: { catalog: string; objectId: string }[]) =>
  rows.map((r) => `${r.catalog}/${r.objectId}`).sort();

const centre = fc.oneof(
  fc.record({
    raDeg: fc.double({ min: 0, max: 359.999999, noNaN: true }),
    decDeg: fc.double({ min: -90, max: 90, noNaN: true }),
  }),
  fc.record({
    raDeg: fc.double({ min: 0, max: 359.999999, noNaN: true }),
    decDeg: fc.constantFrom(90, -90, 89.9, -89.95),
  }),
  fc.record({
    raDeg: fc.constantFrom(0, 359.9999, 0.0001, 180),
    decDeg: fc.double({ min: -30, max: 30, noNaN: true }),
  }),
);
const radius = fc.oneof(
  fc.double({ min: 1e-4, max: 0.5, noNaN: true }),
  fc.double({ min: 0.5, max: 25, noNaN: true }),
);

describe('coneSearch', () => {
  it('returns exactly the rows of a full scan for random cones, including the poles and RA 0/360', () => {
    // Reference: brute-force great-circle test over every row (no index).
    fc.assert(
      fc.property(centre, radius, fc.option(fc.double({ min: 0, max: 1.2, noNaN: true })), (c, r, zMax) => {
        const q: ConeQuery = { ...c, radiusDeg: r, zMax: zMax ?? undefined };
        expect(ids(coneSearch(store, q))).toEqual(ids(coneSearchBruteForce(store, q)));
      }),
      { numRuns: 300, seed: 20240607 },
    );
  });

  it('finds the galaxies placed exactly on the poles and on RA = 0 from either side', () => {
    const near = (raDeg: number, decDeg: number) =>
      ids(coneSearch(store, { raDeg, decDeg, radiusDeg: 1e-3 }));
    expect(near(200, 90)).toContain('sky-a/pole-n');
    expect(near(0, -90)).toContain('sky-a/pole-s');
    expect(near(359.99995, 0)).toContain('sky-a/ra-zero');
    expect(near(0.00005, 0)).toContain('sky-a/ra-zero');
  });

  it('restricts to the named catalogues and sorts by separation', () => {
    const rows = coneSearch(store, { raDeg: 0, decDeg: 0, radiusDeg: 3, catalogs: ['sky-b'] });
    expect(rows.length).toBeGreaterThan(0);
    expect(new Set(rows.map((r) => r.catalog))).toEqual(new Set(['sky-b']));
    for (let k = 1; k < rows.length; k++) expect(rows[k].sepDeg).toBeGreaterThanOrEqual(rows[k - 1].sepDeg);
  });

  it('refuses an unknown catalogue and an out-of-range centre or radius', () => {
    expect(() => coneSearch(store, { raDeg: 0, decDeg: 0, radiusDeg: 1, catalogs: ['nope'] })).toThrow(
      /no catalogue named 'nope'/,
    );
    expect(() => coneSearch(store, { raDeg: 360, decDeg: 0, radiusDeg: 1 })).toThrow(/raDeg/);
    expect(() => coneSearch(store, { raDeg: 0, decDeg: 91, radiusDeg: 1 })).toThrow(/decDeg/);
    expect(() => coneSearch(store, { raDeg: 0, decDeg: 0, radiusDeg: 0 })).toThrow(/radiusDeg/);
  });
});
