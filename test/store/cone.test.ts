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

/**
 * Invented catalogues with varied masses: stellar masses (some missing), catalogued halo masses on
 * some rows, and a second catalogue holding 0.3″ twins of every fifth row (compatible redshifts, so
 * the store links them as one galaxy) with a different stellar mass.
 */
function massSky(seed: number, n: number): { a: string; b: string } {
  const rng = createRng(seed);
  const a = ['id,ra,dec,z,z_err,z_kind,log_mstar,log_mhalo,mhalo_def'];
  const b = ['id,ra,dec,z,z_err,z_kind,log_mstar'];
  for (let k = 0; k < n; k++) {
    const ra = 40 + 6 * rng.uniform();
    const dec = -20 + 6 * rng.uniform();
    const z = 0.005 + 0.8 * rng.uniform();
    const mstar = rng.uniform() < 0.15 ? '' : (8 + 4 * rng.uniform()).toFixed(2);
    const halo =
      mstar === '' || rng.uniform() < 0.1 ? [(11 + 4 * rng.uniform()).toFixed(2), '200c'] : ['', ''];
    a.push(`m${k},${ra.toFixed(7)},${dec.toFixed(7)},${z.toFixed(4)},0.0002,spec,${mstar},${halo.join(',')}`);
    if (k % 5 === 0) {
      const twinDec = dec + 0.3 / 3600;
      b.push(
        `t${k},${ra.toFixed(7)},${twinDec.toFixed(7)},${z.toFixed(4)},0.0002,spec,${(8 + 4 * rng.uniform()).toFixed(2)}`,
      );
    }
  }
  return { a: `${a.join('\n')}\n`, b: `${b.join('\n')}\n` };
}

describe('coneSearch with a redshift window and a mass hint', () => {
  let mdir: string;
  let mstore: Store;
  beforeAll(async () => {
    mdir = mkdtempSync(join(tmpdir(), 'forehalo-cone-mass-'));
    mstore = openStore(join(mdir, 'mass.db'));
    const { a, b } = massSky(21, 3000);
    writeFileSync(join(mdir, 'a.csv'), a);
    writeFileSync(join(mdir, 'b.csv'), b);
    await loadCatalog(mstore, { source: join(mdir, 'a.csv'), name: 'mass-a' });
    await loadCatalog(mstore, { source: join(mdir, 'b.csv'), name: 'mass-b' });
    // A third catalogue over the same field with no twins: its scans run without the link join.
    writeFileSync(join(mdir, 'c.csv'), massSky(22, 1500).a.replaceAll('\nm', '\nc'));
    await loadCatalog(mstore, { source: join(mdir, 'c.csv'), name: 'mass-c' });
  });
  afterAll(() => {
    mstore.close();
    rmSync(mdir, { recursive: true, force: true });
  });

  const full = (rows: ReturnType<typeof coneSearch>) =>
    rows.map((r) => `${r.catalog}/${r.objectId}:${r.preferred}:${r.physicalKey}`).sort();

  it('returns exactly the rows, links and preferred marks of a full scan filtered row by row', () => {
    const linked = (name: string) =>
      mstore.statements.catalogHasLinks.get(mstore.statements.catalogByName.get(name)!.catalog_id);
    expect([linked('mass-a'), linked('mass-b'), linked('mass-c')]).toEqual([1, 1, 0]);
    // Reference: coneSearchBruteForce reads every row of each catalogue and applies the window and
    // the hint in code; coneSearch applies them inside SQLite on the HEALPix range scans.
    const query = fc.record({
      raDeg: fc.double({ min: 39, max: 47, noNaN: true }),
      decDeg: fc.double({ min: -21, max: -13, noNaN: true }),
      radiusDeg: fc.double({ min: 0.01, max: 4, noNaN: true }),
      zMin: fc.option(fc.double({ min: 0, max: 0.8, noNaN: true }), { nil: undefined }),
      zMax: fc.option(fc.double({ min: 0, max: 0.9, noNaN: true }), { nil: undefined }),
      minLogMstar: fc.option(fc.double({ min: 8, max: 12, noNaN: true }), { nil: undefined }),
      minLogMhalo: fc.option(fc.double({ min: 11, max: 15, noNaN: true }), { nil: undefined }),
    });
    fc.assert(
      fc.property(query, (q) => {
        expect(full(coneSearch(mstore, q))).toEqual(full(coneSearchBruteForce(mstore, q)));
      }),
      { numRuns: 200, seed: 20261202 },
    );
  });

  it('applies the window and the hint, but keeps linked twins and rows with a large halo mass', () => {
    const q: ConeQuery = { raDeg: 43, decDeg: -17, radiusDeg: 5, zMin: 0.2, zMax: 0.5 };
    const windowed = coneSearch(mstore, q);
    expect(windowed.length).toBeGreaterThan(0);
    expect(windowed.every((r) => r.z >= 0.2 && r.z <= 0.5)).toBe(true);
    const hinted = coneSearch(mstore, { ...q, minLogMstar: 11.5, minLogMhalo: 14 });
    expect(hinted.length).toBeLessThan(windowed.length / 2);
    for (const r of hinted) {
      const linked =
        r.physicalKey !== `${r.catalog}/${r.objectId}` ||
        hinted.some((o) => o !== r && o.physicalKey === r.physicalKey);
      const needed = (r.logMstar ?? -1) >= 11.5 || (r.logMhalo ?? -1) >= 14;
      expect(needed || linked).toBe(true);
    }
    // Every row the hint allows to drop is indeed absent, every needed row present.
    const kept = new Set(hinted.map((r) => `${r.catalog}/${r.objectId}`));
    for (const r of windowed) {
      const needed = (r.logMstar ?? -1) >= 11.5 || (r.logMhalo ?? -1) >= 14;
      if (needed) expect(kept.has(`${r.catalog}/${r.objectId}`)).toBe(true);
    }
    expect(hinted.some((r) => r.catalog === 'mass-b' && (r.logMstar ?? 0) < 11.5)).toBe(true);
  });

  it('refuses a redshift or mass bound that is not a number', () => {
    expect(() => coneSearch(mstore, { raDeg: 43, decDeg: -17, radiusDeg: 1, zMin: Number.NaN })).toThrow(
      /zMin/,
    );
    expect(() =>
      coneSearch(mstore, { raDeg: 43, decDeg: -17, radiusDeg: 1, minLogMstar: Number.NaN }),
    ).toThrow(/minLogMstar/);
  });
});
