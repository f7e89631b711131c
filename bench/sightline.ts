/**
 * Sightline engine speed and memory on an all-sky mock. Usage:
 *   npx tsx bench/sightline.ts [N=10000000] [SIGHTLINES=1000] [--keep DB_PATH]
 * With --keep, the mock store is written to DB_PATH (and reused on the next run if it exists).
 * Generates N invented galaxies over the whole sky into a temporary SQLite store (through the store's
 * own loader), then runs SIGHTLINES random sightlines (z_s uniform in 0.1–1, default model, 1000 draws):
 * prints the median and 95th percentile per sightline in process, the cost split (search incl. the
 * store / halo model / Monte Carlo / summaries), the batch rate on 2 worker threads, and resident memory.
 * Target: median ≤ 5 ms per sightline, RSS < 500 MB. The temporary folder is deleted at the end.
 */
import { createWriteStream, existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { isMainThread, parentPort, workerData } from 'node:worker_threads';
import { spawnModuleWorker } from '../server/workers/spawn.js';
import { createRng, quantileSorted } from '../src/math/index.js';
import { parseModel } from '../src/model/index.js';
import { createKitCache, runSightline, type SightlineTimings } from '../src/sightline/index.js';
import { coneSearch, loadCatalog, openStore } from '../src/store/index.js';

interface Job {
  ra: number;
  dec: number;
  z_source: number;
}

function sightlines(count: number, seed: number): Job[] {
  const rng = createRng(seed);
  return Array.from({ length: count }, () => ({
    ra: 360 * rng.uniform(),
    dec: (Math.asin(2 * rng.uniform() - 1) * 180) / Math.PI,
    z_source: 0.1 + 0.9 * rng.uniform(),
  }));
}

/** Redshift from p(z) ∝ z² exp(−(z/0.35)^1.5) on (0.005, 1.5) by rejection (a survey-like shape). */
function drawZ(rng: ReturnType<typeof createRng>): number {
  for (;;) {
    const z = 0.005 + 1.495 * rng.uniform();
    const p = (z / 0.467) ** 2 * Math.exp(-((z / 0.35) ** 1.5) + (0.467 / 0.35) ** 1.5);
    if (rng.uniform() < p) return z;
  }
}

async function writeMock(path: string, n: number): Promise<void> {
  const rng = createRng(20261202);
  const out = createWriteStream(path);
  out.write('id,ra,dec,z,z_err,z_kind,log_mstar,log_mstar_err\n');
  let buf = '';
  for (let k = 0; k < n; k++) {
    const ra = 360 * rng.uniform();
    const dec = (Math.asin(2 * rng.uniform() - 1) * 180) / Math.PI;
    const photo = rng.uniform() < 0.8;
    const z = drawZ(rng);
    // Mostly low-mass galaxies, an exponential tail above 10^10.5 (a rough mass-function shape).
    const logM =
      rng.uniform() < 0.75 ? 8 + 2.5 * rng.uniform() : Math.min(12, 10.5 - 0.3 * Math.log(rng.uniform()));
    const zErr = photo ? 0.03 * (1 + z) : 0.0002;
    buf += `M${k},${ra.toFixed(6)},${dec.toFixed(6)},${z.toFixed(4)},${zErr.toFixed(4)},${photo ? 'photo' : 'spec'},${logM.toFixed(2)},${photo ? 0.2 : 0.1}\n`;
    if (buf.length > 1 << 20) {
      if (!out.write(buf)) await new Promise<void>((r) => out.once('drain', () => r()));
      buf = '';
    }
  }
  out.write(buf);
  await new Promise<void>((r) => out.end(r));
}

// One kit per thread, its fast-DM table built before timing (≈1–2 s once per model and profile).
const kits = createKitCache();
kits(parseModel({})).dmObsFast(1e12, 200, 8, 50, 0.1, 0.75);

/** Runs the jobs; returns per-sightline wall times and, separately, the time spent inside the store. */
function runJobs(
  dbPath: string,
  jobs: Job[],
  timings?: SightlineTimings,
): { total: number[]; store: number[] } {
  const store = openStore(dbPath, { readonly: true });
  let inStore = 0;
  const deps = {
    coneSearch: (q: Parameters<typeof coneSearch>[1]) => {
      const t = performance.now();
      const rows = coneSearch(store, q);
      inStore += performance.now() - t;
      return rows;
    },
    timings,
    kits,
  };
  const total: number[] = [];
  const storeMs: number[] = [];
  for (const job of jobs) {
    inStore = 0;
    const t = performance.now();
    runSightline(deps, job);
    total.push(performance.now() - t);
    storeMs.push(inStore);
  }
  store.close();
  return { total, store: storeMs };
}

if (!isMainThread) {
  const { dbPath, jobs } = workerData as { dbPath: string; jobs: Job[] };
  runJobs(dbPath, jobs.slice(0, 5)); // warm-up (kit tables)
  const t = performance.now();
  runJobs(dbPath, jobs);
  parentPort!.postMessage({ ms: performance.now() - t, rss: process.memoryUsage().rss });
} else {
  const args = process.argv.slice(2);
  const keepAt = args.indexOf('--keep');
  const keep = keepAt >= 0 ? args.splice(keepAt, 2)[1] : undefined;
  const n = Number(args[0] ?? 10_000_000);
  const count = Number(args[1] ?? 1000);
  const dir = mkdtempSync(join(tmpdir(), 'forehalo-sightline-'));
  try {
    const csv = join(dir, 'mock.csv');
    const dbPath = keep ?? join(dir, 'mock.db');
    let t = performance.now();
    if (keep && existsSync(keep)) {
      console.log(`reusing the mock store ${keep}`);
    } else {
      await writeMock(csv, n);
      console.log(
        `mock CSV: ${n.toLocaleString()} galaxies in ${((performance.now() - t) / 1000).toFixed(1)} s`,
      );
      t = performance.now();
      const store = openStore(dbPath);
      await loadCatalog(store, { source: csv, name: 'mock' });
      store.close();
      rmSync(csv);
      console.log(`loaded into SQLite in ${((performance.now() - t) / 1000).toFixed(1)} s`);
    }

    const jobs = sightlines(count, 7);
    runJobs(dbPath, sightlines(5, 99)); // warm-up: kit tables are built once per model
    const timings: SightlineTimings = { search: 0, queries: 0, halo: 0, monteCarlo: 0, summary: 0 };
    const run = runJobs(dbPath, jobs, timings);
    const times = [...run.total].sort((a, b) => a - b);
    const engine = run.total.map((t, i) => t - run.store[i]).sort((a, b) => a - b);
    const storeTimes = [...run.store].sort((a, b) => a - b);
    const total = times.reduce((a, b) => a + b, 0);
    const storeTotal = storeTimes.reduce((a, b) => a + b, 0);
    const q = (xs: number[], p: number) => quantileSorted(xs, p).toFixed(2);
    console.log(
      `in process, ${count} sightlines, 1000 draws: median ${q(times, 0.5)} ms, p95 ${q(times, 0.95)} ms, ` +
        `max ${times.at(-1)!.toFixed(1)} ms (target median ≤ 5 ms)`,
    );
    console.log(
      `  of which inside the store's cone search: median ${q(storeTimes, 0.5)} ms; ` +
        `engine alone: median ${q(engine, 0.5)} ms, p95 ${q(engine, 0.95)} ms`,
    );
    const share = (x: number) => `${((100 * x) / total).toFixed(0)} %`;
    console.log(
      `cost split: store ${share(storeTotal)}, search planning/selection ${share(timings.search - storeTotal)}, ` +
        `halo model ${share(timings.halo)}, Monte Carlo ${share(timings.monteCarlo)}, summaries ${share(timings.summary)}`,
    );
    const probe = openStore(dbPath, { readonly: true });
    let nCand = 0;
    for (const job of jobs.slice(0, 200)) {
      nCand += runSightline({ coneSearch: (q) => coneSearch(probe, q), kits }, job).totals.n_candidates;
    }
    probe.close();
    console.log(
      `mean candidates per sightline: ${(nCand / 200).toFixed(1)}; ` +
        `store queries per sightline: ${(timings.queries / count).toFixed(1)}`,
    );

    const halves = [jobs.filter((_, i) => i % 2 === 0), jobs.filter((_, i) => i % 2 === 1)];
    t = performance.now();
    const results = await Promise.all(
      halves.map(
        (part) =>
          new Promise<{ ms: number; rss: number }>((resolve, reject) => {
            const w = spawnModuleWorker(new URL(import.meta.url), { dbPath, jobs: part });
            w.once('message', resolve);
            w.once('error', reject);
          }),
      ),
    );
    const wall = Math.max(...results.map((r) => r.ms));
    console.log(`batch on 2 worker threads: ${((count / wall) * 1000).toFixed(0)} sightlines/s`);
    console.log(`resident memory: ${(process.memoryUsage().rss / 2 ** 20).toFixed(0)} MB (target < 500 MB)`);
    void (performance.now() - t);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
