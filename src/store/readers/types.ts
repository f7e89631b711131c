import { InputError } from '../../errors.js';
import type { DelimitedRecord } from './delimited-records.js';

/**
 * The common shape of every catalogue file reader (CSV/TSV, FITS binary table, VOTable).
 * A reader opens the file, reads its column descriptions, and then streams rows in batches so
 * memory does not grow with file size. Values are already decoded to JS types; the column mapper
 * and validator (src/store/ingest) decide what they mean.
 */
export type CellValue = string | number | boolean | null;

export interface ColumnInfo {
  /** Column name as written in the file. */
  readonly name: string;
  /** Unit string if the format carries one (FITS TUNITn, VOTable unit=). */
  readonly unit?: string;
  /** IVOA UCD if the format carries one (VOTable ucd=, e.g. 'pos.eq.ra;meta.main'). */
  readonly ucd?: string;
  /** Broad type of the decoded values. */
  readonly type: 'number' | 'string' | 'boolean';
}

export interface SourceRow {
  /** 1-based position for error messages: the line number for text formats, the row number otherwise. */
  readonly position: number;
  readonly values: CellValue[];
}

export interface SourceTable {
  readonly format: 'csv' | 'tsv' | 'fits' | 'votable';
  readonly columns: readonly ColumnInfo[];
  /** 'line' for text formats (CSV/TSV), 'row' for FITS and VOTable: what SourceRow.position counts. */
  readonly positionKind: 'line' | 'row';
  /** Total rows if the header says so (FITS NAXIS2), else undefined. */
  readonly rowCountHint?: number;
  /** Rows in batches, in file order. Iterate once (this or delimited.records). */
  batches(batchSize?: number): AsyncIterable<SourceRow[]>;
  /** CSV/TSV only: the records undecoded (unquoted lines kept whole), for reading lines in place. */
  readonly delimited?: {
    readonly delimiter: string;
    records(): AsyncIterable<DelimitedRecord[]>;
  };
  /** Release file handles early (also done when iteration finishes). */
  close(): Promise<void>;
}

/** A reader failed to understand its input; message names the line/row/card and the reason. */
export class FileFormatError extends InputError {
  readonly where?: { line?: number; row?: number; card?: number; column?: string };
  constructor(message: string, where?: { line?: number; row?: number; card?: number; column?: string }) {
    super('bad_file', message, where);
    this.name = 'FileFormatError';
    this.where = where;
  }
}
