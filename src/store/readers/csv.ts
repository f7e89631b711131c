import { createReadStream } from 'node:fs';
import type { Readable } from 'node:stream';
import { StringDecoder } from 'node:string_decoder';
import { type DelimitedRecord, delimitedRecords, recordFields, recordValues } from './delimited-records.js';
import { type ColumnInfo, FileFormatError, type SourceRow, type SourceTable } from './types.js';

export interface DelimitedOptions {
  /** Field separator; default ',' for CSV and a tab for TSV (format 'tsv' or a .tsv/.tab name). */
  delimiter?: string;
  format?: 'csv' | 'tsv';
}

/**
 * Bytes read at a time. Each chunk's records stay alive until they are converted; 64 KiB (~1000
 * catalogue lines) lets them die young in the V8 heap. Measured on a 300k-row CSV (CPU time of read,
 * split and convert, median of 3): 1 MiB chunks 1.7 s, 64 KiB 0.8 s, 16 KiB 1.1 s.
 */
const READ_CHUNK_BYTES = 1 << 16;

async function* utf8Chunks(stream: Readable): AsyncGenerator<string> {
  const decoder = new StringDecoder('utf8');
  for await (const buf of stream) {
    const s = typeof buf === 'string' ? buf : decoder.write(buf as Buffer);
    if (s.length > 0) yield s;
  }
  const tail = decoder.end();
  if (tail.length > 0) yield tail;
}

const OTHER_DELIMITERS: Record<string, string> = {
  ';': 'semicolon',
  '\t': 'tab',
  '|': 'vertical bar',
  ',': 'comma',
};

function checkHeader(record: DelimitedRecord, delimiter: string): string[] {
  const names = recordFields(record, delimiter).map((f) => f.trim());
  if (names.length === 1) {
    for (const [d, word] of Object.entries(OTHER_DELIMITERS)) {
      if (d !== delimiter && names[0].includes(d)) {
        throw new FileFormatError(
          `line ${record.line}: the header has a single column '${names[0].slice(0, 60)}'; the file looks ` +
            `${word}-separated, not '${delimiter === '\t' ? '\\t' : delimiter}'-separated — give the delimiter ` +
            'explicitly (or convert the file)',
          { line: record.line },
        );
      }
    }
  }
  const seen = new Set<string>();
  names.forEach((name, i) => {
    if (name === '')
      throw new FileFormatError(`line ${record.line}: header column ${i + 1} has no name`, {
        line: record.line,
      });
    if (seen.has(name)) {
      throw new FileFormatError(`line ${record.line}: header names column '${name}' twice`, {
        line: record.line,
        column: name,
      });
    }
    seen.add(name);
  });
  return names;
}

/**
 * Open a CSV or TSV catalogue (a path or any byte stream, e.g. an HTTP request body). The first
 * non-blank, non-'#' line is the header. Cells are returned as strings (empty cell → null): the
 * ingest decides what each column means and converts it, so positions in error messages are lines.
 */
export async function openDelimited(
  source: string | Readable,
  options: DelimitedOptions = {},
): Promise<SourceTable> {
  const isTsv =
    options.format === 'tsv' ||
    (typeof source === 'string' && /\.(tsv|tab)$/i.test(source) && !options.format);
  const delimiter = options.delimiter ?? (isTsv ? '\t' : ',');
  if (delimiter.length !== 1 || delimiter === '"' || delimiter === '\n' || delimiter === '\r') {
    throw new FileFormatError(
      `delimiter must be one character other than a quote or newline, got '${delimiter}'`,
    );
  }
  const stream =
    typeof source === 'string' ? createReadStream(source, { highWaterMark: READ_CHUNK_BYTES }) : source;
  const lineRecords = delimitedRecords(utf8Chunks(stream), delimiter);
  let first: DelimitedRecord[] = [];
  try {
    while (first.length === 0) {
      const next = await lineRecords.next();
      if (next.done)
        throw new FileFormatError('the file is empty (no header line, only blank or # comment lines)');
      first = next.value;
    }
  } catch (err) {
    stream.destroy();
    throw err;
  }
  let names: string[];
  try {
    names = checkHeader(first[0], delimiter);
  } catch (err) {
    stream.destroy();
    throw err;
  }
  const columns: ColumnInfo[] = names.map((name) => ({ name, type: 'string' }));
  let used = false;

  async function* batches(batchSize = 50_000): AsyncGenerator<SourceRow[]> {
    if (used) throw new Error('a SourceTable can be iterated only once');
    used = true;
    let batch: SourceRow[] = [];
    try {
      const take = function* (recs: DelimitedRecord[]): Generator<SourceRow[]> {
        for (const rec of recs) {
          batch.push({ position: rec.line, values: recordValues(rec, delimiter) });
          if (batch.length >= batchSize) {
            yield batch;
            batch = [];
          }
        }
      };
      yield* take(first.slice(1));
      for await (const recs of lineRecords) yield* take(recs);
      if (batch.length > 0) yield batch;
    } finally {
      stream.destroy();
    }
  }

  /** The data records as the splitter gives them (for readers that decode lines in place). */
  async function* records(): AsyncGenerator<DelimitedRecord[]> {
    if (used) throw new Error('a SourceTable can be iterated only once');
    used = true;
    try {
      if (first.length > 1) yield first.slice(1);
      for await (const recs of lineRecords) yield recs;
    } finally {
      stream.destroy();
    }
  }

  return {
    format: delimiter === '\t' ? 'tsv' : 'csv',
    columns,
    positionKind: 'line',
    delimited: { delimiter, records },
    batches,
    close: async () => {
      stream.destroy();
    },
  };
}
