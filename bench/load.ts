/**
 * Catalogue load speed and memory. Usage:
 *   npx tsx bench/load.ts [N=1000000]       end-to-end load of a synthetic CSV vs a bare insert loop
 *   npx tsx bench/load.ts 5000000           the same at 5M rows; peak RSS is printed (target < 300 MB)
 *   add --in-thread to parse in the loading thread instead of a worker thread
 * Targets: ≥ 300,000 rows/s end to end and ≥ 0.5 of the bare better-sqlite3 insert loop.
 */
import { createWriteStream, mkdtempSync, rmSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { createRng } from '../src/math/index.js';
import { loadCatalog, openStore } from '../src/store/index.js';

const args = process.argv.slice(2);
const n = Number(args.find((a) => /^\d+$/.test(a)) ?? 1_000_000);
/** --in-thread: parse in the loading thread instead of a worker (to compare the two). */
const inThread = args.includes('--in-thread');
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

async function main(): Promise<void> {
  await writeCsv();
  peakRss = process.memoryUsage.rss(); // from here on: the load only, not the CSV writer
  const store = openStore(join(dir, 'end-to-end.db'));
  const t0 = performance.now();
  let lastProgress = t0;
  const summary = await loadCatalog(store, {
    source: csv,
    name: 'synthetic',
    parseInWorker: !inThread,
    onProgress: () => {
      lastProgress = performance.now();
    },
  });
  const loaded = performance.now();
  // Closing is part of the job (a CLI load ends with it), so it is timed too.
  store.close();
  const endToEnd = (performance.now() - t0) / 1000;
  const streamS = (lastProgress - t0) / 1000;
  const tailS = (loaded - lastProgress) / 1000;
  clearInterval(sampler);
  const loadPeakRss = peakRss;

  // Bare loop: the same rows, already in memory as values (generated 50k at a time, outside the
  // timer), one prepared INSERT call per row in 50k-row transactions into a plain table with no
  // HEALPix index, no checks and no key; close timed as above.
  const bare = new Database(join(dir, 'bare.db'));
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
  const bareS = bareMs / 1000;

  const e2e = summary.rows / endToEnd;
  const bareRate = n / bareS;
  console.log(`rows: ${summary.rows} (parsing in ${inThread ? 'the loading thread' : 'a worker thread'})`);
  console.log(
    `end to end (CSV → checked, HEALPix-indexed, clustered catalogue): ${endToEnd.toFixed(2)} s, ${Math.round(e2e).toLocaleString('en')} rows/s`,
  );
  console.log(
    `bare better-sqlite3 insert loop: ${bareS.toFixed(2)} s, ${Math.round(bareRate).toLocaleString('en')} rows/s`,
  );
  console.log(
    `  of which read + check + stage: ${streamS.toFixed(2)} s; id check, HEALPix-ordered copy, links, commit (WAL checkpoint): ${tailS.toFixed(2)} s; close: ${(endToEnd - streamS - tailS).toFixed(2)} s`,
  );
  console.log(`ratio end-to-end / bare: ${(e2e / bareRate).toFixed(2)}`);
  console.log(`peak RSS during the load: ${(loadPeakRss / 2 ** 20).toFixed(0)} MB`);
  // Other jobs on the machine change every figure above: say how busy it was.
  const [l1, l5] = loadavg();
  console.log(
    `machine: ${cpus().length} cores, load average ${l1.toFixed(2)} (1 min), ${l5.toFixed(2)} (5 min)`,
  );
  rmSync(dir, { recursive: true, force: true });
}

await main();
