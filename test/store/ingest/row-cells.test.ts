import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cellNumber } from '../../../src/store/ingest/cells.js';
import { ArrayCells, LineCells, parsePlainDecimal } from '../../../src/store/ingest/row-cells.js';

/**
 * The in-place number reader must give exactly the double that the general path gives:
 * cellNumber → Number() on the trimmed text, i.e. ECMAScript's StringToNumber (ECMA-262, §7.1.4.1.1),
 * which is correctly rounded. That is the outside reference here; no value is taken from memory.
 */
const same = (a: number | null | undefined, b: number | null) =>
  a === b || (Number.isNaN(a as number) && Number.isNaN(b as number));

const decimalText = fc
  .tuple(
    fc.constantFrom('', '-', '+'),
    fc.stringMatching(/^[0-9]{0,20}$/),
    fc.constantFrom('', '.'),
    fc.stringMatching(/^[0-9]{0,20}$/),
    fc.constantFrom('', 'e', 'E', 'e-', 'e+', 'E-'),
    fc.stringMatching(/^[0-9]{0,3}$/),
    fc.constantFrom('', ' ', '  ', '\t'),
    fc.constantFrom('', ' ', '\t'),
  )
  .map(
    ([sign, int, point, frac, e, exp, lead, trail]) =>
      `${lead}${sign}${int}${point}${frac}${e}${exp}${trail}`,
  );

describe('reading numbers in place (row-cells.ts)', () => {
  it('gives the same double as Number() for every short plain decimal it accepts, and declines the rest', () => {
    fc.assert(
      fc.property(decimalText, (text) => {
        const x = parsePlainDecimal(text, 0, text.length);
        if (x !== undefined) expect(Object.is(x, Number(text.trim()))).toBe(true);
      }),
      { numRuns: 20_000 },
    );
  });

  it('gives Number() exactly on random doubles printed in the ways catalogues print them', () => {
    fc.assert(
      fc.property(
        fc.double({ noNaN: true, noDefaultInfinity: true }),
        fc.integer({ min: 0, max: 17 }),
        (v, digits) => {
          for (const text of [
            String(v),
            v.toFixed(Math.min(digits, 100)),
            v.toExponential(Math.min(digits, 100)),
            v.toPrecision(Math.max(1, digits)),
          ]) {
            const x = parsePlainDecimal(text, 0, text.length);
            if (x !== undefined) expect(Object.is(x, Number(text))).toBe(true);
          }
        },
      ),
      { numRuns: 20_000 },
    );
  });

  it('takes the usual catalogue cells itself (hand-picked), and leaves odd ones to Number()', () => {
    for (const t of [
      '150.123456',
      '-2.5',
      '0.0002',
      '1e5',
      '2.5E-3',
      '-0',
      '+.5',
      '5.',
      ' 10.25 ',
      '000123.4500',
      '999999999999999',
    ])
      expect(parsePlainDecimal(t, 0, t.length), t).toBe(Number(t.trim()));
    for (const t of [
      '',
      ' ',
      '.',
      '-',
      'e5',
      '1e',
      '0x1A',
      'Infinity',
      'NaN',
      '1_0',
      '1.2.3',
      '1234567890123456',
      '1e-400',
      '1e400',
      '12:30:00',
    ])
      expect(parsePlainDecimal(t, 0, t.length), t).toBeUndefined();
  });

  it('reads a line exactly as the split-and-convert path reads its fields', () => {
    const cell = fc.oneof(
      decimalText,
      fc.constantFrom('', ' ', 'photo', 'spec', 'NaN', 'inf', '10:51:52.4', '+31:24:31', '0x10', 'KDF-007'),
      fc.string({ maxLength: 8 }).filter((s) => !s.includes(',') && !s.includes('"')),
    );
    fc.assert(
      fc.property(fc.array(cell, { minLength: 1, maxLength: 9 }), (fields) => {
        const line = fields.join(',');
        const split = line.split(',').map((f) => (f === '' ? null : f));
        const a = new ArrayCells().reset(split);
        const l = new LineCells(',').reset(line);
        expect(l.count).toBe(a.count);
        for (let i = 0; i <= a.count; i++) {
          expect(same(l.number(i), a.number(i))).toBe(true);
          expect(l.text(i)).toBe(a.text(i));
          expect(l.raw(i)).toBe(a.raw(i));
          expect(same(a.number(i), cellNumber(split[i] ?? null))).toBe(true);
        }
      }),
      { numRuns: 5_000 },
    );
  });
});
