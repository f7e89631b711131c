import type { CellValue } from '../readers/types.js';
import { cellNumber, cellText } from './cells.js';

/**
 * The cells of one source row as the row converter reads them. Two kinds: cells already decoded
 * into an array (FITS, VOTable, quoted CSV records), and an unquoted CSV/TSV line read in place,
 * where a number is parsed straight from the line and no string is made for it. Both give exactly
 * the same answers for the same text (test/store/ingest/row-cells.test.ts checks this on random
 * and hand-picked cells); the line kind exists because making and dropping a string per numeric
 * cell was the largest cost of loading a large CSV (bench/load.ts).
 */
export interface RowCells {
  /** Number of fields in the row. */
  readonly count: number;
  /** The cell as a number: null when empty, NaN when it is not a plain number (see cellNumber). */
  number(i: number): number | null;
  /** The cell as trimmed text: null when empty (see cellText). */
  text(i: number): string | null;
  /** The cell as read (for messages, and for sexagesimal angles): null when the field is empty. */
  raw(i: number): CellValue;
}

/** Cells held in an array (a reader's decoded values). Reused: call reset for each row. */
export class ArrayCells implements RowCells {
  private values: readonly CellValue[] = [];
  reset(values: readonly CellValue[]): this {
    this.values = values;
    return this;
  }
  get count(): number {
    return this.values.length;
  }
  number(i: number): number | null {
    return cellNumber(this.values[i]);
  }
  text(i: number): string | null {
    return cellText(this.values[i]);
  }
  raw(i: number): CellValue {
    const v = this.values[i];
    return v === undefined ? null : v;
  }
}

/** Exact powers of ten: every 10^k with k ≤ 22 is a double without rounding (5^22 < 2^53). */
const POW10 = Array.from({ length: 23 }, (_, k) => 10 ** k);

const isBlank = (c: number) => c === 32 || c === 9;

/**
 * The number written in s[start, end), or undefined when the text is not a short plain decimal
 * (the caller then uses Number() on the trimmed text, which is always right). Plain decimal: ASCII
 * blanks around an optional sign, digits with at most one '.', an optional exponent. With at most
 * 15 significant digits the digits form an exact integer m < 2^53; when the power of ten k is within
 * ±22, 10^|k| is exact too, so the one multiplication or division m·10^k is correctly rounded:
 * the same double that Number() gives (Clinger 1990, "How to read floating point numbers
 * accurately", PLDI '90, the fast path; also the first step of V8's own string-to-double).
 */
export function parsePlainDecimal(s: string, start: number, end: number): number | undefined {
  while (start < end && isBlank(s.charCodeAt(start))) start++;
  while (end > start && isBlank(s.charCodeAt(end - 1))) end--;
  if (start === end) return undefined;
  let i = start;
  let negative = false;
  let c = s.charCodeAt(i);
  if (c === 45 /* - */ || c === 43 /* + */) {
    negative = c === 45;
    i++;
  }
  let m = 0;
  let digits = 0; // significant digits taken into m (leading zeros do not count)
  let anyDigit = false;
  let scale = 0; // power of ten of m's last digit
  let seenPoint = false;
  for (; i < end; i++) {
    c = s.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      anyDigit = true;
      if (m === 0 && c === 48) {
        if (seenPoint) scale--;
        continue;
      }
      if (++digits > 15) return undefined;
      m = m * 10 + (c - 48);
      if (seenPoint) scale--;
    } else if (c === 46 /* . */ && !seenPoint) {
      seenPoint = true;
    } else {
      break;
    }
  }
  if (!anyDigit) return undefined;
  if (i < end) {
    if (c !== 101 && c !== 69) return undefined; // e E
    i++;
    let expNegative = false;
    c = s.charCodeAt(i);
    if (c === 45 || c === 43) {
      expNegative = c === 45;
      i++;
    }
    if (i >= end) return undefined;
    let e = 0;
    for (; i < end; i++) {
      c = s.charCodeAt(i);
      if (c < 48 || c > 57 || e > 1000) return undefined;
      e = e * 10 + (c - 48);
    }
    scale += expNegative ? -e : e;
  }
  let x: number;
  if (m === 0) x = 0;
  else if (scale < 0) {
    if (scale < -22) return undefined;
    x = m / POW10[-scale];
  } else {
    if (scale > 22) return undefined;
    x = m * POW10[scale];
  }
  return negative ? -x : x;
}

/**
 * An unquoted CSV/TSV line read in place (no quotes inside: quoted records are parsed into arrays
 * instead). Field boundaries are found once per row; cells are decoded only when asked for.
 * Reused: call reset for each line.
 */
export class LineCells implements RowCells {
  private line = '';
  private starts = new Int32Array(64);
  private n = 0;
  constructor(private readonly delimiter: string) {}

  reset(line: string): this {
    this.line = line;
    let n = 0;
    let at = 0;
    for (;;) {
      if (n + 1 >= this.starts.length) {
        const grown = new Int32Array(this.starts.length * 2);
        grown.set(this.starts);
        this.starts = grown;
      }
      this.starts[n++] = at;
      const next = line.indexOf(this.delimiter, at);
      if (next === -1) break;
      at = next + 1;
    }
    // starts[n] is one past the end of the last field, as if a delimiter followed it.
    this.starts[n] = line.length + 1;
    this.n = n;
    return this;
  }
  get count(): number {
    return this.n;
  }
  private end(i: number): number {
    return this.starts[i + 1] - 1;
  }
  number(i: number): number | null {
    if (i >= this.n) return null;
    const start = this.starts[i];
    const end = this.end(i);
    if (start === end) return null;
    const x = parsePlainDecimal(this.line, start, end);
    return x !== undefined ? x : cellNumber(this.line.slice(start, end));
  }
  text(i: number): string | null {
    if (i >= this.n) return null;
    return cellText(this.line.slice(this.starts[i], this.end(i)));
  }
  raw(i: number): CellValue {
    if (i >= this.n) return null;
    const s = this.line.slice(this.starts[i], this.end(i));
    return s === '' ? null : s;
  }
}
