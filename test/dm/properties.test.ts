import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createHaloDmEvaluator, dmRestExact } from '../../src/dm/index.js';
import { createGasProfile, electronsPerCm3PerMsunKpc3, type ProfileSpec } from '../../src/gas/index.js';
import { integrate } from '../../src/math/index.js';
import { expectClose } from '../helpers/expect-close.js';

const FB = 0.158141;
const haloArb = fc.record({
  logM: fc.double({ min: 10.5, max: 15, noNaN: true }),
  radiusKpc: fc.double({ min: 50, max: 1500, noNaN: true }),
  concentration: fc.double({ min: 2, max: 25, noNaN: true }),
});
const SPECS: ProfileSpec[] = [{ kind: 'nfw' }, { kind: 'mnfw' }, { kind: 'mb04' }];

describe('properties of halo DM', () => {
  for (const spec of [{ kind: 'nfw' }, { kind: 'mb04' }] as ProfileSpec[]) {
    it(`${spec.kind}: DM falls monotonically with impact parameter`, () => {
      fc.assert(
        fc.property(haloArb, fc.constantFrom(1, 2), (h, extent) => {
          const p = createGasProfile(spec, { ...h, massMsun: 10 ** h.logM }, { baryonFraction: FB, extent });
          let prev = Number.POSITIVE_INFINITY;
          for (let x = 0.005; x < extent; x += 0.05) {
            const dm = dmRestExact(p, x * h.radiusKpc);
            expect(dm).toBeLessThan(prev);
            prev = dm;
          }
        }),
        { numRuns: 25 },
      );
    });
  }

  for (const spec of SPECS) {
    it(`${spec.kind}: DM is linear in f_hot and exactly 0 at and beyond r_max`, () => {
      fc.assert(
        fc.property(
          haloArb,
          fc.double({ min: 0.01, max: 1, noNaN: true }),
          fc.double({ min: 1e-9, max: 0.999, noNaN: true }),
          fc.constantFrom(1, 1.5, 2),
          (h, fHot, xi, extent) => {
            const halo = { ...h, massMsun: 10 ** h.logM };
            const full = createGasProfile(spec, halo, { baryonFraction: FB, extent, fHot: 1 });
            const part = createGasProfile(spec, halo, { baryonFraction: FB, extent, fHot });
            const b = xi * extent * h.radiusKpc;
            expectClose(dmRestExact(part, b), fHot * dmRestExact(full, b), { rtol: 1e-12 });
            expect(dmRestExact(full, extent * h.radiusKpc)).toBe(0);
            expect(dmRestExact(full, (extent + 0.3) * h.radiusKpc)).toBe(0);
            const fast = createHaloDmEvaluator(spec, { extent });
            expect(
              fast(halo.massMsun, h.radiusKpc, h.concentration, extent * h.radiusKpc, 0.2, fHot, FB),
            ).toBe(0);
          },
        ),
        { numRuns: 20 },
      );
    });

    it(`${spec.kind}: ∫₀^r_max 2πb Σ(b) db equals the 3-D gas mass inside r_max`, () => {
      fc.assert(
        fc.property(haloArb, fc.constantFrom(1, 2), (h, extent) => {
          const p = createGasProfile(spec, { ...h, massMsun: 10 ** h.logM }, { baryonFraction: FB, extent });
          // Σ_gas [M☉ kpc⁻²] = DM [pc cm⁻³] / (1000 pc/kpc × n_e per M☉ kpc⁻³).
          const perSigma = 1000 * electronsPerCm3PerMsunKpc3(p.muE);
          const rMax = p.rMaxKpc;
          const projected = integrate((b) => 2 * Math.PI * b * (dmRestExact(p, b) / perSigma), 0, rMax, {
            rtol: 1e-9,
          });
          expectClose(projected, p.gasMassWithinMsun(rMax), { rtol: 1e-7 });
        }),
        { numRuns: 4 },
      );
    });
  }
});

describe('a fact of the trade', () => {
  it('a Milky-Way-mass halo with most of its baryons gives tens up to ~100 pc cm⁻³ well inside R_vir', () => {
    // Common practice (no single source): 1–2 × 10¹² M☉, f_hot ≈ 0.75, cored or mNFW gas.
    // Checked for 0.2 ≤ b/R_vir ≤ 0.6 with c_vir ≈ 10 (DM14 at z = 0), R_vir ≈ 260–330 kpc.
    for (const spec of [{ kind: 'mnfw' }, { kind: 'mb04' }] as ProfileSpec[]) {
      for (const [m, r] of [
        [1e12, 263],
        [2e12, 331],
      ]) {
        const p = createGasProfile(
          spec,
          { massMsun: m, radiusKpc: r, concentration: 10 },
          { baryonFraction: FB },
        );
        for (const x of [0.2, 0.4, 0.6]) {
          const dm = dmRestExact(p, x * r);
          expect(dm).toBeGreaterThan(15);
          expect(dm).toBeLessThan(130);
        }
      }
    }
  });
});
