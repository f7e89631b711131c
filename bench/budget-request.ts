/**
 * POST /v1/budgets end to end (app.inject on a temporary store with the invented demo field): latency of a
 * budget with z_s, without z_s (redshift limit + posterior), and with the halo term from a sightline.
 * Run: npx tsx bench/budget-request.ts
 */
import { DEMO_BURST, demoApp } from '../test/server/demo-app.js';

const ctx = await demoApp();
const base = {
  dm_obs: DEMO_BURST.dmObs,
  dm_obs_err: DEMO_BURST.dmObsErr,
  dm_ism: DEMO_BURST.dmIsm,
  dm_ism_err: DEMO_BURST.dmIsmErr,
};
const cases: [string, Record<string, unknown>][] = [
  [
    'with z_s, 10 000 draws, halos mean ± err',
    { ...base, z_source: DEMO_BURST.zSource, halos: { mean: 60, err: 20 } },
  ],
  ['without z_s (limit + posterior, 150 z)', base],
  [
    'with z_s + demo sightline (1000 draws)',
    {
      ...base,
      z_source: DEMO_BURST.zSource,
      sightline: { ra: DEMO_BURST.raDeg, dec: DEMO_BURST.decDeg, host_id: DEMO_BURST.hostId },
    },
  ],
];
for (const [name, body] of cases) {
  const times: number[] = [];
  for (let k = 0; k < 6; k++) {
    const t0 = performance.now();
    const res = await ctx.app.inject({ method: 'POST', url: '/v1/budgets', payload: body });
    if (res.statusCode !== 200) throw new Error(res.body);
    times.push(performance.now() - t0);
  }
  const warm = times.slice(1).sort((a, b) => a - b);
  console.log(`${name.padEnd(44)} first ${times[0].toFixed(0)} ms · warm median ${warm[2].toFixed(0)} ms`);
}
console.log(`RSS ${(process.memoryUsage().rss / 2 ** 20).toFixed(0)} MiB`);
await ctx.cleanup();
