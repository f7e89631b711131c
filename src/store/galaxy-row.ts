import type { CatalogRow } from '../sightline/types.js';

/**
 * One stored galaxy: the fields the sightline engine reads (CatalogRow, degrees ICRS, log10 solar
 * masses; the store fills every optional one) plus what only the store knows.
 */
export interface GalaxyRow extends CatalogRow {
  /** True when logMstar was estimated from g − i colour (Taylor et al. 2011) at load time. */
  readonly massEstimated: boolean;
  readonly gMag: number | null;
  readonly iMag: number | null;
  readonly logMhalo: number | null;
  readonly mhaloDef: '200c' | '200m' | 'vir' | null;
  readonly logMhaloErr: number | null;
  /** object_id of the row that stands for this galaxy's group halo (may be in another catalogue). */
  readonly groupId: string | null;
  /** HEALPix nested index at STORAGE_ORDER. */
  readonly hpx: number;
  /** Line (CSV/TSV) or row (FITS/VOTable) in the source file. */
  readonly sourcePosition: number;
  /**
   * Duplicate-link key: rows that share it are one physical galaxy seen in several catalogues.
   * Unlinked rows carry their own 'catalog/objectId'.
   */
  readonly physicalKey: string;
  /**
   * In a query answer, true for exactly one row per physicalKey: the spectroscopic one if any, then
   * the smallest zErr, then the first catalogue by name. Count only preferred rows to count each
   * halo once.
   */
  readonly preferred: boolean;
}

/** Columns selected for a GalaxyRow (g = galaxy, c = catalog, p = physical_link). */
export const GALAXY_COLUMNS = `c.name AS catalog, g.object_id, g.ra_deg, g.dec_deg, g.z, g.z_err, g.z_kind,
  g.log_mstar, g.log_mstar_err, g.mass_estimated, g.g_mag, g.i_mag, g.log_mhalo, g.mhalo_def,
  g.log_mhalo_err, g.group_id, g.hpx, g.source_position, p.physical_key`;

export interface GalaxySqlRow {
  catalog: string;
  object_id: string;
  ra_deg: number;
  dec_deg: number;
  z: number;
  z_err: number | null;
  z_kind: 'spec' | 'photo';
  log_mstar: number | null;
  log_mstar_err: number | null;
  mass_estimated: number;
  g_mag: number | null;
  i_mag: number | null;
  log_mhalo: number | null;
  mhalo_def: '200c' | '200m' | 'vir' | null;
  log_mhalo_err: number | null;
  group_id: string | null;
  hpx: number;
  source_position: number;
  physical_key: string | null;
}

export function toGalaxyRow(r: GalaxySqlRow): Omit<GalaxyRow, 'preferred'> {
  return {
    catalog: r.catalog,
    objectId: r.object_id,
    raDeg: r.ra_deg,
    decDeg: r.dec_deg,
    z: r.z,
    zErr: r.z_err,
    zKind: r.z_kind,
    logMstar: r.log_mstar,
    logMstarErr: r.log_mstar_err,
    massEstimated: r.mass_estimated === 1,
    gMag: r.g_mag,
    iMag: r.i_mag,
    logMhalo: r.log_mhalo,
    mhaloDef: r.mhalo_def,
    logMhaloErr: r.log_mhalo_err,
    groupId: r.group_id,
    hpx: r.hpx,
    sourcePosition: r.source_position,
    physicalKey: r.physical_key ?? `${r.catalog}/${r.object_id}`,
  };
}

/**
 * Galaxy columns of the lean cone scan, in this order (no join with catalog: its name is added in
 * code); the scan appends the physical key as an 18th column. fromScan reads such a raw row.
 */
export const SCAN_GALAXY_COLUMNS = `g.object_id, g.ra_deg, g.dec_deg, g.z, g.z_err, g.z_kind, g.log_mstar, g.log_mstar_err,
  g.mass_estimated, g.g_mag, g.i_mag, g.log_mhalo, g.mhalo_def, g.log_mhalo_err, g.group_id, g.hpx,
  g.source_position`;

/** A mutable GalaxyRow while a query answer is being built (preferred is set last). */
export type BuildingRow = { -readonly [K in keyof GalaxyRow]: GalaxyRow[K] };

/** One raw scan row (SCAN_GALAXY_COLUMNS, physical key) of catalogue `catalog` as a row object (preferred: true until marked). */
export function fromScan(r: unknown[], catalog: string): BuildingRow {
  const objectId = r[0] as string;
  const key = r[17] as string | null;
  return {
    catalog,
    objectId,
    raDeg: r[1] as number,
    decDeg: r[2] as number,
    z: r[3] as number,
    zErr: r[4] as number | null,
    zKind: r[5] as GalaxyRow['zKind'],
    logMstar: r[6] as number | null,
    logMstarErr: r[7] as number | null,
    massEstimated: r[8] === 1,
    gMag: r[9] as number | null,
    iMag: r[10] as number | null,
    logMhalo: r[11] as number | null,
    mhaloDef: r[12] as GalaxyRow['mhaloDef'],
    logMhaloErr: r[13] as number | null,
    groupId: r[14] as string | null,
    hpx: r[15] as number,
    sourcePosition: r[16] as number,
    physicalKey: key ?? `${catalog}/${objectId}`,
    preferred: true,
  };
}

/**
 * Set preferred in place: one row per physical galaxy (same rule and tie order as markPreferred).
 * Pass only the rows that carry a physical_link key: an unlinked row's key 'catalogue/object' is
 * its own (catalogue names hold no '/'), so it stays preferred.
 */
export function markPreferredInPlace(linked: readonly BuildingRow[]): void {
  if (linked.length === 0) return;
  const best = new Map<string, BuildingRow>();
  for (const r of linked) {
    const cur = best.get(r.physicalKey);
    if (!cur || better(r, cur)) best.set(r.physicalKey, r);
  }
  for (const r of linked) r.preferred = best.get(r.physicalKey) === r;
}

function better(a: Omit<GalaxyRow, 'preferred'>, b: Omit<GalaxyRow, 'preferred'>): boolean {
  if (a.zKind !== b.zKind) return a.zKind === 'spec';
  const ea = a.zErr ?? Number.POSITIVE_INFINITY;
  const eb = b.zErr ?? Number.POSITIVE_INFINITY;
  if (ea !== eb) return ea < eb;
  return a.catalog < b.catalog;
}

/** Mark one preferred row per physical galaxy among the given rows (spec first, then smaller zErr). */
export function markPreferred(rows: readonly Omit<GalaxyRow, 'preferred'>[]): GalaxyRow[] {
  const best = new Map<string, Omit<GalaxyRow, 'preferred'>>();
  for (const r of rows) {
    const cur = best.get(r.physicalKey);
    if (!cur || better(r, cur)) best.set(r.physicalKey, r);
  }
  return rows.map((r) => ({ ...r, preferred: best.get(r.physicalKey) === r }));
}
