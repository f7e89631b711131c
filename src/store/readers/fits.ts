/**
 * FITS binary-table reader (FITS Standard 4.0, IAU FITS Working Group 2018): walks the HDUs of a
 * file, picks a BINTABLE by index or EXTNAME (default: the first one), and streams its rows in
 * batches read straight from the file, so memory does not grow with the table.
 *
 * Why our own reader: the npm FITS packages we looked at are image viewers for the browser (they read
 * the whole file into memory as an ArrayBuffer and target image HDUs) or have been unmaintained for
 * years; none streams binary-table rows from a file handle with TSCAL/TZERO/TNULL handling.
 */
import { type FileHandle, open } from 'node:fs/promises';
import type { FitsValue } from './fits-card.js';
import { type FitsColumn, type SkippedColumn, tableColumns } from './fits-columns.js';
import { BLOCK, dataUnitBytes, type FitsHeader, readHeader, requireInt } from './fits-header.js';
import { type CellValue, FileFormatError, type SourceRow, type SourceTable } from './types.js';

export interface FitsOpenOptions {
  /** HDU to read: 0-based index as astropy counts (0 = primary array), or its EXTNAME (case-insensitive). */
  hdu?: number | string;
}

export interface FitsTable extends SourceTable {
  readonly format: 'fits';
  /** 0-based index of the HDU being read, and its EXTNAME if any. */
  readonly hduIndex: number;
  readonly extname?: string;
  /** Valued header keywords of that HDU (long strings joined from CONTINUE cards). */
  readonly header: ReadonlyMap<string, FitsValue>;
  /** Columns that are not read (bit, complex and variable-length arrays), with the reason. */
  readonly skipped: readonly SkippedColumn[];
}

/** Bytes read per chunk while streaming rows. */
const CHUNK_BYTES = 4 << 20;

function describeNonFits(first: Buffer): string {
  const text = first.toString('latin1');
  if (/^\s*(<\?xml|<VOTABLE)/i.test(text)) return 'it looks like XML (a VOTable?)';
  const printable = [...first].every(
    (b) => b === 9 || b === 10 || b === 13 || (b >= 32 && b < 127) || b >= 160,
  );
  if (printable && /[,\t;]/.test(text) && /\n/.test(text)) return 'it looks like delimited text (CSV/TSV)';
  if (printable) return 'it looks like plain text';
  return 'its first bytes are not a FITS header card';
}

function extnameOf(h: FitsHeader): string | undefined {
  const v = h.values.get('EXTNAME');
  return typeof v === 'string' ? v.trim() : undefined;
}

function kindOf(h: FitsHeader): string {
  if (h.hdu === 0) return 'primary array';
  const x = h.values.get('XTENSION');
  return typeof x === 'string' ? x.trim() : '?';
}

async function selectHdu(
  fh: FileHandle,
  fileSize: number,
  want: number | string | undefined,
): Promise<FitsHeader> {
  const first = Buffer.alloc(Math.min(80, fileSize));
  await fh.read(first, 0, first.length, 0);
  if (fileSize === 0) throw new FileFormatError('not a FITS file: the file is empty');
  if (!first.toString('latin1').startsWith('SIMPLE  =')) {
    throw new FileFormatError(
      `not a FITS file: it does not begin with the card 'SIMPLE  = T' (${describeNonFits(first)})`,
      { card: 1 },
    );
  }
  const seen: string[] = [];
  let offset = 0;
  for (let hdu = 0; offset < fileSize; hdu++) {
    const h = await readHeader(fh, offset, hdu, fileSize);
    if (hdu === 0 && h.values.get('SIMPLE') !== true) {
      throw new FileFormatError('HDU 0, header card 1: SIMPLE must be T for a standard FITS file', {
        card: 1,
      });
    }
    if (hdu > 0 && typeof h.values.get('XTENSION') !== 'string') {
      throw new FileFormatError(`HDU ${hdu} (byte ${offset}): the header does not begin with XTENSION`, {
        card: 1,
      });
    }
    const name = extnameOf(h);
    seen.push(`${hdu}${name ? ` '${name}'` : ''} (${kindOf(h)})`);
    const isTable = kindOf(h) === 'BINTABLE';
    const matches =
      want === undefined
        ? isTable
        : typeof want === 'number'
          ? hdu === want
          : name !== undefined && name.toLowerCase() === want.trim().toLowerCase();
    if (matches) {
      if (!isTable) {
        throw new FileFormatError(
          `HDU ${hdu}${name ? ` '${name}'` : ''} is not a binary table: it is ` +
            (hdu === 0 ? 'the primary array' : `an XTENSION = '${kindOf(h)}' HDU`) +
            " (choose an HDU with XTENSION = 'BINTABLE')",
        );
      }
      return h;
    }
    offset = h.dataStart + dataUnitBytes(h);
  }
  const what =
    want === undefined
      ? 'no binary table (BINTABLE) HDU'
      : `no HDU ${typeof want === 'number' ? want : `named '${want}'`}`;
  throw new FileFormatError(`the FITS file has ${what}; its HDUs are: ${seen.join(', ')}`);
}

/** Open a FITS file and describe one binary table; rows are read only when `batches()` is iterated. */
export async function openFits(path: string, options: FitsOpenOptions = {}): Promise<FitsTable> {
  const fh = await open(path, 'r');
  try {
    const fileSize = (await fh.stat()).size;
    const h = await selectHdu(fh, fileSize, options.hdu);
    const rowBytes = requireInt(h, 'NAXIS1');
    const nRows = requireInt(h, 'NAXIS2');
    if (requireInt(h, 'NAXIS') !== 2) {
      throw new FileFormatError(`HDU ${h.hdu}: a binary table must have NAXIS = 2`, {
        card: h.cardOf.get('NAXIS'),
      });
    }
    const { columns, skipped } = tableColumns(h);
    const needed = rowBytes * nRows;
    const available = fileSize - h.dataStart;
    if (available < needed) {
      const complete = rowBytes > 0 ? Math.max(0, Math.floor(available / rowBytes)) : 0;
      throw new FileFormatError(
        `the FITS file is truncated: HDU ${h.hdu} declares ${nRows} rows of ${rowBytes} bytes ` +
          `(${needed} bytes from byte ${h.dataStart}) but the file ends at byte ${fileSize}; ` +
          `only ${complete} complete rows are present, row ${complete + 1} is cut off`,
        { row: complete + 1 },
      );
    }
    return fitsTable(fh, h, columns, skipped, rowBytes, nRows);
  } catch (err) {
    await fh.close();
    throw err;
  }
}

function fitsTable(
  fh: FileHandle,
  h: FitsHeader,
  columns: FitsColumn[],
  skipped: SkippedColumn[],
  rowBytes: number,
  nRows: number,
): FitsTable {
  let closed = false;
  let used = false;
  const close = async () => {
    if (!closed) {
      closed = true;
      await fh.close();
    }
  };
  async function* batches(batchSize = 50_000): AsyncGenerator<SourceRow[]> {
    if (used) throw new Error('a SourceTable can be iterated only once');
    used = true;
    const rowsPerChunk = Math.max(1, Math.min(batchSize, Math.floor(CHUNK_BYTES / Math.max(rowBytes, 1))));
    const buf = Buffer.alloc(rowsPerChunk * rowBytes);
    let batch: SourceRow[] = [];
    try {
      for (let row = 0; row < nRows; ) {
        const n = Math.min(rowsPerChunk, nRows - row);
        const want = n * rowBytes;
        const { bytesRead } = await fh.read(buf, 0, want, h.dataStart + row * rowBytes);
        if (bytesRead < want) {
          throw new FileFormatError(
            `the FITS file is truncated: row ${row + Math.floor(bytesRead / rowBytes) + 1} of ${nRows} is cut off`,
            { row: row + Math.floor(bytesRead / rowBytes) + 1 },
          );
        }
        for (let i = 0; i < n; i++) {
          const values: CellValue[] = new Array(columns.length);
          for (let c = 0; c < columns.length; c++) values[c] = columns[c].decode(buf, i * rowBytes);
          batch.push({ position: row + i + 1, values });
          if (batch.length >= batchSize) {
            yield batch;
            batch = [];
          }
        }
        row += n;
      }
      if (batch.length > 0) yield batch;
    } finally {
      await close();
    }
  }
  return {
    format: 'fits',
    columns: columns.map(({ name, unit, type }) => (unit ? { name, unit, type } : { name, type })),
    positionKind: 'row',
    rowCountHint: nRows,
    hduIndex: h.hdu,
    extname: extnameOf(h),
    header: h.values,
    skipped,
    batches,
    close,
  };
}

export { BLOCK as FITS_BLOCK_BYTES };
