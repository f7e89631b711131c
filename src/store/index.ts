/**
 * The catalogue store: SQLite with numbered migrations, catalogue files in (CSV/TSV here; FITS and
 * VOTable readers beside them), galaxies out by HEALPix cone search. The only code that speaks SQL
 * or reads files.
 */
export { type CatalogDetail, type CatalogInfo, dropCatalog, getCatalog, listCatalogs } from './catalogs.js';
export { type ConeQuery, type ConeRow, coneSearch, coneSearchBruteForce, groupHaloRows } from './cone.js';
export { matchCatalog, rebuildPhysicalLinks, redshiftsCompatible } from './duplicates.js';
export type { GalaxyRow } from './galaxy-row.js';
export { estimateRowCount } from './ingest/estimate-rows.js';
export { FIELDS, type Field } from './ingest/fields.js';
export {
  checkCatalogName,
  type LoadMode,
  type LoadOptions,
  type LoadReport,
  type LoadSummary,
  loadCatalog,
} from './ingest/load.js';
export { parseMapSpec } from './ingest/mapping.js';
export { ProblemLog, type RowProblem } from './ingest/problems.js';
export type { IngestDefaults, MhaloDef, ZKind } from './ingest/row-converter.js';
export {
  absoluteMagnitude,
  ESTIMATED_LOG_MSTAR_ERR_FLOOR,
  logMstarTaylor2011,
  TAYLOR2011,
} from './ingest/taylor2011.js';
export { applyMigrations, readMigrations } from './migrate.js';
export { DEFAULT_MATCH, type MatchOptions, type OpenStoreOptions, openStore, type Store } from './open.js';
export { openDelimited } from './readers/csv.js';
export { STORAGE_ORDER } from './storage-order.js';
