import { describe, expect, it } from 'vitest';
import {
  dmSingularIsothermal,
  dmUniformSphere,
  nfwProjectionF,
  nfwTruncatedProjectionG,
  projectedShape,
} from '../../src/dm/index.js';
import type { ProfileShape } from '../../src/gas/index.js';
import { integrate } from '../../src/math/index.js';
import { expectClose } from '../helpers/expect-close.js';

// Test-only density laws in units of r_s, fed to the same line-of-sight integrator as the gas profiles.
function testShape(density: (y: number) => number): ProfileShape {
  return {
    spec: { kind: 'nfw', alpha: 0, y0: 0 },
    density,
    enclosed: (Y) => integrate((y) => y * y * density(y), 0, Y),
    outerZero: () => Number.POSITIVE_INFINITY,
  };
}
const uniform = testShape(() => 1);
const isothermal = testShape((y) => 1 / (y * y));
const nfw = testShape((y) => 1 / (y * (1 + y) ** 2));

describe('closed-form DM through spherical density laws (physics.md §6.1)', () => {
  it('uniform sphere matches the sheet (n₀ = 1e-3 cm⁻³, R = 100 kpc)', () => {
    const expected = [200, 190.78784028, 160, 28.21347196];
    // Sheet values carry 8 decimals → half a unit in the last place, 5e-9 absolute.
    for (const [i, b] of [0, 30, 60, 99].entries()) {
      expectClose(dmUniformSphere(1e-3, 100, b), expected[i], { atol: 5e-9, rtol: 0 });
    }
    expect(dmUniformSphere(1e-3, 100, 100)).toBe(0);
  });

  it('singular isothermal sphere matches the sheet, untruncated and truncated at 100 kpc', () => {
    const untrunc = [62.83185307, 15.70796327, 6.28318531];
    const trunc = [60.8310188, 13.69438406, 4.1887902];
    for (const [i, b] of [5, 20, 50].entries()) {
      expectClose(dmSingularIsothermal(1e-3, 10, b), untrunc[i], { atol: 5e-9, rtol: 0 });
      expectClose(dmSingularIsothermal(1e-3, 10, b, 100), trunc[i], { atol: 5e-9, rtol: 0 });
    }
  });

  it('the quadrature integrator reproduces the uniform-sphere chord 2√(R² − b²)', () => {
    for (const X of [1e-6, 0.3, 0.6, 0.99, 0.99999]) {
      expectClose(projectedShape(uniform, X, 1, 1), 2 * Math.sqrt(1 - X * X), { rtol: 1e-10 });
    }
    expectClose(projectedShape(uniform, 0, 1, 1), 2, { rtol: 1e-12 });
  });

  it('the quadrature integrator reproduces the SIS: truncated arctan form and π/b when untruncated', () => {
    for (const X of [0.05, 0.2, 0.5]) {
      expectClose(projectedShape(isothermal, X, 1, 1), (2 / X) * Math.atan(Math.sqrt(1 - X * X) / X), {
        rtol: 1e-10,
      });
      // Cut at 1e9 r_s: the missing tail 2∫_L^∞ dλ/λ² ≈ 2e-9 is below the tolerance.
      expectClose(projectedShape(isothermal, X, 1, 1e9), Math.PI / X, { rtol: 1e-8 });
    }
  });

  it('the quadrature integrator reproduces the untruncated NFW Σ = 2ρ_s r_s F(X) (Bartelmann 1996)', () => {
    for (const X of [1e-3, 0.1, 0.7, 0.9995, 1, 1.0003, 1.5, 4]) {
      // Cut at 1e8 r_s: the NFW tail beyond L contributes ~1/L² ≈ 1e-16.
      expectClose(projectedShape(nfw, X, 1, 1e8), 2 * nfwProjectionF(X), { rtol: 1e-9 });
    }
  });

  it('the truncated NFW closed form G(X, C) agrees with quadrature, also across X = 1', () => {
    for (const C of [3, 8.078366, 20]) {
      for (const X of [1e-4, 0.2, 0.9991, 0.99999, 1, 1.00002, 1.0008, 2, 0.999 * C]) {
        if (X >= C) continue;
        expectClose(projectedShape(nfw, X, 1, C), 2 * nfwTruncatedProjectionG(X, C), { rtol: 1e-8 });
      }
      expect(nfwTruncatedProjectionG(C, C)).toBe(0);
    }
  });
});
