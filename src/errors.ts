/**
 * forehalo's error vocabulary. Science and store code throw these; the server maps them to HTTP
 * status codes and the CLI to exit codes (InputError → 2). Messages say what to change.
 */

/** Base class: a problem with what the caller supplied (bad parameter, bad file, unknown name). */
export class InputError extends Error {
  readonly code: string;
  readonly details: unknown;
  constructor(code: string, message: string, details?: unknown) {
    super(message);
    this.name = 'InputError';
    this.code = code;
    this.details = details;
  }
}

/** A named thing (catalogue, model key) does not exist. HTTP 404 where it is a resource. */
export class NotFoundError extends InputError {
  constructor(code: string, message: string, details?: unknown) {
    super(code, message, details);
    this.name = 'NotFoundError';
  }
}

/** The request conflicts with stored state (catalogue exists, same file already loaded). HTTP 409. */
export class ConflictError extends InputError {
  constructor(code: string, message: string, details?: unknown) {
    super(code, message, details);
    this.name = 'ConflictError';
  }
}

/** A value is outside the range where a published model or numerical method is valid. */
export class DomainError extends InputError {
  constructor(code: string, message: string, details?: unknown) {
    super(code, message, details);
    this.name = 'DomainError';
  }
}
