import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../server/app.js';
import { loadServerConfig, type ServerConfigInput } from '../../server/config.js';
import type { AppServices } from '../../server/services/types.js';
import { ConflictError, DomainError, NotFoundError } from '../../src/errors.js';

/**
 * Test doubles for the plumbing tests: they record calls and answer with fixed shapes so auth,
 * limits and error mapping can be tested without the store or the engine. They carry no science;
 * the end-to-end tests (catalog-load, sightline-e2e) use the real services.
 */
export function recordingServices(): AppServices & { calls: string[]; closed: boolean } {
  const calls: string[] = [];
  const state = { calls, closed: false };
  return Object.assign(state, {
    store: {
      readiness: () => ({ open: !state.closed, migrationsApplied: true }),
      close: () => {
        state.closed = true;
      },
    },
    catalogs: {
      list: () => [{ name: 'alpha', rows: 3 }],
      show: (name: string) => {
        calls.push(`show ${name}`);
        if (name !== 'alpha') throw new NotFoundError('unknown_catalog', `No catalogue named ${name}`);
        return { name, rows: 3 };
      },
      drop: (name: string) => {
        calls.push(`drop ${name}`);
        return { rows: 3 };
      },
      load: async (request: { name: string; body: NodeJS.ReadableStream; mode: string }) => {
        let bytes = 0;
        for await (const chunk of request.body) bytes += (chunk as Buffer).length;
        calls.push(`load ${request.name} ${request.mode} ${bytes}`);
        if (request.name === 'taken') throw new ConflictError('catalog_exists', 'Catalogue taken exists');
        return { name: request.name, bytes };
      },
    },
    sightlines: {
      run: (request: unknown) => {
        const r = request as { ra: number; host_id?: string };
        calls.push(`sightline ${r.ra}`);
        if (r.host_id === 'explode') throw new Error('SELECT * FROM secret_table at /srv/private/path.db');
        if (r.host_id === 'outside') throw new DomainError('outside_validity', 'z outside the model range');
        const dm = { mean: 1, p2_5: 0, p16: 0.5, p50: 1, p84: 1.5, p97_5: 2 };
        return {
          sightline: {
            ra: r.ra,
            dec: 0,
            z_source: 0.5,
            z_source_err: 0,
            host_id: null,
            catalogs: null,
            velocity_window_dz: 0.005,
            z_foreground_max: 0.495,
            shells: 1,
            max_cone_deg: 1,
            rows_scanned: 1,
            n_behind: 0,
          },
          model: {},
          totals: { dm_halos: dm, n_candidates: 1, n_intersected: 1, draws: 10, seed: 1 },
          galaxies: [
            {
              id: 'g,1',
              catalog: 'alpha',
              ra: r.ra,
              dec: 0,
              z: 0.1,
              z_err: null,
              z_kind: 'spec',
              sep_arcsec: 10,
              b_kpc: 20,
              log_mstar: 10,
              log_mhalo: 11.5,
              r_halo_kpc: 150,
              b_over_rhalo: 0.13,
              concentration: 9,
              p_fg: 1,
              dm_central: 1,
              dm,
              p_contributes: 1,
              flags: ['a', 'b'],
            },
          ],
          environment: [],
          priorities: [],
          warnings: [],
        };
      },
    },
  });
}

export async function buildTestApp(
  overrides: Partial<ServerConfigInput> = {},
  services: AppServices = recordingServices(),
): Promise<FastifyInstance> {
  const config = loadServerConfig({}, { dbPath: ':memory:', logLevel: 'silent', ...overrides });
  return buildApp({ config, services, logger: false });
}
