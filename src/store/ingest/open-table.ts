import { closeSync, openSync, readSync } from 'node:fs';
import { InputError } from '../../errors.js';
import { openDelimited } from '../readers/csv.js';
import type { SourceTable } from '../readers/types.js';

export type SourceFormat = 'csv' | 'tsv' | 'fits' | 'votable';

/** What the first bytes say the file is (FITS primary header, XML/VOTable, or text). */
export function sniffFirstBytes(path: string): SourceFormat | 'binary' | 'empty' {
  const buf = Buffer.alloc(4096);
  const fd = openSync(path, 'r');
  let n: number;
  try {
    n = readSync(fd, buf, 0, buf.length, 0);
  } finally {
    closeSync(fd);
  }
  if (n === 0) return 'empty';
  const head = buf.subarray(0, n);
  const text = head.toString('latin1');
  if (text.startsWith('SIMPLE  =')) return 'fits';
  const trimmed = text.replace(/^\uFEFF|^ï»¿/, '').trimStart();
  if (trimmed.startsWith('<?xml') || trimmed.startsWith('<VOTABLE')) return 'votable';
  if (head.includes(0)) return 'binary';
  const firstLine = trimmed.split('\n').find((l) => l.trim() !== '' && !l.startsWith('#')) ?? '';
  return firstLine.includes('\t') && !firstLine.includes(',') ? 'tsv' : 'csv';
}

function formatFromName(fileName: string): SourceFormat | undefined {
  const lower = fileName.toLowerCase().replace(/\.gz$/, '');
  if (/\.(csv|txt)$/.test(lower)) return 'csv';
  if (/\.(tsv|tab)$/.test(lower)) return 'tsv';
  if (/\.(fits|fit|fts)$/.test(lower)) return 'fits';
  if (/\.(vot|votable|xml)$/.test(lower)) return 'votable';
  return undefined;
}

/**
 * Decide the format (explicit > content; the file name must not contradict the content) and open
 * the matching reader. A .csv that holds FITS or XML, or a binary file named as text, is refused.
 */
export async function openTable(
  path: string,
  fileName: string,
  declared?: SourceFormat,
  delimiter?: string,
): Promise<SourceTable> {
  const sniffed = sniffFirstBytes(path);
  if (sniffed === 'empty')
    throw new InputError('empty_file', `${fileName} is empty (0 bytes)`, { file: fileName });
  const byName = formatFromName(fileName);
  const claimed = declared ?? byName;
  const text = (f: string | undefined) => f === 'csv' || f === 'tsv';
  if (sniffed === 'binary' || (claimed && !(claimed === sniffed || (text(claimed) && text(sniffed))))) {
    const what =
      sniffed === 'binary'
        ? 'binary data'
        : sniffed === 'fits'
          ? 'a FITS file'
          : sniffed === 'votable'
            ? 'an XML/VOTable file'
            : 'delimited text';
    throw new InputError(
      'format_mismatch',
      `${fileName} is ${declared ? `declared as ${declared}` : `named as ${claimed ?? 'text'}`} but its content looks like ${what}`,
      { file: fileName, declared: claimed, detected: sniffed },
    );
  }
  const format = claimed ?? sniffed;
  if (format === 'csv' || format === 'tsv') return openDelimited(path, { format, delimiter });
  throw new InputError('format_unavailable', `reading ${format} files is not available yet`, { format });
}
