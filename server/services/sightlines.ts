import { type ParsedSightlineRequest, runParsedSightline } from '../../src/sightline/index.js';
import { coneSearch, type Store } from '../../src/store/index.js';
import type { SightlineService } from './types.js';

/**
 * The sightline engine on the server's store connection (synchronous SQLite reads, WAL snapshots).
 * Routes pass bodies already validated by sightlineRequestSchema, so the engine does not parse them again.
 */
export function createSightlineService(store: Store): SightlineService {
  const deps = { coneSearch: (q: Parameters<typeof coneSearch>[1]) => coneSearch(store, q) };
  return { run: (request) => runParsedSightline(deps, request as ParsedSightlineRequest) };
}
