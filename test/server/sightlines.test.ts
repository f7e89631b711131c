import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runSightline, sightlineResponseSchema } from '../../src/sightline/index.js';
import { coneSearch, openStore } from '../../src/store/index.js';
import { demoApp, demoRequest } from './demo-app.js';

describe('POST /v1/sightlines on the invented demo field', () => {
  let ctx: Awaited<ReturnType<typeof demoApp>>;
  beforeAll(async () => {
    ctx = await demoApp();
  });
  afterAll(async () => ctx.cleanup());

  const post = (body: unknown, url = '/v1/sightlines') =>
    ctx.app.inject({ method: 'POST', url, payload: body as object });

  it('answers with the engine result unchanged (same numbers as calling the engine directly)', async () => {
    const res = await post(demoRequest());
    expect(res.statusCode, res.body).toBe(200);
    const reply = res.json();
    const store = openStore(ctx.dbPath, { readonly: true });
    const direct = runSightline({ coneSearch: (q) => coneSearch(store, q) }, demoRequest());
    store.close();
    expect(reply).toEqual(JSON.parse(JSON.stringify(direct)));
    // The route writes the engine's reply without re-validating it: the reply must match the
    // documented schema (the OpenAPI one) all the same.
    expect(sightlineResponseSchema.safeParse(reply).error).toBeUndefined();
    expect(reply.galaxies.length).toBeGreaterThan(0);
    expect(reply.totals.draws).toBe(200);
    expect(reply.totals.seed).toBe(11);
  });

  it('the same request twice gives the same numbers (seeded)', async () => {
    const a = (await post(demoRequest())).json();
    const b = (await post(demoRequest())).json();
    expect(b.totals).toEqual(a.totals);
  });

  it('include_draws returns one total per draw, consistent with the reported percentiles', async () => {
    const reply = (await post({ ...demoRequest(), include_draws: true })).json();
    expect(reply.draws_dm).toHaveLength(200);
    const sorted = [...reply.draws_dm].sort((x: number, y: number) => x - y);
    expect(reply.totals.dm_halos.p50).toBeGreaterThanOrEqual(sorted[0]);
    expect(reply.totals.dm_halos.p50).toBeLessThanOrEqual(sorted[199]);
    const mean = sorted.reduce((s: number, v: number) => s + v, 0) / sorted.length;
    expect(reply.totals.dm_halos.mean).toBeCloseTo(mean, 6);
  });

  it('?format=csv has one row per galaxy of the JSON answer, with units in the header', async () => {
    const json = (await post(demoRequest())).json();
    const csv = await post(demoRequest(), '/v1/sightlines?format=csv');
    expect(csv.statusCode).toBe(200);
    const lines = csv.body.trim().split('\r\n');
    expect(lines).toHaveLength(json.galaxies.length + 1);
    expect(lines[0]).toContain('dm_p50 [pc cm^-3]');
    const firstId = lines[1].split(',')[0];
    expect(json.galaxies.map((g: { id: string }) => g.id)).toContain(firstId.replaceAll('"', ''));
  });

  it('the NDJSON batch gives, line by line, the same answers as single requests', async () => {
    const requests = [demoRequest(), demoRequest({ shmr: 'behroozi2013' }), { ...demoRequest(), ra: 162.7 }];
    const res = await ctx.app.inject({
      method: 'POST',
      url: '/v1/sightlines/batch',
      payload: requests.map((r) => JSON.stringify(r)).join('\n'),
      headers: { 'content-type': 'application/x-ndjson' },
    });
    const lines = res.body
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    expect(lines).toHaveLength(3);
    for (const [i, request] of requests.entries()) {
      const single = (await post(request)).json();
      expect(lines[i].line).toBe(i + 1);
      expect(lines[i].result.totals).toEqual(single.totals);
    }
  });

  it('an unknown catalogue in the request is a 4xx naming it', async () => {
    const res = await post({ ...demoRequest(), catalogs: ['no-such-catalogue'] });
    expect(res.statusCode).toBeGreaterThanOrEqual(400);
    expect(res.statusCode).toBeLessThan(500);
    expect(res.json().error.message).toContain('no-such-catalogue');
  });

  it('ready reports the database open and migrated', async () => {
    const res = await ctx.app.inject({ method: 'GET', url: '/v1/ready' });
    expect(res.json()).toEqual({ status: 'ready', database: { open: true, migrationsApplied: true } });
  });
});
