/**
 * `npm run bench`: runs every benchmark in turn and lets each print its own figures.
 *
 *   npm run bench                 the quick set (science kernels, budget, 1M-row load, 1M-galaxy sightlines)
 *   npm run bench -- --full       the issue-sized runs: 5M-row load (peak RSS), 10M-galaxy all-sky sightlines,
 *                                 HTTP throughput on a 1M-galaxy catalogue (each takes minutes)
 *
 * Benchmarks generate their inputs (invented data) into temporary folders; nothing is committed.
 * Run on an otherwise idle machine; `uptime` is printed first so the load average goes with the figures.
 */
import { spawnSync } from 'node:child_process';
import { cpus, loadavg } from 'node:os';

const full = process.argv.includes('--full');
const quick: string[][] = [
  ['bench/cosmology.ts'],
  ['bench/sky.ts'],
  ['bench/halo-dm.ts'],
  ['bench/budget.ts'],
  ['bench/budget-request.ts'],
  ['bench/load.ts', '1000000'],
  ['bench/sightline.ts', '1000000', '300'],
];
const heavy: string[][] = [
  ['bench/load.ts', '5000000'],
  ['bench/sightline.ts', '10000000', '1000'],
  ['bench/http.ts'],
];

console.log(
  `forehalo benchmarks on ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown CPU'}), Node ${process.version}, ` +
    `load average ${loadavg()
      .map((x) => x.toFixed(2))
      .join(' ')}`,
);
let failed = 0;
for (const args of full ? [...quick.slice(0, 5), ...heavy] : quick) {
  console.log(`\n=== npx tsx ${args.join(' ')}`);
  const r = spawnSync('npx', ['tsx', ...args], { stdio: 'inherit' });
  if (r.status !== 0) {
    failed++;
    console.log(`(exited with ${r.status})`);
  }
}
process.exitCode = failed ? 1 : 0;
