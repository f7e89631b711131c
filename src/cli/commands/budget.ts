import type { Command } from 'commander';
import { budgetBodyJson, computeBudget, type SightlineRunner } from '../../budget-request/index.js';
import { InputError } from '../../errors.js';
import { type BudgetFlags, budgetRequestFromFlags, flagForKey } from '../budget-args.js';
import { budgetTable } from '../budget-table.js';
import { dbPath } from '../globals.js';

/** Request-key issues restated with the flags that set them. */
function describeForCli(err: InputError): string {
  const issues = err.code === 'bad_request' && Array.isArray(err.details) ? err.details : [];
  if (issues.length === 0) return err.message;
  return issues
    .map((i: { key: string; message: string }) => {
      const flag = flagForKey(i.key);
      return flag === i.key ? `${i.key}: ${i.message}` : `${flag} (${i.key}): ${i.message}`;
    })
    .join('\n  ');
}

const collect = (value: string, previous: string[] | undefined) => [...(previous ?? []), value];

/** The store-backed sightline runner, opened only when the request names a sightline. */
async function storeSightlineRunner(dbPath: string): Promise<{ run: SightlineRunner; close(): void }> {
  const { existsSync } = await import('node:fs');
  if (!existsSync(dbPath)) {
    throw new InputError(
      'bad_database',
      `--db: no catalogue store at ${dbPath}; load catalogues first or name the store with --db`,
    );
  }
  const { coneSearch, openStore } = await import('../../store/index.js');
  const { runSightline } = await import('../../sightline/index.js');
  const store = openStore(dbPath, { readonly: true });
  return {
    run: (request) => runSightline({ coneSearch: (q) => coneSearch(store, q) }, request),
    close: () => store.close(),
  };
}

/**
 * `forehalo budget --dm-obs DM --dm-ism DM [--z ZS] …` — the burst's DM budget, computed by the same
 * function as POST /v1/budgets; `--json` prints exactly that route's reply body. With --ra/--dec the
 * foreground-halo term comes from a sightline run on the store named by the global --db.
 */
export function register(program: Command): void {
  program
    .command('budget')
    .description('DM budget of a burst: Milky Way, cosmic, foreground haloes and the host posterior')
    .option('--dm-obs <DM>', 'observed DM [pc cm⁻³] (required)')
    .option('--dm-obs-err <DM>', '1σ error of the observed DM [pc cm⁻³] (default 0)')
    .option(
      '--dm-ism <DM>',
      'Milky Way ISM DM from your Galactic electron-density model [pc cm⁻³] (required)',
    )
    .option('--dm-ism-err <DM>', '1σ error of the ISM DM [pc cm⁻³] (default 0, with a warning)')
    .option('--dm-mw-halo <DM>', 'Milky Way halo DM [pc cm⁻³] (default: the budget model prior)')
    .option('--dm-mw-halo-err <DM>', '1σ error of the Milky Way halo DM [pc cm⁻³]')
    .option('--z <ZS>', 'burst redshift; omit for the redshift limit and the z_s posterior')
    .option('--z-err <ERR>', '1σ error of the burst redshift (enters the sightline only)')
    .option('--ra <DEG>', 'burst RA [deg]: take the foreground-halo term from this sightline')
    .option('--dec <DEG>', 'burst Dec [deg]')
    .option('--catalog <NAME>', 'catalogue to search (repeat for several; default all)', collect)
    .option('--host-id <ID>', 'catalogue id of the host galaxy (never foreground)')
    .option('--model <FILE.json>', 'sightline model keys as a JSON object')
    .option('--budget-model <FILE.json>', 'budget model keys as a JSON object')
    .option('--draws <N>', 'Monte Carlo draws (budget; sightline too unless --model sets them)')
    .option('--seed <S>', 'random seed (budget; sightline too unless --model sets it)')
    .option('--json', 'print the JSON body POST /v1/budgets would reply with')
    .action(async (flags: BudgetFlags, command: Command) => {
      try {
        const request = budgetRequestFromFlags(flags);
        let runner: Awaited<ReturnType<typeof storeSightlineRunner>> | undefined;
        const runSightline: SightlineRunner = async (r) => {
          runner ??= await storeSightlineRunner(dbPath(command));
          return runner.run(r);
        };
        try {
          const body = await computeBudget({ runSightline }, request);
          process.stdout.write(flags.json ? `${budgetBodyJson(body)}\n` : budgetTable(body));
        } finally {
          runner?.close();
        }
      } catch (err) {
        // Shared-schema issues restated with the flags that set them; main.ts prints and exits 2.
        if (err instanceof InputError && err.code === 'bad_request') {
          throw new InputError(err.code, `budget: ${describeForCli(err)}`, err.details);
        }
        throw err;
      }
    });
}
