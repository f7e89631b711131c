/**
 * Cosmology speed: distances from the interpolation table and closed-form E(z).
 * Run: npx tsx bench/cosmology.ts   (prints calls per second and the table's worst relative error)
 */
import { createCosmology } from '../src/cosmology/index.js';
import { createRng, integrate } from '../src/math/index.js';

const cosmo = createCosmology('planck18');
const rng = createRng(7);
const N = 2_000_000;
const zs = new Float64Array(N);
for (let i = 0; i < N; i++) zs[i] = 3 * rng.uniform();

function rate(label: string, f: (z: number) => number): void {
  let sink = 0;
  for (let i = 0; i < 100_000; i++) sink += f(zs[i]); // warm-up
  const t0 = process.hrtime.bigint();
  for (let i = 0; i < N; i++) sink += f(zs[i]);
  const ns = Number(process.hrtime.bigint() - t0);
  console.log(
    `${label.padEnd(34)} ${((N / ns) * 1e9).toExponential(3)} calls/s  (${(ns / N).toFixed(1)} ns/call)  [sink ${sink.toExponential(3)}]`,
  );
}

const tBuild = process.hrtime.bigint();
cosmo.comovingDistanceMpc(0.5);
console.log(
  `table build (first call)            ${(Number(process.hrtime.bigint() - tBuild) / 1e6).toFixed(2)} ms`,
);
rate('comovingDistanceMpc (table)', cosmo.comovingDistanceMpc);
rate('angularDiameterDistanceMpc (table)', cosmo.angularDiameterDistanceMpc);
rate('E(z) (closed form)', cosmo.E);
rate('criticalDensityMsunKpc3', cosmo.criticalDensityMsunKpc3);
rate('zAtComovingDistance', (z) => cosmo.zAtComovingDistance(1000 * z));

let worst = 0;
for (let k = 0; k < 20000; k++) {
  const z = 10 ** (-5 + rng.uniform() * 6.3);
  const direct = cosmo.hubbleDistanceMpc * integrate((x) => 1 / cosmo.E(x), 0, z, { rtol: 1e-13 });
  worst = Math.max(worst, Math.abs(cosmo.comovingDistanceMpc(z) / direct - 1));
}
console.log(`table vs quadrature, 20,000 z in [1e-5, 20]: worst relative error ${worst.toExponential(2)}`);
