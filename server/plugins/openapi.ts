import swagger from '@fastify/swagger';
import swaggerUi from '@fastify/swagger-ui';
import type { FastifyInstance } from 'fastify';
import fp from 'fastify-plugin';
import { jsonSchemaTransform } from 'fastify-type-provider-zod';

/**
 * OpenAPI 3 document generated from the routes' zod schemas, served at /v1/openapi.json, and the
 * interactive reference at /v1/docs. Register before the routes so it sees them.
 */
export const openapiPlugin = fp(
  async (app: FastifyInstance, options: { version: string }) => {
    await app.register(swagger, {
      openapi: {
        openapi: '3.0.3',
        info: {
          title: 'forehalo HTTP API',
          version: options.version,
          description:
            'Foreground-halo dispersion measure for burst sightlines. Halo DM estimates depend on the ' +
            'chosen stellar-to-halo mass relation, gas profile, hot-gas fraction and extent; treat them ' +
            'as model-dependent, and read the warnings in every reply.',
        },
        components: {
          securitySchemes: { apiKey: { type: 'http', scheme: 'bearer', description: 'FOREHALO_API_KEY' } },
        },
      },
      transform: jsonSchemaTransform,
    });
    // The interactive docs are public even when reads are protected.
    app.addHook('onRoute', (route) => {
      if (route.url.startsWith('/v1/docs')) route.config = { ...(route.config ?? {}), access: 'public' };
    });
    await app.register(swaggerUi, { routePrefix: '/v1/docs', uiConfig: { docExpansion: 'list' } });
    app.get('/v1/openapi.json', { schema: { hide: true }, config: { access: 'public' } }, async () =>
      app.swagger(),
    );
  },
  { name: 'forehalo-openapi' },
);
