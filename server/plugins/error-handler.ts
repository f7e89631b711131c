import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import fp from 'fastify-plugin';
import { hasZodFastifySchemaValidationErrors } from 'fastify-type-provider-zod';
import { ConflictError, InputError, NotFoundError } from '../../src/errors.js';
import { PayloadTooLargeError, UnauthorizedError } from '../http-errors.js';
import { redactDeep, redactPaths } from '../redact.js';

export interface ErrorReply {
  error: { code: string; message: string; details?: unknown };
}

/** Fastify's own 4xx codes → our codes and messages. */
const FASTIFY_CODES: Record<string, { status: number; code: string; message: string }> = {
  FST_ERR_CTP_INVALID_JSON_BODY: { status: 400, code: 'malformed_json', message: 'Body is not valid JSON' },
  FST_ERR_CTP_EMPTY_JSON_BODY: {
    status: 400,
    code: 'malformed_json',
    message: 'Body is empty but Content-Type says JSON',
  },
  FST_ERR_CTP_BODY_TOO_LARGE: {
    status: 413,
    code: 'body_too_large',
    message: 'Request body is larger than the configured limit',
  },
  FST_ERR_CTP_INVALID_MEDIA_TYPE: {
    status: 415,
    code: 'unsupported_media_type',
    message: 'Unsupported Content-Type for this route',
  },
  FST_ERR_CTP_INVALID_CONTENT_LENGTH: {
    status: 400,
    code: 'bad_content_length',
    message: 'Content-Length does not match the body',
  },
  FST_ERR_CTP_INVALID_TYPE: { status: 400, code: 'bad_content_type', message: 'Content-Type is not valid' },
  FST_ERR_BAD_URL: { status: 400, code: 'bad_url', message: 'URL is not valid' },
  FST_ERR_ASYNC_CONSTRAINT: { status: 400, code: 'bad_request', message: 'Request cannot be routed' },
};

/** A zod issue path as a dotted field name with the request part first: body.ra, query.format. */
function fieldName(context: string | undefined, instancePath: string): string {
  const part = context === 'querystring' ? 'query' : (context ?? 'body');
  const rest = instancePath.replace(/^\//, '').split('/').filter(Boolean).join('.');
  return rest ? `${part}.${rest}` : part;
}

function statusOfInputError(err: InputError): number {
  if (err instanceof UnauthorizedError) return 401;
  if (err instanceof PayloadTooLargeError) return 413;
  if (err instanceof NotFoundError) return 404;
  if (err instanceof ConflictError) return 409;
  return 400;
}

/** Turns any thrown value into the status and body the client sees. Never leaks internals for 5xx. */
export function describeError(err: unknown, requestId: string): { status: number; body: ErrorReply } {
  if (hasZodFastifySchemaValidationErrors(err)) {
    const context = (err as { validationContext?: string }).validationContext;
    const issues = err.validation.map((v) => ({
      field: fieldName(context, v.instancePath),
      reason: v.message ?? 'invalid',
    }));
    const summary = issues
      .slice(0, 5)
      .map((i) => `${i.field}: ${i.reason}`)
      .join('; ');
    return {
      status: 400,
      body: {
        error: { code: 'invalid_request', message: `Invalid request — ${summary}`, details: { issues } },
      },
    };
  }
  if (err instanceof InputError) {
    return {
      status: statusOfInputError(err),
      body: {
        error: { code: err.code, message: redactPaths(err.message), details: redactDeep(err.details) },
      },
    };
  }
  const fastifyErr = err as Partial<FastifyError>;
  const known = fastifyErr.code ? FASTIFY_CODES[fastifyErr.code] : undefined;
  if (known) return { status: known.status, body: { error: { code: known.code, message: known.message } } };
  if (Array.isArray(fastifyErr.validation)) {
    // Validation errors from non-zod schemas (e.g. plugin routes): still field-level and 400.
    const context = fastifyErr.validationContext;
    const issues = fastifyErr.validation.map((v) => ({
      field: fieldName(context, v.instancePath),
      reason: v.message ?? 'invalid',
    }));
    return {
      status: 400,
      body: { error: { code: 'invalid_request', message: 'Invalid request', details: { issues } } },
    };
  }
  const status = fastifyErr.statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    return {
      status,
      body: {
        error: { code: status === 429 ? 'rate_limited' : 'bad_request', message: String(fastifyErr.message) },
      },
    };
  }
  return {
    status: 500,
    body: {
      error: { code: 'internal', message: `Internal error; quote request id ${requestId} when reporting it` },
    },
  };
}

/** One error handler and one not-found handler for the whole app. */
export const errorHandlerPlugin = fp(
  async (app: FastifyInstance) => {
    app.setErrorHandler((err: unknown, request: FastifyRequest, reply: FastifyReply) => {
      const { status, body } = describeError(err, String(request.id));
      if (status >= 500) {
        request.log.error(
          { err, method: request.method, url: request.url, reqId: request.id },
          'request failed',
        );
      } else {
        request.log.info({ code: body.error.code, status }, 'request rejected');
      }
      if (reply.sent || reply.raw.headersSent) return;
      // After an oversized upload the rest of the body is discarded; do not reuse the connection.
      if (status === 413) reply.header('connection', 'close');
      return reply.code(status).type('application/json').send(body);
    });
    app.setNotFoundHandler((request, reply) => {
      return reply.code(404).send({
        error: { code: 'no_route', message: `No route ${request.method} ${request.url.split('?')[0]}` },
      } satisfies ErrorReply);
    });
  },
  { name: 'forehalo-error-handler' },
);
