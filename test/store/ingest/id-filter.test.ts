import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createIdFilter } from '../../../src/store/ingest/id-filter.js';

describe('the duplicate-id filter', () => {
  it('flags every repeated id at each repeat (a Bloom filter has no false negatives)', () => {
    fc.assert(
      fc.property(fc.array(fc.string({ maxLength: 12 }), { maxLength: 400 }), (ids) => {
        const filter = createIdFilter(ids.length);
        const seen = new Set<string>();
        for (const id of ids) {
          const flagged = filter.add(id);
          if (seen.has(id)) expect(flagged).toBe(true);
          seen.add(id);
        }
        for (const id of ids.filter((x, i) => ids.indexOf(x) !== i))
          expect(filter.candidates.has(id)).toBe(true);
      }),
    );
  });

  it('raises few false alarms on a million distinct ids at its design size (rate ≈ 4·10⁻⁸ per id)', () => {
    const filter = createIdFilter(1_000_000);
    let alarms = 0;
    for (let i = 0; i < 1_000_000; i++) if (filter.add(`KDF-${i}`)) alarms++;
    // Expected ≈ 0.04 false positives; allow a generous margin for the hash's imperfection.
    expect(alarms).toBeLessThanOrEqual(5);
    expect(filter.overflowed).toBe(false);
  });

  it('says when it can no longer list its candidates, so the caller checks every id', () => {
    const filter = createIdFilter(10, 3);
    for (const id of ['a', 'b', 'c', 'd', 'a', 'b', 'c', 'd']) filter.add(id);
    expect(filter.candidates.size).toBe(3);
    expect(filter.overflowed).toBe(true);
  });
});
