import { createCosmology } from '../../../src/cosmology/index.js';
import type { CatalogRow } from '../../../src/sightline/index.js';
import { offsetPoint } from './sky-offset.js';

const planck18 = createCosmology('planck18');

/** A spectroscopic galaxy placed so that its proper impact parameter at z is bKpc (Planck18 D_A). */
export function galaxyAtImpact(
  sight: { raDeg: number; decDeg: number },
  opts: { id: string; z: number; bKpc: number; logMstar: number; paDeg?: number } & Partial<CatalogRow>,
): CatalogRow {
  const thetaDeg = (opts.bKpc / (planck18.angularDiameterDistanceMpc(opts.z) * 1e3)) * (180 / Math.PI);
  const [ra, dec] = offsetPoint(sight.raDeg, sight.decDeg, thetaDeg, opts.paDeg ?? 30);
  return {
    catalog: 'test',
    objectId: opts.id,
    raDeg: ra,
    decDeg: dec,
    zErr: 0.0002,
    zKind: 'spec',
    logMstarErr: 0.1,
    ...opts,
  };
}
