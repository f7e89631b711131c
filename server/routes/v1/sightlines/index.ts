import { type FastifyPluginAsyncZod, serializerCompiler } from 'fastify-type-provider-zod';
import { type GalaxyResult, galaxyTableCsv } from '../../../../src/sightline/index.js';
import type { ServerConfig } from '../../../config.js';
import { errorBody } from '../../../schemas/primitives.js';
import { sightlineQuery, sightlineReply, sightlineRequest } from '../../../schemas/sightline.js';
import { batchRoute } from './batch.js';
import { checkDrawLimit } from './draw-limit.js';

/** POST /v1/sightlines (one sightline) and POST /v1/sightlines/batch (NDJSON in, NDJSON out). */
export const sightlineRoutes: FastifyPluginAsyncZod<{ config: ServerConfig }> = async (app, { config }) => {
  app.post(
    '/v1/sightlines',
    {
      config: { access: 'read' },
      schema: {
        tags: ['sightlines'],
        summary: 'Foreground haloes of one burst sightline and their DM with Monte Carlo uncertainties',
        description:
          'Model-dependent estimate: results depend on the SHMR, gas profile, f_hot and extent chosen ' +
          '(echoed in `model`) and are valid only within the published ranges of those relations; ' +
          'see `warnings` and each galaxy’s `flags`. `?format=csv` returns the galaxy table only.',
        querystring: sightlineQuery,
        body: sightlineRequest,
        response: { 200: sightlineReply, 400: errorBody, 401: errorBody, 404: errorBody, 413: errorBody },
      },
      // The 200 reply is the engine's own typed result (sightlineResponseSchema, checked in the tests);
      // re-validating it per request costs 0.05–0.3 ms on a 2–5 kB answer and several ms on a
      // deep field's 200 kB one, so it is written with JSON.stringify. Errors keep the zod serializer.
      serializerCompiler: (def) =>
        def.httpStatus === '200'
          ? (data: unknown) => JSON.stringify(data)
          : serializerCompiler(def as unknown as Parameters<typeof serializerCompiler>[0]),
    },
    async (request, reply) => {
      checkDrawLimit(request.body.model?.draws, config.maxDraws, 'body.model.draws');
      const result = (await app.services.sightlines.run(request.body)) as Record<string, unknown>;
      if (request.query.format === 'csv') {
        const galaxies = (result.galaxies ?? []) as GalaxyResult[];
        return reply
          .type('text/csv; charset=utf-8')
          .header('content-disposition', 'attachment; filename="sightline-galaxies.csv"')
          .serializer((payload: unknown) => payload as string)
          .send(galaxyTableCsv(galaxies) as never);
      }
      return reply.send(result as never);
    },
  );

  await app.register(batchRoute, { config });
};
