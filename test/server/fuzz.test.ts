import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import type { InjectOptions } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoApp, demoRequest } from './demo-app.js';

/**
 * Robustness: thousands of random and mutated requests to every route must never produce a 5xx,
 * every 4xx must use the one error shape, and the server must still answer correctly afterwards.
 * Runs on the real store, loader and engine (invented demo field), with a small draw limit so
 * accepted requests stay quick. Seeded, so a failure is reproducible from the printed seed.
 */
const SEED = 20261202;

const validSightline = () => demoRequest({ draws: 20, max_search_deg: 0.3 });
const validBudget = () => ({
  dm_obs: 700,
  dm_obs_err: 0.5,
  dm_ism: 40,
  dm_ism_err: 5,
  z_source: 0.43,
  halos: { mean: 30, err: 10 },
  budget_model: { draws: 20 },
});

/** Replaces, deletes or adds one key somewhere in a JSON object. */
function mutate(base: unknown): fc.Arbitrary<unknown> {
  const paths: string[][] = [];
  const walk = (v: unknown, path: string[]) => {
    paths.push(path);
    if (v && typeof v === 'object' && !Array.isArray(v)) {
      for (const [k, child] of Object.entries(v)) walk(child, [...path, k]);
    }
  };
  walk(base, []);
  const weird = fc.oneof(
    fc.jsonValue(),
    fc.double({ noNaN: true, noDefaultInfinity: true }),
    fc.constantFrom(-1, 0, 360, 1e308, -1e308, 90.0000001, '', 'NaN', null, [], {}, true),
    fc.string(),
  );
  return fc
    .tuple(fc.constantFrom(...paths), fc.constantFrom('replace', 'delete', 'add'), weird, fc.string())
    .map(([path, op, value, newKey]) => {
      const copy = structuredClone(base) as Record<string, unknown>;
      if (path.length === 0) return op === 'replace' ? value : copy;
      let parent = copy as Record<string, unknown>;
      for (const key of path.slice(0, -1)) parent = parent[key] as Record<string, unknown>;
      const last = path[path.length - 1];
      if (op === 'replace') parent[last] = value;
      else if (op === 'delete') delete parent[last];
      else parent[newKey || 'extra'] = value;
      return copy;
    });
}

const contentTypes = fc.constantFrom(
  'application/json',
  'application/json; charset=utf-8',
  'text/plain',
  'application/x-ndjson',
  'application/octet-stream',
  'multipart/form-data; boundary=x',
  'application/json; charset=latin1',
);

describe('fuzzing every route', () => {
  let ctx: Awaited<ReturnType<typeof demoApp>>;
  const statuses = new Map<number, number>();
  beforeAll(async () => {
    ctx = await demoApp({
      maxDraws: 50,
      maxBatchLines: 20,
      uploadLimitBytes: 256 * 1024,
      writeRateLimitPerMinute: 100_000,
    });
  });
  afterAll(async () => ctx.cleanup());

  async function send(options: InjectOptions) {
    const res = await ctx.app.inject(options);
    statuses.set(res.statusCode, (statuses.get(res.statusCode) ?? 0) + 1);
    if (res.statusCode >= 500) {
      throw new Error(`${options.method} ${options.url} → ${res.statusCode}: ${res.body.slice(0, 300)}`);
    }
    if (res.statusCode >= 400 && res.statusCode !== 404) {
      const body = res.json();
      expect(typeof body.error?.code, res.body).toBe('string');
      expect(typeof body.error?.message, res.body).toBe('string');
    }
    return res;
  }

  /** For properties: send and discard the reply (fast-check wants void). */
  const hit = async (options: InjectOptions): Promise<void> => {
    await send(options);
  };

  const json = (url: string, payload: unknown): InjectOptions => ({
    method: 'POST',
    url,
    payload: JSON.stringify(payload),
    headers: { 'content-type': 'application/json' },
  });

  it('POST /v1/sightlines: random JSON, mutated valid bodies and raw bytes never give a 5xx', async () => {
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), (body) => hit(json('/v1/sightlines', body))),
      { numRuns: 500, seed: SEED },
    );
    await fc.assert(
      fc.asyncProperty(
        mutate(validSightline()),
        fc.constantFrom('', '?format=csv', '?format=xml'),
        (body, q) => hit(json(`/v1/sightlines${q}`, body)),
      ),
      { numRuns: 500, seed: SEED + 1 },
    );
    await fc.assert(
      fc.asyncProperty(fc.string({ unit: 'binary', maxLength: 300 }), contentTypes, (raw, type) =>
        hit({ method: 'POST', url: '/v1/sightlines', payload: raw, headers: { 'content-type': type } }),
      ),
      { numRuns: 300, seed: SEED + 2 },
    );
  }, 300_000);

  it('POST /v1/sightlines/batch: random lines never give a 5xx and every line is answered', async () => {
    const line = fc.oneof(
      mutate(validSightline()).map((b) => JSON.stringify(b)),
      fc.string({ maxLength: 80 }),
      fc.jsonValue().map((v) => JSON.stringify(v)),
    );
    await fc.assert(
      fc.asyncProperty(fc.array(line, { maxLength: 6 }), contentTypes, async (lines, type) => {
        const payload = lines.join('\n');
        const res = await send({
          method: 'POST',
          url: '/v1/sightlines/batch',
          payload,
          headers: { 'content-type': type },
        });
        if (res.statusCode === 200) {
          const expected = payload.split(/\r\n|\r|\n/).filter((l) => l.trim() !== '').length;
          const answered = res.body.split('\n').filter((l) => l !== '');
          expect(answered).toHaveLength(expected);
          for (const l of answered) expect(Object.keys(JSON.parse(l))).toContain('line');
        }
      }),
      { numRuns: 200, seed: SEED + 3 },
    );
  }, 300_000);

  it('POST /v1/budgets: random and mutated bodies never give a 5xx', async () => {
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), (body) => hit(json('/v1/budgets', body))),
      { numRuns: 300, seed: SEED + 4 },
    );
    await fc.assert(
      fc.asyncProperty(mutate(validBudget()), (body) => hit(json('/v1/budgets', body))),
      { numRuns: 400, seed: SEED + 5 },
    );
  });

  it('catalogue routes: random names, queries, methods and small bodies never give a 5xx', async () => {
    const name = fc.oneof(
      fc.constantFrom('kestrel-spec', 'kestrel-photo', 'x', '..', '%2e%2e', 'a'.repeat(80), '%00', 'é'),
      fc.string({ maxLength: 20 }).map(encodeURIComponent),
    );
    const query = fc
      .dictionary(
        fc.constantFrom('format', 'map', 'skip_invalid', 'mode', 'file_name', 'zzz'),
        fc.oneof(
          fc.string({ maxLength: 12 }),
          fc.constantFrom('csv', 'fits', 'replace', 'append', 'true', 'ra=x'),
        ),
        { maxKeys: 3 },
      )
      .map((d) => new URLSearchParams(d).toString());
    await fc.assert(
      fc.asyncProperty(fc.constantFrom('GET', 'DELETE' as const), name, query, (method, n, q) =>
        hit({ method: method as 'GET' | 'DELETE', url: `/v1/catalogs/fuzz-${n}?${q}` }),
      ),
      { numRuns: 400, seed: SEED + 6 },
    );
    // PUT with invalid names or queries: rejected before any load starts.
    await fc.assert(
      fc.asyncProperty(name, query, fc.string({ maxLength: 200 }), (n, q, body) =>
        hit({ method: 'PUT', url: `/v1/catalogs/${n}?${q}&mode=bogus`, payload: body }),
      ),
      { numRuns: 200, seed: SEED + 7 },
    );
    // PUT with random small files: each reaches the loader in its worker thread (fewer runs: each starts a thread).
    const csvish = fc
      .array(fc.array(fc.oneof(fc.string({ maxLength: 8 }), fc.double().map(String)), { maxLength: 8 }), {
        maxLength: 6,
      })
      .map((rows) => ['id,ra,dec,z,z_kind,log_mstar', ...rows.map((r) => r.join(','))].join('\n'));
    await fc.assert(
      fc.asyncProperty(
        csvish,
        fc.constantFrom('', 'skip_invalid=true', 'format=tsv', 'format=fits'),
        (body, q) => hit({ method: 'PUT', url: `/v1/catalogs/fuzzload?mode=replace&${q}`, payload: body }),
      ),
      { numRuns: 15, seed: SEED + 8 },
    );
  }, 300_000);

  it('after the fuzzing the server still answers the demo sightline exactly as before', async () => {
    const fresh = await demoApp({ maxDraws: 50 });
    try {
      const expected = (await fresh.app.inject(json('/v1/sightlines', validSightline()))).json();
      const res = await ctx.app.inject(json('/v1/sightlines', validSightline()));
      expect(res.statusCode).toBe(200);
      expect(res.json().totals).toEqual(expected.totals);
      expect((await ctx.app.inject({ method: 'GET', url: '/v1/health' })).statusCode).toBe(200);
      const file = readFileSync(new URL('../../fixtures/demo/kestrel_groups.csv', import.meta.url));
      const put = await ctx.app.inject({ method: 'PUT', url: '/v1/catalogs/after-fuzz', payload: file });
      expect(put.statusCode).toBe(201);
    } finally {
      await fresh.cleanup();
    }
    const total = [...statuses.values()].reduce((s, n) => s + n, 0);
    expect(total).toBeGreaterThan(2500);
    expect([...statuses.keys()].every((s) => s < 500)).toBe(true);
  });
});
