import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { type CatalogRow, probabilityForeground, runSightline } from '../../src/sightline/index.js';
import { expectClose } from '../helpers/expect-close.js';
import { bruteCone } from './helpers/brute-cone.js';
import { offsetPoint } from './helpers/sky-offset.js';

// Source: fixtures/reference/sightline-reference.json, written by scripts/fixtures/sightline-reference.py
// with astropy 5.2.1 and scipy 1.10.1 (Debian), formulas written out independently of src/.
const ref = JSON.parse(
  readFileSync(new URL('../../fixtures/reference/sightline-reference.json', import.meta.url), 'utf8'),
);

describe('sightline against scipy/astropy references', () => {
  it('computes P(foreground) with an uncertain source redshift as scipy quad over truncnorm does', () => {
    for (const k of ref.p_fg) {
      const p = probabilityForeground(k.z_p, k.sigma, k.z_s, k.sigma_s, k.velocity_kms);
      // Tolerance 1e-8 absolute: both sides are quadratures at ~1e-12 relative; normalCdf is ~1e-15.
      expectClose(p, k.p_fg, { rtol: 0, atol: 1e-8 });
    }
  });

  it('averages one photometric halo over its redshift as the scipy expectation does, within 4 standard errors', () => {
    const pm = ref.photo_mean;
    const par = pm.parameters;
    const sight = { ra: 210, dec: -35 };
    const [ra, dec] = offsetPoint(sight.ra, sight.dec, (pm.theta_rad * 180) / Math.PI, 45);
    const row: CatalogRow = {
      catalog: 'ref',
      objectId: 'PH',
      raDeg: ra,
      decDeg: dec,
      z: par.z_p,
      zErr: par.sigma_z,
      zKind: 'photo',
      logMstar: par.log_mstar,
      logMstarErr: 0,
    };
    const res = runSightline(
      { coneSearch: bruteCone([row]) },
      {
        ra: sight.ra,
        dec: sight.dec,
        z_source: par.z_source,
        include_draws: true,
        model: { draws: 40_000, seed: 3, scatter: { shmr_dex: 0, concentration_dex: 0 } },
      },
    );
    const g = res.galaxies[0];
    // Deterministic parts (1e-5: the engine reads D_A from a table for draws, dm_central is exact).
    expectClose(g.log_mhalo, pm.log_mhalo, { rtol: 1e-9 });
    expectClose(g.dm_central, pm.dm_central, { rtol: 1e-5 });
    expectClose(g.p_fg, pm.p_fg, { rtol: 1e-8 });
    const draws = res.draws_dm!;
    const n = draws.length;
    const mean = draws.reduce((a, b) => a + b, 0) / n;
    const sd = Math.sqrt(draws.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
    expect(Math.abs(mean - pm.mean_dm)).toBeLessThan(4 * (sd / Math.sqrt(n)));
    const pSe = Math.sqrt((pm.p_contributes * (1 - pm.p_contributes)) / n);
    expect(Math.abs(g.p_contributes - pm.p_contributes)).toBeLessThan(4 * pSe);
  });
});
