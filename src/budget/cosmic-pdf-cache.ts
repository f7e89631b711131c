import { type CosmicPdf, createCosmicPdf } from './cosmic-pdf.js';

/**
 * A bounded memo of solved Macquart PDFs keyed by (F, z): the shape solve and the CDF table cost a
 * few milliseconds and depend on nothing else, so budgets, redshift limits and posteriors share them.
 * Pure cache of immutable objects (oldest entry dropped beyond the limit).
 */
const LIMIT = 512;
const memo = new Map<string, CosmicPdf>();

export function cosmicPdf(F: number, z: number): CosmicPdf {
  const key = `${F}|${z}`;
  let pdf = memo.get(key);
  if (pdf === undefined) {
    pdf = createCosmicPdf(F, z);
    if (memo.size >= LIMIT) memo.delete(memo.keys().next().value as string);
    memo.set(key, pdf);
  }
  return pdf;
}
