import { describe, expect, it } from 'vitest';
import {
  createGasProfile,
  electronsPerCm3PerMsunKpc3,
  MU_E_DEFAULT,
  profileSchema,
  profileShape,
} from '../../src/gas/index.js';
import { integrate } from '../../src/math/index.js';
import { planck18BaryonFraction } from '../halo/planck18-fixture.js';
import { expectClose } from '../helpers/expect-close.js';

// physics.md §5 reference halo: 1e12 M☉ M200c at z = 0.1, c = 8.078366, R = 204.224048 kpc,
// f_hot = 0.75, Ω_b/Ω_m = Ob0/Om0 of astropy Planck18 at full precision (0.158141187; the sheet's
// M_gas = 1.186059e11 needs more digits than the printed 0.158141), μ_e = 8/7.
const halo = { massMsun: 1e12, radiusKpc: 204.224048, concentration: 8.078366 };
const gas = { fHot: 0.75, baryonFraction: planck18BaryonFraction };
// Values printed to 7 significant figures → 1e-6 relative; quadrature-normalised MB04 likewise.
const TOL = { rtol: 1e-6 };

describe('electron density from gas density', () => {
  it('uses μ_e = 8/7 for fully ionised X = 0.75, Y = 0.25 (physics.md §5.4)', () => {
    expect(MU_E_DEFAULT).toBe(1 / (0.75 + 0.25 / 2));
    // physics.md §0 [calc]: n_e [cm⁻³] = ρ [M☉ kpc⁻³] × 3.540500e-8 for μ_e = 8/7.
    expectClose(electronsPerCm3PerMsunKpc3(), 3.5405e-8, { rtol: 2e-6 });
  });
});

describe('gas profile normalisations (physics.md §5)', () => {
  it('NFW-tracing gas: M_gas, r_s, ρ_s,gas and n_e,s', () => {
    const p = createGasProfile({ kind: 'nfw' }, halo, gas);
    expectClose(p.gasMassMsun, 1.186059e11, TOL);
    expectClose(p.rsKpc, 25.280365, TOL);
    expectClose(p.densityScaleMsunKpc3, 4.438899e5, TOL);
    expectClose(p.electronScaleCm3, 1.571592e-2, TOL);
  });

  it('mNFW (α = 2, y₀ = 2): closed-form I(c), ρ₀ and the n_e prefactor', () => {
    const p = createGasProfile({ kind: 'mnfw' }, halo, gas);
    expectClose(p.shape.enclosed(8.078366, 8.078366), 0.32277964, { rtol: 1e-7 });
    expectClose(p.densityScaleMsunKpc3, 1.80984e6, TOL);
    expectClose(p.electronScaleCm3, 6.407738e-2, TOL);
  });

  it('mNFW closed-form I(Y) equals numerical quadrature of y³/(2+y)⁴', () => {
    const shape = profileShape({ kind: 'mnfw', alpha: 2, y0: 2 });
    for (const Y of [0.01, 1, 8.078366, 40]) {
      const numeric = integrate((y) => (y * y * y) / (2 + y) ** 4, 0, Y, { rtol: 1e-13 });
      expectClose(shape.enclosed(Y, 8), numeric, { rtol: 1e-11 });
    }
  });

  it('mNFW with α ≠ 2 falls back to a numerical normalisation that still encloses M_gas', () => {
    const p = createGasProfile({ kind: 'mnfw', alpha: 1.3, y0: 3 }, halo, gas);
    expectClose(p.gasMassWithinMsun(halo.radiusKpc), p.gasMassMsun, { rtol: 1e-10 });
  });

  it('MB04: ρ_v = ρ(R_Δ), n_e(R_200) and n_e(0)', () => {
    const p = createGasProfile({ kind: 'mb04' }, halo, gas);
    expectClose(p.gasDensityMsunKpc3(halo.radiusKpc), 2423.404, TOL);
    expectClose(p.electronDensityCm3(halo.radiusKpc), 8.58006e-5, TOL);
    expectClose(p.electronDensityCm3(0), 6.08096e-4, TOL);
  });

  it('every profile holds f_hot (Ω_b/Ω_m) M_Δ inside R_Δ, checked by integrating 4πr²ρ', () => {
    for (const kind of ['nfw', 'mnfw', 'mb04'] as const) {
      const p = createGasProfile({ kind }, halo, gas);
      const m = integrate((r) => 4 * Math.PI * r * r * p.gasDensityMsunKpc3(r), 0, halo.radiusKpc, {
        rtol: 1e-12,
      });
      expectClose(m, 0.75 * planck18BaryonFraction * 1e12, { rtol: 1e-9 });
    }
  });

  it('continues the profile beyond R_Δ up to r_max = extent·R_Δ and is zero beyond', () => {
    const p1 = createGasProfile({ kind: 'mnfw' }, halo, gas);
    const p2 = createGasProfile({ kind: 'mnfw' }, halo, { ...gas, extent: 2 });
    expect(p2.densityScaleMsunKpc3).toBe(p1.densityScaleMsunKpc3);
    expect(p1.gasDensityMsunKpc3(1.5 * halo.radiusKpc)).toBe(0);
    expect(p2.gasDensityMsunKpc3(1.5 * halo.radiusKpc)).toBeGreaterThan(0);
    expect(p2.gasDensityMsunKpc3(2.01 * halo.radiusKpc)).toBe(0);
  });

  it('MB04 gas ends where its bracket reaches zero for low concentrations', () => {
    const shape = profileShape({ kind: 'mb04' });
    const y = shape.outerZero(1);
    expect(Number.isFinite(y)).toBe(true);
    expectClose(1 + 3.7 * (Math.log1p(y) / y - Math.log(2)), 0, { atol: 1e-12 });
    // For c = 8 the zero lies far out (y ≈ 1700, beyond any truncation used); for c = 20 it never occurs.
    expect(shape.outerZero(8)).toBeGreaterThan(1000);
    expect(shape.outerZero(20)).toBe(Number.POSITIVE_INFINITY);
  });

  it('mNFW with α = 2 vanishes at the centre', () => {
    const p = createGasProfile({ kind: 'mnfw' }, halo, gas);
    expect(p.gasDensityMsunKpc3(0)).toBe(0);
  });

  it('rejects bad halo and gas parameters with the field name', () => {
    expect(() => createGasProfile({ kind: 'nfw' }, { ...halo, concentration: -1 }, gas)).toThrow(
      /concentration/,
    );
    expect(() => createGasProfile({ kind: 'nfw' }, halo, { ...gas, fHot: 1.5 })).toThrow(/fHot/);
  });
});

describe('profile spec schema', () => {
  it('accepts the three kinds and mNFW parameters', () => {
    expect(profileSchema.parse({ kind: 'mnfw', alpha: 2, y0: 2 })).toEqual({ kind: 'mnfw', alpha: 2, y0: 2 });
    expect(profileSchema.safeParse({ kind: 'nfw' }).success).toBe(true);
  });

  it('rejects unknown kinds, α on a non-mNFW profile and non-positive α', () => {
    expect(profileSchema.safeParse({ kind: 'beta' }).success).toBe(false);
    const r = profileSchema.safeParse({ kind: 'nfw', alpha: 2 });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].path).toEqual(['alpha']);
    expect(profileSchema.safeParse({ kind: 'mnfw', alpha: 0 }).success).toBe(false);
  });
});
