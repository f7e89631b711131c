import { InputError } from '../../../../src/errors.js';

/** Rejects draw counts above the server's limit (FOREHALO_MAX_DRAWS), naming the field. */
export function checkDrawLimit(draws: number | undefined, maxDraws: number, field: string): void {
  if (draws !== undefined && draws > maxDraws) {
    throw new InputError(
      'too_many_draws',
      `${field}: ${draws} draws requested; this server allows at most ${maxDraws}`,
      {
        issues: [{ field, reason: `at most ${maxDraws}` }],
      },
    );
  }
}
