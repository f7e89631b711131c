import { describe, expect, it } from 'vitest';
import { openFits } from '../../../src/store/readers/fits.js';
import type { CellValue, SourceRow } from '../../../src/store/readers/types.js';
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

/** Compare one decoded FITS cell with the CSV text of the same cell. */
function expectSameAsCsv(got: CellValue, csv: string, column: string): void {
  if (csv === '') {
    // missing in the CSV: TNULL → null for integers, NaN kept for floats (so validation can report it)
    expect(got === null || Number.isNaN(got), `${column}: expected null/NaN, got ${got}`).toBe(true);
  } else if (column === 'good') {
    expect(got).toBe(csv === 'true');
  } else if (typeof got === 'number') {
    // D columns hold the CSV's decimal exactly; z_err is stored × 1e-5 (TSCAL), exact to round-off
    expectClose(got, Number(csv), { rtol: column === 'z_err' ? 1e-12 : 0 });
  } else {
    expect(got).toBe(csv);
  }
}

describe('FITS binary-table reader', () => {
  it('reads the GALAXIES table of field.fits with exactly the values of field.csv', async () => {
    // Fixture written by astropy (scripts/fixtures/make_formats.py) from the same invented list as field.csv.
    const truth = readTruth();
    const t = await openFits(fixturePath('field.fits'));
    expect(t.format).toBe('fits');
    expect(t.positionKind).toBe('row');
    expect(t.extname).toBe('GALAXIES');
    expect(t.hduIndex).toBe(1);
    expect(t.rowCountHint).toBe(30);
    expect(t.columns.map((c) => c.name)).toEqual(truth.header);
    expect(t.columns.find((c) => c.name === 'ra')).toEqual({ name: 'ra', unit: 'deg', type: 'number' });
    expect(t.columns.find((c) => c.name === 'survey_key')?.type).toBe('string');
    const rows = await allRows(t);
    expect(rows.map((r) => r.position)).toEqual(Array.from({ length: 30 }, (_, i) => i + 1));
    rows.forEach((r, i) => {
      truth.header.forEach((col, c) => {
        expectSameAsCsv(r.values[c], truth.rows[i][c], col);
      });
    });
  });

  it('decodes the unsigned 16-bit convention (TZERO = 32768) to 0 … 65535 and 64-bit keys beyond 2^53 exactly', async () => {
    const t = await openFits(fixturePath('field.fits'));
    const rows = await allRows(t);
    const nExp = t.columns.findIndex((c) => c.name === 'n_exp');
    const key = t.columns.findIndex((c) => c.name === 'survey_key');
    expect(rows[0].values[nExp]).toBe(65535);
    expect(rows[1].values[nExp]).toBe(0);
    expect(rows[2].values[key]).toBe('-9223372036854775807');
  });

  it('turns TNULL integers into null and keeps NaN floats as NaN', async () => {
    const t = await openFits(fixturePath('field.fits'));
    const rows = await allRows(t);
    const zErr = t.columns.findIndex((c) => c.name === 'z_err');
    const lme = t.columns.findIndex((c) => c.name === 'log_mstar_err');
    expect(rows[4].values[zErr]).toBeNull();
    expect(rows[17].values[zErr]).toBeNull();
    expect(Number.isNaN(rows[9].values[lme])).toBe(true);
  });

  it('joins a CONTINUE long string and lists the variable-length column it does not read', async () => {
    const t = await openFits(fixturePath('field.fits'));
    expect(String(t.header.get('FIELDDSC'))).toMatch(
      /^Invented demonstration field .* CONTINUE long-string convention\.$/,
    );
    expect(t.skipped).toEqual([
      expect.objectContaining({ name: 'spec_pix', reason: expect.stringMatching(/variable-length/) }),
    ]);
    await t.close();
  });

  it('finds the second table past the first one’s heap, by EXTNAME in any case or by index', async () => {
    for (const hdu of ['GROUPS', 'groups', 2] as const) {
      const t = await openFits(fixturePath('field.fits'), { hdu });
      expect(t.columns.map((c) => c.name)).toEqual(['group_id', 'ra', 'dec', 'n_member']);
      const rows = await allRows(t);
      expect(rows.map((r) => r.values)).toEqual([
        ['GRP-01', 212.41, -8.93, 5],
        ['GRP-02', 212.33, -8.85, 3],
        ['GRP-03', 212.47, -8.97, 7],
      ]);
    }
  });

  it('refuses an image HDU, the primary array and a missing EXTNAME, listing the HDUs', async () => {
    await expect(openFits(fixturePath('field.fits'), { hdu: 3 })).rejects.toThrow(
      /HDU 3 'PREVIEW' is not a binary table: it is an XTENSION = 'IMAGE' HDU/,
    );
    await expect(openFits(fixturePath('field.fits'), { hdu: 0 })).rejects.toThrow(/it is the primary array/);
    await expect(openFits(fixturePath('field.fits'), { hdu: 'STARS' })).rejects.toThrow(
      /no HDU named 'STARS'; its HDUs are: 0 \(primary array\), 1 'GALAXIES' \(BINTABLE\), 2 'GROUPS' \(BINTABLE\), 3 'PREVIEW' \(IMAGE\)/,
    );
  });

  it('reports a truncated table with the first incomplete row, before any row is returned', async () => {
    const err = await openFits(fixturePath('truncated.fits')).catch((e) => e);
    expect(err.name).toBe('FileFormatError');
    expect(err.message).toMatch(
      /truncated: HDU 1 declares 30 rows of 78 bytes .* only 12 complete rows are present, row 13 is cut off/,
    );
    expect(err.where).toEqual({ row: 13 });
  });

  it('names the card of a header card without its "=" and of an unreadable value', async () => {
    const bad = await openFits(fixturePath('badcard.fits')).catch((e) => e);
    expect(bad.message).toBe(
      "HDU 1, header card 5 (NAXIS2): no '= ' value indicator in bytes 9–10, but NAXIS2 needs a value",
    );
    expect(bad.where).toEqual({ card: 5 });
    await expect(openFits(fixturePath('badvalue.fits'))).rejects.toThrow(
      /HDU 1, header card 2 \(BITPIX\): cannot read the value 'eight'/,
    );
  });

  it('says a header without END ends the file', async () => {
    await expect(openFits(fixturePath('noend.fits'))).rejects.toThrow(/HDU 0: the header has no END card/);
  });

  it('says a CSV renamed .fits is not FITS but delimited text, and an XML file looks like a VOTable', async () => {
    await expect(openFits(fixturePath('csv_named.fits'))).rejects.toThrow(
      "not a FITS file: it does not begin with the card 'SIMPLE  = T' (it looks like delimited text (CSV/TSV))",
    );
    await expect(openFits(fixturePath('field.vot'))).rejects.toThrow(/it looks like XML \(a VOTable\?\)/);
  });
});
