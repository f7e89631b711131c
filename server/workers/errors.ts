import { ConflictError, DomainError, InputError, NotFoundError } from '../../src/errors.js';

/** An error as it crosses a worker boundary: our classes keep their kind, code and details. */
export interface SerialisedError {
  kind: 'input' | 'not_found' | 'conflict' | 'domain' | 'other';
  code: string;
  message: string;
  details?: unknown;
}

export function serialiseError(err: unknown): SerialisedError {
  if (err instanceof InputError) {
    const kind =
      err instanceof NotFoundError
        ? 'not_found'
        : err instanceof ConflictError
          ? 'conflict'
          : err instanceof DomainError
            ? 'domain'
            : 'input';
    return { kind, code: err.code, message: err.message, details: structuredSafe(err.details) };
  }
  return {
    kind: 'other',
    code: 'internal',
    message: err instanceof Error ? (err.stack ?? err.message) : String(err),
  };
}

/** Rebuilds the error on this side; 'other' becomes a plain Error (a 500, logged, never shown). */
export function reviveError(e: SerialisedError): Error {
  switch (e.kind) {
    case 'not_found':
      return new NotFoundError(e.code, e.message, e.details);
    case 'conflict':
      return new ConflictError(e.code, e.message, e.details);
    case 'domain':
      return new DomainError(e.code, e.message, e.details);
    case 'input':
      return new InputError(e.code, e.message, e.details);
    default:
      return new Error(`worker failed: ${e.message}`);
  }
}

function structuredSafe(value: unknown): unknown {
  try {
    return JSON.parse(JSON.stringify(value ?? null)) ?? undefined;
  } catch {
    return undefined;
  }
}
