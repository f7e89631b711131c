import { createReadStream, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadServerConfig } from '../../server/config.js';
import { type RunningServer, startServer } from '../../server/server.js';
import { writeSyntheticCatalog } from '../helpers/synthetic-catalog.js';
import { DEMO_FILES, demoRequest } from './demo-app.js';

/**
 * A 2-million-row catalogue is uploaded over real HTTP while sightline queries keep arriving: the
 * load runs in a worker thread, so every query must still be answered, and answered exactly as
 * before the load started (the synthetic rows lie in another part of the sky, and SQLite WAL gives
 * readers a consistent snapshot). Latencies are printed for information only, never asserted.
 */
const ROWS = 2_000_000;
const QUERY_PAUSE_MS = 500;

describe('a large catalogue load while sightline queries keep arriving', () => {
  let dir: string;
  let server: RunningServer;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'forehalo-bigload-'));
    const config = loadServerConfig({}, { dbPath: join(dir, 'big.db'), port: 0, logLevel: 'warn' });
    server = await startServer(config, { signals: false, web: false });
    for (const [name, file] of DEMO_FILES) {
      const res = await fetch(`${server.url}/v1/catalogs/${name}`, {
        method: 'PUT',
        body: readFileSync(new URL(`../../fixtures/demo/${file}`, import.meta.url)),
      });
      expect(res.status).toBe(201);
    }
  });
  afterAll(async () => {
    await server?.shutdown('test done');
    rmSync(dir, { recursive: true, force: true });
  });

  it('keeps answering sightline queries correctly during a 2-million-row upload and load', async () => {
    const query = () =>
      fetch(`${server.url}/v1/sightlines`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(demoRequest({ draws: 100, max_search_deg: 0.5 })),
      });
    const baseline = await (await query()).json();
    expect(baseline.galaxies.length).toBeGreaterThan(0);

    const file = join(dir, 'synthetic.csv');
    await writeSyntheticCatalog(file, { rows: ROWS, raDeg: 30, decDeg: -20, radiusDeg: 3, seed: 5 });
    const bytes = statSync(file).size;

    let loading = true;
    const upload = fetch(`${server.url}/v1/catalogs/synthetic?file_name=synthetic.csv`, {
      method: 'PUT',
      headers: { 'content-type': 'text/csv', 'content-length': String(bytes) },
      body: Readable.toWeb(createReadStream(file)) as ReadableStream,
      duplex: 'half',
    } as RequestInit).finally(() => {
      loading = false;
    });

    const latenciesMs: number[] = [];
    let mismatches = 0;
    while (loading) {
      const t0 = performance.now();
      const res = await query();
      const reply = await res.json();
      latenciesMs.push(performance.now() - t0);
      expect(res.status).toBe(200);
      if (JSON.stringify(reply.totals) !== JSON.stringify(baseline.totals)) mismatches++;
      if (JSON.stringify(reply.galaxies) !== JSON.stringify(baseline.galaxies)) mismatches++;
      // Paced like a pipeline polling the service, leaving CPU for the load on a 2-core machine.
      await new Promise((resolve) => setTimeout(resolve, QUERY_PAUSE_MS));
    }
    const loadRes = await upload;
    const summary = await loadRes.json();
    expect(loadRes.status, JSON.stringify(summary)).toBe(201);
    expect(summary.rows).toBe(ROWS);
    expect(mismatches).toBe(0);
    expect(latenciesMs.length).toBeGreaterThan(10);

    const after = await (await query()).json();
    expect(after.totals).toEqual(baseline.totals);
    const listed = (await (await fetch(`${server.url}/v1/catalogs/synthetic`)).json()) as { rows: number };
    expect(listed.rows).toBe(ROWS);

    const sorted = [...latenciesMs].sort((a, b) => a - b);
    const pct = (q: number) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))].toFixed(0);
    console.log(
      `[load-while-querying] ${ROWS} rows (${(bytes / 1e6).toFixed(0)} MB); ${sorted.length} queries during the load; ` +
        `latency p50 ${pct(0.5)} ms, p95 ${pct(0.95)} ms, max ${sorted[sorted.length - 1].toFixed(0)} ms`,
    );
  }, 1_200_000);
});
