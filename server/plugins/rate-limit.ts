import rateLimit from '@fastify/rate-limit';
import type { FastifyInstance } from 'fastify';
import fp from 'fastify-plugin';

export interface RateLimitOptions {
  /** Writes (catalogue load, replace, drop) per client IP per minute. */
  writesPerMinute: number;
}

/**
 * Rate limiting for writes only: loads are expensive, queries are cheap and already bounded by
 * body size and draw limits. Routes opt in with `config.rateLimit` (see routes/v1/catalogs).
 */
export const rateLimitPlugin = fp<RateLimitOptions>(
  async (app: FastifyInstance, options) => {
    await app.register(rateLimit, {
      global: false,
      max: options.writesPerMinute,
      timeWindow: 60_000,
      errorResponseBuilder: (_request, context) => ({
        statusCode: 429,
        error: {
          code: 'rate_limited',
          message: `Too many catalogue writes: at most ${context.max} per minute; retry in ${Math.ceil(context.ttl / 1000)} s`,
        },
      }),
    });
  },
  { name: 'forehalo-rate-limit' },
);
