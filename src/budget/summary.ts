import { quantileSorted } from '../math/index.js';

export interface Summary {
  mean: number;
  p16: number;
  p50: number;
  p84: number;
}

export interface WideSummary extends Summary {
  p2_5: number;
  p97_5: number;
}

function sortedCopy(values: Float64Array): Float64Array {
  return Float64Array.from(values).sort();
}

function mean(values: Float64Array): number {
  let s = 0;
  for (let i = 0; i < values.length; i++) s += values[i];
  return s / values.length;
}

/** Mean and 16th/50th/84th percentiles (type-7 quantiles) of Monte Carlo draws. */
export function summarise(values: Float64Array): Summary {
  const s = sortedCopy(values);
  return {
    mean: mean(values),
    p16: quantileSorted(s, 0.16),
    p50: quantileSorted(s, 0.5),
    p84: quantileSorted(s, 0.84),
  };
}

/** As summarise, plus the 2.5th and 97.5th percentiles. */
export function summariseWide(values: Float64Array): WideSummary {
  const s = sortedCopy(values);
  return {
    mean: mean(values),
    p2_5: quantileSorted(s, 0.025),
    p16: quantileSorted(s, 0.16),
    p50: quantileSorted(s, 0.5),
    p84: quantileSorted(s, 0.84),
    p97_5: quantileSorted(s, 0.975),
  };
}
