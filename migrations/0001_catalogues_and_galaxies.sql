-- forehalo store, migration 1: catalogues and their galaxies.
-- Applied by src/store/migrate.ts inside one transaction; the version goes to PRAGMA user_version.

CREATE TABLE catalog (
  catalog_id     INTEGER PRIMARY KEY,
  name           TEXT    NOT NULL UNIQUE,
  description    TEXT    NOT NULL DEFAULT '',
  source_file    TEXT    NOT NULL,
  source_sha256  TEXT    NOT NULL CHECK (length(source_sha256) = 64),
  format         TEXT    NOT NULL CHECK (format IN ('csv', 'tsv', 'fits', 'votable')),
  row_count      INTEGER NOT NULL CHECK (row_count >= 0),
  rows_skipped   INTEGER NOT NULL DEFAULT 0 CHECK (rows_skipped >= 0),
  loaded_at      TEXT    NOT NULL,            -- ISO 8601 UTC
  mapping_json   TEXT    NOT NULL,            -- column mapping and unit choices used for the load
  report_json    TEXT    NOT NULL             -- stored row report: problems, skipped rows, warnings
);

-- One row per catalogued object. Rows are clustered by (catalog_id, hpx, object_id): a WITHOUT ROWID
-- table is stored in primary-key order, so a cone search is a handful of contiguous range scans.
-- hpx is the HEALPix nested index at the storage order fixed in src/store/storage-order.ts.
CREATE TABLE galaxy (
  catalog_id      INTEGER NOT NULL REFERENCES catalog (catalog_id) ON DELETE CASCADE,
  hpx             INTEGER NOT NULL,
  object_id       TEXT    NOT NULL,
  ra_deg          REAL    NOT NULL CHECK (ra_deg >= 0 AND ra_deg < 360),    -- ICRS
  dec_deg         REAL    NOT NULL CHECK (dec_deg >= -90 AND dec_deg <= 90), -- ICRS
  z               REAL    NOT NULL CHECK (z >= 0),
  z_err           REAL             CHECK (z_err >= 0),
  z_kind          TEXT    NOT NULL CHECK (z_kind IN ('spec', 'photo')),
  log_mstar       REAL,                        -- log10(M*/M_sun)
  log_mstar_err   REAL             CHECK (log_mstar_err >= 0),
  mass_estimated  INTEGER NOT NULL DEFAULT 0 CHECK (mass_estimated IN (0, 1)),
  g_mag           REAL,                        -- apparent AB
  i_mag           REAL,                        -- apparent AB
  log_mhalo       REAL,                        -- log10(M_halo/M_sun) when the catalogue gives one
  mhalo_def       TEXT             CHECK (mhalo_def IN ('200c', '200m', 'vir')),
  log_mhalo_err   REAL             CHECK (log_mhalo_err >= 0),
  group_id        TEXT,                        -- object_id of the group's own row (its one halo)
  source_position INTEGER NOT NULL,            -- line (CSV/TSV) or row (FITS/VOTable) in the source
  PRIMARY KEY (catalog_id, hpx, object_id)
) WITHOUT ROWID;

CREATE UNIQUE INDEX galaxy_object ON galaxy (catalog_id, object_id);
