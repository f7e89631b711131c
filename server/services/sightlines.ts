import { runSightline } from '../../src/sightline/index.js';
import { coneSearch, type Store } from '../../src/store/index.js';
import type { SightlineService } from './types.js';

/** The sightline engine on the server's store connection (synchronous SQLite reads, WAL snapshots). */
export function createSightlineService(store: Store): SightlineService {
  const deps = { coneSearch: (q: Parameters<typeof coneSearch>[1]) => coneSearch(store, q) };
  return { run: (request) => runSightline(deps, request) };
}
