/**
 * DM-budget speed: Macquart mean evaluations, cosmic-PDF samples, host posterior and redshift analyses.
 * Run: npx tsx bench/budget.ts
 */
import {
  createCosmicPdf,
  createMacquartMean,
  hostPosterior,
  maxSourceRedshift,
  redshiftPosterior,
} from '../src/budget/index.js';
import { createCosmology } from '../src/cosmology/index.js';
import { createRng } from '../src/math/index.js';

const cosmology = createCosmology('planck18');
const ms = (t0: number) => (performance.now() - t0).toFixed(1);

let t0 = performance.now();
const mean = createMacquartMean(cosmology, { fd: 0.844 });
mean.meanDmPcCm3(0.5);
console.log(`Macquart mean table build                ${ms(t0)} ms`);
const N = 2_000_000;
let sink = 0;
t0 = performance.now();
for (let i = 0; i < N; i++) sink += mean.meanDmPcCm3((i % 3000) * 1e-3);
const tMean = performance.now() - t0;
console.log(`⟨DM_cosmic⟩(z) evaluations               ${((N / tMean) * 1e3).toExponential(3)} /s`);

t0 = performance.now();
const pdf = createCosmicPdf(0.32, 0.5);
console.log(`cosmic PDF solve + CDF table (F=0.32,z=0.5) ${ms(t0)} ms`);
const rng = createRng(1);
t0 = performance.now();
for (let i = 0; i < N; i++) sink += pdf.sample(rng);
const tS = performance.now() - t0;
console.log(`cosmic PDF samples                       ${((N / tS) * 1e3).toExponential(3)} /s`);

const obs = { dmObs: 650, dmObsErr: 0.5, dmIsm: 40, dmIsmErr: 8, cosmology };
const halos = Float64Array.from({ length: 1000 }, (_, i) => 10 + (i % 50));
hostPosterior({ ...obs, zSource: 0.4, draws: 10_000, haloDraws: halos }); // warm-up (PDF cache)
t0 = performance.now();
hostPosterior({ ...obs, zSource: 0.4, draws: 10_000, haloDraws: halos, seed: 2 });
console.log(`host posterior, 10,000 draws (warm)      ${ms(t0)} ms`);
t0 = performance.now();
hostPosterior({ ...obs, zSource: 0.4123, draws: 10_000, haloDraws: halos, seed: 2 });
console.log(`host posterior, 10,000 draws (new z_s)   ${ms(t0)} ms`);
t0 = performance.now();
const lim = maxSourceRedshift({ ...obs, draws: 10_000 });
console.log(`95 % redshift limit, 10,000 draws         ${ms(t0)} ms  (z_max = ${lim.z_max?.toFixed(4)})`);
t0 = performance.now();
const post = redshiftPosterior({ ...obs, draws: 10_000 });
console.log(`redshift posterior, 150 z × 200 × 160     ${ms(t0)} ms  (median ${post.median.toFixed(3)})`);
console.log(`[sink ${sink.toExponential(3)}]`);
