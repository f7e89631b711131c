import { describe, expect, it } from 'vitest';
import type { CellValue, SourceRow } from '../../../src/store/readers/types.js';
import { openVotable } from '../../../src/store/readers/votable.js';
import { expectClose } from '../../helpers/expect-close.js';
import { fixturePath, readTruth } from './formats-truth.js';

async function allRows(
  t: { batches(n?: number): AsyncIterable<SourceRow[]> },
  batch = 7,
): Promise<SourceRow[]> {
  const out: SourceRow[] = [];
  for await (const b of t.batches(batch)) out.push(...b);
  return out;
}

function expectSameAsCsv(got: CellValue, csv: string, column: string): void {
  if (csv === '') {
    expect(got, column).toBeNull();
  } else if (column === 'good') {
    expect(got).toBe(csv === 'true');
  } else if (typeof got === 'number') {
    // astropy writes doubles with repr(); z_err was computed as integer × 1e-5, hence the 1e-12 tolerance
    expectClose(got, Number(csv), { rtol: 1e-12 });
  } else {
    expect(got).toBe(csv);
  }
}

describe('VOTable reader', () => {
  for (const [file, serialization] of [
    ['field.vot', 'TABLEDATA'],
    ['field_binary2.vot', 'BINARY2'],
  ] as const) {
    it(`reads ${file} (${serialization}) with the values of field.csv, units and UCDs`, async () => {
      // Fixtures written by astropy.io.votable (scripts/fixtures/make_formats.py) from the invented list.
      const truth = readTruth();
      const t = await openVotable(fixturePath(file));
      expect(t.format).toBe('votable');
      expect(t.serialization).toBe(serialization);
      expect(t.tableName).toBe('galaxies');
      expect(t.columns.map((c) => c.name)).toEqual(truth.header);
      expect(t.columns[1]).toEqual({ name: 'ra', unit: 'deg', ucd: 'pos.eq.ra;meta.main', type: 'number' });
      expect(t.columns.find((c) => c.name === 'good')?.type).toBe('boolean');
      expect(t.columns.find((c) => c.name === 'survey_key')?.type).toBe('string');
      const rows = await allRows(t);
      expect(rows.length).toBe(30);
      expect(rows.map((r) => r.position)).toEqual(Array.from({ length: 30 }, (_, i) => i + 1));
      rows.forEach((r, i) => {
        truth.header.forEach((col, c) => {
          expectSameAsCsv(r.values[c], truth.rows[i][c], col);
        });
      });
    });

    it(`picks the second table of ${file} by name or index`, async () => {
      for (const table of ['groups', 'GROUPS', 1] as const) {
        const t = await openVotable(fixturePath(file), { table });
        expect(t.tableIndex).toBe(1);
        expect(t.columns.map((c) => c.name)).toEqual(['group_id', 'n_member']);
        const rows = await allRows(t);
        expect(rows.map((r) => r.values)).toEqual([
          ['GRP-01', 5],
          ['GRP-02', 3],
          ['GRP-03', 7],
        ]);
      }
    });
  }

  it('names the missing table and lists the ones there are', async () => {
    await expect(openVotable(fixturePath('field.vot'), { table: 'stars' })).rejects.toThrow(
      "the VOTable has no TABLE named 'stars'; its tables are: 0 'galaxies', 1 'groups'",
    );
  });

  it('reports XML that is not well-formed with its line', async () => {
    // Small files are parsed while the header is read, large ones while rows stream: either way one error.
    const err = await openVotable(fixturePath('notxml.vot'))
      .then((t) => allRows(t))
      .catch((e) => e);
    expect(err.name).toBe('FileFormatError');
    expect(err.message).toMatch(/^the XML is not well-formed at line 8: /);
    expect(err.where).toEqual({ line: 8 });
  });

  it('says well-formed XML that is not a VOTable is not a VOTable, and so is a FITS file', async () => {
    await expect(openVotable(fixturePath('notvotable.xml'))).rejects.toThrow(
      'not a VOTable: the root element is <catalog> (line 2), not <VOTABLE>',
    );
    await expect(openVotable(fixturePath('field.fits'))).rejects.toThrow(
      /not well-formed at line 1|not a VOTable/,
    );
  });
});
