import { FileFormatError } from './types.js';

/**
 * One 80-character FITS header card (FITS Standard 4.0, IAU FITS Working Group 2018, §4.1–4.2):
 * keyword in bytes 1–8, the value indicator "= " in bytes 9–10, then a fixed- or free-format value
 * and an optional "/ comment".
 */
export type FitsValue = string | number | boolean | null;

export interface FitsCard {
  readonly keyword: string;
  /** undefined for commentary cards (COMMENT, HISTORY, blank, or no value indicator). */
  readonly value?: FitsValue;
  /** 1-based card number within its HDU header, for error messages. */
  readonly cardNumber: number;
  /** For string values: true when the string ends in '&' (long-string convention, §4.2.1.2). */
  readonly continues?: boolean;
}

/** Keywords whose cards must carry a value: a card naming one without "= " is a format error. */
const VALUED =
  /^(SIMPLE|BITPIX|NAXIS\d*|XTENSION|PCOUNT|GCOUNT|TFIELDS|THEAP|EXTNAME|EXTVER|T(FORM|TYPE|UNIT|SCAL|ZERO|NULL|DIM|UCD)\d+)$/;

const INTEGER = /^[+-]?\d+$/;
const REAL = /^[+-]?(\d+\.?\d*|\.\d+)([EDed][+-]?\d+)?$/;

function where(hdu: number, cardNumber: number, keyword: string): string {
  return `HDU ${hdu}, header card ${cardNumber}${keyword ? ` (${keyword})` : ''}`;
}

/** Parse the value field (bytes 11–80) of a card: string, logical, integer, real or empty. */
function parseValue(
  text: string,
  hdu: number,
  cardNumber: number,
  keyword: string,
): { value: FitsValue; continues: boolean } {
  const s = text.trimStart();
  if (s.startsWith("'")) {
    // Character string: '' stands for one quote; trailing blanks are not significant (§4.2.1.1).
    let out = '';
    let i = 1;
    for (;;) {
      const q = s.indexOf("'", i);
      if (q === -1) {
        throw new FileFormatError(`${where(hdu, cardNumber, keyword)}: string value has no closing quote`, {
          card: cardNumber,
        });
      }
      out += s.slice(i, q);
      if (s[q + 1] === "'") {
        out += "'";
        i = q + 2;
      } else {
        i = q + 1;
        break;
      }
    }
    const rest = s.slice(i).trim();
    if (rest !== '' && !rest.startsWith('/')) {
      throw new FileFormatError(
        `${where(hdu, cardNumber, keyword)}: unexpected text '${rest.slice(0, 20)}' after the string value`,
        { card: cardNumber },
      );
    }
    const trimmed = out.replace(/ +$/, '');
    return trimmed.endsWith('&')
      ? { value: trimmed.slice(0, -1), continues: true }
      : { value: trimmed, continues: false };
  }
  const slash = s.indexOf('/');
  const v = (slash === -1 ? s : s.slice(0, slash)).trim();
  if (v === '') return { value: null, continues: false };
  if (v === 'T' || v === 'F') return { value: v === 'T', continues: false };
  if (INTEGER.test(v)) return { value: Number(v), continues: false };
  if (REAL.test(v)) return { value: Number(v.replace(/[Dd]/, 'E')), continues: false };
  throw new FileFormatError(
    `${where(hdu, cardNumber, keyword)}: cannot read the value '${v.slice(0, 30)}' (not a string, T/F, integer or real number)`,
    { card: cardNumber },
  );
}

/** Parse one card; `raw` is exactly 80 characters of latin-1 text. */
export function parseCard(raw: string, hdu: number, cardNumber: number): FitsCard {
  for (let i = 0; i < raw.length; i++) {
    const c = raw.charCodeAt(i);
    if (c < 0x20 || c > 0x7e) {
      throw new FileFormatError(
        `${where(hdu, cardNumber, '')}: byte ${i + 1} is not printable ASCII (code ${c}); FITS headers are ASCII text`,
        { card: cardNumber },
      );
    }
  }
  const keyword = raw.slice(0, 8).trimEnd();
  if (!/^[A-Z0-9_-]*$/.test(keyword)) {
    throw new FileFormatError(
      `${where(hdu, cardNumber, '')}: '${keyword}' is not a valid keyword (A–Z, 0–9, '-' and '_' only)`,
      { card: cardNumber },
    );
  }
  if (keyword === 'CONTINUE') {
    const { value, continues } = parseValue(raw.slice(8), hdu, cardNumber, keyword);
    return { keyword, value: typeof value === 'string' ? value : '', cardNumber, continues };
  }
  if (keyword === 'COMMENT' || keyword === 'HISTORY' || keyword === '' || keyword === 'END') {
    return { keyword, cardNumber };
  }
  if (raw.slice(8, 10) !== '= ') {
    if (VALUED.test(keyword)) {
      throw new FileFormatError(
        `${where(hdu, cardNumber, keyword)}: no '= ' value indicator in bytes 9–10, but ${keyword} needs a value`,
        { card: cardNumber },
      );
    }
    return { keyword, cardNumber };
  }
  const { value, continues } = parseValue(raw.slice(10), hdu, cardNumber, keyword);
  return { keyword, value, cardNumber, continues };
}
