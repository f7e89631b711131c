import { ARCSEC } from '../math/index.js';
import { angularSeparationArcsec, coneToRanges } from '../sky/index.js';
import type { MatchOptions, Store } from './open.js';
import { catalogRows, catalogRuns, inRunPixels, mergeRuns } from './runs.js';
import { STORAGE_ORDER } from './storage-order.js';

interface MatchRow {
  object_id: string;
  ra_deg: number;
  dec_deg: number;
  z: number;
  z_err: number | null;
  z_kind: 'spec' | 'photo';
}

/**
 * Do two redshifts describe one galaxy? Two spectroscopic values must agree within
 * specDz·(1 + z); otherwise |Δz| ≤ k·√(σ₁² + σ₂²) with unknown errors taken as 0.
 */
export function redshiftsCompatible(a: MatchRow, b: MatchRow, m: MatchOptions): boolean {
  const dz = Math.abs(a.z - b.z);
  if (a.z_kind === 'spec' && b.z_kind === 'spec') return dz <= m.specDz * (1 + Math.min(a.z, b.z));
  const sigma = Math.hypot(a.z_err ?? 0, b.z_err ?? 0);
  return dz <= m.k * sigma;
}

/**
 * Each probe seeks once per run of the target catalogue and pixel range: against a target kept in
 * many runs (a 1M-row load keeps 31), that is many seeks per probe. Merging the target's runs costs
 * about as much per target row as one seek does (both ~1–3 µs here; bench/http.ts: a 200k-row load
 * matched against a 1M-row catalogue in 31 runs took 15.6 s), so the target is merged into one run
 * first when probes × (runs − 1) exceeds its row count. The merge is part of the caller's
 * transaction and also makes that catalogue's cone searches cheaper afterwards.
 */
function mergeTargetIfWorthIt(store: Store, targetId: number, probeRows: number, targetRows: number): void {
  const runs = catalogRuns(store.db, targetId);
  if (runs.length > 1 && probeRows * (runs.length - 1) > targetRows) mergeRuns(store.db, targetId, runs);
}

/**
 * Find every pair between catalogue `catalogId` and each other catalogue closer than the match
 * radius with compatible redshifts, replacing that catalogue's previous pairs. Iterates the smaller
 * catalogue of each pair and cone-searches the larger through the HEALPix index.
 * Runs inside the caller's transaction. Returns the number of pairs.
 */
export function matchCatalog(store: Store, catalogId: number): number {
  const { db, match } = store;
  db.prepare('DELETE FROM galaxy_match WHERE catalog_a = ? OR catalog_b = ?').run(catalogId, catalogId);
  const others = db
    .prepare<[number], { catalog_id: number; n: number }>(
      'SELECT c.catalog_id, c.row_count AS n FROM catalog c WHERE c.catalog_id != ?',
    )
    .all(catalogId);
  if (others.length === 0) return 0;
  const nSelf = store.statements.galaxyCount.get({ catalogId })!;
  // Probes go in storage order (run, then HEALPix index), so successive look-ups touch nearby pages.
  const ofCatalog = catalogRows('@catalogId');
  const rowsOf = db.prepare<[{ catalogId: number }], MatchRow>(
    `SELECT g.object_id, g.ra_deg, g.dec_deg, g.z, g.z_err, g.z_kind FROM ${ofCatalog.from}
     WHERE ${ofCatalog.where} ORDER BY k.run, g.gkey`,
  );
  const inRange = db.prepare<[{ catalogId: number; lo: number; hi: number }], MatchRow>(
    `SELECT g.object_id, g.ra_deg, g.dec_deg, g.z, g.z_err, g.z_kind FROM galaxy_run k CROSS JOIN galaxy g
     WHERE k.catalog_id = @catalogId AND ${inRunPixels('k.run', '@lo', '@hi')}`,
  );
  const insert = db.prepare(
    'INSERT OR IGNORE INTO galaxy_match (catalog_a, object_a, catalog_b, object_b, sep_arcsec, dz) VALUES (?, ?, ?, ?, ?, ?)',
  );
  const radiusRad = match.radiusArcsec * ARCSEC;
  let pairs = 0;
  const found: [number, string, number, string, number, number][] = [];
  for (const other of others) {
    const selfIsProbe = nSelf <= other.n;
    const probeId = selfIsProbe ? catalogId : other.catalog_id;
    const targetId = selfIsProbe ? other.catalog_id : catalogId;
    mergeTargetIfWorthIt(store, targetId, selfIsProbe ? nSelf : other.n, selfIsProbe ? other.n : nSelf);
    for (const p of rowsOf.iterate({ catalogId: probeId })) {
      for (const [lo, hi] of coneToRanges(STORAGE_ORDER, p.ra_deg, p.dec_deg, radiusRad)) {
        for (const t of inRange.all({ catalogId: targetId, lo, hi })) {
          const sep = angularSeparationArcsec(p.ra_deg, p.dec_deg, t.ra_deg, t.dec_deg);
          if (sep > match.radiusArcsec || !redshiftsCompatible(p, t, match)) continue;
          const [a, b, ca, cb] = probeId < targetId ? [p, t, probeId, targetId] : [t, p, targetId, probeId];
          found.push([ca, a.object_id, cb, b.object_id, sep, b.z - a.z]);
        }
      }
    }
  }
  // better-sqlite3 cannot write while a read iterator is open: insert after the scan.
  for (const f of found) pairs += insert.run(...f).changes;
  return pairs;
}

/**
 * Rebuild physical_link from galaxy_match: each connected set of matched objects is one physical
 * galaxy, keyed by its alphabetically first 'catalogue/object' member. Runs inside the caller's
 * transaction.
 */
export function rebuildPhysicalLinks(store: Store): number {
  const { db } = store;
  const names = new Map(
    db
      .prepare<[], { catalog_id: number; name: string }>('SELECT catalog_id, name FROM catalog')
      .all()
      .map((r) => [r.catalog_id, r.name]),
  );
  const parent = new Map<string, string>();
  const find = (x: string): string => {
    let r = x;
    while (parent.get(r) !== r) r = parent.get(r)!;
    let c = x;
    while (c !== r) {
      const next = parent.get(c)!;
      parent.set(c, r);
      c = next;
    }
    return r;
  };
  const add = (x: string) => {
    if (!parent.has(x)) parent.set(x, x);
  };
  const pairs = db
    .prepare<[], { catalog_a: number; object_a: string; catalog_b: number; object_b: string }>(
      'SELECT catalog_a, object_a, catalog_b, object_b FROM galaxy_match',
    )
    .iterate();
  for (const p of pairs) {
    const a = `${names.get(p.catalog_a)}/${p.object_a}`;
    const b = `${names.get(p.catalog_b)}/${p.object_b}`;
    add(a);
    add(b);
    const ra = find(a);
    const rb = find(b);
    if (ra !== rb) {
      if (ra < rb) parent.set(rb, ra);
      else parent.set(ra, rb);
    }
  }
  db.prepare('DELETE FROM physical_link').run();
  const ids = new Map([...names].map(([id, name]) => [name, id]));
  const insert = db.prepare(
    'INSERT INTO physical_link (catalog_id, object_id, physical_key) VALUES (?, ?, ?)',
  );
  for (const key of parent.keys()) {
    const slash = key.indexOf('/');
    insert.run(ids.get(key.slice(0, slash)), key.slice(slash + 1), find(key));
  }
  return parent.size;
}
