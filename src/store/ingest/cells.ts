import type { CellValue } from '../readers/types.js';

/**
 * A cell read as a number: null when empty, NaN when it is not a plain number. A NaN that arrives as
 * a binary number (FITS or VOTable floating-point column) is that format's null value (FITS
 * Standard 4.0 §7.3.3.1; VOTable 1.4 §6), so it reads as empty; the text 'NaN' in a CSV is an error.
 */
export function cellNumber(v: CellValue | undefined): number | null {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number') return Number.isNaN(v) ? null : v;
  if (typeof v === 'boolean') return Number.NaN;
  const s = v.trim();
  if (s === '') return null;
  return Number(s);
}

/** A cell read as trimmed text: null when empty. */
export function cellText(v: CellValue | undefined): string | null {
  if (v === null || v === undefined) return null;
  const s = String(v).trim();
  return s === '' ? null : s;
}

/** Why a non-finite number was rejected, in words. */
export function whyNotFinite(x: number): string {
  if (Number.isNaN(x)) return 'is not a number (NaN or unreadable text)';
  return 'is infinite';
}

export function show(v: CellValue | undefined): string {
  if (v === null || v === undefined) return '';
  const s = String(v);
  return s.length > 60 ? `${s.slice(0, 57)}...` : s;
}
