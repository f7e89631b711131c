/**
 * Throughput of the sky index: ang2pixNest at storage order 15, and coneToRanges at storage order 15
 * for cones of 0.05°, 0.5° and 2°. Prints operations per second and the mean number of ranges and
 * the over-coverage (covered pixel area / cone area). Run: npx tsx bench/sky.ts
 */
import { createRng } from '../src/math/index.js';
import { ang2pixNest, coneToRanges, npixOf, pixelAreaSr } from '../src/sky/index.js';

const rng = createRng(99);
const DEG = Math.PI / 180;

function randomPoints(n: number): Float64Array {
  const out = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    out[2 * i] = 360 * rng.uniform();
    out[2 * i + 1] = (Math.asin(2 * rng.uniform() - 1) * 180) / Math.PI;
  }
  return out;
}

function timeIt(n: number, fn: (i: number) => void): number {
  for (let i = 0; i < Math.min(n, 2000); i++) fn(i); // warm-up
  const t0 = process.hrtime.bigint();
  for (let i = 0; i < n; i++) fn(i);
  return Number(process.hrtime.bigint() - t0) / 1e9;
}

const nPts = 1_000_000;
const pts = randomPoints(nPts);
let sink = 0;
const tA = timeIt(nPts, (i) => {
  sink += ang2pixNest(15, pts[2 * i], pts[2 * i + 1]);
});
console.log(`ang2pixNest(order 15): ${(nPts / tA / 1e6).toFixed(2)} M/s`);

for (const radiusDeg of [0.05, 0.5, 2]) {
  const n = radiusDeg < 1 ? 20_000 : 5_000;
  const cones = randomPoints(n);
  const r = radiusDeg * DEG;
  let nRanges = 0;
  let covered = 0;
  const t = timeIt(n, (i) => {
    const ranges = coneToRanges(15, cones[2 * i], cones[2 * i + 1], r);
    nRanges += ranges.length;
    for (const [lo, hi] of ranges) covered += hi - lo + 1;
  });
  const runs = n + Math.min(n, 2000);
  const capPixels = (2 * Math.PI * (1 - Math.cos(r))) / pixelAreaSr(15);
  console.log(
    `coneToRanges(order 15, r = ${radiusDeg}°): ${(n / t).toFixed(0)} /s, ` +
      `${(nRanges / runs).toFixed(1)} ranges, over-coverage ${(covered / runs / capPixels).toFixed(2)}×`,
  );
}
if (sink === -1) console.log(npixOf(0));
