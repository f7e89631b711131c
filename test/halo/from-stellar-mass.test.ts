import { describe, expect, it } from 'vitest';
import {
  behroozi2013,
  concentrationMass,
  convertHaloMass,
  haloFromStellarMass,
  invertShmrExact,
} from '../../src/halo/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { planck18Fixture as cosmo } from './planck18-fixture.js';

describe('halo from stellar mass (SHMR → c–M → mass definition)', () => {
  // physics.md §6.4 [calc] chain Moster13 → DM14 200c; printed to 4–6 significant figures.
  const rows: [number, number, number, number, number][] = [
    // log M*, z, log M200c, c200c, R200 [kpc]
    [10.5, 0.1, 11.9684, 8.1365, 199.325],
    [11.0, 0.3, 13.0292, 5.9339, 418.352],
    [10.0, 0.05, 11.5276, 9.1777, 144.51],
  ];
  for (const [logMs, z, logM, c, r] of rows) {
    it(`reproduces physics.md §6.4 for log M* = ${logMs} at z = ${z}`, () => {
      const h = haloFromStellarMass(logMs, z, cosmo);
      expect(h.massDefinition).toBe('200c');
      expect(h.inversion).toBe('ok');
      expectClose(Math.log10(h.massMsun), logM, { atol: 5e-5, rtol: 0 });
      expectClose(h.concentration, c, { atol: 5e-5, rtol: 0 });
      expectClose(h.radiusKpc, r, { atol: 5e-4, rtol: 0 });
      expect(h.warnings).toEqual([]);
    });
  }

  it('converts the Behroozi 2013 virial mass to 200c with the DM14 vir concentration', () => {
    const h = haloFromStellarMass(10.5, 0.1, cosmo, { shmr: 'behroozi2013', massDefinition: '200c' });
    const logMvir = invertShmrExact(behroozi2013, 10.5, 0.1).logMh;
    const cVir = concentrationMass('dutton-maccio-2014', 10 ** logMvir, 0.1, 'vir', cosmo).concentration;
    const expected = convertHaloMass(10 ** logMvir, cVir, 'vir', '200c', 0.1, cosmo);
    expect(h.native.massDefinition).toBe('vir');
    expectClose(h.native.logMh, 12.0671, { atol: 5e-5, rtol: 0 }); // physics.md §4.5
    expectClose(h.massMsun, expected.massMsun, { rtol: 1e-12 });
    // A 200c mass is smaller than the virial mass of the same halo at low z (Δ200c > Δvir).
    expect(h.massMsun).toBeLessThan(10 ** logMvir);
  });

  it('warns and caps when the SHMR cannot reach the stellar mass', () => {
    const h = haloFromStellarMass(11.5, 0.5, cosmo, { shmr: 'behroozi2013' });
    expect(h.inversion).toBe('above-range');
    expect(h.native.logMh).toBe(16);
    expect(h.warnings.join(' ')).toMatch(/capped/);
  });

  it('gives the SHMR slope and scatters for mapping scatter onto halo mass', () => {
    const h = haloFromStellarMass(10.0, 0, cosmo);
    expectClose(h.slope, 1.5873, { atol: 5e-5, rtol: 0 }); // physics.md §4.5
    expect(h.shmrScatterDex).toBe(0.15);
    expect(h.concentrationScatterDex).toBe(0.11);
  });
});
