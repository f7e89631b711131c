import type { FitsHeader } from './fits-header.js';
import { requireInt } from './fits-header.js';
import { type CellValue, type ColumnInfo, FileFormatError } from './types.js';

/**
 * Binary-table column layout and decoding (FITS Standard 4.0, §7.3). Supported TFORMn codes:
 * L (logical), B (uint8), I (int16), J (int32), K (int64), A (characters), E (float32), D (float64).
 * - TSCALn/TZEROn give physical = TZERO + TSCAL·stored (§7.3.2), which also covers the unsigned
 *   integer convention (TZERO = 32768 for I, 2³¹ for J, 2⁶³ for K; B with TZERO = −128 for signed bytes).
 * - TNULLn marks an undefined integer (compared with the stored value, before scaling) → null.
 * - Floating-point NaN is kept as NaN, so row validation reports it as such.
 * - K (64-bit) columns without scaling are returned as exact decimal strings, since most such
 *   columns are identifiers beyond 2⁵³; scaled K columns become numbers.
 * - A numeric or logical column with repeat > 1 (an array per row) is returned as JSON text such as
 *   "[1.5,2,3]", column type 'string': nothing is dropped, and mapping such a column to a numeric
 *   field fails row validation with the column named instead of silently using one element.
 * - X (bits), C/M (complex) and P/Q (variable-length arrays in the heap) are not read: the column is
 *   left out of `columns` and listed in `skipped` with the reason.
 */
export interface FitsColumn extends ColumnInfo {
  readonly index: number;
  readonly tform: string;
  readonly offset: number;
  decode(buf: Buffer, rowStart: number): CellValue;
}

export interface SkippedColumn {
  readonly index: number;
  readonly name: string;
  readonly tform: string;
  readonly reason: string;
}

const WIDTH: Record<string, number> = {
  L: 1,
  B: 1,
  I: 2,
  J: 4,
  K: 8,
  A: 1,
  E: 4,
  D: 8,
  C: 8,
  M: 16,
  P: 8,
  Q: 16,
};

function num(h: FitsHeader, key: string): number | undefined {
  const v = h.values.get(key);
  if (v === undefined || v === null) return undefined;
  if (typeof v !== 'number') {
    throw new FileFormatError(
      `HDU ${h.hdu}, header card ${h.cardOf.get(key)}: ${key} must be a number, got ${JSON.stringify(v)}`,
      {
        card: h.cardOf.get(key),
      },
    );
  }
  return v;
}

function str(h: FitsHeader, key: string): string | undefined {
  const v = h.values.get(key);
  return typeof v === 'string' ? v.trim() : undefined;
}

type Reader = (buf: Buffer, at: number) => number | bigint;
const READ: Record<string, Reader> = {
  B: (b, at) => b.readUInt8(at),
  I: (b, at) => b.readInt16BE(at),
  J: (b, at) => b.readInt32BE(at),
  K: (b, at) => b.readBigInt64BE(at),
  E: (b, at) => b.readFloatBE(at),
  D: (b, at) => b.readDoubleBE(at),
};

function logical(byte: number): boolean | null {
  if (byte === 0x54) return true; // 'T'
  if (byte === 0x46) return false; // 'F'
  return null; // 0x00 = undefined (§7.3.3.1)
}

function makeScalar(
  code: string,
  scale: number,
  zero: number,
  tnull: number | undefined,
): (b: Buffer, at: number) => CellValue {
  const read = READ[code];
  const scaled = scale !== 1 || zero !== 0;
  if (code === 'K') {
    const nullBig = tnull === undefined ? undefined : BigInt(tnull);
    const exact = scale === 1 && Number.isInteger(zero);
    const zeroBig = exact ? BigInt(zero) : 0n;
    return (b, at) => {
      const raw = read(b, at) as bigint;
      if (nullBig !== undefined && raw === nullBig) return null;
      if (exact) return (raw + zeroBig).toString();
      return zero + scale * Number(raw);
    };
  }
  if (code === 'E' || code === 'D') {
    return scaled ? (b, at) => zero + scale * (read(b, at) as number) : (b, at) => read(b, at) as number;
  }
  return (b, at) => {
    const raw = read(b, at) as number;
    if (tnull !== undefined && raw === tnull) return null;
    return scaled ? zero + scale * raw : raw;
  };
}

/** Read the column descriptions of a BINTABLE header and check they fill NAXIS1 bytes per row. */
export function tableColumns(h: FitsHeader): { columns: FitsColumn[]; skipped: SkippedColumn[] } {
  const rowBytes = requireInt(h, 'NAXIS1');
  const tfields = requireInt(h, 'TFIELDS');
  const columns: FitsColumn[] = [];
  const skipped: SkippedColumn[] = [];
  const seen = new Map<string, number>();
  let offset = 0;
  for (let n = 1; n <= tfields; n++) {
    const tformRaw = str(h, `TFORM${n}`);
    const card = h.cardOf.get(`TFORM${n}`);
    const m = tformRaw === undefined ? null : /^(\d*)([LXBIJKAEDCMPQ])(.*)$/.exec(tformRaw);
    if (!m) {
      throw new FileFormatError(
        `HDU ${h.hdu}${card ? `, header card ${card}` : ''}: column ${n} has ` +
          (tformRaw === undefined ? 'no TFORM' : `an unreadable TFORM${n} '${tformRaw}'`),
        card ? { card } : undefined,
      );
    }
    const repeat = m[1] === '' ? 1 : Number(m[1]);
    const code = m[2];
    const name = str(h, `TTYPE${n}`) || `col${n}`;
    const width =
      code === 'X'
        ? Math.ceil(repeat / 8)
        : code === 'P' || code === 'Q'
          ? WIDTH[code]
          : repeat * WIDTH[code];
    const start = offset;
    offset += width;
    const key = name.toLowerCase();
    if (seen.has(key)) {
      throw new FileFormatError(
        `HDU ${h.hdu}, header card ${h.cardOf.get(`TTYPE${n}`)}: columns ${seen.get(key)} and ${n} are both named '${name}'`,
        { card: h.cardOf.get(`TTYPE${n}`), column: name },
      );
    }
    seen.set(key, n);
    if ('XCMPQ'.includes(code) || repeat === 0) {
      const reason =
        repeat === 0
          ? 'it has repeat count 0 (no data)'
          : code === 'X'
            ? 'bit arrays (X) are not read'
            : code === 'C' || code === 'M'
              ? 'complex numbers are not read'
              : 'variable-length arrays (P/Q, stored in the heap) are not read';
      skipped.push({ index: n, name, tform: tformRaw!, reason });
      continue;
    }
    const unit = str(h, `TUNIT${n}`) || undefined;
    const scale = num(h, `TSCAL${n}`) ?? 1;
    const zero = num(h, `TZERO${n}`) ?? 0;
    const tnull = num(h, `TNULL${n}`);
    let type: ColumnInfo['type'];
    let decode: FitsColumn['decode'];
    if (code === 'A') {
      type = 'string';
      decode = (b, row) => {
        let end = row + start + repeat;
        const nul = b.indexOf(0, row + start);
        if (nul !== -1 && nul < end) end = nul;
        const s = b.toString('latin1', row + start, end).replace(/ +$/, '');
        return s === '' ? null : s;
      };
    } else if (code === 'L') {
      type = repeat === 1 ? 'boolean' : 'string';
      decode =
        repeat === 1
          ? (b, row) => logical(b[row + start])
          : (b, row) => JSON.stringify(Array.from({ length: repeat }, (_, i) => logical(b[row + start + i])));
    } else {
      const one = makeScalar(code, scale, zero, tnull);
      const w = WIDTH[code];
      if (repeat === 1) {
        type = code === 'K' && scale === 1 && Number.isInteger(zero) ? 'string' : 'number';
        decode = (b, row) => one(b, row + start);
      } else {
        type = 'string';
        decode = (b, row) => {
          const parts: string[] = [];
          for (let i = 0; i < repeat; i++) {
            const v = one(b, row + start + i * w);
            parts.push(
              v === null ? 'null' : typeof v === 'number' && !Number.isFinite(v) ? `"${v}"` : String(v),
            );
          }
          return `[${parts.join(',')}]`;
        };
      }
    }
    columns.push({ index: n, name, unit, type, tform: tformRaw!, offset: start, decode });
  }
  if (offset !== rowBytes) {
    throw new FileFormatError(
      `HDU ${h.hdu}: the ${tfields} column formats add up to ${offset} bytes per row, but NAXIS1 says ${rowBytes}`,
      { card: h.cardOf.get('NAXIS1') },
    );
  }
  return { columns, skipped };
}
