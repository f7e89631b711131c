-- forehalo store, migration 4: a catalogue is stored as one or more parts, each in HEALPix order.
-- A load used to stage every row in a temp table and copy it into galaxy in HEALPix order at the end:
-- two writes per row. Now the parsing thread sorts each part of the file (by hpx, then object_id)
-- and the loading thread appends it under its own part number, so the primary key
-- (catalog_id, part, hpx, object_id) grows at its right-hand end: one write per row, still clustered.
-- A cone search does its few HEALPix range scans once per part (catalog.part_count parts).
-- Rows of earlier versions become part 0 of their catalogue.

CREATE TABLE galaxy_parted (
  catalog_id      INTEGER NOT NULL REFERENCES catalog (catalog_id) ON DELETE CASCADE,
  part            INTEGER NOT NULL CHECK (part >= 0),
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
  PRIMARY KEY (catalog_id, part, hpx, object_id)
) WITHOUT ROWID;

INSERT INTO galaxy_parted
  SELECT catalog_id, 0, hpx, object_id, ra_deg, dec_deg, z, z_err, z_kind, log_mstar, log_mstar_err,
         mass_estimated, g_mag, i_mag, log_mhalo, mhalo_def, log_mhalo_err, group_id, source_position
  FROM galaxy;

DROP TABLE galaxy;
ALTER TABLE galaxy_parted RENAME TO galaxy;

CREATE INDEX galaxy_halo_row ON galaxy (object_id, catalog_id) WHERE log_mhalo IS NOT NULL;

-- Number of parts of each catalogue (parts are numbered 0 … part_count − 1; some may be empty).
ALTER TABLE catalog ADD COLUMN part_count INTEGER NOT NULL DEFAULT 1 CHECK (part_count >= 0);
