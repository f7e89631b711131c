import { closeSync, openSync, readSync } from 'node:fs';
import { InputError } from '../../errors.js';
import { openDelimited } from '../readers/csv.js';
import { sniffFormat } from '../readers/sniff.js';
import type { SourceTable } from '../readers/types.js';

export type SourceFormat = 'csv' | 'tsv' | 'fits' | 'votable';

function firstBytes(path: string): Buffer {
  const buf = Buffer.alloc(8192);
  const fd = openSync(path, 'r');
  try {
    return buf.subarray(0, readSync(fd, buf, 0, buf.length, 0));
  } finally {
    closeSync(fd);
  }
}

function formatFromName(fileName: string): SourceFormat | undefined {
  const lower = fileName.toLowerCase();
  if (/\.(csv|txt)$/.test(lower)) return 'csv';
  if (/\.(tsv|tab)$/.test(lower)) return 'tsv';
  if (/\.(fits|fit|fts)$/.test(lower)) return 'fits';
  if (/\.(vot|votable|xml)$/.test(lower)) return 'votable';
  return undefined;
}

const isText = (f: string | undefined) => f === 'csv' || f === 'tsv';
const DESCRIBE: Record<string, string> = {
  csv: 'delimited text',
  tsv: 'delimited text',
  fits: 'a FITS file',
  votable: 'a VOTable (XML)',
  unknown: 'neither text, FITS nor VOTable (binary or other XML)',
};

/**
 * Decide the format (declared > file name, and the content must agree: sniffFormat) and open the
 * matching reader. A .csv that holds FITS or XML, or a binary file named as text, is refused.
 */
export async function openTable(
  path: string,
  fileName: string,
  declared?: SourceFormat,
  delimiter?: string,
): Promise<SourceTable> {
  const head = firstBytes(path);
  if (head.length === 0)
    throw new InputError('empty_file', `${fileName} is empty (0 bytes)`, { file: fileName });
  const sniffed = sniffFormat(head, fileName);
  const claimed = declared ?? formatFromName(fileName);
  if (sniffed === 'unknown' || (claimed && !(claimed === sniffed || (isText(claimed) && isText(sniffed))))) {
    throw new InputError(
      'format_mismatch',
      `${fileName} is ${declared ? `declared as ${declared}` : `named as ${claimed ?? 'a catalogue'}`} but its content looks like ${DESCRIBE[sniffed]}`,
      { file: fileName, claimed, detected: sniffed },
    );
  }
  // Text named .csv but tab-separated is read as TSV unless the caller declared the format.
  const format = declared ?? (isText(sniffed) ? sniffed : (claimed ?? sniffed));
  // The FITS and VOTable readers (and the XML parser) are loaded only when needed: every module
  // loaded here delays the parsing worker's first rows.
  if (format === 'fits') return (await import('../readers/fits.js')).openFits(path);
  if (format === 'votable') return (await import('../readers/votable.js')).openVotable(path);
  return openDelimited(path, { format, delimiter });
}
