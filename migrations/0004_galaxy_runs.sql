-- forehalo store, migration 4: galaxies keyed by run and HEALPix pixel, written once per row.
--
-- A load used to stage every row in a temp table and copy it into galaxy in HEALPix order at the
-- end: two writes per row, plus a sort. Now the parsing thread sorts each part of the file (a "run",
-- at most 2^18 rows) by HEALPix index and the loading thread appends it with keys that grow:
--
--   gkey = run · 2^48 + hpx · 2^18 + seq      (seq: the row's place in its sorted run, < 2^18)
--
-- so every insert lands at the right-hand end of the key range of its run: one write per row, in
-- SQLite's fast rowid-append path. A cone search scans, per run of a catalogue, the few key ranges
-- of its HEALPix pixel ranges (hpx at STORAGE_ORDER = 13 needs 30 bits: 12·4^13 < 2^30).
-- galaxy_run says which catalogue owns each run; run numbers are reused once free (< 2^15).
-- hpx and run are computed from gkey (virtual columns: no storage, no write cost).
-- Range checks on the values are made by the row checker before any write (src/store/ingest/
-- row-converter.ts, tested); the table keeps NOT NULL only. Galaxy rows are deleted with their
-- catalogue by the store (src/store/runs.ts), by key range, not through a foreign key: a cascade
-- would need a second index on catalog_id, maintained on every insert.

CREATE TABLE galaxy_run (
  run         INTEGER PRIMARY KEY CHECK (run >= 0 AND run < 32768),
  catalog_id  INTEGER NOT NULL REFERENCES catalog (catalog_id) ON DELETE CASCADE
);

CREATE INDEX galaxy_run_catalog ON galaxy_run (catalog_id, run);

CREATE TABLE galaxy_keyed (
  gkey            INTEGER PRIMARY KEY,         -- run · 2^48 + hpx · 2^18 + seq (see above)
  catalog_id      INTEGER NOT NULL,            -- the owner of the run (kept for joins)
  object_id       TEXT    NOT NULL,
  ra_deg          REAL    NOT NULL,            -- ICRS, [0, 360)
  dec_deg         REAL    NOT NULL,            -- ICRS, [-90, 90]
  z               REAL    NOT NULL,            -- ≥ 0
  z_err           REAL,                        -- ≥ 0
  z_kind          TEXT    NOT NULL,            -- 'spec' or 'photo'
  log_mstar       REAL,                        -- log10(M*/M_sun)
  log_mstar_err   REAL,
  mass_estimated  INTEGER NOT NULL DEFAULT 0,  -- 1 when log_mstar was estimated from g − i
  g_mag           REAL,                        -- apparent AB
  i_mag           REAL,                        -- apparent AB
  log_mhalo       REAL,                        -- log10(M_halo/M_sun) when the catalogue gives one
  mhalo_def       TEXT,                        -- '200c', '200m' or 'vir'
  log_mhalo_err   REAL,
  group_id        TEXT,                        -- object_id of the group's own row (its one halo)
  source_position INTEGER NOT NULL,            -- line (CSV/TSV) or row (FITS/VOTable) in the source
  hpx             INTEGER GENERATED ALWAYS AS ((gkey >> 18) & 1073741823) VIRTUAL,
  run             INTEGER GENERATED ALWAYS AS (gkey >> 48) VIRTUAL
);

-- Rows of earlier versions: each catalogue's rows in HEALPix order, numbered k = 0, 1, …; every
-- 2^18 of them form one run.
INSERT INTO galaxy_keyed (gkey, catalog_id, object_id, ra_deg, dec_deg, z, z_err, z_kind, log_mstar,
    log_mstar_err, mass_estimated, g_mag, i_mag, log_mhalo, mhalo_def, log_mhalo_err, group_id,
    source_position)
  SELECT ((dense_rank() OVER (ORDER BY catalog_id, k >> 18) - 1) << 48) | (hpx << 18) | (k & 262143),
         catalog_id, object_id, ra_deg, dec_deg, z, z_err, z_kind, log_mstar, log_mstar_err,
         mass_estimated, g_mag, i_mag, log_mhalo, mhalo_def, log_mhalo_err, group_id, source_position
  FROM (SELECT *, row_number() OVER (PARTITION BY catalog_id ORDER BY hpx, object_id) - 1 AS k FROM galaxy);

INSERT INTO galaxy_run (run, catalog_id) SELECT DISTINCT gkey >> 48, catalog_id FROM galaxy_keyed;

DROP TABLE galaxy;
ALTER TABLE galaxy_keyed RENAME TO galaxy;

CREATE INDEX galaxy_halo_row ON galaxy (object_id, catalog_id) WHERE log_mhalo IS NOT NULL;
