/**
 * HTTP throughput of POST /v1/sightlines (autocannon against 127.0.0.1) on a generated 1M-galaxy
 * catalogue with 200 draws per request, then sightline latency while a second catalogue loads.
 *
 *   npx tsx bench/http.ts [--rows 1000000] [--radius 5] [--seconds 10] [--workers 2] [--connections 8]
 *
 * --radius is the radius [deg] of the sky cap the galaxies fill: it sets the surface density, and
 * with it how many rows each sightline's cone search returns.
 *
 * Target (project brief): ≥ 500 requests/s on 2 cores. Synthetic, invented data only.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import { createReadStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { parseArgs } from 'node:util';
import autocannon from 'autocannon';
import { createRng } from '../src/math/random.js';
import { runSightline } from '../src/sightline/index.js';
import { coneSearch, loadCatalog, openStore } from '../src/store/index.js';
import { writeSyntheticCatalog } from '../test/helpers/synthetic-catalog.js';

const { values } = parseArgs({
  options: {
    rows: { type: 'string', default: '1000000' },
    seconds: { type: 'string', default: '10' },
    workers: { type: 'string', default: '2' },
    connections: { type: 'string', default: '8' },
    'load-rows': { type: 'string', default: '500000' },
    radius: { type: 'string', default: '5' },
  },
});
const ROWS = Number(values.rows);
const SECONDS = Number(values.seconds);
const WORKERS = Number(values.workers);
const CONNECTIONS = Number(values.connections);
const LOAD_ROWS = Number(values['load-rows']);
const FIELD = { raDeg: 150, decDeg: 2, radiusDeg: Number(values.radius) };
const PORT = 18000 + Math.floor(Math.random() * 1000);
const BASE = `http://127.0.0.1:${PORT}`;

const dir = mkdtempSync(join(tmpdir(), 'forehalo-bench-http-'));
const dbPath = join(dir, 'bench.db');
let server: ChildProcess | undefined;

/** A random sightline inside the field, 200 draws, its own seed. */
function randomBody(rng: ReturnType<typeof createRng>): string {
  const r = 0.8 * FIELD.radiusDeg * Math.sqrt(rng.uniform());
  const phi = 2 * Math.PI * rng.uniform();
  const dec = FIELD.decDeg + r * Math.sin(phi);
  const ra = FIELD.raDeg + (r * Math.cos(phi)) / Math.cos((dec * Math.PI) / 180);
  const z_source = 0.2 + 0.8 * rng.uniform();
  return JSON.stringify({ ra, dec, z_source, model: { draws: 200, seed: rng.nextUint32() } });
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

async function main() {
  const capDeg2 = 2 * Math.PI * (180 / Math.PI) ** 2 * (1 - Math.cos((FIELD.radiusDeg * Math.PI) / 180));
  console.log(
    `forehalo bench/http — ${ROWS} galaxies on a ${FIELD.radiusDeg}° cap (${(ROWS / capDeg2).toFixed(0)} per deg²), ` +
      `${WORKERS} HTTP worker(s), ${CONNECTIONS} connections, ${SECONDS} s`,
  );
  const csv = join(dir, 'field.csv');
  let t = performance.now();
  await writeSyntheticCatalog(csv, { rows: ROWS, ...FIELD, seed: 3 });
  console.log(`generated ${ROWS} rows in ${((performance.now() - t) / 1000).toFixed(1)} s`);
  t = performance.now();
  const store = openStore(dbPath);
  await loadCatalog(store, { source: csv, name: 'bench-field', mode: 'create' });
  store.close();
  console.log(`loaded in ${((performance.now() - t) / 1000).toFixed(1)} s (store loader, direct)`);

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

  // The engine alone, in this process, on the same store: what one request costs without HTTP.
  const engineRng = createRng(7);
  const readStore = openStore(dbPath, { readonly: true });
  const deps = { coneSearch: (q: Parameters<typeof coneSearch>[1]) => coneSearch(readStore, q) };
  for (let i = 0; i < 5; i++) runSightline(deps, JSON.parse(randomBody(engineRng)));
  t = performance.now();
  const ENGINE_RUNS = 40;
  for (let i = 0; i < ENGINE_RUNS; i++) runSightline(deps, JSON.parse(randomBody(engineRng)));
  const engineMs = (performance.now() - t) / ENGINE_RUNS;
  readStore.close();
  console.log(
    `engine alone (runSightline, 200 draws, one thread): ${engineMs.toFixed(1)} ms per sightline ` +
      `→ at most ~${((1000 / engineMs) * WORKERS).toFixed(0)} req/s on ${WORKERS} cores`,
  );

  // The HTTP layer alone: GET /v1/health through the same server (framework ceiling).
  const health = await autocannon({ url: `${BASE}/v1/health`, connections: CONNECTIONS, duration: 3 });
  console.log(
    `GET /v1/health (HTTP layer only): ${health.requests.average.toFixed(0)} req/s; p50 ${health.latency.p50} ms`,
  );

  const rng = createRng(42);
  for (let i = 0; i < 20; i++) {
    await fetch(`${BASE}/v1/sightlines`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: randomBody(rng),
    });
  }

  const result = await autocannon({
    url: `${BASE}/v1/sightlines`,
    connections: CONNECTIONS,
    duration: SECONDS,
    requests: [
      {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        setupRequest: (req) => ({ ...req, body: randomBody(rng) }),
      },
    ],
  });
  console.log(
    `POST /v1/sightlines (200 draws): ${result.requests.average.toFixed(1)} req/s; ` +
      `latency p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms; ` +
      `${result['2xx']} ok, ${result.non2xx} non-2xx, ${result.errors} errors, ${result.timeouts} timeouts`,
  );

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
  t = performance.now();
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
      body: randomBody(rng),
    });
    await res.arrayBuffer();
    latencies.push(performance.now() - t0);
  }
  const loadStatus = (await upload).status;
  const loadS = (performance.now() - t) / 1000;
  latencies.sort((a, b) => a - b);
  console.log(
    `during a ${LOAD_ROWS}-row PUT load (${loadS.toFixed(1)} s, HTTP ${loadStatus}): ${latencies.length} sightline queries, ` +
      `p50 ${pct(latencies, 0.5).toFixed(0)} ms, p95 ${pct(latencies, 0.95).toFixed(0)} ms`,
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
