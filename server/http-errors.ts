import { InputError } from '../src/errors.js';

/** The caller did not present a valid API key. HTTP 401. */
export class UnauthorizedError extends InputError {
  constructor(message: string) {
    super('unauthorized', message);
    this.name = 'UnauthorizedError';
  }
}

/** The request body exceeds a configured limit. HTTP 413. */
export class PayloadTooLargeError extends InputError {
  constructor(message: string, details?: unknown) {
    super('body_too_large', message, details);
    this.name = 'PayloadTooLargeError';
  }
}
