import type { z } from 'zod';
import { InputError } from '../errors.js';
import { type Model, modelSchema } from './schema.js';

/** One validation problem: the dotted path of the offending key and what is wrong with it. */
export interface ModelIssue {
  readonly key: string;
  readonly message: string;
}

/** Flatten zod issues into key + message pairs (the key is the dotted path, e.g. 'profile.kind'). */
export function describeIssues(issues: readonly z.core.$ZodIssue[], prefix = ''): ModelIssue[] {
  return issues.map((i) => {
    const path = i.path.map(String).join('.');
    const key = prefix && path ? `${prefix}.${path}` : prefix || path || '(root)';
    return { key, message: i.message };
  });
}

/**
 * Validate a model object (undefined → all defaults). Throws InputError('bad_model') whose message
 * names every offending key and whose details list them.
 */
export function parseModel(input: unknown): Model {
  const result = modelSchema.safeParse(input ?? {});
  if (result.success) return Object.freeze(result.data) as Model;
  const issues = describeIssues(result.error.issues, 'model');
  throw new InputError(
    'bad_model',
    `invalid model: ${issues.map((i) => `${i.key}: ${i.message}`).join('; ')}`,
    issues,
  );
}

/** The default model (every key at its default). */
export function defaultModel(): Model {
  return parseModel({});
}
