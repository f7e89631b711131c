/**
 * VOTable reader (IVOA VOTable 1.4, Recommendation 2019): stream-parses the XML with saxes, picks a
 * TABLE (the first by default, or by 0-based index in document order, or by name), reads its FIELDs
 * and streams rows from TABLEDATA or BINARY2. The file is read in 64 kB chunks, so memory holds one
 * chunk plus at most one batch of rows.
 */
import { createReadStream } from 'node:fs';
import { SaxesParser, type SaxesTagPlain } from 'saxes';
import {
  type CellValue,
  type ColumnInfo,
  FileFormatError,
  type SourceRow,
  type SourceTable,
} from './types.js';
import { Binary2Decoder } from './votable-binary2.js';
import { cellFromText, checkField, columnInfo, type VotField } from './votable-fields.js';

export interface VotableOpenOptions {
  /** TABLE to read: 0-based index in document order, or its name= (case-insensitive). Default: the first. */
  table?: number | string;
}

export interface VotableTable extends SourceTable {
  readonly format: 'votable';
  readonly tableIndex: number;
  readonly tableName?: string;
  readonly serialization: 'TABLEDATA' | 'BINARY2';
}

function local(name: string): string {
  const i = name.indexOf(':');
  return i === -1 ? name : name.slice(i + 1);
}

export async function openVotable(path: string, options: VotableOpenOptions = {}): Promise<VotableTable> {
  const stream = createReadStream(path, { encoding: 'utf8', highWaterMark: 1 << 16 });
  const chunks = stream[Symbol.asyncIterator]() as AsyncIterator<string>;
  const parser = new SaxesParser({ position: true });

  const want = options.table;
  const fields: VotField[] = [];
  const seenTables: string[] = [];
  let tableCount = 0;
  let inChosen = false;
  let chosenIndex = -1;
  let chosenName: string | undefined;
  let headerDone = false;
  let serialization: 'TABLEDATA' | 'BINARY2' | undefined;
  let rootChecked = false;
  let finished = false; // the chosen table has ended
  let depthField: VotField | undefined;
  let inTd = false;
  let tdText = '';
  let rowCells: string[] | undefined;
  let rowLine = 0;
  let rowNumber = 0;
  let inStream = false;
  let binary: Binary2Decoder | undefined;
  const pending: SourceRow[] = [];

  const pushRow = (values: CellValue[]) => {
    rowNumber++;
    pending.push({ position: rowNumber, values });
  };

  parser.on('opentag', (tag) => {
    const name = local(tag.name);
    const attr = (tag as SaxesTagPlain).attributes as Record<string, string>;
    if (!rootChecked) {
      rootChecked = true;
      if (name !== 'VOTABLE') {
        throw new FileFormatError(
          `not a VOTable: the root element is <${tag.name}> (line ${parser.line}), not <VOTABLE>`,
          { line: parser.line },
        );
      }
    }
    if (finished) return;
    if (name === 'TABLE') {
      const idx = tableCount++;
      const tname = attr.name;
      seenTables.push(`${idx}${tname ? ` '${tname}'` : ''}`);
      const match =
        want === undefined
          ? idx === 0
          : typeof want === 'number'
            ? idx === want
            : tname !== undefined && tname.toLowerCase() === want.toLowerCase();
      if (match && chosenIndex === -1) {
        inChosen = true;
        chosenIndex = idx;
        chosenName = tname;
      }
      return;
    }
    if (!inChosen) return;
    if (name === 'FIELD' && !headerDone) {
      const f: VotField = {
        name: attr.name ?? attr.ID ?? `col${fields.length + 1}`,
        unit: attr.unit,
        ucd: attr.ucd,
        datatype: attr.datatype ?? '',
        arraysize: attr.arraysize,
      };
      checkField(f, parser.line);
      fields.push(f);
      depthField = f;
    } else if (name === 'VALUES' && depthField && attr.null !== undefined) {
      depthField.nullText = attr.null;
    } else if (name === 'DATA') {
      headerDone = true;
    } else if (name === 'TABLEDATA') {
      serialization = 'TABLEDATA';
    } else if (name === 'BINARY2') {
      serialization = 'BINARY2';
      binary = new Binary2Decoder(fields, pushRow);
    } else if (name === 'BINARY' || name === 'FITS') {
      throw new FileFormatError(
        `line ${parser.line}: the table is serialized as ${name}, which is not read; convert it to TABLEDATA or BINARY2`,
        { line: parser.line },
      );
    } else if (name === 'STREAM' && serialization === 'BINARY2') {
      if (attr.href) {
        throw new FileFormatError(
          `line ${parser.line}: the BINARY2 STREAM refers to an external file; not read`,
          {
            line: parser.line,
          },
        );
      }
      inStream = true;
    } else if (name === 'TR' && serialization === 'TABLEDATA') {
      rowCells = [];
      rowLine = parser.line;
    } else if (name === 'TD' && rowCells) {
      inTd = true;
      tdText = '';
    }
  });

  parser.on('text', (text) => {
    if (inTd) tdText += text;
    else if (inStream) binary!.push(text);
  });
  parser.on('cdata', (text) => {
    if (inTd) tdText += text;
  });

  parser.on('closetag', (tag) => {
    if (finished || !inChosen) return;
    const name = local(tag.name);
    if (name === 'FIELD') depthField = undefined;
    else if (name === 'TD' && rowCells) {
      rowCells.push(tdText);
      inTd = false;
    } else if (name === 'TR' && rowCells) {
      const where = { row: rowNumber + 1, line: rowLine };
      if (rowCells.length !== fields.length) {
        throw new FileFormatError(
          `row ${where.row} (line ${rowLine}): ${rowCells.length} TD cells for ${fields.length} FIELDs`,
          where,
        );
      }
      pushRow(rowCells.map((text, i) => cellFromText(fields[i], text, where)));
      rowCells = undefined;
    } else if (name === 'STREAM' && inStream) {
      inStream = false;
      binary!.end(parser.line);
    } else if (name === 'TABLE') {
      headerDone = true;
      inChosen = false;
      finished = true;
    }
  });

  let eof = false;
  /** Feed the next chunk to the parser; false at end of file. Parser errors become FileFormatError. */
  async function feed(): Promise<boolean> {
    if (eof) return false;
    const next = await chunks.next();
    try {
      if (next.done) {
        eof = true;
        parser.close();
        return false;
      }
      parser.write(next.value);
      return true;
    } catch (err) {
      stream.destroy();
      if (err instanceof FileFormatError) throw err;
      const msg = (err as Error).message.replace(/^(.*?:)?\d+:\d+: /, '');
      const line = parser.line;
      throw new FileFormatError(`the XML is not well-formed at line ${line}: ${msg}`, { line });
    }
  }

  // Header phase: read until the chosen table's DATA begins (or the table/file ends).
  while (!headerDone || chosenIndex === -1) {
    if (!(await feed())) break;
  }
  if (!rootChecked) {
    stream.destroy();
    throw new FileFormatError('not a VOTable: the file holds no XML element');
  }
  if (chosenIndex === -1) {
    stream.destroy();
    const what =
      want === undefined ? 'no TABLE' : `no TABLE ${typeof want === 'number' ? want : `named '${want}'`}`;
    throw new FileFormatError(
      `the VOTable has ${what}${seenTables.length ? `; its tables are: ${seenTables.join(', ')}` : ''}`,
    );
  }
  if (fields.length === 0) {
    stream.destroy();
    throw new FileFormatError(
      `TABLE ${chosenIndex}${chosenName ? ` '${chosenName}'` : ''} has no FIELD elements`,
    );
  }
  const names = new Set<string>();
  for (const f of fields) {
    if (names.has(f.name.toLowerCase())) {
      stream.destroy();
      throw new FileFormatError(`two FIELDs are named '${f.name}'`, { column: f.name });
    }
    names.add(f.name.toLowerCase());
  }
  const columns: ColumnInfo[] = fields.map(columnInfo);
  let used = false;

  async function* batches(batchSize = 50_000): AsyncGenerator<SourceRow[]> {
    if (used) throw new Error('a SourceTable can be iterated only once');
    used = true;
    try {
      for (;;) {
        while (pending.length >= batchSize) yield pending.splice(0, batchSize);
        if (finished || !(await feed())) break;
      }
      // drain: the rest of the file is still checked for well-formedness
      while (await feed()) {
        while (pending.length >= batchSize) yield pending.splice(0, batchSize);
      }
      while (pending.length > 0) yield pending.splice(0, batchSize);
    } finally {
      stream.destroy();
    }
  }

  return {
    format: 'votable',
    columns,
    positionKind: 'row',
    tableIndex: chosenIndex,
    tableName: chosenName,
    serialization: serialization ?? 'TABLEDATA',
    batches,
    close: async () => {
      stream.destroy();
    },
  };
}
