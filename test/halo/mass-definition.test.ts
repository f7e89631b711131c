import { describe, expect, it } from 'vitest';
import {
  deltaVirBryanNorman,
  haloMassFromRadius,
  haloRadiusKpc,
  overdensityCrit,
} from '../../src/halo/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { planck18Fixture as cosmo } from './planck18-fixture.js';

// physics.md §2 [calc] tables (astropy Planck18, scipy); printed to 6 significant figures, so the
// tolerance is 5e-6 relative (half a unit in the last printed place).
describe('overdensities relative to the critical density', () => {
  const table: [number, number, number, number][] = [
    // z, Δvir (crit), Δvir (mean), 200m in crit units — physics.md §2 table
    [0, 102.459, 330.875, 61.932],
    [0.1, 110.994, 297.04, 74.734],
    [0.5, 138.719, 230.838, 120.187],
    [1.0, 157.659, 202.3, 155.867],
  ];
  for (const [z, vir, virMean, m200] of table) {
    it(`matches the physics.md Δ table at z = ${z}`, () => {
      expectClose(overdensityCrit('vir', z, cosmo), vir, { rtol: 5e-6 });
      expectClose(overdensityCrit('vir', z, cosmo) / cosmo.omegaM(z), virMean, { rtol: 5e-6 });
      expectClose(overdensityCrit('200m', z, cosmo), m200, { rtol: 1e-5 });
      expect(overdensityCrit('200c', z, cosmo)).toBe(200);
    });
  }

  it('gives Δvir → 18π² for an Einstein–de Sitter universe (Bryan & Norman 1998, eq. 6)', () => {
    expectClose(deltaVirBryanNorman(1), 18 * Math.PI * Math.PI, { rtol: 1e-15 });
  });

  it('gives Δvir ≈ 102 at z = 0 for Ωm = 0.31 (Bryan & Norman 1998, eq. 6; common quoted value)', () => {
    // 18π² + 82(−0.69) − 39(0.69)² = 177.653 − 56.58 − 18.568 = 102.505
    expectClose(deltaVirBryanNorman(0.31), 102.5, { rtol: 1e-3 });
  });

  it('rejects an unknown mass definition with a message naming the allowed ones', () => {
    expect(() => overdensityCrit('500x' as '200c', 0, cosmo)).toThrow(/200c, 200m or vir/);
  });
});

describe('halo radii', () => {
  it('match physics.md §2 radii for 1e12 and 1e13 M☉', () => {
    // physics.md §2 [calc], 7 significant figures → rtol 1e-6.
    expectClose(haloRadiusKpc(1e12, 0.1, '200c', cosmo), 204.224, { rtol: 1e-6 });
    expectClose(haloRadiusKpc(1e12, 0.1, 'vir', cosmo), 248.5135, { rtol: 1e-6 });
    expectClose(haloRadiusKpc(1e12, 0.1, '200m', cosmo), 283.538, { rtol: 1e-6 });
    expectClose(haloRadiusKpc(1e12, 0, '200c', cosmo), 211.0081, { rtol: 1e-6 });
    expectClose(haloRadiusKpc(1e13, 0.5, '200c', cosmo), 378.0265, { rtol: 1e-6 });
  });

  it('round-trips radius → mass → radius', () => {
    for (const def of ['200c', '200m', 'vir'] as const) {
      const r = haloRadiusKpc(3.7e11, 0.3, def, cosmo);
      expectClose(haloMassFromRadius(r, 0.3, def, cosmo), 3.7e11, { rtol: 1e-14 });
    }
  });
});
