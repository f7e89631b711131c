import { InputError } from '../errors.js';

/** A diffuse-gas fraction f_d(z): a constant, or a table [[z, f_d], ...] interpolated linearly. */
export type DiffuseFractionSpec = number | readonly (readonly [number, number])[];

export interface DiffuseFraction {
  (z: number): number;
  /** Redshifts where f_d has a kink (table nodes); quadrature splits there. */
  readonly breakpoints: readonly number[];
  readonly description: string;
}

/**
 * Build f_d(z). A table must have ≥ 2 rows with strictly increasing z ≥ 0 and 0 < f_d ≤ 1; between
 * rows f_d is interpolated linearly and outside the table the end value is held constant.
 */
export function createDiffuseFraction(spec: DiffuseFractionSpec, field = 'f_d'): DiffuseFraction {
  if (typeof spec === 'number') {
    if (!(spec > 0 && spec <= 1)) {
      throw new InputError('f_d_invalid', `${field} must be in (0, 1], got ${spec}`);
    }
    return Object.assign(() => spec, { breakpoints: [], description: `constant ${spec}` });
  }
  if (spec.length < 2) throw new InputError('f_d_table_invalid', `${field}: a table needs at least 2 rows`);
  spec.forEach(([z, f], i) => {
    if (!(Number.isFinite(z) && z >= 0)) {
      throw new InputError('f_d_table_invalid', `${field} row ${i}: z must be a finite number ≥ 0, got ${z}`);
    }
    if (!(f > 0 && f <= 1)) {
      throw new InputError('f_d_table_invalid', `${field} row ${i}: f_d must be in (0, 1], got ${f}`);
    }
    if (i > 0 && !(z > spec[i - 1][0])) {
      throw new InputError(
        'f_d_table_invalid',
        `${field} row ${i}: z must increase strictly (${z} after ${spec[i - 1][0]})`,
      );
    }
  });
  const zs = spec.map((r) => r[0]);
  const fs = spec.map((r) => r[1]);
  const n = zs.length;
  const f = (z: number): number => {
    if (z <= zs[0]) return fs[0];
    if (z >= zs[n - 1]) return fs[n - 1];
    let i = 0;
    while (zs[i + 1] < z) i++;
    const t = (z - zs[i]) / (zs[i + 1] - zs[i]);
    return fs[i] + t * (fs[i + 1] - fs[i]);
  };
  return Object.assign(f, {
    breakpoints: zs,
    description: `table of ${n} rows, linear in z, end values held constant outside z ∈ [${zs[0]}, ${zs[n - 1]}]`,
  });
}
