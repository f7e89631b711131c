import type { CatalogRow } from './types.js';

/** Rows sharing a physicalKey are one galaxy; unlinked rows stand alone. */
export function physicalKeyOf(row: CatalogRow): string {
  return row.physicalKey ?? `${row.catalog}/${row.objectId}`;
}

function better(a: CatalogRow, b: CatalogRow): boolean {
  if (a.zKind !== b.zKind) return a.zKind === 'spec';
  const ea = a.zErr ?? Number.POSITIVE_INFINITY;
  const eb = b.zErr ?? Number.POSITIVE_INFINITY;
  if (ea !== eb) return ea < eb;
  if (a.catalog !== b.catalog) return a.catalog < b.catalog;
  return a.objectId < b.objectId;
}

/**
 * Keep one row per physical galaxy: the spectroscopic one if any, then the smallest redshift error,
 * then the first catalogue by name (the store's rule). Returns the kept rows in input order and, per
 * kept row, the rows it stands for.
 */
export function resolveDuplicates(rows: readonly CatalogRow[]): {
  kept: CatalogRow[];
  dropped: Map<CatalogRow, CatalogRow[]>;
} {
  // Rows without a physical key stand alone; when no row has one (the usual case) and no (catalogue,
  // id) repeats, every row is kept as it is.
  if (rows.every((r) => r.physicalKey == null) && distinctIds(rows))
    return { kept: [...rows], dropped: new Map() };
  const best = new Map<string, CatalogRow>();
  for (const r of rows) {
    const k = physicalKeyOf(r);
    const cur = best.get(k);
    if (!cur || better(r, cur)) best.set(k, r);
  }
  const dropped = new Map<CatalogRow, CatalogRow[]>();
  const kept: CatalogRow[] = [];
  for (const r of rows) {
    const winner = best.get(physicalKeyOf(r))!;
    if (winner === r) kept.push(r);
    else {
      const list = dropped.get(winner) ?? [];
      list.push(r);
      dropped.set(winner, list);
    }
  }
  return { kept, dropped };
}

function distinctIds(rows: readonly CatalogRow[]): boolean {
  const seen = new Set<string>();
  for (const r of rows) {
    const k = `${r.catalog}/${r.objectId}`;
    if (seen.has(k)) return false;
    seen.add(k);
  }
  return true;
}
