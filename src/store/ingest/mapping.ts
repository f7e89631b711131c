import { InputError } from '../../errors.js';
import type { ColumnInfo } from '../readers/types.js';
import { FIELDS, type Field, fieldForName, fieldForUcd, isField } from './fields.js';

/** Which file column (by index and name) feeds each stored field. */
export interface ColumnMapping {
  readonly index: Partial<Record<Field, number>>;
  readonly column: Partial<Record<Field, string>>;
  /** How each field was found: 'explicit', 'name' or 'ucd'. */
  readonly how: Partial<Record<Field, 'explicit' | 'name' | 'ucd'>>;
}

/** Parse 'ra=ALPHA_J2000,dec=DELTA_J2000,z=ZPHOT' into {ra: 'ALPHA_J2000', ...}. */
export function parseMapSpec(spec: string): Partial<Record<Field, string>> {
  const out: Partial<Record<Field, string>> = {};
  for (const part of spec.split(',')) {
    if (part.trim() === '') continue;
    const eq = part.indexOf('=');
    const field = part.slice(0, eq).trim();
    const column = part.slice(eq + 1).trim();
    if (eq < 1 || column === '') {
      throw new InputError('bad_mapping', `mapping entry '${part}' is not of the form field=COLUMN`, {
        entry: part,
      });
    }
    if (!isField(field)) {
      throw new InputError(
        'bad_mapping',
        `mapping names unknown field '${field}'; known fields: ${FIELDS.join(', ')}`,
        {
          entry: part,
        },
      );
    }
    if (out[field] !== undefined) throw new InputError('bad_mapping', `mapping gives field '${field}' twice`);
    out[field] = column;
  }
  return out;
}

/**
 * Decide which column feeds which field: an explicit mapping first, then recognised column names,
 * then VOTable/FITS UCDs. Two columns that both look like one field is an error (say which with a
 * mapping). Requires ra, dec and at least one redshift column (z, z_spec or z_phot).
 */
export function resolveMapping(
  columns: readonly ColumnInfo[],
  explicit: Partial<Record<Field, string>> = {},
): ColumnMapping {
  const index: Partial<Record<Field, number>> = {};
  const column: Partial<Record<Field, string>> = {};
  const how: Partial<Record<Field, 'explicit' | 'name' | 'ucd'>> = {};
  const names = columns.map((c) => c.name);
  const taken = new Set<number>();

  for (const [field, name] of Object.entries(explicit) as [Field, string][]) {
    let i = names.indexOf(name);
    if (i === -1) i = names.findIndex((n) => n.toLowerCase() === name.toLowerCase());
    if (i === -1) {
      throw new InputError(
        'unknown_column',
        `mapping ${field}=${name}: the file has no column '${name}' (columns: ${names.join(', ')})`,
        {
          field,
          column: name,
        },
      );
    }
    index[field] = i;
    column[field] = names[i];
    how[field] = 'explicit';
    taken.add(i);
  }

  for (const pass of ['name', 'ucd'] as const) {
    const found = new Map<Field, number[]>();
    columns.forEach((c, i) => {
      if (taken.has(i)) return;
      const f = pass === 'name' ? fieldForName(c.name) : c.ucd ? fieldForUcd(c.ucd) : undefined;
      if (f && index[f] === undefined) found.set(f, [...(found.get(f) ?? []), i]);
    });
    for (const [f, idx] of found) {
      if (idx.length > 1) {
        throw new InputError(
          'ambiguous_columns',
          `columns ${idx.map((i) => `'${names[i]}'`).join(' and ')} all look like '${f}'; choose one with a mapping such as ${f}=${names[idx[0]]}`,
          { field: f, columns: idx.map((i) => names[i]) },
        );
      }
      index[f] = idx[0];
      column[f] = names[idx[0]];
      how[f] = pass;
      taken.add(idx[0]);
    }
  }

  const missing: string[] = [];
  if (index.ra === undefined) missing.push('ra');
  if (index.dec === undefined) missing.push('dec');
  if (index.z === undefined && index.z_spec === undefined && index.z_phot === undefined) missing.push('z');
  if (missing.length > 0) {
    throw new InputError(
      'missing_columns',
      `no column found for ${missing.join(', ')} (file columns: ${names.join(', ')}); name them with a mapping such as ra=RA_COL,dec=DEC_COL,z=Z_COL`,
      { missing, columns: names },
    );
  }
  return { index, column, how };
}
