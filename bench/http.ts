/**
 * HTTP throughput of POST /v1/sightlines (autocannon against 127.0.0.1) on a generated 1M-galaxy
 * catalogue with 200 draws per request, then sightline latency while a second catalogue loads.
 *
 *   npx tsx bench/http.ts [--rows 1000000] [--radius 180] [--seconds 10] [--repeats 3]
 *                         [--workers 2] [--connections 8] [--load-rows 200000] [--db PATH]
 *
 * --radius is the radius [deg] of the sky cap the galaxies fill; it sets the surface density and with
 * it how many rows each sightline's cone search meets. 180 (default) spreads 1M galaxies over the whole
 * sky (≈ 24 per deg², a bright all-sky redshift catalogue); 60 gives ≈ 97 per deg²; 5 gives ≈ 12,700
 * per deg² (a deep field). Sightlines are uniform on the cap, 1° inside its edge; z_s uniform in
 * 0.2–1; each request has its own seed. --db keeps the generated store at PATH and reuses it when
 * it exists (the radius and row count must then match the file). --load-rows 0 skips the load test.
 *
 * Target (project brief): ≥ 500 requests/s on 2 cores. Synthetic, invented data only
 * (test/helpers/synthetic-catalog.ts: 20 % spectroscopic, log M* uniform in 8.5–11.5, a third of the
 * rows above 10^10.5 M☉, more massive galaxies than a real mass function gives, so more candidates).
 * Other jobs on the machine lower the figures: the load average is printed beside each run.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import { createReadStream, existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { parseArgs } from 'node:util';
import autocannon from 'autocannon';
import { createRng, type Rng } from '../src/math/random.js';
import { createKitCache, runSightline, type SightlineTimings } from '../src/sightline/index.js';
import { coneSearch, loadCatalog, openStore } from '../src/store/index.js';
import { writeSyntheticCatalog } from '../test/helpers/synthetic-catalog.js';

const { values } = parseArgs({
  options: {
    rows: { type: 'string', default: '1000000' },
    seconds: { type: 'string', default: '10' },
    repeats: { type: 'string', default: '3' },
    workers: { type: 'string', default: '2' },
    connections: { type: 'string', default: '8' },
    'load-rows': { type: 'string', default: '200000' },
    radius: { type: 'string', default: '180' },
    db: { type: 'string' },
  },
});
const ROWS = Number(values.rows);
const SECONDS = Number(values.seconds);
const REPEATS = Number(values.repeats);
const WORKERS = Number(values.workers);
const CONNECTIONS = Number(values.connections);
const LOAD_ROWS = Number(values['load-rows']);
const FIELD = { raDeg: 150, decDeg: 2, radiusDeg: Math.min(180, Number(values.radius)) };
const PORT = 18000 + Math.floor(Math.random() * 1000);
const BASE = `http://127.0.0.1:${PORT}`;
const DRAWS = 200;

const dir = mkdtempSync(join(tmpdir(), 'forehalo-bench-http-'));
const dbPath = values.db ?? join(dir, 'bench.db');
let server: ChildProcess | undefined;

const DEG = Math.PI / 180;
/** Uniform on the cap of radius (R − 1°) around the field centre (same rotation as the catalogue writer). */
function capPoint(rng: Rng): [number, number] {
  const inner = Math.max(0, FIELD.radiusDeg - 1);
  const cosT = 1 - rng.uniform() * (1 - Math.cos(inner * DEG));
  const sinT = Math.sqrt(Math.max(0, 1 - cosT * cosT));
  const phi = 2 * Math.PI * rng.uniform();
  const x = sinT * Math.cos(phi);
  const y = sinT * Math.sin(phi);
  const dec0 = FIELD.decDeg * DEG;
  const xr = x * Math.sin(dec0) + cosT * Math.cos(dec0);
  const zr = -x * Math.cos(dec0) + cosT * Math.sin(dec0);
  const ra = ((((FIELD.raDeg * DEG + Math.atan2(y, xr)) / DEG) % 360) + 360) % 360;
  return [ra >= 360 ? 0 : ra, Math.asin(Math.max(-1, Math.min(1, zr))) / DEG];
}

/** A random sightline inside the field, 200 draws, its own seed. */
function randomRequest(rng: Rng) {
  const [ra, dec] = capPoint(rng);
  return { ra, dec, z_source: 0.2 + 0.8 * rng.uniform(), model: { draws: DRAWS, seed: rng.nextUint32() } };
}

async function waitReady(): Promise<void> {
  for (let i = 0; i < 600; i++) {
    try {
      if ((await fetch(`${BASE}/v1/ready`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('server did not become ready');
}

const pct = (sorted: number[], q: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
const median = (xs: number[]) =>
  pct(
    [...xs].sort((a, b) => a - b),
    0.5,
  );
const load = () => `load average ${loadavg()[0].toFixed(2)}`;

/** The engine alone in this process on the same store (warm: kit tables built, JIT settled). */
function engineAlone(): void {
  const store = openStore(dbPath, { readonly: true });
  let inStore = 0;
  const kits = createKitCache();
  const timings: SightlineTimings = { search: 0, queries: 0, halo: 0, monteCarlo: 0, summary: 0 };
  const deps = {
    kits,
    coneSearch: (q: Parameters<typeof coneSearch>[1]) => {
      const t = performance.now();
      const rows = coneSearch(store, q);
      inStore += performance.now() - t;
      return rows;
    },
  };
  const rng = createRng(7);
  // Bounded in time: up to 300 warm-up runs or 5 s, then up to 1000 runs or 20 s.
  let t0 = performance.now();
  for (let i = 0; i < 300 && performance.now() - t0 < 5000; i++) runSightline(deps, randomRequest(rng));
  const times: number[] = [];
  let candidates = 0;
  let storeTotal = 0;
  const timed = { ...deps, timings };
  t0 = performance.now();
  for (let i = 0; i < 1000 && (i < 20 || performance.now() - t0 < 20_000); i++) {
    inStore = 0;
    const t = performance.now();
    const res = runSightline(timed, randomRequest(rng));
    times.push(performance.now() - t);
    storeTotal += inStore;
    candidates += res.totals.n_candidates;
  }
  store.close();
  const RUNS = times.length;
  times.sort((a, b) => a - b);
  const mean = times.reduce((a, b) => a + b, 0) / RUNS;
  console.log(
    `engine alone (runSightline, ${DRAWS} draws, one thread, ${RUNS} sightlines, ${load()}): ` +
      `median ${pct(times, 0.5).toFixed(2)} ms, mean ${mean.toFixed(2)} ms, p99 ${pct(times, 0.99).toFixed(1)} ms ` +
      `per sightline; ${(storeTotal / RUNS).toFixed(2)} ms of it in the store's cone search ` +
      `(${(timings.queries / RUNS).toFixed(1)} queries); ${(candidates / RUNS).toFixed(1)} candidates ` +
      `→ at most ~${((1000 / mean) * WORKERS).toFixed(0)} req/s on ${WORKERS} cores before HTTP`,
  );
}

async function main() {
  const capDeg2 = 2 * Math.PI * (180 / Math.PI) ** 2 * (1 - Math.cos(FIELD.radiusDeg * DEG));
  console.log(
    `forehalo bench/http — ${ROWS} galaxies on a ${FIELD.radiusDeg}° cap ` +
      `(${(ROWS / capDeg2).toFixed(0)} per deg²), ${DRAWS} draws, ${WORKERS} HTTP worker(s), ` +
      `${CONNECTIONS} connections, ${REPEATS} × ${SECONDS} s, ${load()}`,
  );
  if (values.db && existsSync(dbPath)) {
    console.log(`reusing the store ${dbPath}`);
  } else {
    const csv = join(dir, 'field.csv');
    let t = performance.now();
    await writeSyntheticCatalog(csv, { rows: ROWS, ...FIELD, seed: 3 });
    console.log(`generated ${ROWS} rows in ${((performance.now() - t) / 1000).toFixed(1)} s`);
    t = performance.now();
    const store = openStore(dbPath);
    await loadCatalog(store, { source: csv, name: 'bench-field', mode: 'create' });
    store.close();
    rmSync(csv);
    console.log(`loaded in ${((performance.now() - t) / 1000).toFixed(1)} s (store loader, direct)`);
  }

  // Before the server starts, so the two do not share the cores.
  engineAlone();

  server = spawn(
    process.execPath,
    [
      ...process.execArgv,
      'src/cli/main.ts',
      '--db',
      dbPath,
      'serve',
      '--port',
      String(PORT),
      '--workers',
      String(WORKERS),
    ],
    { stdio: ['ignore', 'ignore', 'inherit'], env: { ...process.env, FOREHALO_LOG_LEVEL: 'warn' } },
  );
  await waitReady();

  // The HTTP layer alone: GET /v1/health through the same server (framework ceiling).
  const health = await autocannon({ url: `${BASE}/v1/health`, connections: CONNECTIONS, duration: 3 });
  console.log(
    `GET /v1/health (HTTP layer only): ${health.requests.average.toFixed(0)} req/s; p50 ${health.latency.p50} ms`,
  );

  const rng = createRng(42);
  const body = () => JSON.stringify(randomRequest(rng));
  const post = {
    url: `${BASE}/v1/sightlines`,
    connections: CONNECTIONS,
    requests: [
      {
        method: 'POST' as const,
        headers: { 'content-type': 'application/json' },
        setupRequest: (req: object) => ({ ...req, body: body() }),
      },
    ],
  };
  // Warm-up: every worker builds its fast-DM table (≈ 1–2 s) and settles its JIT (the first
  // measured run was still ~15 % slow after a 4 s warm-up).
  await autocannon({ ...post, duration: 8 });

  const rates: number[] = [];
  for (let k = 0; k < REPEATS; k++) {
    const before = load();
    const result = await autocannon({ ...post, duration: SECONDS });
    rates.push(result.requests.average);
    console.log(
      `POST /v1/sightlines run ${k + 1}: ${result.requests.average.toFixed(1)} req/s; ` +
        `latency p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms; ` +
        `${result['2xx']} ok, ${result.non2xx} non-2xx, ${result.errors} errors, ${result.timeouts} timeouts ` +
        `(${before} before, ${load()} after)`,
    );
  }
  console.log(
    `POST /v1/sightlines median of ${REPEATS}: ${median(rates).toFixed(1)} req/s at ` +
      `${(ROWS / capDeg2).toFixed(0)} galaxies per deg² (target ≥ 500)`,
  );

  if (LOAD_ROWS <= 0) return;
  // Sightline latency while a second catalogue loads through PUT (worker thread in the server).
  const extra = join(dir, 'extra.csv');
  await writeSyntheticCatalog(extra, {
    rows: LOAD_ROWS,
    raDeg: 40,
    decDeg: -30,
    radiusDeg: 3,
    seed: 9,
    idPrefix: 'E',
  });
  let loading = true;
  const t = performance.now();
  const upload = fetch(`${BASE}/v1/catalogs/bench-extra`, {
    method: 'PUT',
    headers: { 'content-type': 'text/csv', 'content-length': String(statSync(extra).size) },
    body: Readable.toWeb(createReadStream(extra)) as ReadableStream,
    duplex: 'half',
  } as RequestInit).finally(() => {
    loading = false;
  });
  const latencies: number[] = [];
  while (loading) {
    const t0 = performance.now();
    const res = await fetch(`${BASE}/v1/sightlines`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: body(),
    });
    await res.arrayBuffer();
    latencies.push(performance.now() - t0);
  }
  const loadStatus = (await upload).status;
  const loadS = (performance.now() - t) / 1000;
  // Leave a kept store as it was (the extra catalogue would change the next run's sky).
  await fetch(`${BASE}/v1/catalogs/bench-extra`, { method: 'DELETE' });
  latencies.sort((a, b) => a - b);
  console.log(
    `during a ${LOAD_ROWS}-row PUT load (${loadS.toFixed(1)} s, HTTP ${loadStatus}): ${latencies.length} sequential ` +
      `sightline queries, p50 ${pct(latencies, 0.5).toFixed(0)} ms, p95 ${pct(latencies, 0.95).toFixed(0)} ms`,
  );
}

main()
  .catch((err) => {
    console.error(err);
    process.exitCode = 1;
  })
  .finally(() => {
    server?.kill('SIGTERM');
    setTimeout(() => rmSync(dir, { recursive: true, force: true }), 1000);
  });
