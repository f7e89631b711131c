import { type CellValue, type ColumnInfo, FileFormatError } from './types.js';

/**
 * VOTable FIELD descriptions and the conversion of TABLEDATA cell text (IVOA VOTable 1.4,
 * Recommendation 2019-10-21, §4.1 FIELD, §5.1 TABLEDATA, §6 data types):
 * - char / unicodeChar → string; an empty cell → null.
 * - boolean (T/F/true/false/1/0, '?' or empty = null) and a single bit → boolean.
 * - unsignedByte, short, int, float, double → number; `<VALUES null="…">` → null; "NaN" stays NaN.
 * - long → the exact decimal text (type 'string'), as 64-bit identifiers exceed 2⁵³.
 * - arrays (arraysize on a non-character type) and complex numbers → the cell text (type 'string').
 */
export interface VotField {
  readonly name: string;
  readonly unit?: string;
  readonly ucd?: string;
  readonly datatype: string;
  readonly arraysize?: string;
  nullText?: string;
}

const NUMERIC = new Set(['unsignedByte', 'short', 'int', 'float', 'double']);
const KNOWN = new Set([
  'boolean',
  'bit',
  'unsignedByte',
  'short',
  'int',
  'long',
  'char',
  'unicodeChar',
  'float',
  'double',
  'floatComplex',
  'doubleComplex',
]);

export function isScalar(f: VotField): boolean {
  return f.arraysize === undefined || f.arraysize === '1';
}

export function checkField(f: VotField, line: number): void {
  if (!KNOWN.has(f.datatype)) {
    throw new FileFormatError(`line ${line}: FIELD '${f.name}' has unknown datatype '${f.datatype}'`, {
      line,
      column: f.name,
    });
  }
}

export function columnInfo(f: VotField): ColumnInfo {
  let type: ColumnInfo['type'] = 'string';
  if (isScalar(f) && NUMERIC.has(f.datatype)) type = 'number';
  if (isScalar(f) && (f.datatype === 'boolean' || f.datatype === 'bit')) type = 'boolean';
  const out: { name: string; unit?: string; ucd?: string; type: ColumnInfo['type'] } = { name: f.name, type };
  if (f.unit) out.unit = f.unit;
  if (f.ucd) out.ucd = f.ucd;
  return out;
}

/** Convert one TD's text; `where` names the row and line for errors. */
export function cellFromText(f: VotField, text: string, where: { row: number; line: number }): CellValue {
  const t = text.trim();
  if (f.datatype === 'char' || f.datatype === 'unicodeChar') return text === '' ? null : text;
  if (t === '' || (f.nullText !== undefined && t === f.nullText.trim())) return null;
  if (!isScalar(f) || f.datatype === 'floatComplex' || f.datatype === 'doubleComplex') return t;
  switch (f.datatype) {
    case 'boolean':
    case 'bit': {
      const c = t.toLowerCase();
      if (c === 't' || c === 'true' || c === '1') return true;
      if (c === 'f' || c === 'false' || c === '0') return false;
      if (c === '?') return null;
      throw new FileFormatError(
        `row ${where.row} (line ${where.line}), column '${f.name}': '${t.slice(0, 20)}' is not a ${f.datatype} (T/F/1/0/?)`,
        { row: where.row, line: where.line, column: f.name },
      );
    }
    case 'long':
      return t;
    default: {
      if (f.nullText !== undefined && Number(t) === Number(f.nullText)) return null;
      if (/^[+-]?nan$/i.test(t)) return Number.NaN;
      if (/^[+-]?inf(inity)?$/i.test(t)) return t.startsWith('-') ? -Infinity : Infinity;
      return t.startsWith('0x') || t.startsWith('0X') ? Number.parseInt(t, 16) : Number(t);
    }
  }
}
