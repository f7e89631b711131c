import { createCosmology } from '../cosmology/index.js';
import { createHaloDmEvaluator, dmRestExact } from '../dm/index.js';
import { createGasProfile } from '../gas/index.js';
import {
  concentrationMass,
  convertHaloMass,
  createShmrInverter,
  type HaloCosmology,
  type HaloMassInversion,
  type MassDefinition,
  overdensityCrit,
  stellarHaloRelation,
} from '../halo/index.js';
import type { Model } from '../model/index.js';
import type { HaloKit } from './kit.js';
import { createZTable } from './z-table.js';

/**
 * The real kit for a parsed model: cosmology from src/cosmology, SHMR / concentration / NFW
 * conversion from src/halo, gas profile from src/gas and the line-of-sight integral from src/dm.
 * Build it once per model and reuse it across sightlines (it holds no per-sightline state).
 */
export function createHaloKit(model: Model): HaloKit {
  const cosmo = createCosmology(model.cosmology);
  const haloCosmo: HaloCosmology = cosmo;
  const def = model.mass_definition;
  const rel = stellarHaloRelation(model.shmr);
  // Table-guided Newton inversion, agreeing with Brent's root to ~1e-11 dex (src/halo).
  const inverter = createShmrInverter(rel);
  const cRelation = model.concentration;
  const gasOptions = {
    fHot: model.f_hot,
    baryonFraction: cosmo.baryonFraction,
    muE: model.mu_e,
    extent: model.extent,
  };
  const publishedCScatter = concentrationMass(cRelation, 1e12, 0, def, haloCosmo).scatterDex;
  const cScatter =
    model.scatter.concentration_dex === 'published' ? publishedCScatter : model.scatter.concentration_dex;
  const shmrScatterOverride = model.scatter.shmr_dex;

  const concentration = (massMsun: number, z: number) => {
    const r = concentrationMass(cRelation, massMsun, z, def, haloCosmo);
    return { c: r.concentration, inRange: r.inRange };
  };
  const toModelLogMass = (logM: number, from: MassDefinition, z: number) => {
    if (from === def) return logM;
    const m = 10 ** logM;
    const c = concentrationMass(cRelation, m, z, from, haloCosmo).concentration;
    return Math.log10(convertHaloMass(m, c, from, def, z, haloCosmo).massMsun);
  };
  const fb = cosmo.baryonFraction;
  const fast = createHaloDmEvaluator(model.profile, { extent: model.extent, muE: model.mu_e });
  const profile = (massMsun: number, radiusKpc: number, c: number) =>
    createGasProfile(model.profile, { massMsun, radiusKpc, concentration: c }, gasOptions);

  const dA = (z: number) => cosmo.angularDiameterDistanceMpc(z) * 1e3;
  const haloDensity = (z: number) => overdensityCrit(def, z, haloCosmo) * cosmo.criticalDensityMsunKpc3(z);
  const dATable = createZTable(dA);
  const densityTable = createZTable(haloDensity);
  return {
    model,
    massDefinition: def,
    baryonFraction: cosmo.baryonFraction,
    angularDiameterDistanceKpc: dA,
    haloDensityMsunKpc3: haloDensity,
    angularDiameterDistanceKpcFast: dATable,
    haloDensityMsunKpc3Fast: densityTable,
    shmrNativeDefinition: rel.nativeDefinition,
    shmrLogMhRange: rel.logMhRange,
    shmrZRange: rel.zRange,
    shmrLogMstar: (logMh, z) => rel.logMstar(logMh, z),
    shmrInvert: (logMstar, z) => {
      const out: HaloMassInversion = { logMh: 0, status: 'ok' };
      inverter.invertInto(out, logMstar, z);
      return out;
    },
    shmrScatterDex: (z) => (shmrScatterOverride === 'published' ? rel.scatterDex(z) : shmrScatterOverride),
    toModelLogMass,
    concentration,
    concentrationScatterDex: cScatter,
    dmObsExact: (m, r, c, b, z) => dmRestExact(profile(m, r, c), b) / (1 + z),
    dmObsFast: (m, r, c, b, z, fHot) => fast(m, r, c, b, z, fHot, fb),
  };
}
