/**
 * The galaxy table of a sightline reply as CSV, one row per candidate, units in the header
 * (`name [unit]`). Quoting follows RFC 4180: fields with comma, quote or newline are quoted.
 */
const COLUMNS: ReadonlyArray<readonly [header: string, pick: (g: Record<string, unknown>) => unknown]> = [
  ['id', (g) => g.id],
  ['catalog', (g) => g.catalog],
  ['ra [deg]', (g) => g.ra],
  ['dec [deg]', (g) => g.dec],
  ['z', (g) => g.z],
  ['z_err', (g) => g.z_err],
  ['z_kind', (g) => g.z_kind],
  ['sep [arcsec]', (g) => g.sep_arcsec],
  ['b [kpc]', (g) => g.b_kpc],
  ['log_mstar [log10 Msun]', (g) => g.log_mstar],
  ['log_mhalo [log10 Msun]', (g) => g.log_mhalo],
  ['r_halo [kpc]', (g) => g.r_halo_kpc],
  ['b_over_rhalo', (g) => g.b_over_rhalo],
  ['concentration', (g) => g.concentration],
  ['p_fg', (g) => g.p_fg],
  ['dm_central [pc cm^-3]', (g) => g.dm_central],
  ['dm_mean [pc cm^-3]', (g) => dm(g).mean],
  ['dm_p2_5 [pc cm^-3]', (g) => dm(g).p2_5],
  ['dm_p16 [pc cm^-3]', (g) => dm(g).p16],
  ['dm_p50 [pc cm^-3]', (g) => dm(g).p50],
  ['dm_p84 [pc cm^-3]', (g) => dm(g).p84],
  ['dm_p97_5 [pc cm^-3]', (g) => dm(g).p97_5],
  ['p_contributes', (g) => g.p_contributes],
  ['flags', (g) => (Array.isArray(g.flags) ? g.flags.join(';') : '')],
];

const dm = (g: Record<string, unknown>): Record<string, unknown> =>
  (g.dm as Record<string, unknown> | undefined) ?? {};

export function csvField(value: unknown): string {
  if (value === null || value === undefined) return '';
  const text = typeof value === 'number' ? (Number.isFinite(value) ? String(value) : '') : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

export function galaxyTableCsv(galaxies: readonly Record<string, unknown>[]): string {
  const lines = [COLUMNS.map(([header]) => csvField(header)).join(',')];
  for (const g of galaxies) lines.push(COLUMNS.map(([, pick]) => csvField(pick(g))).join(','));
  return `${lines.join('\r\n')}\r\n`;
}
