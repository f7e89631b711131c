/**
 * The quantities forehalo stores for a galaxy, and the column names and IVOA UCDs by which a
 * catalogue usually labels them. Recognition is case-insensitive and ignores '_', '-', '.' and spaces
 * (so RA_deg, ra-deg and RADEG are one name).
 */
export const FIELDS = [
  'id',
  'ra',
  'dec',
  'z',
  'z_spec',
  'z_phot',
  'z_err',
  'z_spec_err',
  'z_phot_err',
  'z_kind',
  'log_mstar',
  'log_mstar_err',
  'g',
  'i',
  'log_mhalo',
  'log_mhalo_err',
  'mhalo_def',
  'group_id',
] as const;

export type Field = (typeof FIELDS)[number];

export function isField(name: string): name is Field {
  return (FIELDS as readonly string[]).includes(name);
}

/** Column-name spellings seen in survey catalogues (normalised: lower case, letters and digits only). */
const ALIASES: Record<Field, readonly string[]> = {
  id: ['id', 'objid', 'objectid', 'object', 'sourceid', 'galaxyid', 'galid', 'name', 'objname', 'identifier'],
  ra: ['ra', 'raj2000', 'radeg', 'alphaj2000', 'raicrs', 'ra2000', 'alpha', 'radegrees'],
  dec: [
    'dec',
    'decl',
    'dej2000',
    'decj2000',
    'decdeg',
    'deltaj2000',
    'deicrs',
    'decicrs',
    'dec2000',
    'delta',
  ],
  z: ['z', 'redshift', 'zbest', 'bestz'],
  z_spec: ['zspec', 'specz', 'zsp', 'zspectro', 'speczbest'],
  z_phot: ['zphot', 'photoz', 'photz', 'zph', 'zphotbest', 'zb', 'zml'],
  z_err: ['zerr', 'zerror', 'redshifterr', 'redshifterror', 'ez', 'sigmaz', 'zsigma', 'errz'],
  z_spec_err: ['zspecerr', 'speczerr', 'ezspec', 'zspecerror'],
  z_phot_err: ['zphoterr', 'photozerr', 'photzerr', 'ezphot', 'zphoterror', 'photozerror'],
  z_kind: ['zkind', 'ztype', 'redshifttype', 'redshiftkind', 'zsource'],
  log_mstar: [
    'logmstar',
    'lmass',
    'mstar',
    'logm',
    'logmass',
    'lmstar',
    'logmstellar',
    'logsm',
    'stellarmass',
  ],
  log_mstar_err: ['logmstarerr', 'lmasserr', 'mstarerr', 'elogmstar', 'logmerr', 'logmasserr', 'lmstarerr'],
  g: ['g', 'gmag', 'maggab', 'magg', 'gab', 'gapmag'],
  i: ['i', 'imag', 'magiab', 'magi', 'iab', 'iapmag'],
  log_mhalo: ['logmhalo', 'lmhalo', 'mhalo', 'logmh', 'loghalomass'],
  log_mhalo_err: ['logmhaloerr', 'lmhaloerr', 'mhaloerr', 'elogmhalo', 'logmherr'],
  mhalo_def: ['mhalodef', 'halomassdef', 'mhalodefinition', 'massdef'],
  group_id: ['groupid', 'grpid', 'group', 'groupname'],
};

/** UCD words (IVOA UCD1+) that identify a field when the name does not. */
const UCDS: { field: Field; test: (words: string[]) => boolean }[] = [
  { field: 'z_phot_err', test: (w) => w.includes('stat.error') && w.includes('src.redshift.phot') },
  { field: 'z_err', test: (w) => w.includes('stat.error') && w.includes('src.redshift') },
  { field: 'z_phot', test: (w) => w[0] === 'src.redshift.phot' },
  { field: 'z', test: (w) => w[0] === 'src.redshift' },
  { field: 'ra', test: (w) => w[0] === 'pos.eq.ra' },
  { field: 'dec', test: (w) => w[0] === 'pos.eq.dec' },
  { field: 'id', test: (w) => w[0] === 'meta.id' && w.includes('meta.main') },
];

export function normaliseName(name: string): string {
  return name.toLowerCase().replace(/[^a-z0-9]/g, '');
}

export function fieldForName(name: string): Field | undefined {
  const key = normaliseName(name);
  return FIELDS.find((f) => ALIASES[f].includes(key));
}

export function fieldForUcd(ucd: string): Field | undefined {
  const words = ucd
    .toLowerCase()
    .split(';')
    .map((w) => w.trim())
    .filter(Boolean);
  if (words.length === 0) return undefined;
  return UCDS.find((u) => u.test(words))?.field;
}
