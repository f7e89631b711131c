import { describe, expect, it } from 'vitest';
import {
  absoluteMagnitude,
  coneSearchBruteForce,
  ESTIMATED_LOG_MSTAR_ERR_FLOOR,
  loadCatalog,
  logMstarTaylor2011,
} from '../../../src/store/index.js';
import { expectClose } from '../../helpers/expect-close.js';
import { useTmp } from '../tmp.js';

describe('colour-based stellar masses (Taylor et al. 2011, MNRAS 418, 1587, eq. 8)', () => {
  const tmp = useTmp();

  it('gives 10.25 for g − i = 1.0, M_i = −21.0 and 9.17 for 0.6, −19.0 (physics.md §8 [calc], closed form)', () => {
    // log M* = 1.15 + 0.70 (g − i) − 0.4 M_i; closed form, so 1e-12 relative.
    expectClose(logMstarTaylor2011(1.0, -21.0), 10.25, { rtol: 1e-12 });
    expectClose(logMstarTaylor2011(0.6, -19.0), 9.17, { rtol: 1e-12 });
  });

  it('puts a source at 10 pc at its apparent magnitude and one at 1 Mpc 25 mag fainter (distance modulus)', () => {
    expectClose(absoluteMagnitude(5, 1e-5), 5, { atol: 1e-12 });
    expectClose(absoluteMagnitude(20, 1), -5, { atol: 1e-12 });
  });

  it('estimates and flags the mass of a row with g and i but no mass, using the Planck18 luminosity distance', async () => {
    const store = tmp.store();
    const csv = 'id,ra,dec,z,z_err,z_kind,g,i\nc1,20,30,0.1,0.0002,spec,18.0,17.0\n';
    const s = await loadCatalog(store, { source: tmp.file('col.csv', csv), name: 'colours' });
    expect(s.warnings.join(' ')).toMatch(/no k-correction/);
    const [r] = coneSearchBruteForce(store, { raDeg: 20, decDeg: 30, radiusDeg: 1 });
    // D_L(z = 0.1) = 475.8223 Mpc for astropy Planck18 (physics.md §1 [calc]); tolerance covers
    // the 7 significant digits of that table value.
    const expected = 1.15 + 0.7 * (18.0 - 17.0) - 0.4 * (17.0 - 5 * Math.log10(475.8223e5));
    expectClose(r.logMstar!, expected, { rtol: 1e-7 });
    expect(r.massEstimated).toBe(true);
    expect(r.logMstarErr).toBe(ESTIMATED_LOG_MSTAR_ERR_FLOOR);
    expect(r.gMag).toBe(18);
    expect(r.iMag).toBe(17);
  });

  it('warns when estimated masses lie beyond the z ≲ 0.4 calibration', async () => {
    const store = tmp.store();
    const csv = 'id,ra,dec,z,z_err,z_kind,g,i\nc1,20,30,0.6,0.0002,spec,23.0,21.5\n';
    const s = await loadCatalog(store, { source: tmp.file('far.csv', csv), name: 'far' });
    expect(s.warnings.join(' ')).toMatch(/at z > 0.4, beyond the calibration/);
  });

  it('refuses a colour-based mass at z = 0, where there is no luminosity distance', async () => {
    const store = tmp.store();
    const csv = 'id,ra,dec,z,z_err,z_kind,g,i\nc1,20,30,0,0.0002,spec,18.0,17.0\n';
    await expect(loadCatalog(store, { source: tmp.file('z0.csv', csv), name: 'z0' })).rejects.toThrow(
      /needs z > 0/,
    );
  });
});
