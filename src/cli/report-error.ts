import { InputError } from '../errors.js';
import { ProblemLog, type RowProblem } from '../store/index.js';

/** Exit codes: 0 success, 2 bad input (InputError and its kinds, bad arguments), 1 anything else. */
export const EXIT_OK = 0;
export const EXIT_FAILURE = 1;
export const EXIT_BAD_INPUT = 2;

function isProblem(p: unknown): p is RowProblem {
  return typeof p === 'object' && p !== null && 'position' in p && 'reason' in p;
}

/** Print an error for a person (with the row report when there is one) and return the exit code. */
export function reportError(
  err: unknown,
  write: (line: string) => void = (l) => process.stderr.write(`${l}\n`),
): number {
  if (err instanceof InputError) {
    write(`forehalo: ${err.message}`);
    const details = err.details as
      | { problems?: unknown[]; problemCount?: number; complete?: boolean }
      | undefined;
    const problems = (details?.problems ?? []).filter(isProblem);
    if (problems.length > 0) {
      const total = details?.problemCount ?? problems.length;
      write(
        `row report (${problems.length} of ${details?.complete === false ? 'at least ' : ''}${total} problem(s)):`,
      );
      for (const p of problems) write(`  ${ProblemLog.format(p)}`);
    }
    return EXIT_BAD_INPUT;
  }
  const e = err as Error;
  write(`forehalo: unexpected failure: ${e?.message ?? String(err)}`);
  if (process.env.FOREHALO_DEBUG) write(e?.stack ?? '');
  return EXIT_FAILURE;
}
