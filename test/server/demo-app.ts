import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { FastifyInstance } from 'fastify';
import { DEMO_BURST } from '../../scripts/demo/make-field.js';
import { buildApp } from '../../server/app.js';
import { loadServerConfig, type ServerConfigInput } from '../../server/config.js';
import { createServices } from '../../server/services/index.js';

export { DEMO_BURST };

export const DEMO_FILES = [
  ['kestrel-spec', 'kestrel_spec.csv'],
  ['kestrel-photo', 'kestrel_photo.csv'],
  ['kestrel-groups', 'kestrel_groups.csv'],
] as const;

/** The demo sightline request (invented field and burst, see scripts/demo/make-field.ts). */
export const demoRequest = (model: Record<string, unknown> = {}) => ({
  ra: DEMO_BURST.raDeg,
  dec: DEMO_BURST.decDeg,
  z_source: DEMO_BURST.zSource,
  host_id: DEMO_BURST.hostId,
  model: { draws: 200, seed: 11, ...model },
});

/**
 * A real app (real store, loader and engine) on a fresh temporary database, with the invented demo
 * field loaded through PUT /v1/catalogs. `cleanup` closes the app and deletes the folder.
 */
export async function demoApp(overrides: Partial<ServerConfigInput> = {}) {
  const dir = mkdtempSync(join(tmpdir(), 'forehalo-demo-'));
  const dbPath = join(dir, 'demo.db');
  const config = loadServerConfig({}, { dbPath, logLevel: 'silent', ...overrides });
  const app: FastifyInstance = await buildApp({
    config,
    services: await createServices(config),
    logger: false,
  });
  for (const [name, file] of DEMO_FILES) {
    const res = await app.inject({
      method: 'PUT',
      url: `/v1/catalogs/${name}?file_name=${file}`,
      payload: readFileSync(new URL(`../../fixtures/demo/${file}`, import.meta.url)),
      headers: {
        'content-type': 'text/csv',
        ...(config.apiKey ? { authorization: `Bearer ${config.apiKey}` } : {}),
      },
    });
    if (res.statusCode !== 201) throw new Error(`demo load of ${file} failed: ${res.body}`);
  }
  return {
    app,
    dir,
    dbPath,
    config,
    cleanup: async () => {
      await app.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
