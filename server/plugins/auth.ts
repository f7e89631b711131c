import { createHash, timingSafeEqual } from 'node:crypto';
import type { FastifyInstance, FastifyRequest } from 'fastify';
import fp from 'fastify-plugin';
import { UnauthorizedError } from '../http-errors.js';

/**
 * Who may call a route: 'public' (health, docs, web view), 'read' (queries) or 'write' (catalogue
 * load, replace, drop). Routes declare it in `config.access`; routes that do not are treated as reads.
 */
export type RouteAccess = 'public' | 'read' | 'write';

declare module 'fastify' {
  interface FastifyContextConfig {
    access?: RouteAccess;
  }
}

export interface AuthOptions {
  /** When undefined, every route is open (local single-user use). */
  apiKey?: string;
  /** When true, 'read' routes need the key as well. */
  protectReads: boolean;
}

const digest = (text: string): Buffer => createHash('sha256').update(text, 'utf8').digest();

/** Compares a presented key with the configured one in constant time (equal-length SHA-256 digests). */
export function keyMatches(presented: string, expectedDigest: Buffer): boolean {
  return timingSafeEqual(digest(presented), expectedDigest);
}

function bearerToken(request: FastifyRequest): string | undefined {
  const header = request.headers.authorization;
  if (typeof header !== 'string') return undefined;
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  return match?.[1];
}

/** Bearer-key check on writes (and on reads when protectReads is set). */
export const authPlugin = fp<AuthOptions>(
  async (app: FastifyInstance, options) => {
    if (!options.apiKey) return;
    const expected = digest(options.apiKey);
    app.addHook('onRequest', async (request) => {
      const access: RouteAccess = request.routeOptions.config?.access ?? 'read';
      if (access === 'public') return;
      if (access === 'read' && !options.protectReads) return;
      const token = bearerToken(request);
      if (token === undefined) {
        throw new UnauthorizedError(
          'This server requires an API key for this request: send "Authorization: Bearer <key>"',
        );
      }
      if (!keyMatches(token, expected)) throw new UnauthorizedError('The API key is not valid');
    });
  },
  { name: 'forehalo-auth' },
);
