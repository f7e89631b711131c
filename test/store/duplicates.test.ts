import { describe, expect, it } from 'vitest';
import { coneSearch, dropCatalog, getCatalog, loadCatalog } from '../../src/store/index.js';
import { useTmp } from './tmp.js';

const ARCSEC_DEG = 1 / 3600;
const H = 'id,ra,dec,z,z_err,z_kind,log_mstar';

describe('cross-catalogue duplicates', () => {
  const tmp = useTmp();

  async function field(store: ReturnType<typeof tmp.store>) {
    const d = (n: number) => (40 + n * ARCSEC_DEG).toFixed(8);
    await loadCatalog(store, {
      source: tmp.file(
        'spec.csv',
        `${H}\nS1,${d(0)},10,0.2000,0.0002,spec,10.5\nS2,${d(100)},10,0.3000,0.0002,spec,10.1\nS3,${d(200)},10,0.1000,0.0002,spec,10.0\nS4,${d(300)},10,0.4000,0.0002,spec,10.0\n`,
      ),
      name: 'spec',
    });
    // P1: 0.5″ from S1, compatible z → same galaxy. P2: 0.5″ from S2 but Δz = 0.3 ≫ 3σ → different.
    // P3: 1.5″ from S3 → beyond the 1″ radius. P4: 0.8″ from S4, compatible.
    await loadCatalog(store, {
      source: tmp.file(
        'photo.csv',
        `${H}\nP1,${d(0.5)},10,0.23,0.03,photo,10.4\nP2,${d(100.5)},10,0.60,0.03,photo,10.0\nP3,${d(201.5)},10,0.10,0.03,photo,10.0\nP4,${d(300)},${(10 + 0.8 * ARCSEC_DEG).toFixed(8)},0.38,0.03,photo,10.0\n`,
      ),
      name: 'photo',
    });
  }

  function cone(store: ReturnType<typeof tmp.store>) {
    return coneSearch(store, { raDeg: 40.05, decDeg: 10, radiusDeg: 0.2 });
  }

  it('links objects within 1″ with compatible redshifts and marks the spectroscopic one preferred', async () => {
    const store = tmp.store();
    await field(store);
    const rows = cone(store);
    const key = (id: string) => rows.find((r) => r.objectId === id)!.physicalKey;
    const preferred = (id: string) => rows.find((r) => r.objectId === id)!.preferred;
    expect(key('P1')).toBe(key('S1'));
    expect(key('P4')).toBe(key('S4'));
    expect(key('P2')).not.toBe(key('S2'));
    expect(key('P3')).not.toBe(key('S3'));
    expect([preferred('S1'), preferred('P1'), preferred('S4'), preferred('P4')]).toEqual([
      true,
      false,
      true,
      false,
    ]);
    // One preferred row per physical galaxy: 8 rows, 6 galaxies.
    expect(rows.filter((r) => r.preferred)).toHaveLength(6);
    expect(getCatalog(store, 'photo').duplicatePairs).toBe(2);
  });

  it('unlinks the objects of a dropped catalogue', async () => {
    const store = tmp.store();
    await field(store);
    dropCatalog(store, 'spec');
    const rows = cone(store);
    expect(rows.every((r) => r.physicalKey === `photo/${r.objectId}` && r.preferred)).toBe(true);
    expect(store.db.prepare('SELECT COUNT(*) AS n FROM physical_link').get()).toEqual({ n: 0 });
    expect(() => getCatalog(store, 'spec')).toThrow(/no catalogue named 'spec'/);
  });

  it('honours a configurable match radius', async () => {
    const store = tmp.store({ match: { radiusArcsec: 2 } });
    await field(store);
    const rows = cone(store);
    const key = (id: string) => rows.find((r) => r.objectId === id)!.physicalKey;
    expect(key('P3')).toBe(key('S3'));
  });

  it('treats two spectroscopic redshifts as one galaxy only within the velocity tolerance', async () => {
    const store = tmp.store();
    const d = (40).toFixed(8);
    await loadCatalog(store, {
      source: tmp.file('a.csv', `${H}\nA,${d},10,0.2000,0.0001,spec,10\nB,41,10,0.2,0.0001,spec,10\n`),
      name: 'a',
    });
    // 0.001 (1+z) ≈ 0.0012: A' differs by 0.0005 (same), B' by 0.01 (a different galaxy on the same line of sight).
    await loadCatalog(store, {
      source: tmp.file('b.csv', `${H}\nA2,${d},10,0.2005,0.0001,spec,10\nB2,41,10,0.21,0.0001,spec,10\n`),
      name: 'b',
    });
    const pairs = store.db.prepare('SELECT object_a, object_b FROM galaxy_match').all();
    expect(pairs).toEqual([{ object_a: 'A', object_b: 'A2' }]);
  });
});
