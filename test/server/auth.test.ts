import { createHash } from 'node:crypto';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { keyMatches } from '../../server/plugins/auth.js';
import { buildTestApp, recordingServices } from './helpers.js';

const KEY = 'correct-horse-battery-staple';
const body = JSON.stringify({ ra: 10, dec: 0, z_source: 0.5 });
const json = { 'content-type': 'application/json' };

describe('API key on writes', () => {
  let app: FastifyInstance;
  const services = recordingServices();
  beforeAll(async () => {
    app = await buildTestApp({ apiKey: KEY }, services);
  });
  afterAll(async () => app.close());

  it('a write without a key is refused with 401 and nothing is loaded', async () => {
    const res = await app.inject({ method: 'PUT', url: '/v1/catalogs/alpha', payload: 'x\n' });
    expect(res.statusCode).toBe(401);
    expect(res.json().error.code).toBe('unauthorized');
    expect(services.calls.some((c) => c.startsWith('load'))).toBe(false);
  });

  it('a write with a wrong key is refused, one with the right key is accepted', async () => {
    const wrong = await app.inject({
      method: 'DELETE',
      url: '/v1/catalogs/alpha',
      headers: { authorization: 'Bearer not-the-key-at-all' },
    });
    expect(wrong.statusCode).toBe(401);
    const right = await app.inject({
      method: 'DELETE',
      url: '/v1/catalogs/alpha',
      headers: { authorization: `Bearer ${KEY}` },
    });
    expect(right.statusCode).toBe(200);
    expect(services.calls).toContain('drop alpha');
  });

  it('reads stay open when reads are not protected', async () => {
    const res = await app.inject({ method: 'POST', url: '/v1/sightlines', payload: body, headers: json });
    expect(res.statusCode).toBe(200);
    expect((await app.inject({ method: 'GET', url: '/v1/catalogs' })).statusCode).toBe(200);
  });

  it('the key comparison is by digest, so keys of different length simply do not match', () => {
    const expected = createHash('sha256').update(KEY).digest();
    expect(keyMatches(KEY, expected)).toBe(true);
    expect(keyMatches('short', expected)).toBe(false);
    expect(keyMatches(`${KEY}x`, expected)).toBe(false);
  });
});

describe('API key on reads when reads are protected', () => {
  let app: FastifyInstance;
  beforeAll(async () => {
    app = await buildTestApp({ apiKey: KEY, protectReads: true });
  });
  afterAll(async () => app.close());

  it('queries need the key but health, readiness and the OpenAPI document do not', async () => {
    const res = await app.inject({ method: 'POST', url: '/v1/sightlines', payload: body, headers: json });
    expect(res.statusCode).toBe(401);
    const ok = await app.inject({
      method: 'POST',
      url: '/v1/sightlines',
      payload: body,
      headers: { ...json, authorization: `Bearer ${KEY}` },
    });
    expect(ok.statusCode).toBe(200);
    for (const url of ['/v1/health', '/v1/ready', '/v1/openapi.json']) {
      expect((await app.inject({ method: 'GET', url })).statusCode, url).toBe(200);
    }
  });
});

describe('write rate limit', () => {
  it('the third write in a minute over a limit of two is a 429 with a JSON error', async () => {
    const app = await buildTestApp({ writeRateLimitPerMinute: 2 });
    const codes: number[] = [];
    for (let i = 0; i < 3; i++) {
      codes.push((await app.inject({ method: 'DELETE', url: '/v1/catalogs/alpha' })).statusCode);
    }
    const last = await app.inject({ method: 'DELETE', url: '/v1/catalogs/alpha' });
    expect(codes).toEqual([200, 200, 429]);
    expect(last.json().error.code).toBe('rate_limited');
    // reads are not rate limited
    expect((await app.inject({ method: 'GET', url: '/v1/catalogs' })).statusCode).toBe(200);
    await app.close();
  });
});
