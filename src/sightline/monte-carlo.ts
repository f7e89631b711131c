import { createRng, deriveSeed, type Rng } from '../math/index.js';
import { type HaloKit, haloRadiusFromDensity } from './kit.js';
import { foregroundThreshold } from './p-foreground.js';
import { B_FLOOR_KPC, type PreparedGalaxy } from './prepare.js';
import { interpolateAt, positionOfStellarMass, slopeAt } from './shmr-table.js';

export interface MonteCarloOptions {
  readonly draws: number;
  readonly seed: number;
  readonly zSource: number;
  readonly zSourceErr: number;
}

export interface MonteCarloResult {
  readonly draws: number;
  /** Observer-frame DM of galaxy i in draw d at [i·draws + d] [pc cm⁻³]. */
  readonly perGalaxy: Float64Array;
  /** Drawn redshift of galaxy i in draw d (same layout). */
  readonly zDrawn: Float64Array;
  /** Sum over galaxies per draw [pc cm⁻³]. */
  readonly total: Float64Array;
}

/** 32-bit FNV-1a hash (Fowler, Noll & Vo; common practice) of a string. */
function fnv1a(s: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < s.length; i++) {
    h ^= s.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/**
 * Each galaxy draws from its own stream, seeded from the model seed and a hash of its id and
 * catalogued redshift, so results do not depend on the order in which catalogues return rows or on
 * which catalogue holds a row (splitting a catalogue in two leaves every number unchanged). Source redshift and f_hot come from a separate
 * sightline stream. Generator: xoshiro128** (src/math createRng).
 */
export function galaxyStream(seed: number, g: PreparedGalaxy): Rng {
  const r = g.cand.row;
  return createRng(deriveSeed(seed, fnv1a(`${r.objectId}|${r.z}`)));
}

function drawTruncatedPositive(rng: Rng, mean: number, sigma: number): number {
  for (let k = 0; k < 64; k++) {
    const z = mean + sigma * rng.normal();
    if (z > 0) return z;
  }
  return mean;
}

/**
 * One realisation of the whole sightline per draw: source redshift (if uncertain) and f_hot (if a prior
 * is set) per draw; per galaxy its redshift (photo-z: Gaussian truncated at z > 0, moving b, ρc, r_halo,
 * c and whether it is in front), measured log M* (Gaussian), SHMR scatter mapped to halo mass by the
 * local slope at the drawn M* (σ_h = σ* / slope, physics.md §4.5), log-normal concentration scatter,
 * and the mass ceiling. Photometric draws below photo_z_floor are placed at the floor (the search
 * never places a galaxy nearer); spectroscopic rows below model.z_min are never candidates.
 */
export function runMonteCarlo(
  kit: HaloKit,
  galaxies: readonly PreparedGalaxy[],
  opts: MonteCarloOptions,
): MonteCarloResult {
  const m = kit.model;
  const n = opts.draws;
  const nGal = galaxies.length;
  const perGalaxy = new Float64Array(nGal * n);
  const zDrawn = new Float64Array(nGal * n);
  const total = new Float64Array(n);
  const threshold = new Float64Array(n);
  const fHot = new Float64Array(n);
  const sightRng = createRng(deriveSeed(opts.seed, 0xfffffffe));
  const prior = m.f_hot_prior;
  for (let d = 0; d < n; d++) {
    let zs = opts.zSource;
    if (opts.zSourceErr > 0) zs = drawTruncatedPositive(sightRng, opts.zSource, opts.zSourceErr);
    threshold[d] = foregroundThreshold(zs, m.velocity_window_kms);
    fHot[d] = prior ? prior.min + (prior.max - prior.min) * sightRng.uniform() : m.f_hot;
  }
  const ceiling = m.log_mhalo_max;
  const sigmaC = kit.concentrationScatterDex;
  const extent = m.extent;
  const zMin = m.z_min;
  const zPhotoMin = Math.max(m.z_min, m.photo_z_floor);
  for (let i = 0; i < nGal; i++) {
    const g = galaxies[i];
    const base = i * n;
    if (g.mode === 'none') {
      zDrawn.fill(g.zCat, base, base + n);
      continue;
    }
    const rng = galaxyStream(opts.seed, g);
    const t = g.table;
    const xModelAtCentre = t ? interpolateAt(t.xModel, g.tablePos) : 0;
    const logCAtCentre = t ? interpolateAt(t.logC, g.tablePos) : 0;
    const logCCentral = Math.log10(g.concentration);
    const spec = !g.isPhoto;
    const dA0 = kit.angularDiameterDistanceKpc(g.zCat);
    const dens0 = kit.haloDensityMsunKpc3(g.zCat);
    const logCeiling = ceiling;
    const fourThirdsPi = (4 * Math.PI) / 3;
    for (let d = 0; d < n; d++) {
      let z = spec ? g.zCat : drawTruncatedPositive(rng, g.zCat, g.sigmaZ);
      if (!spec && z < zPhotoMin) z = zPhotoMin;
      zDrawn[base + d] = z;
      if (!(z < threshold[d]) || z < zMin) continue;
      let dA = dA0;
      let dens = dens0;
      let logCShift = 0;
      if (!spec) {
        dA = kit.angularDiameterDistanceKpcFast(z);
        dens = kit.haloDensityMsunKpc3Fast(z);
        const cs = g.cShift!;
        logCShift = interpolateAt(cs.values, (z - cs.z0) / cs.dz);
      }
      const b = g.sepRad * dA;
      // The halo is intersected only if r_halo > b/extent, i.e. log M > log M_needed; the remaining
      // normals are drawn only when they can matter (the stream stays deterministic).
      const rNeeded = b / extent;
      const logMNeeded = Math.log10(fourThirdsPi * dens * rNeeded * rNeeded * rNeeded);
      if (logMNeeded >= logCeiling) continue;
      let logM: number;
      let logC: number;
      if (t) {
        const pos0 = positionOfStellarMass(t, g.logMstar + g.sigmaMeasDex * rng.normal());
        const sigmaH = g.sigmaShmrDex / slopeAt(t, pos0);
        const pos = pos0 + (sigmaH * rng.normal()) / t.dx;
        logM = g.logMhalo + interpolateAt(t.xModel, pos) - xModelAtCentre;
        logC = logCCentral + interpolateAt(t.logC, pos) - logCAtCentre;
      } else {
        logM = g.logMhalo + g.sigmaHaloDex * rng.normal();
        logC = logCCentral;
      }
      if (logM > logCeiling) logM = logCeiling;
      if (logM <= logMNeeded) continue;
      const mass = 10 ** logM;
      const r = haloRadiusFromDensity(mass, dens);
      if (b >= extent * r) continue;
      const c = 10 ** (logC + logCShift + sigmaC * rng.normal());
      const dm = kit.dmObsFast(mass, r, c, Math.max(b, B_FLOOR_KPC), z, fHot[d]);
      perGalaxy[base + d] = dm;
      total[d] += dm;
    }
  }
  return { draws: n, perGalaxy, zDrawn, total };
}
