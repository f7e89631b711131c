import { z } from 'zod';
import { sightlineRequestSchema, sightlineResponseSchema } from '../../src/sightline/schemas.js';

/**
 * POST /v1/sightlines body and reply: the engine's own schemas (src/sightline/schemas.ts), so the
 * server, the CLI and the OpenAPI document can never disagree with what the engine accepts.
 */
export const sightlineRequest = sightlineRequestSchema;
export type SightlineRequest = z.output<typeof sightlineRequest>;

export const sightlineReply = sightlineResponseSchema;

export const sightlineQuery = z.object({
  format: z.enum(['json', 'csv']).default('json').describe('csv returns the galaxy table only'),
});
