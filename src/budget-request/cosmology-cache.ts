import { type CosmologyModel, type CosmologySpec, createCosmology } from '../cosmology/index.js';

/**
 * Cosmologies keyed by their spec, so repeated requests reuse the distance tables and the budget's
 * Macquart-mean tables (which src/budget caches per cosmology object). Small and bounded.
 */
export function createCosmologyCache(maxSize = 4): (spec: CosmologySpec) => CosmologyModel {
  const cache = new Map<string, CosmologyModel>();
  return (spec) => {
    const key = JSON.stringify(spec);
    let c = cache.get(key);
    if (c) {
      cache.delete(key);
    } else {
      c = createCosmology(spec);
      if (cache.size >= maxSize) cache.delete(cache.keys().next().value as string);
    }
    cache.set(key, c);
    return c;
  };
}
