import type { Model } from '../model/index.js';
import { createHaloKit } from './create-kit.js';
import type { HaloKit } from './kit.js';

/** Builds or reuses a kit for a model. */
export type KitProvider = (model: Model) => HaloKit;

/**
 * A small least-recently-used cache of kits keyed by every model key except draws, seed and
 * priorities_top (which do not enter the kit). Building a kit is cheap, but its first fast-DM use builds
 * a projection table (≈1–2 s for mNFW/MB04), so servers and batches should reuse kits.
 */
export function createKitCache(maxSize = 8, build: (model: Model) => HaloKit = createHaloKit): KitProvider {
  const cache = new Map<string, HaloKit>();
  return (model) => {
    const { draws: _d, seed: _s, priorities_top: _p, ...physics } = model;
    const key = JSON.stringify(physics);
    let kit = cache.get(key);
    if (kit) {
      cache.delete(key);
    } else {
      kit = build(model);
      if (cache.size >= maxSize) cache.delete(cache.keys().next().value as string);
    }
    cache.set(key, kit);
    return kit;
  };
}
