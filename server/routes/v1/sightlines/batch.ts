import { createInterface } from 'node:readline';
import { Readable, Transform } from 'node:stream';
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { z } from 'zod';
import { InputError } from '../../../../src/errors.js';
import type { ServerConfig } from '../../../config.js';
import { PayloadTooLargeError } from '../../../http-errors.js';
import { describeError } from '../../../plugins/error-handler.js';
import { sightlineRequest } from '../../../schemas/sightline.js';
import type { AppServices } from '../../../services/types.js';
import { checkDrawLimit } from './draw-limit.js';

/**
 * One output line per input line, in order: `{"line": n, "result": {...}}` on success or
 * `{"line": n, "error": {code, message, details}}` when that line is bad. Blank lines are skipped.
 * A line's failure never stops the batch; a body over the limit ends it with a final error line.
 */
export async function* runBatch(
  input: Readable,
  services: AppServices,
  limits: { maxLines: number; maxBytes: number; maxDraws: number },
  requestId: string,
): AsyncGenerator<string> {
  let bytes = 0;
  let count = 0;
  let lineNo = 0;
  let overLimit = false;
  // Passes at most maxBytes on and swallows the rest, so even a body without newlines stays bounded.
  const capped = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      if (!overLimit) {
        bytes += chunk.length;
        if (bytes > limits.maxBytes) overLimit = true;
        else return done(null, chunk);
      }
      done();
    },
  });
  input.pipe(capped);
  const lines = createInterface({ input: capped, crlfDelay: Number.POSITIVE_INFINITY });
  try {
    for await (const line of lines) {
      lineNo++;
      if (overLimit) {
        const err = new PayloadTooLargeError(
          `Batch body exceeds ${limits.maxBytes} bytes (FOREHALO_BODY_LIMIT)`,
        );
        yield `${JSON.stringify({ line: lineNo, ...describeError(err, requestId).body })}\n`;
        return;
      }
      if (line.trim() === '') continue;
      count++;
      if (count > limits.maxLines) {
        const err = new InputError(
          'batch_too_long',
          `A batch may hold at most ${limits.maxLines} sightlines`,
        );
        yield `${JSON.stringify({ line: lineNo, ...describeError(err, requestId).body })}\n`;
        return;
      }
      yield `${JSON.stringify(await runLine(line, lineNo, services, limits.maxDraws, requestId))}\n`;
    }
    if (overLimit) {
      const err = new PayloadTooLargeError(
        `Batch body exceeds ${limits.maxBytes} bytes (FOREHALO_BODY_LIMIT)`,
      );
      yield `${JSON.stringify({ line: lineNo + 1, ...describeError(err, requestId).body })}\n`;
    }
  } finally {
    lines.close();
    input.unpipe(capped);
    input.resume();
  }
}

async function runLine(
  line: string,
  lineNo: number,
  services: AppServices,
  maxDraws: number,
  requestId: string,
) {
  try {
    let parsedJson: unknown;
    try {
      parsedJson = JSON.parse(line);
    } catch {
      throw new InputError('malformed_json', `Line ${lineNo} is not valid JSON`);
    }
    const parsed = sightlineRequest.safeParse(parsedJson);
    if (!parsed.success) {
      const issues = parsed.error.issues.map((i) => ({
        field: ['body', ...i.path].join('.'),
        reason: i.message,
      }));
      throw new InputError(
        'invalid_request',
        `Line ${lineNo}: ${issues.map((i) => `${i.field}: ${i.reason}`).join('; ')}`,
        { issues },
      );
    }
    checkDrawLimit(parsed.data.model?.draws, maxDraws, 'body.model.draws');
    return { line: lineNo, result: await services.sightlines.run(parsed.data) };
  } catch (err) {
    return { line: lineNo, ...describeError(err, requestId).body };
  }
}

export const batchRoute: FastifyPluginAsyncZod<{ config: ServerConfig }> = async (app, { config }) => {
  app.removeAllContentTypeParsers();
  app.addContentTypeParser(
    ['application/x-ndjson', 'application/jsonl', 'text/plain'],
    (_req, _payload, done) => done(null, undefined),
  );
  app.post(
    '/v1/sightlines/batch',
    {
      config: { access: 'read' },
      schema: {
        tags: ['sightlines'],
        summary: 'Many sightlines: NDJSON in (one POST /v1/sightlines body per line), NDJSON out, streamed',
        consumes: ['application/x-ndjson'],
        produces: ['application/x-ndjson'],
        response: {
          200: z
            .string()
            .describe('NDJSON: {"line": n, "result": {...}} or {"line": n, "error": {...}} per input line'),
        },
      },
    },
    async (request, reply) => {
      const stream = Readable.from(
        runBatch(
          request.raw,
          app.services,
          { maxLines: config.maxBatchLines, maxBytes: config.bodyLimitBytes, maxDraws: config.maxDraws },
          String(request.id),
        ),
      );
      return reply.type('application/x-ndjson; charset=utf-8').send(stream as never);
    },
  );
};
