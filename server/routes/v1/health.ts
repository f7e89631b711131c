import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { healthReply, readyReply } from '../../schemas/health.js';

/** GET /v1/health (process alive) and GET /v1/ready (database open, migrations applied). */
export const healthRoutes: FastifyPluginAsyncZod = async (app) => {
  app.get(
    '/v1/health',
    {
      config: { access: 'public' },
      schema: { tags: ['service'], summary: 'Liveness: the process answers', response: { 200: healthReply } },
    },
    async () => ({ status: 'ok' as const, uptimeS: process.uptime() }),
  );

  app.get(
    '/v1/ready',
    {
      config: { access: 'public' },
      schema: {
        tags: ['service'],
        summary: 'Readiness: the database is open and its migrations are applied',
        response: { 200: readyReply, 503: readyReply },
      },
    },
    async (_request, reply) => {
      const state = app.services.store.readiness();
      const ready = state.open && state.migrationsApplied;
      return reply.code(ready ? 200 : 503).send({ status: ready ? 'ready' : 'not_ready', database: state });
    },
  );
};
