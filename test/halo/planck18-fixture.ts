import { readFileSync } from 'node:fs';
import type { HaloCosmology } from '../../src/halo/index.js';

/**
 * Planck18 ρc(z) and Ωm(z) as written by astropy 5.2 (scripts/fixtures/halo-reference.py →
 * fixtures/reference/halo-reference.json). Only the fixture redshifts are available; any other z throws,
 * so a test cannot silently use an untabulated value.
 */
export const haloReference = JSON.parse(
  readFileSync(new URL('../../fixtures/reference/halo-reference.json', import.meta.url), 'utf8'),
);

function lookup(values: number[], z: number): number {
  const i = (haloReference.planck18.z as number[]).indexOf(z);
  if (i < 0) throw new Error(`z = ${z} is not in the halo reference fixture`);
  return values[i];
}

export const planck18Fixture: HaloCosmology = {
  h: haloReference.planck18.h,
  criticalDensityMsunKpc3: (z) => lookup(haloReference.planck18.rho_crit_msun_kpc3, z),
  omegaM: (z) => lookup(haloReference.planck18.Om_z, z),
};

export const planck18BaryonFraction: number = haloReference.planck18.Ob0_over_Om0;
