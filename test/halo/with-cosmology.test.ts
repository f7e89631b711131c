import { describe, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import { createHaloDmEvaluator } from '../../src/dm/index.js';
import { haloFromStellarMass, haloRadiusKpc, overdensityCrit } from '../../src/halo/index.js';
import { expectClose } from '../helpers/expect-close.js';

// The halo code against the project's own Planck18 cosmology (not just the astropy fixture):
// the same physics.md numbers must come out.
describe('haloes with createCosmology("planck18")', () => {
  const cosmo = createCosmology('planck18');

  it('gives the physics.md §2 Δvir and r200c values', () => {
    expectClose(overdensityCrit('vir', 0.1, cosmo), 110.994, { rtol: 5e-6 });
    expectClose(haloRadiusKpc(1e13, 0.5, '200c', cosmo), 378.0265, { rtol: 1e-6 });
  });

  it('reproduces the physics.md §6.4 chain row log M* = 11.0, z = 0.3, b = 150 kpc', () => {
    const h = haloFromStellarMass(11.0, 0.3, cosmo);
    expectClose(h.radiusKpc, 418.352, { atol: 5e-4, rtol: 0 });
    const dm = createHaloDmEvaluator({ kind: 'mnfw' })(
      h.massMsun,
      h.radiusKpc,
      h.concentration,
      150,
      0.3,
      0.75,
      cosmo.baryonFraction,
    );
    expectClose(dm, 120.9322, { rtol: 2e-6 });
  });
});
