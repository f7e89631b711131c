import { openStore, readMigrations, type Store } from '../../src/store/index.js';
import type { ServerConfig } from '../config.js';
import { createCatalogService } from './catalogs.js';
import { createSightlineService } from './sightlines.js';
import type { AppServices, StoreService } from './types.js';

function storeService(store: Store, latestVersion: number): StoreService {
  let closed = false;
  return {
    readiness() {
      if (closed || !store.db.open) return { open: false, migrationsApplied: false };
      const version = store.db.pragma('user_version', { simple: true }) as number;
      return { open: true, migrationsApplied: version === latestVersion };
    },
    close() {
      if (!closed) {
        closed = true;
        store.close();
      }
    },
  };
}

/**
 * The real services: opens (creating and migrating if needed) the SQLite store at config.dbPath and
 * wires the catalogue operations and the sightline engine to it.
 */
export async function createServices(config: ServerConfig): Promise<AppServices> {
  const store = openStore(config.dbPath);
  return {
    store: storeService(store, readMigrations().length),
    catalogs: createCatalogService(store, config.dbPath),
    sightlines: createSightlineService(store),
  };
}
