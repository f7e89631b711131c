import type { HaloKit } from './kit.js';
import type { CatalogRow } from './types.js';

/** The mean-relation halo of a row at its catalogued redshift, before any scatter. */
export interface CentralHalo {
  /** log₁₀ M_h [M☉] in the model's definition, capped at model.log_mhalo_max. */
  readonly logMhalo: number;
  /** 'catalogue': a catalogued halo mass used as given; 'shmr': from the stellar mass. */
  readonly source: 'catalogue' | 'shmr';
  /** log₁₀ M_h in the SHMR's own definition (shmr source only). */
  readonly logMhNative: number | null;
  readonly flags: readonly string[];
}

/**
 * Halo mass of one row: a catalogued halo mass converted to the chosen definition, else the inverse
 * of the chosen SHMR at the catalogued stellar mass and redshift (physics.md §4.5), converted from the
 * SHMR's native definition. Returns null when the row has neither mass.
 */
export function centralHalo(row: CatalogRow, kit: HaloKit): CentralHalo | null {
  const ceiling = kit.model.log_mhalo_max;
  const flags: string[] = [];
  let logM: number;
  let source: CentralHalo['source'];
  let logMhNative: number | null = null;
  if (row.logMhalo !== null && row.logMhalo !== undefined) {
    source = 'catalogue';
    logM = kit.toModelLogMass(row.logMhalo, row.mhaloDef ?? kit.massDefinition, row.z);
  } else if (row.logMstar !== null) {
    source = 'shmr';
    const inv = kit.shmrInvert(row.logMstar, row.z);
    if (inv.status === 'above-range') flags.push('mstar_above_shmr_range');
    if (inv.status === 'below-range') flags.push('mstar_below_shmr_range');
    logMhNative = inv.logMh;
    const [lo, hi] = kit.shmrLogMhRange;
    if (inv.status === 'ok' && inv.logMh > hi) flags.push('mhalo_above_shmr_fit_range');
    if (inv.status === 'ok' && inv.logMh < lo) flags.push('mhalo_below_shmr_fit_range');
    const [zLo, zHi] = kit.shmrZRange;
    if (row.z < zLo || row.z > zHi) flags.push('z_outside_shmr_fit_range');
    logM = kit.toModelLogMass(inv.logMh, kit.shmrNativeDefinition, row.z);
  } else {
    return null;
  }
  if (logM > ceiling) {
    flags.push('mhalo_capped_at_ceiling');
    logM = ceiling;
  }
  return { logMhalo: logM, source, logMhNative, flags };
}
