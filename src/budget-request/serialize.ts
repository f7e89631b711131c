import { z } from 'zod';
import { type BudgetResponse, budgetResponseSchema } from './response-schema.js';

/**
 * The reply body as JSON text, made exactly as the HTTP layer makes it (zod encode against the
 * response schema, then JSON.stringify), so `forehalo budget --json` prints the HTTP body byte for byte.
 */
export function budgetBodyJson(body: BudgetResponse): string {
  return JSON.stringify(z.encode(budgetResponseSchema, body));
}
