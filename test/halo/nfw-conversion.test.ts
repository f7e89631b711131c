import { describe, it } from 'vitest';
import { convertHaloMass, convertNfwOverdensity, nfwMu, overdensityCrit } from '../../src/halo/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { planck18Fixture as cosmo } from './planck18-fixture.js';

/** Hu & Kravtsov 2003, ApJ 584, 702, Appendix C fitting formula (eq. C11 (mem)), for comparison only. */
function huKravtsov(M1: number, c1: number, delta1: number, delta2: number) {
  const f = (x: number) => x ** 3 * (Math.log(1 + 1 / x) - 1 / (1 + x));
  const [a1, a2, a3, a4] = [0.5116, -0.4283, -3.13e-3, -3.52e-5];
  const f2 = (delta2 / delta1) * f(1 / c1);
  const lf = Math.log(f2);
  const p = a2 + a3 * lf + a4 * lf * lf;
  const x2 = (a1 * f2 ** (2 * p) + 0.75 ** 2) ** -0.5 + 2 * f2;
  return { massMsun: M1 * (delta2 / delta1) * (c1 * x2) ** -3, concentration: 1 / x2 };
}

describe('exact NFW conversion between mass definitions', () => {
  // physics.md §2.1 [calc]: M200c = 1e12 M☉, z = 0.1, c200c = 8.078366. Six printed digits → 5e-6.
  const c200c = 8.078366;
  const cases: [string, number, number, number, number, number, number][] = [
    // target, Δ (crit), exact M, exact c, r [kpc], HK03 M, HK03 c
    ['vir', 110.994, 1.14979e12, 10.2985, 260.349, 1.14938e12, 10.2972],
    ['200m', 74.734, 1.25239e12, 12.0895, 305.627, 1.25076e12, 12.0842],
    ['500c', 500, 7.76442e11, 5.4707, 138.302, 7.79099e11, 5.477],
  ];
  for (const [name, delta, m, c, r, hkM, hkC] of cases) {
    it(`reproduces the physics.md values for 200c → ${name}`, () => {
      const deltaTo = name === '500c' ? 500 : overdensityCrit(name as 'vir', 0.1, cosmo);
      expectClose(deltaTo, delta, { rtol: 5e-6 });
      const conv = convertNfwOverdensity(1e12, c200c, 200, deltaTo);
      expectClose(conv.massMsun, m, { rtol: 5e-6 });
      expectClose(conv.concentration, c, { rtol: 1e-5 });
      const r200 = 204.224048;
      expectClose(conv.radiusRatio * r200, r, { rtol: 5e-6 });
      // Hu & Kravtsov fitting formula reproduces its own physics.md column (HK03 is ~0.4 % accurate).
      const hk = huKravtsov(1e12, c200c, 200, deltaTo);
      expectClose(hk.massMsun, hkM, { rtol: 5e-6 });
      expectClose(hk.concentration, hkC, { rtol: 1e-5 });
      expectClose(conv.massMsun, hk.massMsun, { rtol: 5e-3 });
    });
  }

  it('the Hu & Kravtsov 2003 inverse x(f) is accurate to 0.41 % for 0.01 ≤ x ≤ 10 (physics.md §2.1 [calc])', () => {
    // Feed f(x) through HK03 with Δ₂ = Δ₁ so that x₂ = x(f(x₁)); compare with x₁ = 1/c₁.
    let worst = 0;
    for (let lx = -2; lx <= 1; lx += 0.001) {
      const x = 10 ** lx;
      const hk = huKravtsov(1, 1 / x, 200, 200);
      worst = Math.max(worst, Math.abs(1 / hk.concentration / x - 1));
    }
    expectClose(worst, 0.0041, { atol: 5e-5 });
  });

  it('keeps the same scale radius and satisfies M = 4π ρ_s r_s³ μ(c) in both definitions', () => {
    const h = convertHaloMass(1e12, 8.078366, '200c', 'vir', 0.1, cosmo);
    const rs1 = 204.224048 / 8.078366;
    expectClose(h.radiusKpc / h.concentration, rs1, { rtol: 1e-6 });
    expectClose(h.massMsun / 1e12, nfwMu(h.concentration) / nfwMu(8.078366), { rtol: 1e-14 });
  });

  it('round-trips 200c → 200m → 200c', () => {
    const there = convertNfwOverdensity(5e13, 4.2, 200, 61.9);
    const back = convertNfwOverdensity(there.massMsun, there.concentration, 61.9, 200);
    expectClose(back.massMsun, 5e13, { rtol: 1e-12 });
    expectClose(back.concentration, 4.2, { rtol: 1e-12 });
  });
});
