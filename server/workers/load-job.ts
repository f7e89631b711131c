import type { LoadMode } from '../services/types.js';

/** What the load worker receives (structured-cloned). Paths are server-side and never sent to clients. */
export interface LoadJob {
  dbPath: string;
  filePath: string;
  fileName: string;
  name: string;
  format?: 'csv' | 'tsv' | 'fits' | 'votable';
  map?: Record<string, string>;
  skipInvalid: boolean;
  mode: LoadMode;
}
