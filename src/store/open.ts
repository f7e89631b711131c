import Database from 'better-sqlite3';
import { InputError } from '../errors.js';
import { applyMigrations, readMigrations } from './migrate.js';
import { prepareStatements, type Statements } from './statements.js';

/** How objects in different catalogues are recognised as one physical galaxy. */
export interface MatchOptions {
  /** Largest separation of a duplicate pair [arcsec]; default 1.0. */
  readonly radiusArcsec: number;
  /** Redshifts agree when |Δz| ≤ k·√(σ₁² + σ₂²); default k = 3. */
  readonly k: number;
  /** Two spectroscopic redshifts agree when |Δz| ≤ specDz·(1 + z); default 0.001 (≈ 300 km s⁻¹). */
  readonly specDz: number;
}

export const DEFAULT_MATCH: MatchOptions = Object.freeze({ radiusArcsec: 1.0, k: 3, specDz: 0.001 });

export interface Store {
  readonly db: Database.Database;
  readonly path: string;
  readonly match: MatchOptions;
  readonly statements: Statements;
  close(): void;
}

export interface OpenStoreOptions {
  match?: Partial<MatchOptions>;
  readonly?: boolean;
}

/**
 * Open (creating if needed) a forehalo database: WAL journal, foreign keys on, a busy timeout so a
 * second process waits instead of failing, pending migrations applied, statements prepared once.
 */
export function openStore(path: string, options: OpenStoreOptions = {}): Store {
  const match = { ...DEFAULT_MATCH, ...options.match };
  if (!(match.radiusArcsec > 0 && match.radiusArcsec <= 60)) {
    throw new InputError(
      'bad_match_radius',
      `match radius must be in (0, 60] arcsec, got ${match.radiusArcsec}`,
    );
  }
  if (!(match.k > 0) || !(match.specDz >= 0)) {
    throw new InputError('bad_match_tolerance', 'match k must be > 0 and specDz ≥ 0');
  }
  let db: Database.Database;
  try {
    db = new Database(path, {
      readonly: options.readonly ?? false,
      fileMustExist: options.readonly ?? false,
    });
  } catch (err) {
    throw new InputError('bad_database', `cannot open database ${path}: ${(err as Error).message}`);
  }
  try {
    db.pragma('busy_timeout = 10000');
    if (!options.readonly) {
      // A new database gets 16 KiB pages (SQLite's default is 4 KiB): a load appends ~100-byte rows
      // in key order, and fewer, larger pages cut its B-tree work (bench/load.ts). The size can only
      // be chosen before the first table exists; an existing database keeps its own.
      if (db.pragma('page_count', { simple: true }) === 0) db.pragma('page_size = 16384');
      db.pragma('journal_mode = WAL');
      db.pragma('synchronous = NORMAL');
      // The sorter of a large load's merge (runs.ts mergeRuns) and of duplicate-id GROUP BYs spills
      // to temporary files, not memory, so memory stays flat however large the load.
      db.pragma('temp_store = FILE');
      // 32 MiB page caches (they also bound the sorter's memory before it spills).
      db.pragma('cache_size = -32768');
      db.pragma('temp.cache_size = -32768');
      // Let SQLite's sorter use a helper thread for that merge and those GROUP BYs.
      db.pragma('threads = 2');
      applyMigrations(db, readMigrations());
    }
    db.pragma('foreign_keys = ON');
    const statements = prepareStatements(db);
    return Object.freeze({ db, path, match: Object.freeze(match), statements, close: () => db.close() });
  } catch (err) {
    db.close();
    throw err;
  }
}
