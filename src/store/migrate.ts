import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type Database from 'better-sqlite3';

/** A numbered SQL migration: migrations/NNNN_name.sql. */
export interface Migration {
  readonly version: number;
  readonly name: string;
  readonly sql: string;
}

const FILE_PATTERN = /^(\d{4})_([a-z0-9_]+)\.sql$/;

/** The migrations folder: the repository's migrations/ from src/ (tsx) and from dist/src/ (built). */
export function migrationsDir(): string {
  const candidates = ['../../migrations/', '../../../migrations/'].map((rel) =>
    fileURLToPath(new URL(rel, import.meta.url)),
  );
  const found = candidates.find((dir) => existsSync(`${dir}0001_catalogues_and_galaxies.sql`));
  if (!found) throw new Error(`forehalo migrations folder not found (looked in ${candidates.join(', ')})`);
  return found;
}

/** Read migrations in version order; versions must be 1, 2, 3, … without gaps. */
export function readMigrations(dir = migrationsDir()): Migration[] {
  const migrations = readdirSync(dir)
    .map((file) => FILE_PATTERN.exec(file))
    .filter((m): m is RegExpExecArray => m !== null)
    .map((m) => ({ version: Number(m[1]), name: m[2], sql: readFileSync(`${dir}${m[0]}`, 'utf8') }))
    .sort((a, b) => a.version - b.version);
  migrations.forEach((m, i) => {
    if (m.version !== i + 1)
      throw new Error(`migration ${m.version}_${m.name} breaks the sequence 1, 2, 3, …`);
  });
  return migrations;
}

/**
 * Bring the database to the newest version: every pending migration runs in ONE synchronous
 * transaction together with the PRAGMA user_version update, so a crash leaves the old version.
 * Returns the versions applied. A database newer than this program is refused.
 */
export function applyMigrations(db: Database.Database, migrations: readonly Migration[] = readMigrations()) {
  const current = db.pragma('user_version', { simple: true }) as number;
  const latest = migrations.length;
  if (current > latest) {
    throw new Error(
      `database schema version ${current} is newer than this forehalo (knows ${latest}); upgrade forehalo`,
    );
  }
  const pending = migrations.filter((m) => m.version > current);
  if (pending.length === 0) return [];
  db.transaction(() => {
    for (const m of pending) db.exec(m.sql);
    db.pragma(`user_version = ${latest}`);
  }).immediate();
  return pending.map((m) => m.version);
}
