import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../server/app.js';
import { loadServerConfig } from '../../server/config.js';
import { createCatalogService } from '../../server/services/catalogs.js';
import { openStore, type Store } from '../../src/store/index.js';
import { recordingServices } from './helpers.js';

const demo = (file: string) => readFileSync(new URL(`../../fixtures/demo/${file}`, import.meta.url));

describe('catalogue routes on a real store', () => {
  let dir: string;
  let store: Store;
  let app: FastifyInstance;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'forehalo-catalogs-'));
    const dbPath = join(dir, 'test.db');
    store = openStore(dbPath);
    const config = loadServerConfig({}, { dbPath, logLevel: 'silent', uploadLimitBytes: 100_000 });
    const services = {
      ...recordingServices(),
      store: {
        readiness: () => ({ open: store.db.open, migrationsApplied: true }),
        close: () => store.close(),
      },
      catalogs: createCatalogService(store, dbPath),
    };
    app = await buildApp({ config, services, logger: false });
  });
  afterAll(async () => {
    await app.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('a PUT streams the file into a worker-thread load and answers 201 with the summary', async () => {
    const res = await app.inject({
      method: 'PUT',
      url: '/v1/catalogs/kestrel-spec?file_name=kestrel_spec.csv',
      payload: demo('kestrel_spec.csv'),
      headers: { 'content-type': 'text/csv' },
    });
    expect(res.statusCode, res.body).toBe(201);
    const summary = res.json();
    expect(summary.name).toBe('kestrel-spec');
    expect(summary.rows).toBe(420); // the file's data rows (422 lines minus comment and header)
    const list = (await app.inject({ method: 'GET', url: '/v1/catalogs' })).json();
    expect(list.catalogs.map((c: { name: string }) => c.name)).toEqual(['kestrel-spec']);
    const one = (await app.inject({ method: 'GET', url: '/v1/catalogs/kestrel-spec' })).json();
    expect(one.rows).toBe(420);
    expect(one.sourceFile).toBe('kestrel_spec.csv');
  });

  it('creating a catalogue that exists from a different file is a 409', async () => {
    const res = await app.inject({
      method: 'PUT',
      url: '/v1/catalogs/kestrel-spec',
      payload: demo('kestrel_groups.csv'),
      headers: { 'content-type': 'text/csv' },
    });
    expect(res.statusCode).toBe(409);
    expect(res.json().error.code).toBe('catalog_exists');
  });

  it('a file with a bad row is refused with the line and field named, and nothing is stored', async () => {
    const bad = 'id,ra,dec,z,z_kind,log_mstar\nA1,10.0,5.0,0.2,spec,10.1\nA2,10.1,95.0,0.3,spec,10.2\n';
    const res = await app.inject({
      method: 'PUT',
      url: '/v1/catalogs/broken',
      payload: bad,
      headers: { 'content-type': 'text/csv' },
    });
    expect(res.statusCode).toBe(400);
    const err = res.json().error;
    expect(err.code).toBe('invalid_rows');
    expect(err.message).toMatch(/dec/);
    expect(err.message).toMatch(/line 3|row 2|:3/);
    expect((await app.inject({ method: 'GET', url: '/v1/catalogs/broken' })).statusCode).toBe(404);
  });

  it('an upload over the limit is a 413 and leaves no catalogue', async () => {
    const big = demo('kestrel_photo.csv');
    expect(big.length).toBeGreaterThan(100_000);
    const res = await app.inject({
      method: 'PUT',
      url: '/v1/catalogs/too-big',
      payload: big,
      headers: { 'content-type': 'text/csv' },
    });
    expect(res.statusCode).toBe(413);
    expect((await app.inject({ method: 'GET', url: '/v1/catalogs/too-big' })).statusCode).toBe(404);
  });

  it('a chunked upload without Content-Length is cut off at the limit while streaming', async () => {
    const big = demo('kestrel_photo.csv');
    const res = await app.inject({
      method: 'PUT',
      url: '/v1/catalogs/too-big-stream',
      payload: Readable.from([big.subarray(0, 60_000), big.subarray(60_000)]),
      headers: { 'content-type': 'text/csv' },
    });
    expect(res.statusCode).toBe(413);
    expect(res.json().error.code).toBe('body_too_large');
    expect((await app.inject({ method: 'GET', url: '/v1/catalogs/too-big-stream' })).statusCode).toBe(404);
  });

  it('an empty body is a 400 naming the problem', async () => {
    const res = await app.inject({
      method: 'PUT',
      url: '/v1/catalogs/empty',
      headers: { 'content-type': 'text/csv' },
    });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.code).toBe('empty_upload');
  });

  it('DELETE drops the catalogue and a second DELETE is a 404', async () => {
    expect((await app.inject({ method: 'DELETE', url: '/v1/catalogs/kestrel-spec' })).statusCode).toBe(200);
    expect((await app.inject({ method: 'DELETE', url: '/v1/catalogs/kestrel-spec' })).statusCode).toBe(404);
  });
});
