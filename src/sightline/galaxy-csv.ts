import type { GalaxyResult } from './schemas.js';

/**
 * The galaxy table of a sightline result as CSV (RFC 4180 quoting, CRLF line ends), one row per
 * foreground candidate, units in the header as `name [unit]`. Used by `forehalo sightline --csv` and
 * `?format=csv`. With `sightlineLabel`, a first column `sightline` tells batch rows apart.
 */
const COLUMNS: ReadonlyArray<readonly [string, (g: GalaxyResult) => unknown]> = [
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
  ['dm_mean [pc cm^-3]', (g) => g.dm.mean],
  ['dm_p2_5 [pc cm^-3]', (g) => g.dm.p2_5],
  ['dm_p16 [pc cm^-3]', (g) => g.dm.p16],
  ['dm_p50 [pc cm^-3]', (g) => g.dm.p50],
  ['dm_p84 [pc cm^-3]', (g) => g.dm.p84],
  ['dm_p97_5 [pc cm^-3]', (g) => g.dm.p97_5],
  ['p_contributes', (g) => g.p_contributes],
  ['flags', (g) => g.flags.join(';')],
];

export function csvField(value: unknown): string {
  if (value === null || value === undefined) return '';
  const text = typeof value === 'number' ? (Number.isFinite(value) ? String(value) : '') : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/** Header line of the galaxy table (no line end). */
export function galaxyCsvHeader(withSightline = false): string {
  const cols = COLUMNS.map(([h]) => csvField(h));
  return (withSightline ? ['sightline', ...cols] : cols).join(',');
}

/** Data lines of the galaxy table (no line ends). */
export function galaxyCsvRows(galaxies: readonly GalaxyResult[], sightlineLabel?: string): string[] {
  return galaxies.map((g) => {
    const cells = COLUMNS.map(([, pick]) => csvField(pick(g)));
    return (sightlineLabel === undefined ? cells : [csvField(sightlineLabel), ...cells]).join(',');
  });
}

/** The whole table with header, CRLF line ends. */
export function galaxyTableCsv(galaxies: readonly GalaxyResult[]): string {
  return `${[galaxyCsvHeader(), ...galaxyCsvRows(galaxies)].join('\r\n')}\r\n`;
}
