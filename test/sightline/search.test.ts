import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/index.js';
import {
  type CatalogRow,
  createHaloKit,
  findCandidates,
  type HaloKit,
  planShells,
  QUERY_COST_ROWS,
  resolveDuplicates,
  type SearchTarget,
  selectCandidate,
  velocityWindowDz,
} from '../../src/sightline/index.js';
import { bruteCone } from './helpers/brute-cone.js';
import { offsetPoint } from './helpers/sky-offset.js';

// Model variants spanning tiny and huge search radii: the mass ceiling, the search factor and the
// angle cap change the cone sizes by orders of magnitude.
const KITS: HaloKit[] = [
  createHaloKit(parseModel({})),
  createHaloKit(parseModel({ log_mhalo_max: 12, search: 1, extent: 1, max_search_deg: 0.05 })),
  createHaloKit(
    parseModel({ log_mhalo_max: 16, search: 20, extent: 5, max_search_deg: 30, shmr: 'behroozi2013' }),
  ),
  createHaloKit(parseModel({ mass_definition: '200m', photo_z_width: 0.4, photo_z_k: 5, z_min: 0.01 })),
  createHaloKit(parseModel({ mass_definition: 'vir', photo_z_width: 0, velocity_window_kms: 5000 })),
];

const sightline = fc.record({
  raDeg: fc.oneof(
    fc.double({ min: 0, max: 359.999999, noNaN: true }),
    fc.double({ min: 0, max: 0.01, noNaN: true }),
    fc.double({ min: 359.99, max: 359.9999999, noNaN: true }),
  ),
  decDeg: fc.oneof(
    fc.double({ min: -90, max: 90, noNaN: true }),
    fc.double({ min: 89.9, max: 90, noNaN: true }),
    fc.double({ min: -90, max: -89.9, noNaN: true }),
  ),
  zSource: fc.double({ min: 0.02, max: 1.5, noNaN: true }),
});

const galaxy = fc.record({
  logSepDeg: fc.double({ min: -5, max: 1.5, noNaN: true }),
  paDeg: fc.double({ min: 0, max: 360, noNaN: true }),
  z: fc.double({ min: 0.0002, max: 2.5, noNaN: true }),
  photo: fc.boolean(),
  zErr: fc.option(fc.double({ min: 0.001, max: 0.3, noNaN: true }), { nil: null }),
  logMstar: fc.option(fc.double({ min: 7, max: 12.5, noNaN: true }), { nil: null }),
  logMhalo: fc.option(fc.double({ min: 11, max: 16, noNaN: true }), { freq: 5, nil: null }),
  def: fc.constantFrom('200c', '200m', 'vir') as fc.Arbitrary<'200c' | '200m' | 'vir'>,
  catalog: fc.constantFrom('alpha', 'beta'),
});

type GalaxyDraw = typeof galaxy extends fc.Arbitrary<infer T> ? T : never;

function buildRows(target: { raDeg: number; decDeg: number }, gals: GalaxyDraw[]): CatalogRow[] {
  return gals.map((g, i) => {
    const [ra, dec] = offsetPoint(target.raDeg, target.decDeg, 10 ** g.logSepDeg, g.paDeg);
    return {
      catalog: g.catalog,
      objectId: `G${i}`,
      raDeg: ra,
      decDeg: dec,
      z: g.z,
      zErr: g.photo ? g.zErr : 0.0002,
      zKind: g.photo ? 'photo' : 'spec',
      logMstar: g.logMstar,
      logMstarErr: 0.1,
      logMhalo: g.logMhalo,
      mhaloDef: g.logMhalo === null ? null : g.def,
    };
  });
}

function keysOf(rows: readonly { row: CatalogRow }[]): string[] {
  return rows.map((c) => `${c.row.catalog}/${c.row.objectId}`).sort();
}

describe('candidate search', () => {
  it('finds exactly the brute-force candidate set on thousands of random sightlines and catalogues', () => {
    let nonEmpty = 0;
    fc.assert(
      fc.property(
        sightline,
        fc.array(galaxy, { minLength: 1, maxLength: 30 }),
        fc.nat(KITS.length - 1),
        // Query grouping: one query per shell, the default cost model, and everything merged.
        fc.constantFrom(0, QUERY_COST_ROWS, 1e12),
        (s, gals, k, queryCostRows) => {
          const kit = KITS[k];
          const rows = buildRows(s, gals);
          const target: SearchTarget = { raDeg: s.raDeg, decDeg: s.decDeg, zSourceHi: s.zSource };
          const viaShells = findCandidates(bruteCone(rows), kit, target, { queryCostRows });
          const zFrontMax = s.zSource + velocityWindowDz(s.zSource, kit.model.velocity_window_kms);
          const brute = resolveDuplicates(rows)
            .kept.map((r) => selectCandidate(r, target, kit, zFrontMax))
            .filter((c) => c !== null);
          if (brute.length > 0) nonEmpty++;
          expect(keysOf(viaShells.candidates)).toEqual(keysOf(brute));
        },
      ),
      { numRuns: 2000, seed: 20261201 },
    );
    // The comparison must not be vacuous: many runs have candidates.
    expect(nonEmpty).toBeGreaterThan(300);
  });

  it('covers every catalogued redshift from z_min up to the top of the query range without gaps', () => {
    const kit = KITS[0];
    const planned = planShells(kit, 0.8);
    const allRows = planned.filter((s) => s.minLogMstar === undefined);
    const massive = planned.filter((s) => s.minLogMstar !== undefined);
    for (const shells of [allRows, massive]) {
      expect(shells[0].zLo).toBe(kit.model.z_min);
      for (let i = 1; i < shells.length; i++) expect(shells[i].zLo).toBe(shells[i - 1].zHi);
      expect(shells.at(-1)!.zHi).toBeGreaterThan(0.8);
      // Cones shrink with redshift at low z (D_A grows faster than r_halo shrinks).
      expect(shells[0].radiusDeg).toBeGreaterThan(shells.at(-1)!.radiusDeg);
    }
    // The massive tier's cones are wider, and only for rows that could hold a halo above 10^12.5 M☉.
    expect(massive.at(-1)!.radiusDeg).toBeGreaterThan(allRows.at(-1)!.radiusDeg);
    expect(massive[0].minLogMhalo).toBe(12.5);
  });

  it('plans the same shells whether or not the kit has planned shells before', () => {
    // planShells keeps the full-width shells with the kit; a fresh kit recomputes them all.
    for (const zs of [0.05, 0.8, 0.3, 2.5, 0.8]) {
      const used = planShells(KITS[0], zs);
      const fresh = planShells(createHaloKit(parseModel({})), zs);
      expect(used).toEqual(fresh);
    }
  });

  it('makes one query per planned shell at cost 0 and fewer on a sparse catalogue', () => {
    const kit = KITS[0];
    const target: SearchTarget = { raDeg: 150, decDeg: 2, zSourceHi: 0.8 };
    const planned = planShells(kit, 0.8).length;
    const calls: unknown[] = [];
    const none = findCandidates(bruteCone([], calls as never), kit, target, { queryCostRows: 0 });
    expect(none.queries).toBe(planned);
    expect(calls).toHaveLength(planned);
    // An empty sky: the probe finds nothing, so the remaining shells fold into one query.
    const sparse = findCandidates(bruteCone([]), kit, target);
    expect(planned).toBeGreaterThan(4);
    expect(sparse.queries).toBe(2);
  });

  it('keeps the spectroscopic twin of a cross-catalogue duplicate and drops the photometric one', () => {
    const kit = KITS[0];
    const base = { raDeg: 150, decDeg: 2, logMstar: 10.5, logMstarErr: 0.1, physicalKey: 'link-1' };
    const rows: CatalogRow[] = [
      { ...base, catalog: 'photo', objectId: 'P1', z: 0.11, zErr: 0.03, zKind: 'photo' },
      { ...base, catalog: 'spec', objectId: 'S1', decDeg: 2.00001, z: 0.1, zErr: 0.0002, zKind: 'spec' },
    ];
    const res = findCandidates(bruteCone(rows), kit, { raDeg: 150.005, decDeg: 2.0, zSourceHi: 0.5 });
    expect(keysOf(res.candidates)).toEqual(['spec/S1']);
    expect(res.duplicates.get(rows[1])?.map((r) => r.objectId)).toEqual(['P1']);
  });
});
