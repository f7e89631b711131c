import { compensatedSum, quantileSorted } from '../math/index.js';

/** Mean and percentiles of a set of draws [pc cm⁻³]; percentiles are type-7 (numpy's default). */
export interface DmSummary {
  readonly mean: number;
  readonly p2_5: number;
  readonly p16: number;
  readonly p50: number;
  readonly p84: number;
  readonly p97_5: number;
}

/** Summarise draws (the input is not modified). */
export function summarizeDraws(values: Float64Array): DmSummary {
  const sorted = Float64Array.from(values).sort();
  return {
    mean: compensatedSum(values) / values.length,
    p2_5: quantileSorted(sorted, 0.025),
    p16: quantileSorted(sorted, 0.16),
    p50: quantileSorted(sorted, 0.5),
    p84: quantileSorted(sorted, 0.84),
    p97_5: quantileSorted(sorted, 0.975),
  };
}

/** Fraction of draws with a strictly positive value. */
export function fractionPositive(values: Float64Array): number {
  let k = 0;
  for (let i = 0; i < values.length; i++) if (values[i] > 0) k++;
  return k / values.length;
}
