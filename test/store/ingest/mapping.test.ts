import { describe, expect, it } from 'vitest';
import { parseMapSpec, resolveMapping } from '../../../src/store/ingest/mapping.js';
import type { ColumnInfo } from '../../../src/store/readers/types.js';

const cols = (...names: (string | Partial<ColumnInfo>)[]): ColumnInfo[] =>
  names.map((n) =>
    typeof n === 'string' ? { name: n, type: 'string' } : { name: 'x', type: 'number', ...n },
  );

describe('column mapping', () => {
  it('recognises survey spellings regardless of case and separators', () => {
    const m = resolveMapping(
      cols('OBJID', 'ALPHA_J2000', 'DELTA_J2000', 'Z_PHOT', 'photoz_err', 'LMASS', 'mag_g_ab', 'GRP_ID'),
    );
    expect(m.column).toEqual({
      id: 'OBJID',
      ra: 'ALPHA_J2000',
      dec: 'DELTA_J2000',
      z_phot: 'Z_PHOT',
      z_phot_err: 'photoz_err',
      log_mstar: 'LMASS',
      g: 'mag_g_ab',
      group_id: 'GRP_ID',
    });
  });

  it('falls back on VOTable UCDs when names say nothing', () => {
    const m = resolveMapping(
      cols(
        { name: 'c1', ucd: 'pos.eq.ra;meta.main' },
        { name: 'c2', ucd: 'pos.eq.dec;meta.main' },
        { name: 'c3', ucd: 'src.redshift.phot' },
        { name: 'c4', ucd: 'stat.error;src.redshift.phot' },
      ),
    );
    expect(m.column).toEqual({ ra: 'c1', dec: 'c2', z_phot: 'c3', z_phot_err: 'c4' });
    expect(m.how.ra).toBe('ucd');
  });

  it('lets an explicit mapping win and refuses two candidates for one field', () => {
    expect(() => resolveMapping(cols('ra', 'RAJ2000', 'dec', 'z'))).toThrow(
      /columns 'ra' and 'RAJ2000' all look like 'ra'/,
    );
    const m = resolveMapping(cols('ra', 'RAJ2000', 'dec', 'z'), parseMapSpec('ra=RAJ2000'));
    expect(m.column.ra).toBe('RAJ2000');
    expect(m.how.ra).toBe('explicit');
  });

  it('names what is missing and what is unknown', () => {
    expect(() => resolveMapping(cols('id', 'ra'))).toThrow(
      /no column found for dec, z \(file columns: id, ra\)/,
    );
    expect(() => parseMapSpec('ra=A,velocity=V')).toThrow(/unknown field 'velocity'/);
    expect(() => parseMapSpec('ra')).toThrow(/not of the form field=COLUMN/);
    expect(() => resolveMapping(cols('ra', 'dec', 'z'), { z: 'ZB' })).toThrow(/the file has no column 'ZB'/);
  });
});
