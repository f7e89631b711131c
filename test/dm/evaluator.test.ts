import { describe, expect, it } from 'vitest';
import { createHaloDmEvaluator, dmRestExact, TABLE_C_MAX } from '../../src/dm/index.js';
import { createGasProfile, type ProfileSpec } from '../../src/gas/index.js';
import { createRng } from '../../src/math/index.js';

const FB = 0.158141;

/**
 * Fast path vs adaptive quadrature on a dense random sample: x = b/R drawn uniformly in (0, E) and,
 * for a third of the draws, log-uniformly down to 1e-7 E (b → 0); c log-uniform in [1, 40].
 * Tolerance 1e-4 relative with an absolute floor of 1e-6 × DM(b = E R/2) of the same halo, because
 * DM → 0 like √(r_max − b) at the edge where a relative error means nothing.
 */
function worstError(spec: ProfileSpec, extent: number, draws: number, seed: number): number {
  const rng = createRng(seed);
  const fast = createHaloDmEvaluator(spec, { extent });
  let worst = 0;
  for (let k = 0; k < draws; k++) {
    const c = Math.exp(rng.uniform() * Math.log(40));
    const x = extent * (k % 3 === 0 ? Math.exp(-rng.uniform() * 16) : rng.uniform());
    const edge = k % 7 === 0 ? extent * (1 - 1e-6 * rng.uniform()) : x;
    const R = 100 + 400 * rng.uniform();
    const p = createGasProfile(
      spec,
      { massMsun: 1e12, radiusKpc: R, concentration: c },
      { baryonFraction: FB, extent },
    );
    const exact = dmRestExact(p, edge * R);
    const floor = 1e-6 * dmRestExact(p, 0.5 * extent * R);
    const got = fast(1e12, R, c, edge * R, 0, 0.75, FB);
    worst = Math.max(worst, Math.abs(got - exact) / (Math.abs(exact) + floor / 1e-4));
  }
  return worst;
}

describe('fast halo DM evaluator', () => {
  const cases: [ProfileSpec, number][] = [
    [{ kind: 'nfw' }, 1],
    [{ kind: 'nfw' }, 2],
    [{ kind: 'mnfw' }, 1],
    [{ kind: 'mnfw' }, 2],
    [{ kind: 'mnfw', alpha: 1, y0: 3 }, 1],
    [{ kind: 'mb04' }, 1],
    [{ kind: 'mb04' }, 2],
    // Low-c MB04 gas ends inside r_max = 4 R_Δ: those haloes must take the quadrature fallback.
    [{ kind: 'mb04' }, 4],
    [{ kind: 'mnfw', alpha: 0.5, y0: 2 }, 1],
  ];
  for (const [spec, extent] of cases) {
    it(`agrees with quadrature to 1e-4 for ${JSON.stringify(spec)}, extent ${extent}`, () => {
      expect(worstError(spec, extent, 700, 17)).toBeLessThan(1e-4);
    });
  }

  it('falls back to quadrature for concentrations outside the table', () => {
    const fast = createHaloDmEvaluator({ kind: 'mnfw' });
    const c = TABLE_C_MAX * 1.5;
    const p = createGasProfile(
      { kind: 'mnfw' },
      { massMsun: 1e13, radiusKpc: 400, concentration: c },
      { baryonFraction: FB },
    );
    expect(fast(1e13, 400, c, 37, 0.5, 0.75, FB)).toBeCloseTo(dmRestExact(p, 37) / 1.5, 9);
  });

  it('returns +Infinity at b = 0 through an NFW cusp and a finite value for cored profiles', () => {
    expect(createHaloDmEvaluator({ kind: 'nfw' })(1e12, 200, 8, 0, 0, 0.75, FB)).toBe(
      Number.POSITIVE_INFINITY,
    );
    const mb = createHaloDmEvaluator({ kind: 'mb04' })(1e12, 200, 8, 0, 0, 0.75, FB);
    expect(Number.isFinite(mb) && mb > 0).toBe(true);
  });

  it('rejects a non-positive extent', () => {
    expect(() => createHaloDmEvaluator({ kind: 'nfw' }, { extent: 0 })).toThrow(/extent/);
  });
});
