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
  let allZero = true;
  for (let i = 0; i < values.length && allZero; i++) allZero = values[i] === 0;
  if (allZero && values.length > 0) return { mean: 0, p2_5: 0, p16: 0, p50: 0, p84: 0, p97_5: 0 };
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
