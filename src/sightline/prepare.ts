import { type HaloKit, haloRadiusFromDensity } from './kit.js';
import { foregroundThreshold, probabilityForeground } from './p-foreground.js';
import { redshiftSigma } from './redshift-range.js';
import type { Candidate } from './search.js';
import { buildShmrTable, positionOfStellarMass, type ShmrTable } from './shmr-table.js';

/** Smallest impact parameter used in DM integrals [kpc]: guards the NFW cusp (physics.md §6, "e.g. 1 kpc"). */
export const B_FLOOR_KPC = 1;

/** Everything about one foreground galaxy that does not change between draws. */
export interface PreparedGalaxy {
  readonly cand: Candidate;
  readonly isPhoto: boolean;
  readonly zCat: number;
  /** Photo-z width σ (0 for spectroscopic rows). */
  readonly sigmaZ: number;
  readonly sepRad: number;
  // Central (mean-relation, catalogued-value) halo:
  readonly logMhalo: number;
  readonly massMsun: number;
  readonly rHaloKpc: number;
  readonly concentration: number;
  readonly bKpc: number;
  readonly dmCentral: number;
  readonly pFg: number;
  // Monte Carlo inputs:
  /** 'shmr': drawn from log M*; 'catalogue': catalogued halo mass ± its error; 'none': not drawn. */
  readonly mode: 'shmr' | 'catalogue' | 'none';
  readonly logMstar: number;
  readonly sigmaMeasDex: number;
  readonly sigmaShmrDex: number;
  readonly sigmaHaloDex: number;
  readonly table: ShmrTable | null;
  /** Fractional table position of the catalogued stellar mass (draws are offsets from it). */
  readonly tablePos: number;
  /**
   * Photometric rows: log₁₀ c(M_central, z) − log₁₀ c(M_central, z_cat) on a uniform z grid from z0 in
   * steps of dz, so a drawn redshift moves c without calling the relation (the z-evolution is taken at
   * the central mass; its mass dependence is weak).
   */
  readonly cShift: { readonly z0: number; readonly dz: number; readonly values: Float64Array } | null;
  readonly flags: string[];
}

export interface PrepareContext {
  readonly zSource: number;
  readonly zSourceErr: number;
}

/**
 * Central values and Monte Carlo ingredients for one candidate. dm_central takes every input at its
 * catalogued or mean-relation value at the catalogued redshift (observer frame, exact integrator),
 * and is 0 when that redshift is not in front of the burst environment. `countable` false (member of a
 * catalogued group halo) keeps the row listed with no DM.
 */
export function prepareGalaxy(
  cand: Candidate,
  kit: HaloKit,
  ctx: PrepareContext,
  countable: boolean,
): PreparedGalaxy {
  const m = kit.model;
  const row = cand.row;
  const flags = [...cand.halo.flags];
  const isPhoto = row.zKind === 'photo';
  const sigmaZ = redshiftSigma(row);
  if (isPhoto && !(row.zErr !== null && row.zErr > 0)) flags.push('photo_z_err_missing_assumed_0.05(1+z)');
  if (cand.zRange.truncated) flags.push('photo_z_range_cut_at_outlier_bound');
  const zCat = row.z;
  const density = kit.haloDensityMsunKpc3(zCat);
  const logMhalo = cand.halo.logMhalo;
  const massMsun = 10 ** logMhalo;
  const rHaloKpc = haloRadiusFromDensity(massMsun, density);
  const conc = kit.concentration(massMsun, zCat);
  if (!conc.inRange) flags.push('outside_concentration_relation_range');
  const bKpc = cand.sepRad * kit.angularDiameterDistanceKpc(zCat);
  if (bKpc < B_FLOOR_KPC) flags.push('b_below_1kpc_floored');
  const inFront = zCat < foregroundThreshold(ctx.zSource, m.velocity_window_kms);
  if (!inFront) flags.push('catalogued_z_not_in_front');
  if (!countable) flags.push('member_of_catalogued_group_halo');
  const dmCentral =
    countable && inFront ? kit.dmObsExact(massMsun, rHaloKpc, conc.c, Math.max(bKpc, B_FLOOR_KPC), zCat) : 0;
  const pFg = probabilityForeground(zCat, sigmaZ, ctx.zSource, ctx.zSourceErr, m.velocity_window_kms);

  let mode: PreparedGalaxy['mode'] = 'none';
  let table: ShmrTable | null = null;
  let tablePos = 0;
  let sigmaMeasDex = 0;
  let sigmaShmrDex = 0;
  let sigmaHaloDex = 0;
  const logMstar = row.logMstar ?? Number.NaN;
  if (countable && cand.halo.source === 'catalogue') {
    mode = 'catalogue';
    sigmaHaloDex = row.logMhaloErr ?? 0;
    if (row.logMhaloErr === null || row.logMhaloErr === undefined) flags.push('mhalo_err_missing_taken_as_0');
  } else if (countable && cand.halo.source === 'shmr') {
    mode = 'shmr';
    if (row.logMstarErr === null) flags.push('mstar_err_missing_default_used');
    sigmaMeasDex = row.logMstarErr ?? m.log_mstar_err_default;
    sigmaShmrDex = kit.shmrScatterDex(zCat);
    const native = kit.shmrNativeDefinition;
    const centre = cand.halo.logMhNative!;
    table = buildShmrTable(centre, [9, 16], {
      yStar: (x) => kit.shmrLogMstar(x, zCat),
      xModel: (x) => kit.toModelLogMass(x, native, zCat),
      logC: (xm) => Math.log10(kit.concentration(10 ** xm, zCat).c),
    });
    tablePos = positionOfStellarMass(table, logMstar);
  }
  let cShift: PreparedGalaxy['cShift'] = null;
  if (isPhoto && mode !== 'none') {
    const z0 = Math.max(1e-4, zCat - 6 * sigmaZ);
    const z1 = zCat + 6 * sigmaZ;
    const nodes = 33;
    const dz = (z1 - z0) / (nodes - 1);
    const values = new Float64Array(nodes);
    const ref = Math.log10(conc.c);
    for (let i = 0; i < nodes; i++) values[i] = Math.log10(kit.concentration(massMsun, z0 + i * dz).c) - ref;
    cShift = { z0, dz, values };
  }
  return {
    cand,
    isPhoto,
    zCat,
    sigmaZ,
    sepRad: cand.sepRad,
    logMhalo,
    massMsun,
    rHaloKpc,
    concentration: conc.c,
    bKpc,
    dmCentral,
    pFg,
    mode,
    logMstar,
    sigmaMeasDex,
    sigmaShmrDex,
    sigmaHaloDex,
    table,
    tablePos,
    cShift,
    flags,
  };
}
