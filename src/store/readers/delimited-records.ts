import { parse } from 'csv-parse/sync';
import { FileFormatError } from './types.js';

/**
 * One logical record of a delimited text file and the line it starts on (1-based): either a line
 * without quotes, kept whole (`text`; split it on the delimiter, or read it in place), or a quoted
 * record already split into its fields (`fields`).
 */
export type DelimitedRecord =
  | { readonly line: number; readonly text: string; readonly fields?: undefined }
  | { readonly line: number; readonly fields: string[]; readonly text?: undefined };

/** The fields of a record. */
export function recordFields(record: DelimitedRecord, delimiter: string): string[] {
  return record.fields ?? record.text.split(delimiter);
}

/** The fields of a record as cell values: an empty field is null (as every reader gives it). */
export function recordValues(record: DelimitedRecord, delimiter: string): (string | null)[] {
  const values: (string | null)[] = recordFields(record, delimiter);
  for (let i = 0; i < values.length; i++) if (values[i] === '') values[i] = null;
  return values;
}

function countQuotes(s: string): number {
  let n = 0;
  for (let i = s.indexOf('"'); i !== -1; i = s.indexOf('"', i + 1)) n++;
  return n;
}

/**
 * Split a stream of text chunks into delimited records, yielded as one array per chunk (a
 * generator step per record would cost more than the parsing). Fast path: a line without a double
 * quote is passed on whole, to be split on the delimiter directly (several times faster than a
 * general parser on plain numeric catalogues). A line with quotes is joined with the following lines until its quotes balance and
 * handed to csv-parse, which handles RFC 4180 quoting ("" escapes, delimiters and newlines inside
 * quotes). Handles a UTF-8 BOM, CRLF line ends, blank lines and '#' comment lines.
 */
export async function* delimitedRecords(
  chunks: AsyncIterable<string>,
  delimiter: string,
): AsyncGenerator<DelimitedRecord[]> {
  let rest = '';
  let lineNo = 0;
  let first = true;
  let pending: string[] | null = null; // lines of an unfinished quoted record
  let pendingStart = 0;
  let pendingQuotes = 0;

  function quoted(text: string, line: number): string[] {
    try {
      const rows = parse(text, {
        delimiter,
        relax_column_count: true,
        skip_empty_lines: false,
      }) as string[][];
      if (rows.length !== 1) throw new Error(`expected one record, found ${rows.length}`);
      return rows[0];
    } catch (err) {
      throw new FileFormatError(`line ${line}: cannot parse quoted fields (${(err as Error).message})`, {
        line,
      });
    }
  }

  let out: DelimitedRecord[] = [];
  function handle(raw: string): void {
    lineNo++;
    let line = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    if (first) {
      if (line.charCodeAt(0) === 0xfeff) line = line.slice(1);
      first = false;
    }
    if (pending) {
      pending.push(line);
      pendingQuotes += countQuotes(line);
      if (pendingQuotes % 2 === 0) {
        const text = pending.join('\n');
        pending = null;
        out.push({ line: pendingStart, fields: quoted(text, pendingStart) });
      }
      return;
    }
    if (line.length === 0 || line.charCodeAt(0) === 35 /* # */) return;
    if (line.indexOf('"') === -1) {
      out.push({ line: lineNo, text: line });
      return;
    }
    const q = countQuotes(line);
    if (q % 2 === 0) {
      out.push({ line: lineNo, fields: quoted(line, lineNo) });
      return;
    }
    pending = [line];
    pendingStart = lineNo;
    pendingQuotes = q;
  }

  for await (const chunk of chunks) {
    const text = rest + chunk;
    const lines = text.split('\n');
    rest = lines.pop() ?? '';
    for (const l of lines) handle(l);
    if (out.length > 0) {
      yield out;
      out = [];
    }
  }
  if (rest.length > 0) handle(rest);
  if (out.length > 0) yield out;
  if (pending) {
    throw new FileFormatError(`line ${pendingStart}: a quoted field is never closed (unbalanced '"')`, {
      line: pendingStart,
    });
  }
}
