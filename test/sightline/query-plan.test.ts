import { describe, expect, it } from 'vitest';
import {
  type CatalogRow,
  type ConeWindow,
  type DensityEstimate,
  estimateDensity,
  expectedRows,
  mergeWindows,
  unionWindow,
} from '../../src/sightline/index.js';
import { expectClose } from '../helpers/expect-close.js';

const flat = (rowsPerDeg2PerZ: number, pass = 1): DensityEstimate => ({
  rowsPerDeg2PerZ,
  passFraction: () => pass,
});

/** True when every row window `inner` can return is also returned by `outer`. */
function covers(outer: ConeWindow, inner: ConeWindow): boolean {
  const hintOk =
    outer.minLogMstar === undefined ||
    (inner.minLogMstar !== undefined &&
      outer.minLogMstar <= inner.minLogMstar &&
      (outer.minLogMhalo ?? Number.POSITIVE_INFINITY) <= (inner.minLogMhalo ?? Number.POSITIVE_INFINITY));
  return outer.radiusDeg >= inner.radiusDeg && outer.zLo <= inner.zLo && outer.zHi >= inner.zHi && hintOk;
}

const SHELLS: ConeWindow[] = [
  { radiusDeg: 1, zLo: 0.001, zHi: 0.017 },
  { radiusDeg: 0.15, zLo: 0.276, zHi: 0.376 },
  { radiusDeg: 0.08, zLo: 0.376, zHi: 0.476 },
  { radiusDeg: 0.045, zLo: 0.476, zHi: 0.698 },
  { radiusDeg: 1, zLo: 0.001, zHi: 0.376, minLogMstar: 10.4, minLogMhalo: 12.5 },
  { radiusDeg: 0.544, zLo: 0.376, zHi: 0.476, minLogMstar: 10.5, minLogMhalo: 12.5 },
];

describe('store query grouping', () => {
  it('expects rows as density × π r² × Δz, times the hint pass fraction for hinted windows', () => {
    expectClose(expectedRows({ radiusDeg: 0.5, zLo: 0.1, zHi: 0.3 }, flat(100)), 100 * Math.PI * 0.25 * 0.2, {
      rtol: 1e-12,
    });
    expectClose(expectedRows(SHELLS[4], flat(100, 0.25)), 100 * Math.PI * 0.375 * 0.25, { rtol: 1e-12 });
  });

  it('unites two windows into one that covers both, dropping the hint if either has none', () => {
    const u = unionWindow(SHELLS[0], SHELLS[4]);
    expect(u).toEqual({ radiusDeg: 1, zLo: 0.001, zHi: 0.376 });
    const h = unionWindow(SHELLS[4], SHELLS[5]);
    expect(h).toEqual({ radiusDeg: 1, zLo: 0.001, zHi: 0.476, minLogMstar: 10.4, minLogMhalo: 12.5 });
    for (const [a, b] of [
      [SHELLS[0], SHELLS[4]],
      [SHELLS[4], SHELLS[5]],
      [SHELLS[1], SHELLS[3]],
    ]) {
      const w = unionWindow(a, b);
      expect(covers(w, a) && covers(w, b)).toBe(true);
    }
  });

  it('folds every shell into one query on an empty sky and keeps them apart on a dense one', () => {
    const one = mergeWindows(SHELLS, flat(0));
    expect(one).toHaveLength(1);
    for (const s of SHELLS) expect(covers(one[0], s)).toBe(true);
    // 10⁶ rows per deg² per unit z, hints keeping 30 %: any merge adds far more rows than a query costs.
    expect(mergeWindows(SHELLS, flat(1e6, 0.3))).toHaveLength(SHELLS.length);
    // With hints that keep every row, an unhinted cone inside a hinted one of the same z range joins it
    // at no cost (three such pairs here), and nothing else merges.
    expect(mergeWindows(SHELLS, flat(1e6, 1))).toHaveLength(3);
    expect(mergeWindows(SHELLS, flat(0), 0)).toHaveLength(SHELLS.length);
  });

  it('merges at intermediate density only where the saved query outweighs the added rows', () => {
    const est = flat(2000, 0.3);
    const merged = mergeWindows(SHELLS, est, 30);
    expect(merged.length).toBeGreaterThan(1);
    expect(merged.length).toBeLessThan(SHELLS.length);
    // Every shell is covered by some query, and the total cost did not grow.
    for (const s of SHELLS) expect(merged.some((w) => covers(w, s))).toBe(true);
    const cost = (ws: ConeWindow[]) => ws.reduce((a, w) => a + 30 + expectedRows(w, est), 0);
    expect(cost(merged)).toBeLessThan(cost(SHELLS));
  });

  it('estimates density as (n + 1)/(area · Δz) and the hint pass fraction by the rule of succession', () => {
    const probe: ConeWindow = { radiusDeg: 0.5, zLo: 0.1, zHi: 0.3 };
    const row = (z: number, logMstar: number | null): CatalogRow => ({
      catalog: 'c',
      objectId: `${z}-${logMstar}`,
      raDeg: 0,
      decDeg: 0,
      z,
      zErr: null,
      zKind: 'spec',
      logMstar,
      logMstarErr: null,
    });
    // Three rows in the window (one without mass), one outside it (not counted).
    const rows = [row(0.15, 10), row(0.2, 11), row(0.25, null), row(0.5, 11)];
    const est = estimateDensity(probe, rows);
    expectClose(est.rowsPerDeg2PerZ, 4 / (Math.PI * 0.25 * 0.2), { rtol: 1e-12 });
    // Hint log M* ≥ 10.5: the 10^11 row and the massless row pass (the store keeps rows with no mass).
    expectClose(est.passFraction(10.5, 12.5), 3 / 5, { rtol: 1e-12 });
    expectClose(est.passFraction(10.5, 12.5), 3 / 5, { rtol: 1e-12 }); // remembered answer
    expectClose(est.passFraction(9, undefined), 4 / 5, { rtol: 1e-12 });
  });
});
