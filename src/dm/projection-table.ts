import type { ProfileShape } from '../gas/index.js';
import { projectedShape } from './line-integral.js';

/** Concentration range covered by the tables (outside it the evaluator falls back to quadrature). */
export const TABLE_C_MIN = 1;
export const TABLE_C_MAX = 40;
/** Smallest tabulated x = b/R_Δ in units of the extent; below it the value at the node is used. */
export const TABLE_X_MIN_OVER_EXTENT = 1e-7;
const DU = 0.04;
const DV = 0.04;

/**
 * Dimensionless DM table of one profile shape and extent E (r_max = E R_Δ).
 * DM_rest = f_hot (Ω_b/Ω_m) M_Δ · k_e / R_Δ² · T(x, c) with x = b/R_Δ, k_e = 1000 n_e per (M☉ kpc⁻³),
 * T(x, c) = c² P(x c) / (4π K(c)). Stored: Q = T / √(1 − (x/E)²), smooth up to the edge where T
 * falls like √(E − x); nodes uniform in u = ln x and v = ln c, read with 4-point Lagrange
 * interpolation in both axes (error O(h⁴)).
 */
export interface ProjectionTable {
  readonly extent: number;
  readonly uMin: number;
  readonly uMax: number;
  readonly nU: number;
  readonly nV: number;
  /** Row-major in v (concentration), nU values per row. */
  readonly q: Float64Array;
}

export function buildProjectionTable(shape: ProfileShape, extent: number): ProjectionTable {
  const uMax = Math.log(extent);
  const uMin = Math.log(extent * TABLE_X_MIN_OVER_EXTENT);
  const nU = Math.ceil((uMax - uMin) / DU) + 1;
  const nV = Math.ceil(Math.log(TABLE_C_MAX / TABLE_C_MIN) / DV) + 1;
  const du = (uMax - uMin) / (nU - 1);
  const dv = Math.log(TABLE_C_MAX / TABLE_C_MIN) / (nV - 1);
  const q = new Float64Array(nU * nV);
  for (let j = 0; j < nV; j++) {
    const c = TABLE_C_MIN * Math.exp(j * dv);
    const yEdge = extent * c;
    const norm = (c * c) / (4 * Math.PI * shape.enclosed(c, c));
    for (let i = 0; i < nU; i++) {
      const x = i === nU - 1 ? extent : Math.exp(uMin + i * du);
      const xi = x / extent;
      let value: number;
      if (i === nU - 1) {
        // Limit of P/√(1 − (x/E)²) at the edge: 2 Y_edge s(Y_edge).
        value = 2 * yEdge * shape.density(yEdge, c);
      } else {
        value = projectedShape(shape, x * c, c, yEdge) / Math.sqrt((1 - xi) * (1 + xi));
      }
      q[j * nU + i] = norm * value;
    }
  }
  return { extent, uMin, uMax, nU, nV, q };
}

/** T(x, c) from the table; x in (0, E), c in [TABLE_C_MIN, TABLE_C_MAX]. */
export function readProjectionTable(t: ProjectionTable, x: number, c: number): number {
  const nU = t.nU;
  let u = Math.log(x);
  if (u < t.uMin) u = t.uMin;
  const su = ((u - t.uMin) / (t.uMax - t.uMin)) * (nU - 1);
  const sv = (Math.log(c / TABLE_C_MIN) / Math.log(TABLE_C_MAX / TABLE_C_MIN)) * (t.nV - 1);
  let i = Math.floor(su) - 1;
  if (i < 0) i = 0;
  else if (i > nU - 4) i = nU - 4;
  let j = Math.floor(sv) - 1;
  if (j < 0) j = 0;
  else if (j > t.nV - 4) j = t.nV - 4;
  // Lagrange weights on nodes i..i+3 at offset a = su − i (and likewise for v).
  const a = su - i;
  const a0 = a;
  const a1 = a - 1;
  const a2 = a - 2;
  const a3 = a - 3;
  const wu0 = (-a1 * a2 * a3) / 6;
  const wu1 = (a0 * a2 * a3) / 2;
  const wu2 = (-a0 * a1 * a3) / 2;
  const wu3 = (a0 * a1 * a2) / 6;
  const b = sv - j;
  const b1 = b - 1;
  const b2 = b - 2;
  const b3 = b - 3;
  const wv0 = (-b1 * b2 * b3) / 6;
  const wv1 = (b * b2 * b3) / 2;
  const wv2 = (-b * b1 * b3) / 2;
  const wv3 = (b * b1 * b2) / 6;
  const q = t.q;
  let k = j * nU + i;
  const r0 = wu0 * q[k] + wu1 * q[k + 1] + wu2 * q[k + 2] + wu3 * q[k + 3];
  k += nU;
  const r1 = wu0 * q[k] + wu1 * q[k + 1] + wu2 * q[k + 2] + wu3 * q[k + 3];
  k += nU;
  const r2 = wu0 * q[k] + wu1 * q[k + 1] + wu2 * q[k + 2] + wu3 * q[k + 3];
  k += nU;
  const r3 = wu0 * q[k] + wu1 * q[k + 1] + wu2 * q[k + 2] + wu3 * q[k + 3];
  const Q = wv0 * r0 + wv1 * r1 + wv2 * r2 + wv3 * r3;
  const xi = x / t.extent;
  return Q * Math.sqrt((1 - xi) * (1 + xi));
}
