import { NotFoundError } from '../errors.js';
import { rebuildPhysicalLinks } from './duplicates.js';
import type { Store } from './open.js';
import { deleteCatalogGalaxies } from './runs.js';
import type { CatalogSqlRow } from './statements.js';

/** A stored catalogue as the CLI and the HTTP layer show it. */
export interface CatalogInfo {
  name: string;
  description: string;
  sourceFile: string;
  sha256: string;
  format: 'csv' | 'tsv' | 'fits' | 'votable';
  rows: number;
  rowsSkipped: number;
  loadedAt: string;
  mapping: Record<string, unknown>;
  report: Record<string, unknown>;
}

export interface CatalogDetail extends CatalogInfo {
  spectroscopic: number;
  photometric: number;
  massesEstimated: number;
  /** Pairs linking this catalogue's objects to objects in other catalogues. */
  duplicatePairs: number;
}

function toInfo(r: CatalogSqlRow): CatalogInfo {
  return {
    name: r.name,
    description: r.description,
    sourceFile: r.source_file,
    sha256: r.source_sha256,
    format: r.format,
    rows: r.row_count,
    rowsSkipped: r.rows_skipped,
    loadedAt: r.loaded_at,
    mapping: JSON.parse(r.mapping_json),
    report: JSON.parse(r.report_json),
  };
}

export function listCatalogs(store: Store): CatalogInfo[] {
  return store.statements.catalogs.all().map(toInfo);
}

function mustGet(store: Store, name: string): CatalogSqlRow {
  const row = store.statements.catalogByName.get(name);
  if (!row) throw new NotFoundError('catalog_not_found', `no catalogue named '${name}'`, { name });
  return row;
}

export function getCatalog(store: Store, name: string): CatalogDetail {
  const row = mustGet(store, name);
  const kinds = store.statements.zKindCounts.all({ catalogId: row.catalog_id });
  const count = (k: string) => kinds.find((x) => x.z_kind === k)?.n ?? 0;
  return {
    ...toInfo(row),
    spectroscopic: count('spec'),
    photometric: count('photo'),
    massesEstimated: kinds.reduce((s, k) => s + (k.estimated ?? 0), 0),
    duplicatePairs: store.statements.matchCount.get(row.catalog_id, row.catalog_id)!.n,
  };
}

/** Remove a catalogue, its galaxies and its duplicate pairs in one transaction; relink the rest. */
export function dropCatalog(store: Store, name: string): { name: string; rows: number } {
  return store.db
    .transaction(() => {
      const row = mustGet(store, name);
      deleteCatalogGalaxies(store.db, row.catalog_id);
      store.statements.deleteCatalog.run(row.catalog_id);
      rebuildPhysicalLinks(store);
      return { name, rows: row.row_count };
    })
    .immediate();
}
