import { describe, expect, it } from 'vitest';
import { concentrationMass, convertHaloMass } from '../../src/halo/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { planck18Fixture as cosmo } from './planck18-fixture.js';

describe('concentration–mass relations', () => {
  // physics.md §3 [calc] table, M in M☉ with h = 0.6766; 4 decimals printed → 1e-5 relative.
  const table: [number, number, number, number, number, number, number][] = [
    // M, z, DM14 200c, DM14 vir, D08 200c, D08 vir, D08 200m
    [1e11, 0, 10.5472, 13.7549, 7.5888, 10.3275, 13.3403],
    [1e12, 0, 8.3587, 11.0016, 6.2542, 8.5703, 11.0704],
    [1e12, 0.1, 8.0784, 10.2982, 5.9803, 8.0095, 10.0544],
    [1e12, 0.5, 6.7577, 7.9231, 5.1691, 6.4265, 7.3504],
    [1e13, 0.5, 5.5182, 6.5147, 4.26, 5.333, 6.0998],
    [1e14, 1.0, 3.8945, 4.3792, 3.0668, 3.608, 3.7855],
  ];
  for (const [m, z, dm200c, dmVir, d200c, dVir, d200m] of table) {
    it(`matches physics.md §3 for M = ${m} M☉ at z = ${z}`, () => {
      const tol = { atol: 5e-5, rtol: 0 }; // 4 decimals printed
      expectClose(concentrationMass('dutton-maccio-2014', m, z, '200c', cosmo).concentration, dm200c, tol);
      expectClose(concentrationMass('dutton-maccio-2014', m, z, 'vir', cosmo).concentration, dmVir, tol);
      expectClose(concentrationMass('duffy-2008', m, z, '200c', cosmo).concentration, d200c, tol);
      expectClose(concentrationMass('duffy-2008', m, z, 'vir', cosmo).concentration, dVir, tol);
      expectClose(concentrationMass('duffy-2008', m, z, '200m', cosmo).concentration, d200m, tol);
    });
  }

  it('reports the intrinsic scatters 0.11 dex (DM14) and 0.15 dex (D08 full sample), both (mem)', () => {
    expect(concentrationMass('dutton-maccio-2014', 1e12, 0, '200c', cosmo).scatterDex).toBe(0.11);
    expect(concentrationMass('duffy-2008', 1e12, 0, '200c', cosmo).scatterDex).toBe(0.15);
  });

  it('obtains DM14 200m by NFW conversion from a self-consistent 200c halo', () => {
    const c200m = concentrationMass('dutton-maccio-2014', 1.25e12, 0.1, '200m', cosmo);
    // Independent check: convert back to 200c and evaluate the 200c relation there.
    const back = convertHaloMass(1.25e12, c200m.concentration, '200m', '200c', 0.1, cosmo);
    const c200c = concentrationMass('dutton-maccio-2014', back.massMsun, 0.1, '200c', cosmo).concentration;
    expectClose(back.concentration, c200c, { rtol: 1e-9 });
    expect(c200m.validity).toMatch(/conversion/);
  });

  it('flags masses and redshifts outside the fitted ranges (Duffy 2008 abstract: 1e11–1e15 h⁻¹ M☉, z < 2)', () => {
    expect(concentrationMass('duffy-2008', 1e10, 0, '200c', cosmo).inRange).toBe(false);
    expect(concentrationMass('duffy-2008', 1e12, 0.1, '200c', cosmo).inRange).toBe(true);
    expect(concentrationMass('dutton-maccio-2014', 1e9, 0, '200c', cosmo).inRange).toBe(false);
  });

  it('rejects an unknown relation by name', () => {
    expect(() => concentrationMass('prada' as 'duffy-2008', 1e12, 0, '200c', cosmo)).toThrow(/unknown/);
  });
});
