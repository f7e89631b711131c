/**
 * Halo DM speed: the hot-loop evaluator (closed form for NFW, tables for mNFW/MB04) against adaptive
 * quadrature, table build times, worst table error on a random sample, and SHMR inversions per second.
 * Run: npx tsx bench/halo-dm.ts
 */
import { createHaloDmEvaluator, dmRestExact } from '../src/dm/index.js';
import { createGasProfile, type ProfileSpec } from '../src/gas/index.js';
import {
  behroozi2013,
  createShmrInverter,
  type HaloMassInversion,
  invertShmrExact,
  moster2013,
} from '../src/halo/index.js';
import { createRng } from '../src/math/index.js';

const FB = 0.158141;
const rng = createRng(11);
const N = 2_000_000;
const mass = new Float64Array(N);
const radius = new Float64Array(N);
const conc = new Float64Array(N);
const b = new Float64Array(N);
const z = new Float64Array(N);
for (let i = 0; i < N; i++) {
  mass[i] = 10 ** (11 + 3 * rng.uniform());
  radius[i] = 100 + 500 * rng.uniform();
  conc[i] = 10 ** (0.4 + 0.8 * rng.uniform());
  b[i] = radius[i] * 1.05 * rng.uniform();
  z[i] = 0.05 + rng.uniform();
}

function perSecond(n: number, ns: number): string {
  return `${((n / ns) * 1e9).toExponential(3)} /s (${(ns / n).toFixed(1)} ns each)`;
}

const specs: [ProfileSpec, number][] = [
  [{ kind: 'nfw' }, 1],
  [{ kind: 'mnfw' }, 1],
  [{ kind: 'mnfw' }, 2],
  [{ kind: 'mb04' }, 1],
];
for (const [spec, extent] of specs) {
  const label = `${spec.kind} extent ${extent}`;
  const ev = createHaloDmEvaluator(spec, { extent });
  const t0 = process.hrtime.bigint();
  ev(1e12, 200, 8, 20, 0.1, 0.75, FB);
  const buildMs = Number(process.hrtime.bigint() - t0) / 1e6;
  let sink = 0;
  for (let i = 0; i < 100_000; i++) sink += ev(mass[i], radius[i], conc[i], b[i], z[i], 0.75, FB);
  const t1 = process.hrtime.bigint();
  for (let i = 0; i < N; i++) sink += ev(mass[i], radius[i], conc[i], b[i], z[i], 0.75, FB);
  const fastNs = Number(process.hrtime.bigint() - t1);
  const M = 2000;
  let worst = 0;
  const t2 = process.hrtime.bigint();
  for (let i = 0; i < M; i++) {
    const p = createGasProfile(
      spec,
      { massMsun: mass[i], radiusKpc: radius[i], concentration: conc[i] },
      {
        baryonFraction: FB,
        extent,
      },
    );
    const exact = dmRestExact(p, b[i]) / (1 + z[i]);
    const fast = ev(mass[i], radius[i], conc[i], b[i], z[i], 0.75, FB);
    if (exact > 1e-3) worst = Math.max(worst, Math.abs(fast / exact - 1));
  }
  const quadNs = Number(process.hrtime.bigint() - t2);
  console.log(
    `${label.padEnd(16)} table/closed form: ${perSecond(N, fastNs)}  first-call build ${buildMs.toFixed(0)} ms`,
  );
  console.log(
    `${''.padEnd(16)} quadrature path:   ${perSecond(M, quadNs)}  worst |fast/exact − 1| (DM > 1e-3) ${worst.toExponential(2)}  [sink ${sink.toExponential(2)}]`,
  );
}

for (const rel of [moster2013, behroozi2013]) {
  const inv = createShmrInverter(rel);
  const out: HaloMassInversion = { logMh: 0, status: 'ok' };
  const K = 300_000;
  const logMs = new Float64Array(K);
  const zs = new Float64Array(K);
  for (let i = 0; i < K; i++) {
    logMs[i] = 8.5 + 2.7 * rng.uniform();
    zs[i] = 1.5 * rng.uniform();
  }
  let sink = 0;
  for (let i = 0; i < 20_000; i++) sink += inv.invertInto(out, logMs[i], zs[i]);
  const t0 = process.hrtime.bigint();
  for (let i = 0; i < K; i++) sink += inv.invertInto(out, logMs[i], zs[i]);
  const fastNs = Number(process.hrtime.bigint() - t0);
  const t1 = process.hrtime.bigint();
  for (let i = 0; i < K / 10; i++) sink += invertShmrExact(rel, logMs[i], zs[i]).logMh;
  const brentNs = Number(process.hrtime.bigint() - t1);
  console.log(
    `SHMR ${rel.name.padEnd(12)} table+polish: ${perSecond(K, fastNs)}  Brent: ${perSecond(K / 10, brentNs)}  [sink ${sink.toExponential(2)}]`,
  );
}
