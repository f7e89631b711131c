import { InputError } from '../errors.js';
import { DEG } from '../math/index.js';
import { checkDecDeg, separationRad } from '../sky/index.js';
import { coneCoverRanges } from './cone-cover.js';
import { scanRanges } from './cone-scan.js';
import {
  type BuildingRow,
  fromScan,
  type GalaxyRow,
  type GalaxySqlRow,
  markPreferred,
  markPreferredInPlace,
  toGalaxyRow,
} from './galaxy-row.js';
import type { Store } from './open.js';
import { STORAGE_ORDER } from './storage-order.js';

export interface ConeQuery {
  raDeg: number;
  decDeg: number;
  /** Cone radius [deg], in (0, 180]. */
  radiusDeg: number;
  /** Restrict to these catalogues (default: all). Unknown names are an error. */
  catalogs?: readonly string[];
  /** Keep galaxies with z ≥ zMin (default: no limit). */
  zMin?: number;
  /** Keep galaxies with z ≤ zMax (default: no limit). */
  zMax?: number;
  /**
   * Mass hint (log10 M☉): rows with log_mstar < minLogMstar and no log_mhalo ≥ minLogMhalo may be
   * left out. Rows with neither mass, and rows linked to a twin in another catalogue, are always
   * kept. A missing bound keeps every row that has that mass.
   */
  minLogMstar?: number;
  minLogMhalo?: number;
}

/** A cone-search answer row: the galaxy plus its separation from the cone centre. */
export type ConeRow = GalaxyRow & { readonly sepDeg: number };

function checkOptionalNumber(q: ConeQuery, field: 'zMin' | 'zMax' | 'minLogMstar' | 'minLogMhalo'): void {
  const x = q[field];
  if (x !== undefined && Number.isNaN(x)) {
    throw new InputError('bad_query', `${field} must be a number, got ${x}`, { field });
  }
}

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
  for (const f of ['zMin', 'minLogMstar', 'minLogMhalo'] as const) checkOptionalNumber(q, f);
}

/** The queried catalogues as [id, name], in name order (unknown names are an error). */
function catalogsOf(store: Store, names?: readonly string[]): [number, string][] {
  const all = store.statements.catalogNames.all();
  if (!names) return all.map((c) => [c.catalog_id, c.name]);
  return names.map((n) => {
    const c = all.find((x) => x.name === n);
    if (!c) throw new InputError('catalog_not_found', `no catalogue named '${n}'`, { name: n });
    return [c.catalog_id, c.name];
  });
}

const BIG = Number.MAX_VALUE;
/** Widening of the Dec band [deg] so round-off in the exact test can never meet a pre-filtered row. */
const DEC_BAND_PAD_DEG = 1e-9;

/** Exact great-circle test, sort by separation (then catalogue, id), one preferred row per galaxy. */
function finish(
  q: ConeQuery,
  candidates: readonly BuildingRow[],
  linked: ReadonlySet<BuildingRow>,
): ConeRow[] {
  const inside: (BuildingRow & { sepDeg: number })[] = [];
  const ra0 = q.raDeg * DEG;
  const dec0 = q.decDeg * DEG;
  for (const r of candidates) {
    const sepDeg = separationRad(ra0, dec0, r.raDeg * DEG, r.decDeg * DEG) / DEG;
    if (sepDeg <= q.radiusDeg) {
      const row = r as BuildingRow & { sepDeg: number };
      row.sepDeg = sepDeg;
      inside.push(row);
    }
  }
  inside.sort(
    (a, b) =>
      a.sepDeg - b.sepDeg ||
      (a.catalog < b.catalog ? -1 : a.catalog > b.catalog ? 1 : a.objectId < b.objectId ? -1 : 1),
  );
  if (linked.size > 0) markPreferredInPlace(inside.filter((r) => linked.has(r)));
  return inside;
}

/**
 * Galaxies within radiusDeg of (raDeg, decDeg), nearest first: the cone becomes a few HEALPix
 * index ranges at the storage order (coneCoverRanges), each a contiguous key-range scan (per run) of the galaxy
 * table in which SQLite drops rows outside the redshift window, the Dec band of the cone and the
 * mass hint; an exact great-circle separation test follows. One row per physical galaxy has
 * preferred = true.
 */
export function coneSearch(store: Store, q: ConeQuery): ConeRow[] {
  checkQuery(q);
  const ranges = coneCoverRanges(STORAGE_ORDER, q.raDeg, q.decDeg, q.radiusDeg * DEG);
  const hinted = q.minLogMstar !== undefined || q.minLogMhalo !== undefined;
  const raw: unknown[][] = [];
  const rows: BuildingRow[] = [];
  const linked = new Set<BuildingRow>();
  for (const [catalogId, name] of catalogsOf(store, q.catalogs)) {
    raw.length = 0;
    scanRanges(
      store.db,
      ranges,
      {
        catalogId,
        zMin: q.zMin ?? -BIG,
        zMax: q.zMax ?? BIG,
        decLoDeg: q.decDeg - q.radiusDeg - DEC_BAND_PAD_DEG,
        decHiDeg: q.decDeg + q.radiusDeg + DEC_BAND_PAD_DEG,
        linked: store.statements.catalogHasLinks.get(catalogId) === 1,
        ...(hinted
          ? { mass: { minLogMstar: q.minLogMstar ?? -BIG, minLogMhalo: q.minLogMhalo ?? -BIG } }
          : {}),
      },
      raw,
    );
    for (const r of raw) {
      const row = fromScan(r, name);
      rows.push(row);
      if (r[17] !== null) linked.add(row);
    }
  }
  return finish(q, rows, linked);
}

/** The mass hint of coneSearch, written out on a row (for the brute-force reference). */
function passesMassHint(q: ConeQuery, r: GalaxyRow, linked: boolean): boolean {
  if (q.minLogMstar === undefined && q.minLogMhalo === undefined) return true;
  if (r.logMstar === null && r.logMhalo === null) return true;
  if (linked) return true;
  if (r.logMstar !== null && r.logMstar >= (q.minLogMstar ?? -BIG)) return true;
  return r.logMhalo !== null && r.logMhalo >= (q.minLogMhalo ?? -BIG);
}

/**
 * Same answer as coneSearch from a full scan of each catalogue with no index and no SQL filter but
 * the catalogue; the redshift window and the mass hint are applied here, row by row (for tests and
 * cross-checks).
 */
export function coneSearchBruteForce(store: Store, q: ConeQuery): ConeRow[] {
  checkQuery(q);
  const zMin = q.zMin ?? -BIG;
  const zMax = q.zMax ?? BIG;
  const rows: BuildingRow[] = [];
  const linked = new Set<BuildingRow>();
  for (const [catalogId] of catalogsOf(store, q.catalogs)) {
    for (const sql of store.statements.galaxiesOfCatalog.iterate({ catalogId, zMax: BIG })) {
      const r = toGalaxyRow(sql);
      if (r.z < zMin || r.z > zMax || !passesMassHint(q, r as GalaxyRow, sql.physical_key !== null)) continue;
      const row: BuildingRow = { ...r, preferred: true };
      rows.push(row);
      if (sql.physical_key !== null) linked.add(row);
    }
  }
  return finish(q, rows, linked);
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
  if (allowed) catalogsOf(store, catalogs); // unknown names are an error
  const rows: GalaxySqlRow[] = [];
  for (const id of new Set(groupIds)) {
    for (const r of store.statements.haloRowById.all(id))
      if (!allowed || allowed.has(r.catalog)) rows.push(r);
  }
  return markPreferred(rows.map(toGalaxyRow));
}
