import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { coneSearchBruteForce, getCatalog, loadCatalog } from '../../../src/store/index.js';
import { expectClose } from '../../helpers/expect-close.js';
import { useTmp } from '../tmp.js';

// fixtures/formats holds one invented field written as CSV, FITS and VOTable by astropy
// (scripts/fixtures/make_formats.py): every format must load to the same galaxies.
const FORMATS = join(import.meta.dirname, '../../../fixtures/formats');

describe('loading the same field from CSV, FITS and VOTable', () => {
  const tmp = useTmp();

  it('stores identical galaxies whichever format carried them', async () => {
    const store = tmp.store();
    const files = { csv: 'field.csv', fits: 'field.fits', vot: 'field.vot', bin2: 'field_binary2.vot' };
    for (const [name, file] of Object.entries(files)) {
      const s = await loadCatalog(store, { source: join(FORMATS, file), name });
      expect(s.rows).toBe(30);
    }
    expect(getCatalog(store, 'vot').format).toBe('votable');
    expect(getCatalog(store, 'fits').format).toBe('fits');
    const all = coneSearchBruteForce(store, { raDeg: 212.4, decDeg: -8.9, radiusDeg: 5 });
    const view = (catalog: string) =>
      all
        .filter((r) => r.catalog === catalog)
        .map((r) => [r.objectId, r.raDeg, r.decDeg, r.z, r.zErr, r.zKind, r.logMstar, r.logMstarErr])
        .sort((a, b) => String(a[0]).localeCompare(String(b[0])));
    const reference = view('csv');
    expect(reference).toHaveLength(30);
    // Same objects in other catalogues are linked as one galaxy each.
    for (const other of ['fits', 'vot', 'bin2']) {
      const rows = view(other);
      // Ids and redshift kinds exactly; numbers to 1e-12 relative (FITS scaled integers, TSCAL/TZERO,
      // decode with round-off).
      expect(rows.map((r) => [r[0], r[5]])).toEqual(reference.map((r) => [r[0], r[5]]));
      rows.forEach((r, k) => {
        for (const c of [1, 2, 3, 4, 6, 7]) {
          const want = reference[k][c] as number | null;
          if (want === null) expect(r[c]).toBeNull();
          else expectClose(r[c] as number, want, { rtol: 1e-12 });
        }
      });
    }
    expect(all.filter((r) => r.preferred)).toHaveLength(30);
  });

  it('records how each column was recognised (VOTable UCDs and names)', async () => {
    const store = tmp.store();
    await loadCatalog(store, { source: join(FORMATS, 'field.vot'), name: 'vot' });
    const mapping = getCatalog(store, 'vot').mapping as {
      columns: Record<string, string>;
      units: Record<string, string>;
    };
    expect(mapping.columns).toMatchObject({ ra: 'ra', dec: 'dec', z: 'z', log_mstar: 'log_mstar' });
    expect(mapping.units.ra).toBe('deg');
  });

  it('refuses a CSV file named .fits and a VOTable that is not well-formed XML', async () => {
    const store = tmp.store();
    await expect(loadCatalog(store, { source: join(FORMATS, 'csv_named.fits'), name: 'x' })).rejects.toThrow(
      /named as fits but its content looks like delimited text/,
    );
    await expect(loadCatalog(store, { source: join(FORMATS, 'notxml.vot'), name: 'y' })).rejects.toThrow(
      /line 8|not well-formed|XML/i,
    );
  });
});
