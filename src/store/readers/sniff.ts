/**
 * Guess a catalogue file's format from its first bytes (and, as a tie-breaker only, its name), so the
 * loader can say "the file is named .fits but holds CSV". Content wins over the name:
 * - 'fits': the first card is "SIMPLE  =" (FITS Standard 4.0, §4.4.1.1).
 * - 'votable': XML whose first element is VOTABLE (a prolog, comments or a BOM may come first).
 * - 'tsv' / 'csv': printable text; tabs in the first data line → 'tsv', otherwise 'csv'.
 * - 'unknown': empty, binary, or XML that is not a VOTable.
 */
export type SniffedFormat = 'csv' | 'tsv' | 'fits' | 'votable' | 'unknown';

export function sniffFormat(firstBytes: Buffer, fileName?: string): SniffedFormat {
  if (firstBytes.length === 0) return 'unknown';
  const text = firstBytes.toString('latin1');
  if (text.startsWith('SIMPLE  =')) return 'fits';
  const body = text.replace(/^(\uFEFF|\u00EF\u00BB\u00BF)/, '').trimStart();
  if (body.startsWith('<')) {
    // skip the prolog, comments and doctype to the first element name
    const rest = body.replace(/^(<\?[\s\S]*?\?>\s*|<!--[\s\S]*?-->\s*|<!DOCTYPE[^>]*>\s*)*/, '');
    const m = /^<([A-Za-z_][\w.-]*:)?([A-Za-z_][\w.-]*)/.exec(rest);
    if (m) return m[2] === 'VOTABLE' ? 'votable' : 'unknown';
    // the first element lies beyond the sniffed bytes: fall back on the name
    return /\.(vot|votable|xml)$/i.test(fileName ?? '') ? 'votable' : 'unknown';
  }
  for (let i = 0; i < firstBytes.length; i++) {
    const c = firstBytes[i];
    if (c === 0 || (c < 32 && c !== 9 && c !== 10 && c !== 13)) return 'unknown';
  }
  const firstLine = body.split(/\r?\n/).find((l) => l.trim() !== '' && !l.startsWith('#')) ?? '';
  if (firstLine.includes('\t')) return 'tsv';
  if (firstLine.includes(',') || /\.csv$/i.test(fileName ?? '')) return 'csv';
  return /\.(tsv|tab)$/i.test(fileName ?? '') ? 'tsv' : 'csv';
}
