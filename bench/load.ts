/**
 * Catalogue load speed and memory. Usage:
 *   npx tsx bench/load.ts [N=1000000]       end-to-end load of a synthetic CSV vs a bare insert loop
 *   npx tsx bench/load.ts 5000000           the same at 5M rows; peak RSS is printed (target < 300 MB)
 *   --runs K       repeat both timings K times (default 3) and report the median (this machine's speed
 *                  varies run to run; every run is printed)
 *   --built        load with the compiled code in dist/ (run `npm run build` first): what the packaged
 *                  `forehalo` binary runs; by default the TypeScript sources run under tsx
 *   --in-thread    parse in the loading thread instead of a worker thread
 *   --part-rows R  rows per sorted part (default: the loader's own)
 *   --merge-above K  merge a load's parts into one run when there are more than K (default: the loader's)
 * Targets: ≥ 300,000 rows/s end to end and ≥ 0.5 of the bare better-sqlite3 insert loop.
 */
import { createWriteStream, existsSync, mkdtempSync, rmSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { createRng } from '../src/math/index.js';
import * as fromSource from '../src/store/index.js';

const args = process.argv.slice(2);
const n = Number(args.find((a) => /^\d+$/.test(a)) ?? 1_000_000);
/** --in-thread: parse in the loading thread instead of a worker (to compare the two). */
const inThread = args.includes('--in-thread');
const runsArg = args.indexOf('--runs');
const runs = runsArg >= 0 ? Math.max(1, Number(args[runsArg + 1])) : 3;
const built = args.includes('--built');
const partArg = args.indexOf('--part-rows');
const partRows = partArg >= 0 ? Number(args[partArg + 1]) : undefined;
const mergeArg = args.indexOf('--merge-above');
const mergeAboveRuns = mergeArg >= 0 ? Number(args[mergeArg + 1]) : undefined;
const distStore = new URL('../dist/src/store/index.js', import.meta.url);
if (built && !existsSync(distStore)) {
  console.error('--built needs the compiled code: run `npm run build` first');
  process.exit(2);
}
const { loadCatalog, openStore } = (built ? await import(distStore.href) : fromSource) as typeof fromSource;
const dir = mkdtempSync(join(tmpdir(), 'forehalo-bench-'));
const csv = join(dir, 'synthetic.csv');

let peakRss = 0;
const sampler = setInterval(() => {
  peakRss = Math.max(peakRss, process.memoryUsage.rss());
}, 50);

type Row = [string, number, number, number, number, string, number, number];

function* rows(): Generator<Row> {
  const rng = createRng(20240601);
  for (let k = 0; k < n; k++) {
    const ra = 360 * rng.uniform();
    const dec = (Math.asin(2 * rng.uniform() - 1) * 180) / Math.PI;
    const photo = rng.uniform() < 0.8;
    const z = 0.02 + 0.98 * rng.uniform();
    yield [
      `G${k}`,
      ra,
      dec,
      z,
      photo ? 0.03 * (1 + z) : 0.0002,
      photo ? 'photo' : 'spec',
      8 + 3.5 * rng.uniform(),
      0.15,
    ];
  }
}

async function writeCsv(): Promise<void> {
  const out = createWriteStream(csv);
  out.write('id,ra,dec,z,z_err,z_kind,log_mstar,log_mstar_err\n');
  let buf = '';
  for (const r of rows()) {
    buf += `${r[0]},${r[1].toFixed(6)},${r[2].toFixed(6)},${r[3].toFixed(4)},${r[4].toFixed(4)},${r[5]},${r[6].toFixed(2)},${r[7]}\n`;
    if (buf.length > 1 << 20) {
      if (!out.write(buf)) await new Promise<void>((res) => out.once('drain', () => res()));
      buf = '';
    }
  }
  out.end(buf);
  await new Promise<void>((res) => out.once('finish', () => res()));
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** One end-to-end load into a fresh database, timed up to and including closing it. */
async function endToEnd(k: number): Promise<{ rows: number; seconds: number; writeSeconds: number }> {
  const store = openStore(join(dir, `end-to-end-${k}.db`));
  const t0 = performance.now();
  let lastProgress = t0;
  const summary = await loadCatalog(store, {
    source: csv,
    name: 'synthetic',
    parseInWorker: !inThread,
    batchSize: partRows,
    mergeAboveRuns,
    onProgress: () => {
      lastProgress = performance.now();
    },
  });
  // Closing is part of the job (a CLI load ends with it), so it is timed too.
  store.close();
  const seconds = (performance.now() - t0) / 1000;
  rmSync(join(dir, `end-to-end-${k}.db`), { force: true });
  return { rows: summary.rows, seconds, writeSeconds: (lastProgress - t0) / 1000 };
}

/**
 * Bare loop: the same rows, already in memory as values (generated 50k at a time, outside the
 * timer), one prepared INSERT call per row in 50k-row transactions into a plain table with no
 * HEALPix index, no checks and no key; close timed as above.
 */
function bareLoop(k: number): number {
  const path = join(dir, `bare-${k}.db`);
  const bare = new Database(path);
  bare.pragma('journal_mode = WAL');
  bare.pragma('synchronous = NORMAL');
  bare.exec(
    'CREATE TABLE g (id TEXT, ra REAL, dec REAL, z REAL, z_err REAL, z_kind TEXT, log_mstar REAL, log_mstar_err REAL)',
  );
  const ins = bare.prepare('INSERT INTO g VALUES (?, ?, ?, ?, ?, ?, ?, ?)');
  const many = bare.transaction((batch: Row[]) => {
    for (const r of batch) ins.run(r);
  });
  let bareMs = 0;
  let batch: Row[] = [];
  const timed = (b: Row[]) => {
    const t = performance.now();
    many(b);
    bareMs += performance.now() - t;
  };
  for (const r of rows()) {
    batch.push(r);
    if (batch.length === 50_000) {
      timed(batch);
      batch = [];
    }
  }
  timed(batch);
  const tc = performance.now();
  bare.close();
  bareMs += performance.now() - tc;
  rmSync(path, { force: true });
  return bareMs / 1000;
}

async function main(): Promise<void> {
  await writeCsv();
  peakRss = process.memoryUsage.rss(); // from here on: the loads only, not the CSV writer
  const loads: { rows: number; seconds: number; writeSeconds: number }[] = [];
  for (let k = 0; k < runs; k++) loads.push(await endToEnd(k));
  clearInterval(sampler);
  const loadPeakRss = peakRss;
  // The bare loops run after the loads, alternating would not change the medians much but would
  // mix the peak RSS figures.
  const bares: number[] = [];
  for (let k = 0; k < runs; k++) bares.push(bareLoop(k));

  const rates = loads.map((l) => l.rows / l.seconds);
  const bareRates = bares.map((b) => n / b);
  const e2e = median(rates);
  const bareRate = median(bareRates);
  const typical = loads[rates.indexOf(e2e)];
  console.log(
    `rows: ${loads[0].rows} (parsing in ${inThread ? 'the loading thread' : 'a worker thread'}; ${built ? 'compiled code from dist/' : 'TypeScript sources under tsx'}; ${runs} run(s) each)`,
  );
  const list = (xs: number[]) => xs.map((x) => Math.round(x).toLocaleString('en')).join(' / ');
  console.log(
    `end to end (CSV → checked, HEALPix-keyed catalogue, committed and closed): median ${Math.round(e2e).toLocaleString('en')} rows/s (${(loads[0].rows / e2e).toFixed(2)} s); runs: ${list(rates)} rows/s`,
  );
  console.log(
    `bare better-sqlite3 insert loop: median ${Math.round(bareRate).toLocaleString('en')} rows/s (${(n / bareRate).toFixed(2)} s); runs: ${list(bareRates)} rows/s`,
  );
  console.log(
    `  median run: read + check + sort + write: ${typical.writeSeconds.toFixed(2)} s; id check, links, commit (WAL checkpoint) and close: ${(typical.seconds - typical.writeSeconds).toFixed(2)} s`,
  );
  console.log(`ratio end-to-end / bare (medians): ${(e2e / bareRate).toFixed(2)}`);
  console.log(`peak RSS during the loads: ${(loadPeakRss / 2 ** 20).toFixed(0)} MB`);
  // Other jobs on the machine change every figure above: say how busy it was.
  const [l1, l5] = loadavg();
  console.log(
    `machine: ${cpus().length} cores, load average ${l1.toFixed(2)} (1 min), ${l5.toFixed(2)} (5 min)`,
  );
  rmSync(dir, { recursive: true, force: true });
}

await main();
