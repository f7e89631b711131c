import { randomUUID } from 'node:crypto';
import Fastify, { type FastifyInstance, type FastifyServerOptions } from 'fastify';
import { serializerCompiler, validatorCompiler, type ZodTypeProvider } from 'fastify-type-provider-zod';
import type { ServerConfig } from './config.js';
import { authPlugin } from './plugins/auth.js';
import { errorHandlerPlugin } from './plugins/error-handler.js';
import { openapiPlugin } from './plugins/openapi.js';
import { rateLimitPlugin } from './plugins/rate-limit.js';
import { servicesPlugin } from './plugins/services.js';
import { webPlugin } from './plugins/web.js';
import { v1Routes } from './routes/v1/index.js';
import type { AppServices } from './services/types.js';

export const API_VERSION = '1.0.0';

export interface BuildAppOptions {
  config: ServerConfig;
  /** The store and engines the routes call (services/index.ts builds the real ones). */
  services: AppServices;
  /** Fastify logger setting; server.ts passes pino options, tests usually pass false. */
  logger?: FastifyServerOptions['logger'];
  /** Serve the web view at `/` (default true). */
  web?: boolean;
}

/**
 * Builds the whole HTTP app from plugins and routes. Never listens: server.ts does that, tests use
 * `app.inject`. Errors from any route go through the one error handler.
 */
export async function buildApp(options: BuildAppOptions): Promise<FastifyInstance> {
  const { config } = options;
  const app = Fastify({
    logger: options.logger ?? false,
    bodyLimit: config.bodyLimitBytes,
    requestTimeout: config.requestTimeoutMs,
    return503OnClosing: true,
    forceCloseConnections: 'idle',
    requestIdHeader: 'x-request-id',
    genReqId: () => randomUUID(),
    routerOptions: { maxParamLength: 200 },
  }).withTypeProvider<ZodTypeProvider>();

  app.addHook('onSend', async (request, reply) => {
    reply.header('x-request-id', request.id);
  });
  app.setValidatorCompiler(validatorCompiler);
  app.setSerializerCompiler(serializerCompiler);

  await app.register(errorHandlerPlugin);
  await app.register(servicesPlugin, { services: options.services });
  await app.register(authPlugin, { apiKey: config.apiKey, protectReads: config.protectReads });
  await app.register(rateLimitPlugin, { writesPerMinute: config.writeRateLimitPerMinute });
  await app.register(openapiPlugin, { version: API_VERSION });
  await app.register(v1Routes, { config });
  if (options.web ?? true) await app.register(webPlugin);

  await app.ready();
  return app;
}
