import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/errors.js';
import { ang2pixNest } from '../../../src/sky/index.js';
import {
  coneSearch,
  coneSearchBruteForce,
  dropCatalog,
  getCatalog,
  loadCatalog,
} from '../../../src/store/index.js';
import { STORAGE_ORDER } from '../../../src/store/storage-order.js';
import { useTmp } from '../tmp.js';

const HEADER = 'id,ra,dec,z,z_err,z_kind,log_mstar,log_mstar_err';

/** An invented field of n galaxies around (150°, 2°), deterministic. */
function fieldCsv(n: number, idOf: (i: number) => string = (i) => `P${i}`): string {
  let s = 7;
  const rnd = () => {
    s = (Math.imul(s, 1103515245) + 12345) >>> 0;
    return s / 2 ** 32;
  };
  const lines = Array.from({ length: n }, (_, i) => {
    const ra = (150 + 0.4 * (rnd() - 0.5)).toFixed(6);
    const dec = (2 + 0.4 * (rnd() - 0.5)).toFixed(6);
    const z = (0.05 + 0.6 * rnd()).toFixed(4);
    return `${idOf(i)},${ra},${dec},${z},0.03,photo,${(8.5 + 3 * rnd()).toFixed(2)},0.15`;
  });
  return `${HEADER}\n${lines.join('\n')}\n`;
}

type TestStore = ReturnType<ReturnType<typeof useTmp>['store']>;

/** Each cone answered exactly as a full scan answers it; returns the ids found per cone. */
function expectConesAsFullScan(store: TestStore, cones: number[][], zMax?: number): string[][] {
  return cones.map(([raDeg, decDeg, radiusDeg]) => {
    const q = { raDeg, decDeg, radiusDeg, zMax };
    const fast = coneSearch(store, q).map((x) => x.objectId);
    expect(fast).toEqual(coneSearchBruteForce(store, q).map((x) => x.objectId));
    return fast;
  });
}

/** The pixel read back from each key (a virtual column) is the pixel of the stored position. */
function expectKeyPixels(store: TestStore, where = '1'): number {
  const rows = store.db.prepare(`SELECT hpx, ra_deg, dec_deg FROM galaxy WHERE ${where}`).all() as {
    hpx: number;
    ra_deg: number;
    dec_deg: number;
  }[];
  for (const r of rows) expect(r.hpx).toBe(ang2pixNest(STORAGE_ORDER, r.ra_deg, r.dec_deg));
  return rows.length;
}

/** Runs (sorted parts) a catalogue is stored in. */
function partCount(store: TestStore, name: string): number {
  return store.db
    .prepare('SELECT COUNT(*) FROM galaxy_run r JOIN catalog c USING (catalog_id) WHERE c.name = ?')
    .pluck()
    .get(name) as number;
}

describe('a catalogue stored in several parts', () => {
  const tmp = useTmp();

  it('answers cone searches exactly as a full scan does', async () => {
    const store = tmp.store();
    const s = await loadCatalog(store, {
      source: tmp.file('f.csv', fieldCsv(500)),
      name: 'field',
      batchSize: 37,
    });
    expect(s.rows).toBe(500);
    expect(partCount(store, 'field')).toBe(Math.ceil(500 / 37));
    const cones = [
      [150, 2, 0.05],
      [150.1, 1.9, 0.12],
      [149.85, 2.15, 0.3],
      [150, 2, 2],
    ];
    for (const found of expectConesAsFullScan(store, cones, 0.5)) expect(found.length).toBeGreaterThan(0);
  });

  it('keeps keys exact past 2^53 (run numbers ≥ 32) and frees run numbers with their catalogue', async () => {
    const store = tmp.store();
    await loadCatalog(store, {
      source: tmp.file('f.csv', fieldCsv(400)),
      name: 'many',
      batchSize: 10,
      mergeAboveRuns: 100,
    });
    expect(partCount(store, 'many')).toBe(40);
    expect(expectKeyPixels(store, 'run >= 32')).toBe(80);
    expectConesAsFullScan(store, [
      [150, 2, 0.05],
      [150.1, 1.9, 0.12],
      [150, 2, 2],
    ]);
    dropCatalog(store, 'many');
    expect(store.db.prepare('SELECT COUNT(*) FROM galaxy_run').pluck().get()).toBe(0);
    expect(store.db.prepare('SELECT COUNT(*) FROM galaxy').pluck().get()).toBe(0);
    await loadCatalog(store, { source: tmp.file('g.csv', fieldCsv(30)), name: 'again', batchSize: 10 });
    expect(store.db.prepare('SELECT run FROM galaxy_run ORDER BY run').pluck().all()).toEqual([0, 1, 2]);
  });

  it('merges a load of many parts into one run, keeping every row and rows that share a position', async () => {
    const store = tmp.store();
    // Lines 2–401: an invented field; then 30 more objects at one and the same position.
    const extra = Array.from({ length: 30 }, (_, i) => `S${i},150.000000,2.000000,0.3,0.03,photo,10.0,0.15`);
    const csv = `${fieldCsv(400).trimEnd()}\n${extra.join('\n')}\n`;
    const s = await loadCatalog(store, {
      source: tmp.file('m.csv', csv),
      name: 'merged',
      batchSize: 10,
      mergeAboveRuns: 3,
    });
    expect(s.rows).toBe(430);
    expect(partCount(store, 'merged')).toBe(1);
    expect(expectKeyPixels(store)).toBe(430);
    expectConesAsFullScan(store, [
      [150, 2, 0.01],
      [150.1, 1.9, 0.12],
      [150, 2, 2],
    ]);
    expect(
      coneSearch(store, { raDeg: 150, decDeg: 2, radiusDeg: 0.001 }).filter((r) =>
        r.objectId.startsWith('S'),
      ),
    ).toHaveLength(30);
    // Runs freed by the merge are reused.
    expect(store.db.prepare('SELECT MAX(run) FROM galaxy_run').pluck().get()).toBeLessThan(60);
  });

  it('merges a many-run catalogue before matching a large enough new catalogue against it', async () => {
    const store = tmp.store();
    await loadCatalog(store, {
      source: tmp.file('a.csv', fieldCsv(400)),
      name: 'wide',
      batchSize: 10,
      mergeAboveRuns: 100,
    });
    expect(partCount(store, 'wide')).toBe(40);
    // 30 objects of 'wide' seen again (same position and redshift) under other ids: 30 twins.
    const twins = fieldCsv(400)
      .trimEnd()
      .split('\n')
      .slice(1, 31)
      .map((l) => l.replace(/^P/, 'T'));
    const s = await loadCatalog(store, {
      source: tmp.file('b.csv', `${HEADER}\n${twins.join('\n')}\n`),
      name: 'deep',
    });
    // 30 probes × 39 extra runs > 400 target rows: 'wide' is merged into one run first.
    expect(partCount(store, 'wide')).toBe(1);
    expect(s.duplicatePairs).toBe(30);
    expectConesAsFullScan(store, [[150, 2, 1]]);
  });

  it('finds an id repeated in another part, or twice in one pixel of one part, and names every line', async () => {
    const store = tmp.store();
    // Ids repeat at lines 2/402 (different parts, different positions) and the row at line 5 is
    // copied verbatim to line 6 (same part, same pixel).
    const lines = fieldCsv(400).trimEnd().split('\n');
    lines.push(lines[1].replace(/^P0,/, 'P0,').replace(/,0\.03,/, ',0.02,'));
    lines.splice(5, 0, lines[4]);
    const csv = `${lines.join('\n')}\n`;
    const err = await loadCatalog(store, { source: tmp.file('d.csv', csv), name: 'dup', batchSize: 50 }).then(
      () => null,
      (e) => e,
    );
    expect(err).toBeInstanceOf(InputError);
    const details = (err as InputError).details as {
      problems: { position: number; value: string; reason: string }[];
    };
    expect(details.problems.map((p) => [p.position, p.value, p.reason])).toEqual([
      [6, 'P3', 'duplicate id (first at line 5)'],
      [403, 'P0', 'duplicate id (first at line 2)'],
    ]);
    expect(store.db.prepare('SELECT COUNT(*) FROM catalog').pluck().get()).toBe(0);
    expect(store.db.prepare('SELECT COUNT(*) FROM galaxy').pluck().get()).toBe(0);

    const kept = await loadCatalog(store, {
      source: tmp.file('d.csv', csv),
      name: 'dup',
      batchSize: 50,
      skipInvalid: true,
    });
    expect(kept).toMatchObject({ rows: 400, skipped: 2 });
    const p0 = coneSearchBruteForce(store, { raDeg: 150, decDeg: 2, radiusDeg: 5 }).filter(
      (r) => r.objectId === 'P0',
    );
    expect(p0.map((r) => [r.sourcePosition, r.zErr])).toEqual([[2, 0.03]]);
    expect(getCatalog(store, 'dup').rowsSkipped).toBe(2);
  });

  it('appends new parts and replaces older rows by id', async () => {
    const store = tmp.store();
    await loadCatalog(store, { source: tmp.file('a.csv', fieldCsv(120)), name: 'grow', batchSize: 40 });
    const more = `${HEADER}\nP5,150.01,2.01,0.2,0.0001,spec,10.1,0.1\nNEW1,150.02,2.02,0.3,0.0001,spec,10.2,0.1\n`;
    const s = await loadCatalog(store, {
      source: tmp.file('b.csv', more),
      name: 'grow',
      mode: 'append',
      batchSize: 40,
    });
    expect(s).toMatchObject({ outcome: 'appended', rows: 2, totalRows: 121 });
    expect(partCount(store, 'grow')).toBe(4);
    const all = coneSearch(store, { raDeg: 150, decDeg: 2, radiusDeg: 1 });
    expect(all).toHaveLength(121);
    expect(all.filter((r) => r.objectId === 'P5').map((r) => [r.zKind, r.z])).toEqual([['spec', 0.2]]);
  });

  it('gives up promptly when the name turns out to be taken while parts are already waiting', async () => {
    const store = tmp.store();
    await loadCatalog(store, { source: tmp.file('a.csv', fieldCsv(10)), name: 'taken' });
    for (const parseInWorker of [false, true]) {
      const err = await loadCatalog(store, {
        source: tmp.file('b.csv', fieldCsv(3000)),
        name: 'taken',
        batchSize: 10,
        parseInWorker,
      }).then(
        () => null,
        (e) => e,
      );
      expect((err as { code?: string })?.code).toBe('catalog_exists');
      expect(store.db.inTransaction).toBe(false);
    }
    expect(getCatalog(store, 'taken').rows).toBe(10);
  }, 20_000);

  it('runs two loads on one connection one after the other (each holds the write transaction)', async () => {
    const store = tmp.store();
    const [a, b] = await Promise.all([
      loadCatalog(store, { source: tmp.file('a.csv', fieldCsv(300)), name: 'first', batchSize: 64 }),
      loadCatalog(store, {
        source: tmp.file(
          'b.csv',
          fieldCsv(200, (i) => `Q${i}`),
        ),
        name: 'second',
        batchSize: 64,
      }),
    ]);
    expect([a.rows, b.rows]).toEqual([300, 200]);
    expect(store.db.inTransaction).toBe(false);
    expect(coneSearch(store, { raDeg: 150, decDeg: 2, radiusDeg: 1 })).toHaveLength(500);
  });
});
