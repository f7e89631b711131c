import { join } from 'node:path';
import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { applyMigrations, openStore, readMigrations } from '../../src/store/index.js';
import { useTmp } from './tmp.js';

describe('migrations', () => {
  const tmp = useTmp();

  it('are numbered 1, 2, … without gaps', () => {
    const ms = readMigrations();
    expect(ms.map((m) => m.version)).toEqual(ms.map((_, i) => i + 1));
    expect(ms.length).toBeGreaterThanOrEqual(2);
  });

  it('upgrade a database made with only the first migration in place, keeping its rows', () => {
    const path = join(tmp.dir(), 'old.db');
    const old = new Database(path);
    applyMigrations(old, readMigrations().slice(0, 1));
    expect(old.pragma('user_version', { simple: true })).toBe(1);
    old
      .prepare(
        `INSERT INTO catalog (name, source_file, source_sha256, format, row_count, loaded_at, mapping_json, report_json)
         VALUES ('early', 'early.csv', ?, 'csv', 1, '2024-01-01T00:00:00Z', '{}', '{}')`,
      )
      .run('0'.repeat(64));
    old
      .prepare(
        `INSERT INTO galaxy (catalog_id, hpx, object_id, ra_deg, dec_deg, z, z_kind, source_position)
         VALUES (1, 5, 'g1', 10, 20, 0.1, 'spec', 2)`,
      )
      .run();
    old.close();

    const store = openStore(path);
    try {
      expect(store.db.pragma('user_version', { simple: true })).toBe(readMigrations().length);
      const tables = store.db
        .prepare("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name")
        .all()
        .map((r) => (r as { name: string }).name);
      expect(tables).toEqual(expect.arrayContaining(['catalog', 'galaxy', 'galaxy_match', 'physical_link']));
      expect(store.db.prepare('SELECT object_id FROM galaxy').all()).toEqual([{ object_id: 'g1' }]);
      expect(store.db.pragma('journal_mode', { simple: true })).toBe('wal');
      expect(store.db.pragma('foreign_keys', { simple: true })).toBe(1);
    } finally {
      store.close();
    }
  });

  it('run again on an up-to-date database change nothing', () => {
    const path = join(tmp.dir(), 'a.db');
    openStore(path).close();
    const db = new Database(path);
    expect(applyMigrations(db)).toEqual([]);
    db.close();
  });

  it('refuse a database whose schema is newer than this program', () => {
    const path = join(tmp.dir(), 'future.db');
    const db = new Database(path);
    db.pragma('user_version = 99');
    db.close();
    expect(() => openStore(path)).toThrow(/newer than this forehalo/);
  });

  it('roll back completely when one migration fails', () => {
    const db = new Database(':memory:');
    const broken = [
      ...readMigrations().slice(0, 1),
      { version: 2, name: 'broken', sql: 'CREATE TABLE x (a); SELECT * FROM nowhere;' },
    ];
    expect(() => applyMigrations(db, broken)).toThrow();
    expect(db.pragma('user_version', { simple: true })).toBe(0);
    expect(db.prepare("SELECT COUNT(*) AS n FROM sqlite_master WHERE type = 'table'").get()).toEqual({
      n: 0,
    });
  });
});
