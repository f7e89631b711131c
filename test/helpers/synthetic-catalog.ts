import { once } from 'node:events';
import { createWriteStream } from 'node:fs';
import { createRng } from '../../src/math/random.js';

/**
 * Writes an invented galaxy catalogue (CSV: id, ra, dec, z, z_err, z_kind, log_mstar, log_mstar_err)
 * for load and throughput tests: positions uniform on a spherical cap, 20 % spectroscopic and 80 %
 * photometric redshifts, stellar masses 10^8.5–10^11.5 M☉. Seeded, so a given size is reproducible.
 * Synthetic test data only — no real field or survey.
 */
export async function writeSyntheticCatalog(
  path: string,
  options: {
    rows: number;
    raDeg: number;
    decDeg: number;
    radiusDeg: number;
    seed?: number;
    idPrefix?: string;
  },
): Promise<void> {
  const rng = createRng(options.seed ?? 7);
  const out = createWriteStream(path);
  const deg = Math.PI / 180;
  const cosMax = Math.cos(options.radiusDeg * deg);
  const ra0 = options.raDeg * deg;
  const dec0 = options.decDeg * deg;
  const prefix = options.idPrefix ?? 'S';
  const write = async (text: string) => {
    if (!out.write(text)) await once(out, 'drain');
  };
  await write('id,ra,dec,z,z_err,z_kind,log_mstar,log_mstar_err\n');
  let buffer = '';
  for (let i = 0; i < options.rows; i++) {
    // Uniform on the cap around the pole, then rotated to (ra0, dec0).
    const cosT = 1 - rng.uniform() * (1 - cosMax);
    const sinT = Math.sqrt(1 - cosT * cosT);
    const phi = 2 * Math.PI * rng.uniform();
    const x = sinT * Math.cos(phi);
    const y = sinT * Math.sin(phi);
    const z = cosT;
    // Rotate: pole → (ra0, dec0).
    const xr = x * Math.sin(dec0) + z * Math.cos(dec0);
    const zr = -x * Math.cos(dec0) + z * Math.sin(dec0);
    const ra = ((((ra0 + Math.atan2(y, xr)) / deg) % 360) + 360) % 360;
    const dec = Math.asin(Math.max(-1, Math.min(1, zr))) / deg;
    const spec = rng.uniform() < 0.2;
    const zg = 0.02 + 1.18 * rng.uniform() ** 0.8;
    const zErr = spec ? 0.0003 : 0.03 * (1 + zg);
    const logM = 8.5 + 3 * rng.uniform();
    buffer += `${prefix}${i},${ra.toFixed(6)},${dec.toFixed(6)},${zg.toFixed(4)},${zErr.toFixed(4)},${spec ? 'spec' : 'photo'},${logM.toFixed(2)},0.15\n`;
    if (buffer.length > 1 << 20) {
      await write(buffer);
      buffer = '';
    }
  }
  await write(buffer);
  out.end();
  await once(out, 'close');
}
