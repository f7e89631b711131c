import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, recordingServices } from './helpers.js';

describe('error replies', () => {
  let app: FastifyInstance;
  beforeAll(async () => {
    app = await buildTestApp({}, recordingServices());
  });
  afterAll(async () => app.close());

  const post = (payload: unknown, headers: Record<string, string> = {}) =>
    app.inject({
      method: 'POST',
      url: '/v1/sightlines',
      payload: typeof payload === 'string' ? payload : JSON.stringify(payload),
      headers: { 'content-type': 'application/json', ...headers },
    });

  it('malformed JSON is a 400 with code malformed_json', async () => {
    const res = await post('{"ra": 1,');
    expect(res.statusCode).toBe(400);
    expect(res.json().error.code).toBe('malformed_json');
  });

  it('a wrong type names the field and the reason', async () => {
    const res = await post({ ra: 'ten', dec: 0, z_source: 0.5 });
    expect(res.statusCode).toBe(400);
    const body = res.json();
    expect(body.error.code).toBe('invalid_request');
    expect(body.error.details.issues[0].field).toBe('body.ra');
    expect(body.error.message).toContain('body.ra');
  });

  it('right ascension 360 and declination 91 are out of range', async () => {
    const res = await post({ ra: 360, dec: 91, z_source: 0.5 });
    expect(res.statusCode).toBe(400);
    const fields = res.json().error.details.issues.map((i: { field: string }) => i.field);
    expect(fields).toEqual(expect.arrayContaining(['body.ra', 'body.dec']));
  });

  it('z_source of zero is rejected with its own reason', async () => {
    const res = await post({ ra: 10, dec: 0, z_source: 0 });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.details.issues[0].field).toBe('body.z_source');
  });

  it('an unknown model name names the model key', async () => {
    const res = await post({ ra: 10, dec: 0, z_source: 0.5, model: { shmr: 'nonesuch' } });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.details.issues[0].field).toBe('body.model.shmr');
  });

  it('more draws than the server allows is a 400 naming model.draws', async () => {
    const res = await post({ ra: 10, dec: 0, z_source: 0.5, model: { draws: 50_000 } });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.code).toBe('too_many_draws');
    expect(res.json().error.message).toContain('body.model.draws');
  });

  it('an unknown key in the body is rejected rather than ignored', async () => {
    const res = await post({ ra: 10, dec: 0, z_source: 0.5, zsource: 1 });
    expect(res.statusCode).toBe(400);
  });

  it('an unexpected failure is a generic 500 that leaks no SQL, path or stack', async () => {
    const res = await post({ ra: 10, dec: 0, z_source: 0.5, host_id: 'explode' });
    expect(res.statusCode).toBe(500);
    const text = res.body;
    expect(text).not.toMatch(/SELECT|secret|\/srv|at .*\.ts/);
    expect(res.json().error.code).toBe('internal');
    expect(res.json().error.message).toContain(res.headers['x-request-id']);
  });

  it('a DomainError from the engine becomes a 400 with its code', async () => {
    const res = await post({ ra: 10, dec: 0, z_source: 0.5, host_id: 'outside' });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.code).toBe('outside_validity');
  });

  it('an unknown catalogue is a 404 and a taken name a 409', async () => {
    const missing = await app.inject({ method: 'GET', url: '/v1/catalogs/nope' });
    expect(missing.statusCode).toBe(404);
    expect(missing.json().error.code).toBe('unknown_catalog');
    const taken = await app.inject({ method: 'PUT', url: '/v1/catalogs/taken', payload: 'a,b\n1,2\n' });
    expect(taken.statusCode).toBe(409);
  });

  it('a catalogue name with a slash or leading dot is rejected', async () => {
    const res = await app.inject({ method: 'GET', url: '/v1/catalogs/.hidden' });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.details.issues[0].field).toBe('params.name');
  });

  it('an unknown route is a JSON 404', async () => {
    const res = await app.inject({ method: 'GET', url: '/v1/nothing-here' });
    expect(res.statusCode).toBe(404);
    expect(res.json().error.code).toBe('no_route');
  });

  it('a JSON body over the limit is a 413', async () => {
    const res = await post({ ra: 10, dec: 0, z_source: 0.5, host_id: 'x'.repeat(2 * 1024 * 1024) });
    expect(res.statusCode).toBe(413);
    expect(res.json().error.code).toBe('body_too_large');
  });
});

describe('file-system paths never reach an error body', () => {
  it('an InputError mentioning a server path is shown with the path replaced', async () => {
    const { describeError } = await import('../../server/plugins/error-handler.js');
    const { InputError } = await import('../../src/errors.js');
    const err = new InputError('bad_file', 'cannot read /tmp/forehalo-http-abc/upload: gone', {
      file: '/srv/data/x.db',
      where: { line: 3 },
    });
    const { status, body } = describeError(err, 'id');
    expect(status).toBe(400);
    expect(body.error.message).toBe('cannot read [path]: gone');
    expect(body.error.details).toEqual({ file: '[path]', where: { line: 3 } });
  });

  it('units, ratios and API routes in messages are left alone', async () => {
    const { redactPaths } = await import('../../server/redact.js');
    expect(redactPaths('DM must be ≤ 100000 pc cm⁻³; b/r_halo = 2')).toBe(
      'DM must be ≤ 100000 pc cm⁻³; b/r_halo = 2',
    );
    expect(redactPaths('see /v1/catalogs/kestrel-spec')).toBe('see /v1/catalogs/kestrel-spec');
  });
});
