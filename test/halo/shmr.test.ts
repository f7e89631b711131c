import { describe, expect, it } from 'vitest';
import {
  behroozi2013,
  createShmrInverter,
  type HaloMassInversion,
  invertShmrExact,
  kravtsov2018,
  moster2013,
  shmrSlope,
  shmrValidity,
} from '../../src/halo/index.js';
import { expectClose } from '../helpers/expect-close.js';

// physics.md §4.4 [calc] forward values, 4 decimals printed → |Δ| ≤ 5e-5 dex.
const ATOL_PRINTED = 5e-5;

describe('forward stellar-to-halo mass relations', () => {
  const table: [number, number, number, number][] = [
    [11.0, 0, 9.0061, 8.6698],
    [12.0, 0, 10.535, 10.4281],
    [13.0, 0, 10.9884, 10.9537],
    [12.0, 0.5, 10.4313, 10.462],
    [12.0, 1.0, 10.3093, 10.4419],
    [14.0, 1.0, 11.2575, 11.1874],
  ];
  for (const [logMh, z, mo, be] of table) {
    it(`Moster 2013 and Behroozi 2013 match physics.md §4.4 at log M_h = ${logMh}, z = ${z}`, () => {
      expectClose(moster2013.logMstar(logMh, z), mo, { atol: ATOL_PRINTED, rtol: 0 });
      expectClose(behroozi2013.logMstar(logMh, z), be, { atol: ATOL_PRINTED, rtol: 0 });
    });
  }

  it('Kravtsov 2018 (200c, first set) matches physics.md §4.4', () => {
    const expected = [8.8745, 10.6525, 11.3542, 11.9013];
    [11, 12, 13, 14].forEach((logMh, i) => {
      expectClose(kravtsov2018.logMstar(logMh, 0), expected[i], { atol: ATOL_PRINTED, rtol: 0 });
    });
  });

  it('Moster 2013: at M_h = M₁(z = 0) the efficiency M*/M_h equals N₁₀ (eq. 2)', () => {
    // At M_h = M₁ the bracket is 1 + 1 = 2, so M* = 2N M₁/2 = N M₁.
    expectClose(10 ** (moster2013.logMstar(11.59, 0) - 11.59), 0.0351, { rtol: 1e-12 });
  });

  it('Moster 2013 peak efficiency agrees with the paper abstract (23 % of f_b at ~10^11.8, z = 0)', () => {
    // physics.md §4.1: with WMAP7 f_b = 0.0455/0.272 the peak of M*/(f_b M_h) is 0.227 at log M_h = 11.77.
    const fb = 0.0455 / 0.272;
    let best = 0;
    let bestX = 0;
    for (let x = 10.5; x <= 13; x += 0.001) {
      const eff = 10 ** (moster2013.logMstar(x, 0) - x) / fb;
      if (eff > best) {
        best = eff;
        bestX = x;
      }
    }
    expectClose(best, 0.227, { atol: 5e-4 });
    expectClose(bestX, 11.77, { atol: 0.01 });
  });

  it('Behroozi 2013 scatter ξ(z) matches physics.md §4.4', () => {
    expectClose(behroozi2013.scatterDex(0), 0.218, { rtol: 1e-12 });
    expectClose(behroozi2013.scatterDex(0.5), 0.2257, { atol: 5e-5 });
    expectClose(behroozi2013.scatterDex(1), 0.2295, { atol: 5e-5 });
    expect(moster2013.scatterDex(1)).toBe(0.15);
  });

  it('Behroozi 2013 stays finite where exp(10^(−x)) overflows (very low halo mass)', () => {
    expect(Number.isFinite(behroozi2013.logMstar(8, 0))).toBe(true);
    expect(behroozi2013.logMstar(8, 0)).toBeLessThan(behroozi2013.logMstar(9, 0));
  });

  it('all relations increase strictly with halo mass over 1e9–1e16 M☉ for z = 0–4 (physics.md §4.5)', () => {
    for (const rel of [moster2013, behroozi2013, kravtsov2018]) {
      for (const z of [0, 0.5, 1, 2, 4]) {
        let prev = -Infinity;
        for (let x = 9; x <= 16; x += 0.01) {
          const y = rel.logMstar(x, z);
          expect(y).toBeGreaterThan(prev);
          prev = y;
        }
      }
    }
  });

  it('reports the stellar-mass range covered by the fitted halo-mass range', () => {
    const v = shmrValidity(moster2013, 0);
    expectClose(v.logMstarRange[0], moster2013.logMstar(10.5, 0), { rtol: 1e-15 });
    expect(v.zInRange).toBe(true);
    expect(shmrValidity(kravtsov2018, 0.5).zInRange).toBe(false);
  });
});

describe('inversion M* → M_h', () => {
  const table: [number, number, number, number, number | null][] = [
    // log M*, z, Moster13 log M200c, Behroozi13 log Mvir, KVM18 log M200c — physics.md §4.5 [calc]
    [9.0, 0, 10.9973, 11.1686, 11.0544],
    [10.0, 0, 11.499, 11.6616, 11.5069],
    [10.5, 0.1, 11.9684, 12.0671, null],
    [11.0, 0, 13.0295, 13.1565, 12.4353],
    [10.0, 0.5, 11.7004, 11.6703, null],
    [11.0, 1.0, 12.9538, 12.8704, null],
  ];
  for (const [logMs, z, mo, be, kr] of table) {
    it(`matches physics.md §4.5 for log M* = ${logMs} at z = ${z}`, () => {
      expectClose(invertShmrExact(moster2013, logMs, z).logMh, mo, { atol: ATOL_PRINTED, rtol: 0 });
      expectClose(invertShmrExact(behroozi2013, logMs, z).logMh, be, { atol: ATOL_PRINTED, rtol: 0 });
      if (kr !== null) {
        expectClose(invertShmrExact(kravtsov2018, logMs, z).logMh, kr, { atol: ATOL_PRINTED, rtol: 0 });
      }
    });
  }

  it('round-trips log M_h → log M* → log M_h to 1e-8 dex for every relation', () => {
    for (const rel of [moster2013, behroozi2013, kravtsov2018]) {
      for (const z of [0, 0.37, 1.2, 3]) {
        for (let x = 9.5; x <= 15.5; x += 0.25) {
          const back = invertShmrExact(rel, rel.logMstar(x, z), z);
          expect(back.status).toBe('ok');
          expectClose(back.logMh, x, { atol: 1e-8, rtol: 0 });
        }
      }
    }
  });

  it('flags and caps Behroozi 2013 where it saturates (log M* = 11.5 is unreachable at z ≥ 0.5)', () => {
    const inv = invertShmrExact(behroozi2013, 11.5, 0.5);
    expect(inv.status).toBe('above-range');
    expect(inv.logMh).toBe(16);
    expect(invertShmrExact(moster2013, 3, 0)).toEqual({ logMh: 9, status: 'below-range' });
  });

  it('local slopes match physics.md §4.5 (Moster z = 0: 1.5873 at 10, 0.3948 at 11; B13: 0.2837 at 11)', () => {
    const at = (rel: typeof moster2013, logMs: number) =>
      shmrSlope(rel, invertShmrExact(rel, logMs, 0).logMh, 0);
    expectClose(at(moster2013, 10), 1.5873, { atol: 5e-5 });
    expectClose(at(moster2013, 11), 0.3948, { atol: 5e-5 });
    expectClose(at(behroozi2013, 11), 0.2837, { atol: 5e-5 });
    // σ_h = σ*/s: 0.15/1.5873 = 0.0945 (physics.md).
    expectClose(0.15 / at(moster2013, 10), 0.0945, { atol: 5e-5 });
  });

  it('the fast table inverter agrees with Brent to 1e-6 dex on a dense random sample', () => {
    const out: HaloMassInversion = { logMh: 0, status: 'ok' };
    let seed = 12345;
    const rand = () => {
      seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0;
      return seed / 2 ** 32;
    };
    for (const rel of [moster2013, behroozi2013, kravtsov2018]) {
      const inv = createShmrInverter(rel);
      let worst = 0;
      for (let k = 0; k < 4000; k++) {
        const z = rand() * 3;
        const logMs = 7 + rand() * 5.2;
        const exact = invertShmrExact(rel, logMs, z);
        inv.invertInto(out, logMs, z);
        expect(out.status).toBe(exact.status);
        worst = Math.max(worst, Math.abs(out.logMh - exact.logMh));
      }
      expect(worst).toBeLessThan(1e-6);
    }
  });
});
