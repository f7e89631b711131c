import type Database from 'better-sqlite3';
import {
  CODE_COLUMNS,
  MHALO_DEF_CODES,
  NUMBER_COLUMNS,
  type StagedBatch,
  Z_KIND_CODES,
} from './staged-batch.js';

let counter = 0;

/**
 * A private staging table in the connection's temp database (on disk, see openStore). Rows are
 * appended here while the file streams in; the catalogue only becomes visible when one final
 * transaction copies them into galaxy in HEALPix order. A killed process leaves nothing behind:
 * the temp database dies with the connection.
 */
export function createStage(db: Database.Database) {
  counter++;
  const table = `temp.forehalo_stage_${process.pid}_${counter}`;
  db.exec(`CREATE TABLE ${table} (
    hpx INTEGER, object_id TEXT, ra_deg REAL, dec_deg REAL, z REAL, z_err REAL, z_kind TEXT,
    log_mstar REAL, log_mstar_err REAL, mass_estimated INTEGER, g_mag REAL, i_mag REAL,
    log_mhalo REAL, mhalo_def TEXT, log_mhalo_err REAL, group_id TEXT, source_position INTEGER)`);
  const insert = db.prepare(
    `INSERT INTO ${table} VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
  );
  // One transaction per batch; a NaN number binds as NULL (see StagedBatch).
  const insertMany = db.transaction((b: StagedBatch) => {
    const n = b.numbers;
    const c = b.codes;
    for (let i = 0; i < b.length; i++) {
      const o = i * NUMBER_COLUMNS;
      const k = i * CODE_COLUMNS;
      insert.run(
        n[o],
        b.ids[i],
        n[o + 1],
        n[o + 2],
        n[o + 3],
        n[o + 4],
        Z_KIND_CODES[c[k]],
        n[o + 5],
        n[o + 6],
        c[k + 1],
        n[o + 7],
        n[o + 8],
        n[o + 9],
        MHALO_DEF_CODES[c[k + 2]],
        n[o + 10],
        b.groupIds[i],
        n[o + 11],
      );
    }
  });
  return {
    table,
    insertMany,
    /** Objects whose id occurs more than once, with the lines/rows where they occur (first 100). */
    duplicateIds(): { objectId: string; positions: number[] }[] {
      return db
        .prepare<[], { object_id: string; positions: string }>(
          `SELECT object_id, group_concat(source_position) AS positions FROM ${table}
           GROUP BY object_id HAVING COUNT(*) > 1 LIMIT 100`,
        )
        .all()
        .map((r) => ({
          objectId: r.object_id,
          positions: r.positions
            .split(',')
            .map(Number)
            .sort((a, b) => a - b),
        }));
    },
    /** Keep the first occurrence of each id; returns how many rows were removed. */
    dropLaterDuplicates(): number {
      return db
        .prepare(
          `DELETE FROM ${table} WHERE rowid NOT IN (SELECT MIN(rowid) FROM ${table} GROUP BY object_id)`,
        )
        .run().changes;
    },
    count(): number {
      return (db.prepare(`SELECT COUNT(*) AS n FROM ${table}`).get() as { n: number }).n;
    },
    drop(): void {
      db.exec(`DROP TABLE IF EXISTS ${table}`);
    },
  };
}

export type Stage = ReturnType<typeof createStage>;
