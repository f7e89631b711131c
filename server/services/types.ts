import type { Readable } from 'node:stream';

/**
 * What the HTTP layer needs from the rest of forehalo. The real implementations (services/index.ts)
 * wrap src/store and src/sightline; tests may pass their own. Routes only ever talk to these.
 */

export interface Readiness {
  open: boolean;
  migrationsApplied: boolean;
}

export interface StoreService {
  readiness(): Readiness;
  /** Close the database cleanly (after in-flight requests finished). */
  close(): Promise<void> | void;
}

export type LoadMode = 'create' | 'replace' | 'append';

export interface LoadRequest {
  name: string;
  body: Readable;
  format?: string;
  /** Original file name, recorded with the catalogue (never a server path). */
  fileName?: string;
  map?: Record<string, string>;
  skipInvalid: boolean;
  mode: LoadMode;
  /** Largest accepted body in bytes; the load fails cleanly (nothing written) beyond it. */
  limitBytes: number;
}

export interface CatalogService {
  list(): Promise<unknown[]> | unknown[];
  show(name: string): Promise<unknown> | unknown;
  drop(name: string): Promise<unknown> | unknown;
  load(request: LoadRequest): Promise<unknown>;
}

export interface SightlineService {
  /** Runs one sightline request (already validated against the request schema). */
  run(request: unknown): Promise<unknown> | unknown;
}

export interface AppServices {
  store: StoreService;
  catalogs: CatalogService;
  sightlines: SightlineService;
}
