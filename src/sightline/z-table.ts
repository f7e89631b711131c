/** Node spacing and range of the redshift tables used in Monte Carlo draws. */
const Z_STEP = 1e-3;
const Z_TABLE_MAX = 10;

/**
 * A function of redshift read from a table with linear interpolation on a uniform grid (step 1e-3,
 * built lazily in blocks of 1000 nodes); beyond z = 10 the function itself is called.
 */
export function createZTable(f: (z: number) => number): (z: number) => number {
  const n = Math.round(Z_TABLE_MAX / Z_STEP) + 1;
  const values = new Float64Array(n);
  const block = 1000;
  const built = new Uint8Array(Math.ceil(n / block));
  const ensure = (b: number) => {
    if (built[b]) return;
    const end = Math.min(n, (b + 1) * block + 1);
    for (let i = b * block; i < end; i++) values[i] = f(i * Z_STEP);
    built[b] = 1;
  };
  return (z) => {
    if (!(z >= 0 && z < Z_TABLE_MAX)) return f(z);
    const u = z / Z_STEP;
    const i = Math.floor(u);
    const b = Math.floor(i / block);
    ensure(b);
    const t = u - i;
    return values[i] + t * (values[i + 1] - values[i]);
  };
}
