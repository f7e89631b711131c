import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import type { ServerConfig } from '../../../config.js';
import { PayloadTooLargeError } from '../../../http-errors.js';
import { catalogParams, catalogSummary, loadQuery, loadReport } from '../../../schemas/catalog.js';
import { errorBody } from '../../../schemas/primitives.js';

const errors = {
  400: errorBody,
  401: errorBody,
  404: errorBody,
  409: errorBody,
  413: errorBody,
  429: errorBody,
};

/** Catalogue management: list, show, load (PUT with the file as the body), drop. */
export const catalogRoutes: FastifyPluginAsyncZod<{ config: ServerConfig }> = async (app, { config }) => {
  // The upload is handed on as a stream, never parsed or buffered here.
  app.removeAllContentTypeParsers();
  app.addContentTypeParser('*', (_request, _payload, done) => done(null, undefined));

  app.get(
    '/v1/catalogs',
    {
      config: { access: 'read' },
      schema: {
        tags: ['catalogs'],
        summary: 'List stored catalogues',
        response: { 200: z.object({ catalogs: z.array(catalogSummary) }), 401: errorBody },
      },
    },
    async () => ({ catalogs: (await app.services.catalogs.list()) as Record<string, unknown>[] }),
  );

  app.get(
    '/v1/catalogs/:name',
    {
      config: { access: 'read' },
      schema: {
        tags: ['catalogs'],
        summary: 'Describe one catalogue',
        params: catalogParams,
        response: { 200: catalogSummary, ...errors },
      },
    },
    async (request) => (await app.services.catalogs.show(request.params.name)) as Record<string, unknown>,
  );

  app.delete(
    '/v1/catalogs/:name',
    {
      config: { access: 'write', rateLimit: {} },
      schema: {
        tags: ['catalogs'],
        summary: 'Drop a catalogue and its rows',
        params: catalogParams,
        response: { 200: z.record(z.string(), z.unknown()), ...errors },
      },
    },
    async (request) => {
      const result = await app.services.catalogs.drop(request.params.name);
      return { dropped: request.params.name, ...(result && typeof result === 'object' ? result : {}) };
    },
  );

  app.put(
    '/v1/catalogs/:name',
    {
      config: { access: 'write', rateLimit: {} },
      schema: {
        tags: ['catalogs'],
        summary: 'Load a catalogue file (request body: the CSV/TSV, FITS or VOTable file)',
        description:
          `Streams the body to the loader (limit ${config.uploadLimitBytes} bytes). ` +
          'The load runs in a worker thread; on any error nothing is stored.',
        params: catalogParams,
        querystring: loadQuery,
        response: { 200: loadReport, 201: loadReport, ...errors },
      },
    },
    async (request, reply) => {
      const declared = Number(request.headers['content-length']);
      if (Number.isFinite(declared) && declared > config.uploadLimitBytes) {
        throw new PayloadTooLargeError(
          `Upload of ${declared} bytes exceeds the limit of ${config.uploadLimitBytes} bytes (FOREHALO_UPLOAD_LIMIT)`,
          { limitBytes: config.uploadLimitBytes },
        );
      }
      const { format, map, skip_invalid, mode, file_name } = request.query;
      const report = await app.services.catalogs.load({
        name: request.params.name,
        body: request.raw,
        format,
        fileName: file_name,
        map,
        skipInvalid: skip_invalid ?? false,
        mode,
        limitBytes: config.uploadLimitBytes,
      });
      return reply.code(mode === 'create' ? 201 : 200).send(report as Record<string, unknown>);
    },
  );
};
