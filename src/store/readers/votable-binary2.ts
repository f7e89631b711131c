import { type CellValue, FileFormatError } from './types.js';
import type { VotField } from './votable-fields.js';
import { isScalar } from './votable-fields.js';

/**
 * BINARY2 serialization (IVOA VOTable 1.4, §5.5): a base64 STREAM of rows; each row starts with a
 * null-flag bitmask (one bit per FIELD, most significant bit first) followed by the fields in
 * big-endian binary. Variable-size arrays (arraysize "*" or "n*") carry a 4-byte element count.
 * Values follow the TABLEDATA rules of votable-fields.ts (long → decimal text, arrays → JSON text).
 */
const SIZE: Record<string, number> = {
  boolean: 1,
  unsignedByte: 1,
  short: 2,
  int: 4,
  long: 8,
  char: 1,
  unicodeChar: 2,
  float: 4,
  double: 8,
  floatComplex: 8,
  doubleComplex: 16,
};

interface Layout {
  readonly variable: boolean;
  readonly fixedCount: number; // elements (fixed arrays) or elements per count unit (variable)
}

function layoutOf(f: VotField): Layout {
  if (f.arraysize === undefined) return { variable: false, fixedCount: 1 };
  const dims = f.arraysize.split('x');
  const last = dims[dims.length - 1];
  const fixed = dims.slice(0, -1).reduce((n, d) => n * Number(d), 1);
  if (last.endsWith('*')) return { variable: true, fixedCount: fixed };
  return { variable: false, fixedCount: fixed * Number(last) };
}

function scalarAt(b: Buffer, at: number, datatype: string): CellValue {
  switch (datatype) {
    case 'boolean': {
      const c = String.fromCharCode(b[at]).toLowerCase();
      return c === 't' || c === '1' ? true : c === 'f' || c === '0' ? false : null;
    }
    case 'unsignedByte':
      return b.readUInt8(at);
    case 'short':
      return b.readInt16BE(at);
    case 'int':
      return b.readInt32BE(at);
    case 'long':
      return b.readBigInt64BE(at).toString();
    case 'float':
      return b.readFloatBE(at);
    case 'double':
      return b.readDoubleBE(at);
    case 'floatComplex':
      return `${b.readFloatBE(at)} ${b.readFloatBE(at + 4)}`;
    default:
      return `${b.readDoubleBE(at)} ${b.readDoubleBE(at + 8)}`;
  }
}

export class Binary2Decoder {
  private readonly layouts: Layout[];
  private readonly flagBytes: number;
  private carry = '';
  private bytes: Buffer = Buffer.alloc(0);

  constructor(
    private readonly fields: readonly VotField[],
    private readonly onRow: (values: CellValue[]) => void,
  ) {
    this.layouts = fields.map(layoutOf);
    this.flagBytes = Math.ceil(fields.length / 8);
  }

  /** Add base64 text (whitespace allowed) and emit every complete row. */
  push(text: string): void {
    const clean = this.carry + text.replace(/\s+/g, '');
    const usable = clean.length - (clean.length % 4);
    this.carry = clean.slice(usable);
    if (usable === 0) return;
    const chunk = Buffer.from(clean.slice(0, usable), 'base64');
    this.bytes = this.bytes.length === 0 ? chunk : Buffer.concat([this.bytes, chunk]);
    let at = 0;
    for (;;) {
      const next = this.row(at);
      if (next < 0) break;
      at = next;
    }
    this.bytes = this.bytes.subarray(at);
  }

  /** The STREAM ended: leftover bytes mean a cut-off row. */
  end(line: number): void {
    if (this.carry.length > 0 || this.bytes.length > 0) {
      throw new FileFormatError(
        `line ${line}: the BINARY2 stream ends inside a row (${this.bytes.length} bytes and ${this.carry.length} base64 characters left over)`,
        { line },
      );
    }
  }

  /** Decode one row at `at`; return the offset after it, or −1 if the bytes are not all there yet. */
  private row(at: number): number {
    const b = this.bytes;
    if (at + this.flagBytes > b.length) return -1;
    const flags = at;
    let p = at + this.flagBytes;
    const values: CellValue[] = new Array(this.fields.length);
    for (let i = 0; i < this.fields.length; i++) {
      const f = this.fields[i];
      const lay = this.layouts[i];
      let count = lay.fixedCount;
      if (lay.variable) {
        if (p + 4 > b.length) return -1;
        count = b.readInt32BE(p) * lay.fixedCount;
        p += 4;
      }
      const size = f.datatype === 'bit' ? Math.ceil(count / 8) : count * SIZE[f.datatype];
      if (p + size > b.length) return -1;
      const isNull = (b[flags + (i >> 3)] & (0x80 >> (i & 7))) !== 0;
      values[i] = isNull ? null : this.value(f, b, p, count);
      p += size;
    }
    this.onRow(values);
    return p;
  }

  private value(f: VotField, b: Buffer, p: number, count: number): CellValue {
    if (f.datatype === 'char' || f.datatype === 'unicodeChar') {
      let raw = '';
      if (f.datatype === 'char') raw = b.toString('latin1', p, p + count);
      else for (let k = 0; k < count; k++) raw += String.fromCharCode(b.readUInt16BE(p + 2 * k));
      const s = raw.replace(/\0.*$/s, '').replace(/ +$/, '');
      return s === '' ? null : s;
    }
    if (f.datatype === 'bit') {
      // A single bit: any non-zero byte is true. The standard packs the first bit into the most
      // significant position (0x80), while astropy 5.2 writes a true scalar bit as 0x08; unused bits
      // are zero either way, so this reads both.
      if (isScalar(f)) return b[p] !== 0;
      const bits = Array.from({ length: count }, (_, k) => (b[p + (k >> 3)] & (0x80 >> (k & 7))) !== 0);
      return JSON.stringify(bits);
    }
    if (isScalar(f)) {
      const v = scalarAt(b, p, f.datatype);
      if (f.nullText !== undefined && v !== null && String(v) === f.nullText.trim()) return null;
      return v;
    }
    const parts: string[] = [];
    for (let k = 0; k < count; k++) {
      const v = scalarAt(b, p + k * SIZE[f.datatype], f.datatype);
      parts.push(typeof v === 'number' && !Number.isFinite(v) ? `"${v}"` : JSON.stringify(v));
    }
    return `[${parts.join(',')}]`;
  }
}
