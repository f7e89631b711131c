-- forehalo store, migration 3: drop the unique (catalog_id, object_id) index.
-- Maintaining it in random order was ~40 % of the cost of a large load (bench/load.ts). Id uniqueness
-- is now checked on the staged rows before the commit (src/store/ingest/stage.ts), and an append
-- merges by id with one scan of that catalogue. Group rows (those carrying a halo mass) keep a small
-- partial index so members can find their group's halo by id quickly.

DROP INDEX galaxy_object;

CREATE INDEX galaxy_halo_row ON galaxy (object_id, catalog_id) WHERE log_mhalo IS NOT NULL;
