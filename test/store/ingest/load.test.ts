import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../src/errors.js';
import { coneSearchBruteForce, getCatalog, listCatalogs, loadCatalog } from '../../../src/store/index.js';
import { expectClose } from '../../helpers/expect-close.js';
import { useTmp } from '../tmp.js';

const HEADER = 'id,ra,dec,z,z_err,z_kind,log_mstar,log_mstar_err';
const GOOD = `${HEADER}\nA1,150.1,2.2,0.10,0.0002,spec,10.5,0.1\nA2,150.2,2.3,0.30,0.04,photo,9.8,0.2\n`;

async function failure(p: Promise<unknown>): Promise<InputError> {
  const err = await p.then(
    () => null,
    (e) => e,
  );
  expect(err).toBeInstanceOf(InputError);
  return err as InputError;
}

function everything(store: ReturnType<ReturnType<typeof useTmp>['store']>) {
  return coneSearchBruteForce(store, { raDeg: 0, decDeg: 90, radiusDeg: 180 });
}

describe('loadCatalog', () => {
  const tmp = useTmp();

  it('stores every field of every row as given (round trip)', async () => {
    const store = tmp.store();
    const s = await loadCatalog(store, {
      source: tmp.file('good.csv', GOOD),
      name: 'field-a',
      description: 'test',
    });
    expect(s).toMatchObject({ outcome: 'loaded', rows: 2, totalRows: 2, skipped: 0, format: 'csv' });
    expect(s.sha256).toMatch(/^[0-9a-f]{64}$/);
    const rows = everything(store).sort((a, b) => a.objectId.localeCompare(b.objectId));
    expect(rows[0]).toMatchObject({
      catalog: 'field-a',
      objectId: 'A1',
      raDeg: 150.1,
      decDeg: 2.2,
      z: 0.1,
      zErr: 0.0002,
      zKind: 'spec',
      logMstar: 10.5,
      logMstarErr: 0.1,
      massEstimated: false,
      sourcePosition: 2,
      physicalKey: 'field-a/A1',
      preferred: true,
    });
    expect(rows[1]).toMatchObject({ objectId: 'A2', zKind: 'photo', zErr: 0.04, sourcePosition: 3 });
    const info = getCatalog(store, 'field-a');
    expect(info).toMatchObject({
      description: 'test',
      sourceFile: 'good.csv',
      rows: 2,
      spectroscopic: 1,
      photometric: 1,
    });
    expect(info.mapping).toMatchObject({ columns: { ra: 'ra', dec: 'dec', z: 'z' }, storageOrder: 13 });
  });

  it('reads sexagesimal positions (RA in hours) and converts linear masses and σ/(1+z) errors', async () => {
    const store = tmp.store();
    const csv = 'name,RAJ2000,DEJ2000,zphot,zphot_err,mstar\nq,14:09:36.2,-08:54:12,0.5,0.02,3.1623e10\n';
    const s = await loadCatalog(store, {
      source: tmp.file('sex.csv', csv),
      name: 'sex',
      defaults: { zErrKind: 'sigma_over_1pz' },
    });
    expect(s.warnings.join(' ')).toMatch(/linear M☉/);
    const [r] = everything(store);
    // 14h09m36.2s = 15 × (14 + 9/60 + 36.2/3600) deg; −(8 + 54/60 + 12/3600) deg (common practice)
    expectClose(r.raDeg, 212.4008333333333, { rtol: 1e-12 });
    expectClose(r.decDeg, -8.903333333333334, { rtol: 1e-12 });
    expect(r.zKind).toBe('photo');
    expectClose(r.zErr!, 0.02 * 1.5, { rtol: 1e-12 });
    expectClose(r.logMstar!, Math.log10(3.1623e10), { rtol: 1e-12 });
  });

  it('accepts an explicit mapping and per-catalogue defaults for z_kind and z_err', async () => {
    const store = tmp.store();
    const csv = 'OBJ,ALPHA_J2000,DELTA_J2000,ZBEST,MASS\nk1,10,-5,0.2,10.1\n';
    await loadCatalog(store, {
      source: tmp.file('m.csv', csv),
      name: 'mapped',
      map: 'id=OBJ,ra=ALPHA_J2000,dec=DELTA_J2000,z=ZBEST,log_mstar=MASS',
      defaults: { zKind: 'photo', zErr: 0.05, massUnit: 'log' },
    });
    expect(everything(store)[0]).toMatchObject({
      objectId: 'k1',
      raDeg: 10,
      z: 0.2,
      zKind: 'photo',
      zErr: 0.05,
      logMstar: 10.1,
    });
  });

  it('prefers a spectroscopic redshift column over a photometric one row by row', async () => {
    const store = tmp.store();
    const csv =
      'id,ra,dec,z_spec,z_phot,z_phot_err,log_mstar\na,1,1,0.101,0.12,0.03,10\nb,1,1.1,,0.33,0.03,10\n';
    await loadCatalog(store, { source: tmp.file('zz.csv', csv), name: 'zz' });
    const rows = everything(store).sort((x, y) => x.objectId.localeCompare(y.objectId));
    expect(rows.map((r) => [r.z, r.zKind])).toEqual([
      [0.101, 'spec'],
      [0.33, 'photo'],
    ]);
  });

  it('wraps RA of exactly 360 to 0 and says so', async () => {
    const store = tmp.store();
    const s = await loadCatalog(store, {
      source: tmp.file('w.csv', `${HEADER}\nw,360,0,0.1,0.001,spec,10,0.1\n`),
      name: 'w',
    });
    expect(everything(store)[0].raDeg).toBe(0);
    expect(s.warnings.join(' ')).toMatch(/RA exactly 360/);
  });

  it('takes the same file under the same name again as a no-op', async () => {
    const store = tmp.store();
    const path = tmp.file('good.csv', GOOD);
    await loadCatalog(store, { source: path, name: 'again' });
    const s = await loadCatalog(store, { source: path, name: 'again' });
    expect(s.outcome).toBe('unchanged');
    expect(s.message).toMatch(/already holds this file/);
    expect(listCatalogs(store)).toHaveLength(1);
  });

  it('refuses a different file under an existing name unless replace or append is asked', async () => {
    const store = tmp.store();
    await loadCatalog(store, { source: tmp.file('good.csv', GOOD), name: 'x' });
    const other = tmp.file('other.csv', `${HEADER}\nB1,10,10,0.2,0.001,spec,10,0.1\n`);
    const err = await failure(loadCatalog(store, { source: other, name: 'x' }));
    expect(err.code).toBe('catalog_exists');

    const r = await loadCatalog(store, { source: other, name: 'x', mode: 'replace' });
    expect(r).toMatchObject({ outcome: 'replaced', totalRows: 1 });
    expect(everything(store).map((g) => g.objectId)).toEqual(['B1']);

    const more = tmp.file(
      'more.csv',
      `${HEADER}\nB1,10,10,0.25,0.001,spec,10.2,0.1\nB2,11,10,0.2,0.001,spec,10,0.1\n`,
    );
    const a = await loadCatalog(store, { source: more, name: 'x', mode: 'append' });
    expect(a).toMatchObject({ outcome: 'appended', rows: 2, totalRows: 2 });
    const rows = everything(store).sort((p, q) => p.objectId.localeCompare(q.objectId));
    expect(rows.map((g) => [g.objectId, g.z])).toEqual([
      ['B1', 0.25],
      ['B2', 0.2],
    ]);
  });

  it('loads from a stream (as an HTTP body would arrive) with the original file name', async () => {
    const store = tmp.store();
    const s = await loadCatalog(store, {
      source: Readable.from([GOOD.slice(0, 30), GOOD.slice(30)]),
      fileName: 'upload.csv',
      name: 'streamed',
    });
    expect(s.rows).toBe(2);
    expect(getCatalog(store, 'streamed').sourceFile).toBe('upload.csv');
  });

  it('reports progress in rows read', async () => {
    const store = tmp.store();
    const lines = Array.from({ length: 250 }, (_, i) => `g${i},${i % 360},0,0.1,0.001,spec,10,0.1`);
    const seen: number[] = [];
    await loadCatalog(store, {
      source: tmp.file('p.csv', `${HEADER}\n${lines.join('\n')}\n`),
      name: 'p',
      batchSize: 100,
      onProgress: (n) => seen.push(n),
    });
    expect(seen).toEqual([100, 200, 250]);
  });
});

describe('loadCatalog refuses bad files with a clear message and writes nothing', () => {
  const tmp = useTmp();

  const cases: [string, string, RegExp][] = [
    ['empty file', '', /empty/],
    ['header only', `${HEADER}\n`, /header but no data rows/],
    ['missing dec and z columns', 'id,ra,mass\na,1,10\n', /no column found for dec, z/],
    ['semicolon delimiter', 'id;ra;dec;z\na;1;2;0.1\n', /semicolon-separated/],
    ['NaN value', `${HEADER}\nn,1,2,NaN,0.001,spec,10,0.1\n`, /line 2, column z: is not a number/],
    [
      'infinite value',
      `${HEADER}\nn,1,2,0.1,inf,spec,10,0.1\n`,
      /line 2, column z_err: is not a number|is infinite/,
    ],
    ['RA out of range', `${HEADER}\nn,361,2,0.1,0.001,spec,10,0.1\n`, /column ra: must be in \[0, 360\)/],
    ['Dec out of range', `${HEADER}\nn,1,-91,0.1,0.001,spec,10,0.1\n`, /column dec: must be in \[-90, 90\]/],
    ['negative z', `${HEADER}\nn,1,2,-0.1,0.001,spec,10,0.1\n`, /column z: must be ≥ 0/],
    ['negative error', `${HEADER}\nn,1,2,0.1,-0.001,spec,10,0.1\n`, /column z_err: must be ≥ 0/],
    [
      'stellar mass out of range',
      `${HEADER}\nn,1,2,0.1,0.001,spec,14.2,0.1\n`,
      /log10\(M\* \/ M☉\) must be within 6–13/,
    ],
    [
      'unknown z kind',
      `${HEADER}\nn,1,2,0.1,0.001,guess,10,0.1\n`,
      /column z_kind: must be 'spec' or 'photo'/,
    ],
    [
      'duplicate ids',
      `${HEADER}\nd,1,2,0.1,0.001,spec,10,0.1\nd,3,4,0.1,0.001,spec,10,0.1\n`,
      /line 3, column id: duplicate id \(first at line 2\)/,
    ],
    ['short row', `${HEADER}\nn,1,2\n`, /expected 8 fields as in the header, found 3/],
    [
      'z kind unknown for a plain z column',
      'id,ra,dec,z,log_mstar\nn,1,2,0.1,10\n',
      /say whether z is 'spec' or 'photo'/,
    ],
    [
      'photo-z without an error',
      'id,ra,dec,z_phot,log_mstar\nn,1,2,0.1,10\n',
      /photometric redshift needs an error/,
    ],
    [
      'no mass at all',
      'id,ra,dec,z,z_kind\nn,1,2,0.1,spec\n',
      /needs a stellar mass, both g and i magnitudes, or a halo mass/,
    ],
  ];

  for (const [what, content, message] of cases) {
    it(`a file with ${what}`, async () => {
      const store = tmp.store();
      const err = await failure(loadCatalog(store, { source: tmp.file('bad.csv', content), name: 'bad' }));
      expect(err.message).toMatch(message);
      expect(listCatalogs(store)).toEqual([]);
      expect(store.db.prepare('SELECT COUNT(*) AS n FROM galaxy').get()).toEqual({ n: 0 });
    });
  }

  it('a FITS file named .csv (format mismatch)', async () => {
    const store = tmp.store();
    const fits = Buffer.alloc(2880, ' ');
    fits.write('SIMPLE  =                    T', 0, 'latin1');
    const err = await failure(loadCatalog(store, { source: tmp.file('looks.csv', fits), name: 'bad' }));
    expect(err.code).toBe('format_mismatch');
    expect(err.message).toMatch(/looks\.csv is named as csv but its content looks like a FITS file/);
  });

  it('a CSV declared as VOTable', async () => {
    const store = tmp.store();
    const err = await failure(
      loadCatalog(store, { source: tmp.file('t.csv', GOOD), name: 'bad', format: 'votable' }),
    );
    expect(err.message).toMatch(/declared as votable but its content looks like delimited text/);
  });

  it('carries the first 100 problems with line, column, value and reason in the error details', async () => {
    const store = tmp.store();
    const lines = Array.from({ length: 150 }, (_, i) => `b${i},400,0,0.1,0.001,spec,10,0.1`);
    const err = await failure(
      loadCatalog(store, { source: tmp.file('many.csv', `${HEADER}\n${lines.join('\n')}\n`), name: 'bad' }),
    );
    const details = err.details as {
      problems: { position: number; column: string; value: string; reason: string }[];
    };
    expect(details.problems).toHaveLength(100);
    expect(details.problems[0]).toEqual({
      position: 2,
      positionKind: 'line',
      column: 'ra',
      value: '400',
      reason: 'must be in [0, 360) degrees',
    });
  });

  it('with skipInvalid loads the good rows and stores the report of the bad ones', async () => {
    const store = tmp.store();
    const csv = `${HEADER}\ng1,1,2,0.1,0.001,spec,10,0.1\nb1,1,95,0.1,0.001,spec,10,0.1\ng2,3,4,0.2,0.001,spec,10,0.1\ng1,5,6,0.1,0.001,spec,10,0.1\n`;
    const s = await loadCatalog(store, {
      source: tmp.file('mixed.csv', csv),
      name: 'mixed',
      skipInvalid: true,
    });
    expect(s).toMatchObject({ rows: 2, skipped: 2 });
    expect(s.report.problems.map((p) => [p.position, p.column])).toEqual([
      [3, 'dec'],
      [5, 'id'],
    ]);
    const stored = getCatalog(store, 'mixed');
    expect(stored.rowsSkipped).toBe(2);
    expect((stored.report as { problemCount: number }).problemCount).toBe(2);
    expect(
      everything(store)
        .map((r) => r.objectId)
        .sort(),
    ).toEqual(['g1', 'g2']);
  });
});
