import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Command } from 'commander';
import { budgetBodyJson, computeBudget } from '../../budget-request/index.js';
import { galaxyCsvHeader, galaxyCsvRows, runSightline, sightlineTextReport } from '../../sightline/index.js';
import { coneSearch, loadCatalog, openStore } from '../../store/index.js';
import { budgetTable } from '../budget-table.js';
import { drawDemoCharts } from '../demo/charts.js';
import { DEMO_BURST as DEMO, DEMO_CATALOGS } from '../demo/scenario.js';
import { packageRoot } from '../demo/web-dir.js';

export interface DemoFlags {
  out: string;
  draws: string;
  seed: string;
}

export function register(program: Command): void {
  program
    .command('demo')
    .description(
      'run the main job on the built-in invented field: load its catalogues into a fresh database, trace the ' +
        "demo burst's sightline, compute its DM budget, print the report and write the charts as SVG files",
    )
    .option('--out <dir>', 'folder for the demo database, report and charts', 'forehalo-demo')
    .option('--draws <n>', 'Monte Carlo draws', '2000')
    .option('--seed <s>', 'random seed', '1')
    .action(async (flags: DemoFlags) => {
      await runDemo(flags);
    });
}

export async function runDemo(flags: DemoFlags): Promise<void> {
  const root = packageRoot();
  const out = resolve(flags.out);
  mkdirSync(out, { recursive: true });
  const dbFile = join(out, 'demo.db');
  for (const suffix of ['', '-wal', '-shm']) rmSync(dbFile + suffix, { force: true });
  const log = (s = '') => process.stdout.write(`${s}\n`);

  log(`forehalo demo — the invented ${DEMO.field} and its burst "${DEMO.name}" (fictional data)`);
  log(`database: ${dbFile}`);
  const store = openStore(dbFile);
  try {
    for (const c of DEMO_CATALOGS) {
      const summary = await loadCatalog(store, {
        source: join(root, 'fixtures', 'demo', c.file),
        name: c.name,
        description: c.description,
      });
      log(`  loaded ${c.name}: ${summary.rows} rows`);
    }
    const draws = Number(flags.draws);
    const seed = Number(flags.seed);
    const sightlineRequest = {
      ra: DEMO.raDeg,
      dec: DEMO.decDeg,
      z_source: DEMO.zSource,
      host_id: DEMO.hostId,
      model: { draws, seed },
      include_draws: true,
    };
    const deps = { coneSearch: (q: Parameters<typeof coneSearch>[1]) => coneSearch(store, q) };
    const sightline = runSightline(deps, sightlineRequest);
    log();
    log(sightlineTextReport(sightline));

    const budget = await computeBudget(
      { runSightline: (req) => runSightline(deps, req) },
      {
        dm_obs: DEMO.dmObs,
        dm_obs_err: DEMO.dmObsErr,
        dm_ism: DEMO.dmIsm,
        dm_ism_err: DEMO.dmIsmErr,
        z_source: DEMO.zSource,
        sightline: { ra: DEMO.raDeg, dec: DEMO.decDeg, host_id: DEMO.hostId, model: { draws, seed } },
      },
    );
    log();
    log(`DM budget for DM_obs = ${DEMO.dmObs} ± ${DEMO.dmObsErr} pc cm⁻³ at z_s = ${DEMO.zSource}`);
    log(budgetTable(budget));

    writeFileSync(join(out, 'sightline.json'), `${JSON.stringify(sightline, null, 2)}\n`);
    writeFileSync(join(out, 'budget.json'), `${budgetBodyJson(budget)}\n`);
    writeFileSync(
      join(out, 'galaxies.csv'),
      [galaxyCsvHeader(), ...galaxyCsvRows(sightline.galaxies)].join('\n') + '\n',
    );
    const charts = await drawDemoCharts(root, sightline, budget);
    for (const c of charts) writeFileSync(join(out, c.name), c.svg);
    log();
    log(`Wrote to ${out}/:`);
    log('  sightline.json, budget.json (the HTTP bodies), galaxies.csv');
    for (const c of charts) log(`  ${c.name}  — ${c.title} (open in any browser)`);
    log();
    log('To explore the field live in the web view:');
    log(`  forehalo --db ${dbFile} serve     (from a clone: npx tsx src/cli/main.ts --db ${dbFile} serve)`);
    log('  then open http://127.0.0.1:8080/');
  } finally {
    store.close();
  }
}
