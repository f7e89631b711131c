import { InputError } from '../errors.js';
import { DEG } from '../math/index.js';
import { angularSeparationDeg, checkDecDeg, coneToRanges } from '../sky/index.js';
import { type GalaxyRow, type GalaxySqlRow, markPreferred, toGalaxyRow } from './galaxy-row.js';
import type { Store } from './open.js';
import { STORAGE_ORDER } from './storage-order.js';

export interface ConeQuery {
  raDeg: number;
  decDeg: number;
  /** Cone radius [deg], in (0, 180]. */
  radiusDeg: number;
  /** Restrict to these catalogues (default: all). Unknown names are an error. */
  catalogs?: readonly string[];
  /** Keep galaxies with z ≤ zMax (default: no limit). */
  zMax?: number;
}

/** A cone-search answer row: the galaxy plus its separation from the cone centre. */
export type ConeRow = GalaxyRow & { readonly sepDeg: number };

function checkQuery(q: ConeQuery): void {
  if (!Number.isFinite(q.raDeg) || q.raDeg < 0 || q.raDeg >= 360) {
    throw new InputError('bad_coordinate', `raDeg must be in [0, 360), got ${q.raDeg}`, { field: 'raDeg' });
  }
  checkDecDeg(q.decDeg);
  if (!(q.radiusDeg > 0 && q.radiusDeg <= 180)) {
    throw new InputError('bad_radius', `radiusDeg must be in (0, 180], got ${q.radiusDeg}`, {
      field: 'radiusDeg',
    });
  }
  if (q.zMax !== undefined && !(q.zMax >= 0)) {
    throw new InputError('bad_z', `zMax must be ≥ 0, got ${q.zMax}`, { field: 'zMax' });
  }
}

function catalogIds(store: Store, names?: readonly string[]): number[] {
  const all = store.statements.catalogs.all();
  if (!names) return all.map((c) => c.catalog_id);
  return names.map((n) => {
    const c = all.find((x) => x.name === n);
    if (!c) throw new InputError('catalog_not_found', `no catalogue named '${n}'`, { name: n });
    return c.catalog_id;
  });
}

function finish(q: ConeQuery, candidates: Iterable<GalaxySqlRow>): ConeRow[] {
  const inside: (Omit<GalaxyRow, 'preferred'> & { sepDeg: number })[] = [];
  for (const r of candidates) {
    const sepDeg = angularSeparationDeg(q.raDeg, q.decDeg, r.ra_deg, r.dec_deg);
    if (sepDeg <= q.radiusDeg) inside.push({ ...toGalaxyRow(r), sepDeg });
  }
  inside.sort(
    (a, b) =>
      a.sepDeg - b.sepDeg ||
      (a.catalog < b.catalog ? -1 : a.catalog > b.catalog ? 1 : a.objectId < b.objectId ? -1 : 1),
  );
  return markPreferred(inside) as ConeRow[];
}

/**
 * Galaxies within radiusDeg of (raDeg, decDeg), nearest first: the cone becomes a few HEALPix index
 * ranges at the storage order (coneToRanges), each a contiguous scan of the clustered galaxy table,
 * then an exact great-circle separation test. One row per physical galaxy has preferred = true.
 */
export function coneSearch(store: Store, q: ConeQuery): ConeRow[] {
  checkQuery(q);
  const zMax = q.zMax ?? Number.MAX_VALUE;
  const ranges = coneToRanges(STORAGE_ORDER, q.raDeg, q.decDeg, q.radiusDeg * DEG);
  const stmt = store.statements.galaxiesInRange;
  function* candidates() {
    for (const id of catalogIds(store, q.catalogs)) {
      for (const [lo, hi] of ranges) yield* stmt.iterate(id, lo, hi, zMax);
    }
  }
  return finish(q, candidates());
}

/** Same answer as coneSearch from a full scan with no index (for tests and cross-checks). */
export function coneSearchBruteForce(store: Store, q: ConeQuery): ConeRow[] {
  checkQuery(q);
  const zMax = q.zMax ?? Number.MAX_VALUE;
  const stmt = store.statements.galaxiesOfCatalog;
  function* candidates() {
    for (const id of catalogIds(store, q.catalogs)) yield* stmt.iterate(id, zMax);
  }
  return finish(q, candidates());
}

/**
 * Rows that stand for a group halo (they carry a halo mass) with the given ids, from any catalogue
 * (or the named ones): members name their group's row in groupId, and that one halo must be counted
 * once, not once per member.
 */
export function groupHaloRows(
  store: Store,
  groupIds: readonly string[],
  catalogs?: readonly string[],
): GalaxyRow[] {
  const allowed = catalogs ? new Set(catalogs) : undefined;
  if (allowed) catalogIds(store, catalogs); // unknown names are an error
  const rows: GalaxySqlRow[] = [];
  for (const id of new Set(groupIds)) {
    for (const r of store.statements.haloRowById.all(id))
      if (!allowed || allowed.has(r.catalog)) rows.push(r);
  }
  return markPreferred(rows.map(toGalaxyRow));
}
