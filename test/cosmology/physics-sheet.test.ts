import { describe, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import { expectClose } from '../helpers/expect-close.js';

// Source: /work/shared/reference/physics.md §1 check table [calc] (astropy 5.2 Planck18). The sheet
// prints 7–8 significant digits, so each value is compared within half a unit of its last digit.
const halfUlp = (printed: string) => {
  const decimals = printed.includes('.') ? printed.split('.')[1].length : 0;
  return 0.5 * 10 ** -decimals;
};
const rows: [number, string, string, string, string, string, string | null][] = [
  [0.1, '1.0502392', '432.5657', '393.2415', '475.8223', '140.1396', '1.906489'],
  [0.5, '1.3187584', '1946.4166', '1297.6111', '2919.6250', '220.9606', '6.290996'],
  [1.0, '1.7828937', '3395.6345', '1697.8172', '6791.2689', '403.8641', '8.231250'],
  [2.0, '3.0156727', '5308.1889', '1769.3963', '15924.5667', '1155.4541', null],
];

describe('Planck18 against the physics sheet §1', () => {
  const c = createCosmology('planck18');
  const check = (actual: number, printed: string) =>
    expectClose(actual, Number(printed), { rtol: 0, atol: halfUlp(printed) * 1.0000001 });

  it.each(rows)('matches E, distances, ρc and kpc/arcsec at z = %s', (z, E, dc, da, dl, rho, kpc) => {
    check(c.E(z), E);
    check(c.comovingDistanceMpc(z), dc);
    check(c.angularDiameterDistanceMpc(z), da);
    check(c.luminosityDistanceMpc(z), dl);
    check(c.criticalDensityMsunKpc3(z), rho);
    if (kpc !== null) check(c.kpcProperPerArcsec(z), kpc);
  });

  it('has the sheet’s derived constants: Ωγ0 h², Ων0, ΩΛ, D_H and ρc0', () => {
    expectClose(c.Ogamma0 * c.h * c.h, 2.472975e-5, { rtol: 0, atol: 5e-12 });
    expectClose(c.Onu0, 1.4396743e-3, { rtol: 0, atol: 5e-11 });
    expectClose(c.Ode0, 0.6888463055, { rtol: 0, atol: 5e-11 });
    expectClose(c.hubbleDistanceMpc, 4430.867, { rtol: 0, atol: 5e-4 });
    expectClose(c.criticalDensityMsunKpc3(0), 127.052815, { rtol: 0, atol: 5e-7 });
    expectClose(c.baryonFraction, 0.158141, { rtol: 0, atol: 5e-7 });
  });

  it('matches the sheet’s impact-parameter scale: 60″ at z = 0.1 and 0.5 is 114.38933 and 377.45977 kpc', () => {
    expectClose(60 * c.kpcProperPerArcsec(0.1), 114.38933, { rtol: 0, atol: 5e-6 });
    expectClose(60 * c.kpcProperPerArcsec(0.5), 377.45977, { rtol: 0, atol: 5e-6 });
  });
});
