import type Database from 'better-sqlite3';
import { GALAXY_COLUMNS, type GalaxySqlRow } from './galaxy-row.js';
import { catalogRows } from './runs.js';

/** A catalogue as stored (snake_case columns of the catalog table). */
export interface CatalogSqlRow {
  catalog_id: number;
  name: string;
  description: string;
  source_file: string;
  source_sha256: string;
  format: 'csv' | 'tsv' | 'fits' | 'votable';
  row_count: number;
  rows_skipped: number;
  loaded_at: string;
  mapping_json: string;
  report_json: string;
}

/** The catalogue (c) and duplicate link (p) of a galaxy row g, for GALAXY_COLUMNS. */
const GALAXY_JOINS = `JOIN catalog c ON c.catalog_id = g.catalog_id
  LEFT JOIN physical_link p ON p.catalog_id = g.catalog_id AND p.object_id = g.object_id`;

/** Every statement the store runs more than once, prepared when the store opens. */
export function prepareStatements(db: Database.Database) {
  const ofCatalog = catalogRows('@catalogId');
  return {
    catalogByName: db.prepare<[string], CatalogSqlRow>('SELECT * FROM catalog WHERE name = ?'),
    catalogs: db.prepare<[], CatalogSqlRow>('SELECT * FROM catalog ORDER BY name'),
    /** 1 when some object of the catalogue is linked to a twin in another catalogue, else 0. */
    catalogHasLinks: db
      .prepare<[number], number>('SELECT EXISTS (SELECT 1 FROM physical_link WHERE catalog_id = ?)')
      .pluck(),
    /** Ids and names only (a cone search needs no JSON reports). */
    catalogNames: db.prepare<[], { catalog_id: number; name: string }>(
      'SELECT catalog_id, name FROM catalog ORDER BY name',
    ),
    /** The catalogue row only: its galaxies go first, with deleteCatalogGalaxies (runs.ts). */
    deleteCatalog: db.prepare<[number]>('DELETE FROM catalog WHERE catalog_id = ?'),
    insertCatalog: db.prepare<
      [string, string, string, string, string, number, number, string, string, string]
    >(`INSERT INTO catalog (name, description, source_file, source_sha256, format, row_count, rows_skipped,
        loaded_at, mapping_json, report_json) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`),
    galaxiesOfCatalog: db.prepare<[{ catalogId: number; zMax: number }], GalaxySqlRow>(
      `SELECT ${GALAXY_COLUMNS} FROM ${ofCatalog.from} ${GALAXY_JOINS}
       WHERE ${ofCatalog.where} AND g.z <= @zMax`,
    ),
    /** Rows that carry a halo mass (group rows), by id: uses the partial index galaxy_halo_row. */
    haloRowById: db.prepare<[string], GalaxySqlRow>(
      `SELECT ${GALAXY_COLUMNS} FROM galaxy g ${GALAXY_JOINS} WHERE g.object_id = ? AND g.log_mhalo IS NOT NULL`,
    ),
    zKindCounts: db.prepare<[{ catalogId: number }], { z_kind: string; n: number; estimated: number }>(
      `SELECT g.z_kind, COUNT(*) AS n, SUM(g.mass_estimated) AS estimated FROM ${ofCatalog.from}
       WHERE ${ofCatalog.where} GROUP BY g.z_kind`,
    ),
    /** Rows stored for a catalogue. */
    galaxyCount: db
      .prepare<[{ catalogId: number }], number>(
        `SELECT COUNT(*) FROM ${ofCatalog.from} WHERE ${ofCatalog.where}`,
      )
      .pluck(),
    matchCount: db.prepare<[number, number], { n: number }>(
      'SELECT COUNT(*) AS n FROM galaxy_match WHERE catalog_a = ? OR catalog_b = ?',
    ),
  };
}

export type Statements = ReturnType<typeof prepareStatements>;
