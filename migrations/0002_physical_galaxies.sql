-- forehalo store, migration 2: one physical galaxy seen in several catalogues.
-- galaxy_match holds every cross-catalogue pair closer than the match radius with compatible
-- redshifts; physical_link gives each matched object the key of its physical galaxy (the connected
-- component of the pairs). Both are rebuilt whenever a catalogue is loaded or dropped.

CREATE TABLE galaxy_match (
  catalog_a   INTEGER NOT NULL REFERENCES catalog (catalog_id) ON DELETE CASCADE,
  object_a    TEXT    NOT NULL,
  catalog_b   INTEGER NOT NULL REFERENCES catalog (catalog_id) ON DELETE CASCADE,
  object_b    TEXT    NOT NULL,
  sep_arcsec  REAL    NOT NULL CHECK (sep_arcsec >= 0),
  dz          REAL    NOT NULL,
  PRIMARY KEY (catalog_a, object_a, catalog_b, object_b),
  CHECK (catalog_a < catalog_b)
) WITHOUT ROWID;

CREATE INDEX galaxy_match_b ON galaxy_match (catalog_b, object_b);

CREATE TABLE physical_link (
  catalog_id    INTEGER NOT NULL REFERENCES catalog (catalog_id) ON DELETE CASCADE,
  object_id     TEXT    NOT NULL,
  physical_key  TEXT    NOT NULL,
  PRIMARY KEY (catalog_id, object_id)
) WITHOUT ROWID;

CREATE INDEX physical_link_key ON physical_link (physical_key);
