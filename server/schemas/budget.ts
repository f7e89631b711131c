import { budgetRequestSchema, budgetResponseSchema } from '../../src/budget-request/index.js';

/**
 * POST /v1/budgets body and reply: the shared schemas of src/budget-request, so the server, the CLI
 * (`forehalo budget --json` prints this reply) and the OpenAPI document never disagree.
 */
export const budgetRequest = budgetRequestSchema;
export const budgetReply = budgetResponseSchema;
