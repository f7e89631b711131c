import type { Command } from 'commander';

/** Default database file when neither --db nor FOREHALO_DB is given. */
export const DEFAULT_DB = './forehalo.db';

/** The store path every command uses: --db, else the FOREHALO_DB environment variable, else ./forehalo.db. */
export function dbPath(command: Command): string {
  const { db } = command.optsWithGlobals() as { db?: string };
  return db || process.env.FOREHALO_DB || DEFAULT_DB;
}
