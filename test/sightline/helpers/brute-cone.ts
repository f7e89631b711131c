import { DEG } from '../../../src/math/index.js';
import type { CatalogRow, ConeQuery, ConeSearchFn } from '../../../src/sightline/index.js';
import { separationRad } from '../../../src/sky/index.js';

/** A cone search by scanning every row (the exact reference the store's HEALPix search must match). */
export function bruteCone(rows: readonly CatalogRow[], calls?: ConeQuery[]): ConeSearchFn {
  return (q) => {
    calls?.push(q);
    const out: CatalogRow[] = [];
    for (const r of rows) {
      if (q.catalogs && !q.catalogs.includes(r.catalog)) continue;
      if (q.zMin !== undefined && r.z < q.zMin) continue;
      if (q.zMax !== undefined && r.z > q.zMax) continue;
      if (q.minLogMstar !== undefined) {
        const byStar = r.logMstar !== null && r.logMstar >= q.minLogMstar;
        const byHalo = r.logMhalo != null && q.minLogMhalo !== undefined && r.logMhalo >= q.minLogMhalo;
        if (!byStar && !byHalo) continue;
      }
      const sep = separationRad(q.raDeg * DEG, q.decDeg * DEG, r.raDeg * DEG, r.decDeg * DEG);
      if (sep <= q.radiusDeg * DEG) out.push(r);
    }
    return out;
  };
}
