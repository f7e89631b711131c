import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, recordingServices } from './helpers.js';

describe('health, readiness and the OpenAPI document', () => {
  let app: FastifyInstance;
  const services = recordingServices();
  beforeAll(async () => {
    app = await buildTestApp({}, services);
  });
  afterAll(async () => app.close());

  it('health answers ok with the uptime', async () => {
    const res = await app.inject({ method: 'GET', url: '/v1/health' });
    expect(res.statusCode).toBe(200);
    expect(res.json().status).toBe('ok');
  });

  it('ready reports the database state and 503 when it is closed', async () => {
    expect((await app.inject({ method: 'GET', url: '/v1/ready' })).json().status).toBe('ready');
    services.closed = true;
    const res = await app.inject({ method: 'GET', url: '/v1/ready' });
    services.closed = false;
    expect(res.statusCode).toBe(503);
    expect(res.json().database.open).toBe(false);
  });

  it('the OpenAPI 3 document lists every route with its method', async () => {
    const doc = (await app.inject({ method: 'GET', url: '/v1/openapi.json' })).json();
    expect(doc.openapi).toMatch(/^3\./);
    const expected: Record<string, string[]> = {
      '/v1/health': ['get'],
      '/v1/ready': ['get'],
      '/v1/catalogs': ['get'],
      '/v1/catalogs/{name}': ['get', 'put', 'delete'],
      '/v1/sightlines': ['post'],
      '/v1/sightlines/batch': ['post'],
      '/v1/budgets': ['post'],
    };
    for (const [path, methods] of Object.entries(expected)) {
      expect(Object.keys(doc.paths[path] ?? {}).sort(), path).toEqual([...methods].sort());
    }
    for (const path of Object.keys(doc.paths)) expect(path.startsWith('/v1/'), path).toBe(true);
  });

  it('the OpenAPI document carries the request schema with its ranges', async () => {
    const doc = (await app.inject({ method: 'GET', url: '/v1/openapi.json' })).json();
    const body = doc.paths['/v1/sightlines'].post.requestBody.content['application/json'].schema;
    expect(body.required).toEqual(expect.arrayContaining(['ra', 'dec', 'z_source']));
    expect(body.properties.dec.minimum).toBe(-90);
    expect(body.properties.dec.maximum).toBe(90);
    expect(body.properties.model).toBeDefined();
  });

  it('the interactive docs are served under /v1/docs', async () => {
    const res = await app.inject({ method: 'GET', url: '/v1/docs/' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toContain('text/html');
  });

  it('every reply carries a request id header, and a client id is echoed', async () => {
    const res = await app.inject({
      method: 'GET',
      url: '/v1/health',
      headers: { 'x-request-id': 'abc-123' },
    });
    expect(res.headers['x-request-id']).toBe('abc-123');
  });
});

describe('sightline output formats', () => {
  let app: FastifyInstance;
  beforeAll(async () => {
    app = await buildTestApp();
  });
  afterAll(async () => app.close());

  it('?format=csv returns the galaxy table with units in the header and quoted fields', async () => {
    const res = await app.inject({
      method: 'POST',
      url: '/v1/sightlines?format=csv',
      payload: { ra: 10, dec: 0, z_source: 0.5 },
    });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toContain('text/csv');
    const [header, row] = res.body.trim().split('\r\n');
    expect(header).toContain('b [kpc]');
    expect(header).toContain('dm_p50 [pc cm^-3]');
    expect(row.startsWith('"g,1",alpha,10,')).toBe(true);
    expect(row.endsWith('a;b')).toBe(true);
  });

  it('the batch route answers each NDJSON line in order and reports bad lines without stopping', async () => {
    const lines = [
      JSON.stringify({ ra: 1, dec: 0, z_source: 0.5 }),
      '{not json',
      '',
      JSON.stringify({ ra: 400, dec: 0, z_source: 0.5 }),
      JSON.stringify({ ra: 2, dec: 0, z_source: 0.5 }),
    ].join('\n');
    const res = await app.inject({
      method: 'POST',
      url: '/v1/sightlines/batch',
      payload: lines,
      headers: { 'content-type': 'application/x-ndjson' },
    });
    expect(res.statusCode).toBe(200);
    const out = res.body
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    expect(out.map((o) => o.line)).toEqual([1, 2, 4, 5]);
    expect(out[0].result.sightline.ra).toBe(1);
    expect(out[1].error.code).toBe('malformed_json');
    expect(out[2].error.details.issues[0].field).toBe('body.ra');
    expect(out[3].result.sightline.ra).toBe(2);
  });

  it('a batch longer than the line limit ends with a batch_too_long line', async () => {
    const small = await buildTestApp({ maxBatchLines: 2 });
    const line = JSON.stringify({ ra: 1, dec: 0, z_source: 0.5 });
    const res = await small.inject({
      method: 'POST',
      url: '/v1/sightlines/batch',
      payload: [line, line, line].join('\n'),
      headers: { 'content-type': 'application/x-ndjson' },
    });
    const out = res.body
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    expect(out).toHaveLength(3);
    expect(out[2].error.code).toBe('batch_too_long');
    await small.close();
  });
});

describe('batch body limit', () => {
  it('a batch body over the limit, even one long line, ends with a body_too_large line', async () => {
    const app = await buildTestApp({ bodyLimitBytes: 4096 });
    const res = await app.inject({
      method: 'POST',
      url: '/v1/sightlines/batch',
      payload: `${JSON.stringify({ ra: 1, dec: 0, z_source: 0.5 })}\n${'x'.repeat(50_000)}`,
      headers: { 'content-type': 'application/x-ndjson' },
    });
    expect(res.statusCode).toBe(200);
    const out = res.body
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    expect(out[out.length - 1].error.code).toBe('body_too_large');
    await app.close();
  });
});
