import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { openDelimited } from '../../../src/store/readers/csv.js';
import { FileFormatError, type SourceRow } from '../../../src/store/readers/types.js';
import { useTmp } from '../tmp.js';

async function all(
  table: Awaited<ReturnType<typeof openDelimited>>,
  batchSize?: number,
): Promise<SourceRow[]> {
  const out: SourceRow[] = [];
  for await (const b of table.batches(batchSize)) out.push(...b);
  return out;
}

describe('openDelimited', () => {
  const tmp = useTmp();

  it('reads a header, skips # comments and blank lines, and reports file line numbers', async () => {
    const path = tmp.file('a.csv', '# made up\n\nid,ra,dec\n# mid comment\na,1.5,2\n\nb,3,-4\n');
    const t = await openDelimited(path);
    expect(t.columns.map((c) => c.name)).toEqual(['id', 'ra', 'dec']);
    expect(t.positionKind).toBe('line');
    const rows = await all(t);
    expect(rows).toEqual([
      { position: 5, values: ['a', '1.5', '2'] },
      { position: 7, values: ['b', '3', '-4'] },
    ]);
  });

  it('strips a UTF-8 byte-order mark and CRLF line ends', async () => {
    const path = tmp.file('b.csv', Buffer.from('\uFEFFid,ra\r\nx,1\r\ny,2\r\n', 'utf8'));
    const t = await openDelimited(path);
    expect(t.columns.map((c) => c.name)).toEqual(['id', 'ra']);
    expect((await all(t)).map((r) => r.values)).toEqual([
      ['x', '1'],
      ['y', '2'],
    ]);
  });

  it('parses quoted fields with delimiters, doubled quotes and newlines (RFC 4180), keeping the start line', async () => {
    const path = tmp.file('c.csv', 'id,note,ra\n"g,1","say ""hi""",1\n"g2","two\nlines",2\nplain,,3\n');
    const rows = await all(await openDelimited(path));
    expect(rows).toEqual([
      { position: 2, values: ['g,1', 'say "hi"', '1'] },
      { position: 3, values: ['g2', 'two\nlines', '2'] },
      { position: 5, values: ['plain', null, '3'] },
    ]);
  });

  it('reads TSV by extension and by option', async () => {
    const path = tmp.file('d.tsv', 'id\tra\nq\t7\n');
    const t = await openDelimited(path);
    expect(t.format).toBe('tsv');
    expect((await all(t))[0].values).toEqual(['q', '7']);
    const t2 = await openDelimited(tmp.file('d.txt', 'id\tra\nq\t7\n'), { format: 'tsv' });
    expect((await all(t2))[0].values).toEqual(['q', '7']);
  });

  it('streams from a Readable and splits batches at the requested size', async () => {
    const text = `id,v\n${Array.from({ length: 25 }, (_, i) => `r${i},${i}`).join('\n')}\n`;
    const t = await openDelimited(Readable.from([text.slice(0, 17), text.slice(17)]));
    const sizes: number[] = [];
    for await (const b of t.batches(10)) sizes.push(b.length);
    expect(sizes).toEqual([10, 10, 5]);
  });

  it('decodes multi-byte UTF-8 split across chunks', async () => {
    const bytes = Buffer.from('id,name\n1,Ωmega\n', 'utf8');
    const cut = bytes.indexOf(0xa9) > 0 ? bytes.indexOf(0xce) + 1 : 10;
    const t = await openDelimited(Readable.from([bytes.subarray(0, cut), bytes.subarray(cut)]));
    expect((await all(t))[0].values).toEqual(['1', 'Ωmega']);
  });

  it('refuses an empty file and a file with only comments', async () => {
    await expect(openDelimited(tmp.file('e.csv', ''))).rejects.toThrow(/empty/);
    await expect(openDelimited(tmp.file('f.csv', '# nothing\n\n'))).rejects.toThrow(/empty/);
  });

  it('names the delimiter when a semicolon file is read as CSV', async () => {
    const err = await openDelimited(tmp.file('g.csv', 'id;ra;dec\na;1;2\n')).catch((e) => e);
    expect(err).toBeInstanceOf(FileFormatError);
    expect(err.message).toMatch(/semicolon-separated/);
  });

  it('refuses duplicate and empty header names', async () => {
    await expect(openDelimited(tmp.file('h.csv', 'id,ra,ra\n'))).rejects.toThrow(/names column 'ra' twice/);
    await expect(openDelimited(tmp.file('i.csv', 'id,,ra\n'))).rejects.toThrow(/column 2 has no name/);
  });

  it('reports an unclosed quote with its line', async () => {
    const t = await openDelimited(tmp.file('j.csv', 'id,ra\n"open,1\nx,2\n'));
    await expect(all(t)).rejects.toThrow(/line 2: a quoted field is never closed/);
  });
});
