import { sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import fastifyStatic from '@fastify/static';
import type { FastifyInstance } from 'fastify';
import fp from 'fastify-plugin';

/** Folder of the web view (plain HTML, CSS, ES modules); resolved from this file so dist/ works too. */
const compiled = fileURLToPath(import.meta.url).includes(`${sep}dist${sep}server${sep}`);
export const WEB_ROOT = fileURLToPath(new URL(compiled ? '../../../web/' : '../../web/', import.meta.url));

/** Serves the field view at `/` (index.html) and its assets. */
export const webPlugin = fp(
  async (app: FastifyInstance, options: { root?: string }) => {
    app.addHook('onRoute', (route) => {
      if (!route.url.startsWith('/v1')) route.config = { ...(route.config ?? {}), access: 'public' };
    });
    await app.register(fastifyStatic, {
      root: options.root ?? WEB_ROOT,
      prefix: '/',
      index: ['index.html'],
      schemaHide: true,
      cacheControl: true,
      maxAge: 0,
    });
  },
  { name: 'forehalo-web' },
);
