import { readFileSync } from 'node:fs';
import { describe, it } from 'vitest';
import { type CosmologyModel, createCosmology } from '../../src/cosmology/index.js';
import { expectClose } from '../helpers/expect-close.js';

// Source: astropy 5.2.1 (Debian python3-astropy) via scripts/fixtures/cosmology_astropy.py →
// fixtures/reference/cosmology_astropy.json (versions and parameters inside). astropy integrates
// distances with scipy quad at its default ~1.5e-8 relative tolerance, so 1e-6 relative is a fair
// bound; lookback time is compared at 1e-5 as the brief asks.
interface ModelTable {
  params: { H0: number; Om0: number; Ob0: number; Ogamma0: number; Onu0: number; Ode0: number };
  z: number[];
  E: number[];
  comoving_distance_Mpc: number[];
  angular_diameter_distance_Mpc: number[];
  luminosity_distance_Mpc: number[];
  critical_density_Msun_kpc3: number[];
  Om: number[];
  lookback_time_Gyr: number[];
  kpc_proper_per_arcsec: number[];
}
const fixture = JSON.parse(
  readFileSync(new URL('../../fixtures/reference/cosmology_astropy.json', import.meta.url), 'utf8'),
) as { models: Record<string, ModelTable> };

const cases: [string, CosmologyModel, ModelTable][] = [
  ['astropy Planck18', createCosmology('planck18'), fixture.models.planck18],
  [
    'astropy FlatLambdaCDM(H0=70, Om0=0.3, Ob0=0.05, Tcmb0=0)',
    createCosmology({ H0: 70, Om0: 0.3, Ob0: 0.05 }),
    fixture.models.flat_H70_Om03_Ob005_T0,
  ],
];

describe.each(cases)('%s', (_label, cosmo, ref) => {
  it('has the same photon, neutrino and dark-energy densities', () => {
    expectClose(cosmo.Ogamma0, ref.params.Ogamma0, { rtol: 1e-9, atol: 1e-300 });
    expectClose(cosmo.Onu0, ref.params.Onu0, { rtol: 1e-9, atol: 1e-300 });
    expectClose(cosmo.Ode0, ref.params.Ode0, { rtol: 1e-12 });
  });

  it('reproduces E(z), ρc(z) and Ωm(z) to 1e-9 relative (closed forms)', () => {
    ref.z.forEach((z, i) => {
      expectClose(cosmo.E(z), ref.E[i], { rtol: 1e-9 });
      expectClose(cosmo.criticalDensityMsunKpc3(z), ref.critical_density_Msun_kpc3[i], { rtol: 1e-9 });
      expectClose(cosmo.omegaM(z), ref.Om[i], { rtol: 1e-9 });
    });
  });

  it('reproduces comoving, angular-diameter and luminosity distances to 1e-6 relative', () => {
    ref.z.forEach((z, i) => {
      expectClose(cosmo.comovingDistanceMpc(z), ref.comoving_distance_Mpc[i], { rtol: 1e-6 });
      expectClose(cosmo.angularDiameterDistanceMpc(z), ref.angular_diameter_distance_Mpc[i], { rtol: 1e-6 });
      expectClose(cosmo.luminosityDistanceMpc(z), ref.luminosity_distance_Mpc[i], { rtol: 1e-6 });
      expectClose(cosmo.kpcProperPerArcsec(z), ref.kpc_proper_per_arcsec[i], { rtol: 1e-6 });
    });
  });

  it('reproduces lookback time to 1e-5 relative', () => {
    ref.z.forEach((z, i) => {
      expectClose(cosmo.lookbackTimeGyr(z), ref.lookback_time_Gyr[i], { rtol: 1e-5 });
    });
  });
});
