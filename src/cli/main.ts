#!/usr/bin/env node
import { existsSync, readFileSync, realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Command, CommanderError } from 'commander';
import { register as registerBudget } from './commands/budget.js';
import { register as registerCatalog } from './commands/catalog.js';
import { register as registerDemo } from './commands/demo.js';
import { register as registerServe } from './commands/serve.js';
import { register as registerSightline } from './commands/sightline.js';
import { DEFAULT_DB } from './globals.js';
import { EXIT_BAD_INPUT, EXIT_OK, reportError } from './report-error.js';

/**
 * forehalo's command line. Each command lives in src/cli/commands/<name>.ts and exports
 * register(program); add one import and one entry in COMMANDS to add a command.
 */
const COMMANDS: ((program: Command) => void)[] = [
  registerCatalog,
  registerServe,
  registerBudget,
  registerDemo,
  registerSightline,
];

function version(): string {
  for (const rel of ['../../package.json', '../../../package.json']) {
    const path = fileURLToPath(new URL(rel, import.meta.url));
    if (existsSync(path)) return (JSON.parse(readFileSync(path, 'utf8')) as { version: string }).version;
  }
  return 'unknown';
}

export function buildProgram(): Command {
  const program = new Command('forehalo')
    .description('foreground-halo dispersion measure for fast radio burst sightlines')
    .version(version(), '--version', 'print the forehalo version')
    .option('--db <path>', `SQLite store (env FOREHALO_DB; default ${DEFAULT_DB})`)
    .showHelpAfterError('(add --help for usage)')
    .exitOverride();
  for (const register of COMMANDS) register(program);
  return program;
}

export async function main(argv: readonly string[]): Promise<number> {
  try {
    await buildProgram().parseAsync(argv as string[]);
    return EXIT_OK;
  } catch (err) {
    if (err instanceof CommanderError) {
      // help and version end with exitCode 0; argument errors were already printed by commander.
      return err.exitCode === 0 ? EXIT_OK : EXIT_BAD_INPUT;
    }
    return reportError(err);
  }
}

// Run when executed as a script (npx tsx src/cli/main.ts); bin/forehalo.js imports main() instead.
const script = process.argv[1] ? realpathSync(process.argv[1]) : '';
if (script === realpathSync(fileURLToPath(import.meta.url))) {
  main(process.argv).then((code) => {
    process.exitCode = code;
  });
}
