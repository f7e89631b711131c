import { expect } from 'vitest';

/**
 * Assert |actual − expected| ≤ atol + rtol·|expected| (numpy.isclose convention).
 * The message shows both numbers and the achieved relative error.
 */
export function expectClose(
  actual: number,
  expected: number,
  { rtol = 1e-9, atol = 0 }: { rtol?: number; atol?: number } = {},
): void {
  const diff = Math.abs(actual - expected);
  const limit = atol + rtol * Math.abs(expected);
  if (!(diff <= limit)) {
    const rel = expected === 0 ? diff : diff / Math.abs(expected);
    expect.fail(
      `expected ${actual} to be close to ${expected} (|Δ| = ${diff}, rel = ${rel}, limit = ${limit})`,
    );
  }
}
