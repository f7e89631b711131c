import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeBudget } from '../../src/budget-request/index.js';
import { budgetRequestFromFlags, flagForKey } from '../../src/cli/budget-args.js';
import { budgetTable } from '../../src/cli/budget-table.js';
import { InputError } from '../../src/errors.js';
import { DEMO_BURST, demoApp } from '../server/demo-app.js';

const run = promisify(execFile);
const noSightline = { runSightline: () => Promise.reject(new Error('no sightline expected')) };

describe('forehalo budget flags', () => {
  it('turn into the same request object POST /v1/budgets takes', () => {
    const dir = mkdtempSync(join(tmpdir(), 'forehalo-budget-flags-'));
    const modelFile = join(dir, 'model.json');
    writeFileSync(modelFile, JSON.stringify({ shmr: 'behroozi2013', draws: 300 }));
    try {
      const req = budgetRequestFromFlags({
        dmObs: '701.3',
        dmObsErr: '0.5',
        dmIsm: '38.6',
        dmIsmErr: '7.7',
        dmMwHalo: '40',
        dmMwHaloErr: '10',
        z: '0.4275',
        ra: '162.7',
        dec: '31.4',
        catalog: ['a', 'b'],
        hostId: 'H1',
        model: modelFile,
        draws: '2000',
        seed: '9',
      });
      expect(req).toEqual({
        dm_obs: 701.3,
        dm_obs_err: 0.5,
        dm_ism: 38.6,
        dm_ism_err: 7.7,
        dm_mw_halo: { mean: 40, err: 10 },
        z_source: 0.4275,
        // --draws does not override the model file's own draws; --seed fills the missing seed.
        sightline: {
          ra: 162.7,
          dec: 31.4,
          catalogs: ['a', 'b'],
          host_id: 'H1',
          model: { shmr: 'behroozi2013', draws: 300, seed: 9 },
        },
        budget_model: { draws: 2000, seed: 9 },
      });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('name the flag when a value is not a number, a file is missing, or --dec is absent', () => {
    expect(() => budgetRequestFromFlags({ dmObs: '7o1', dmIsm: '3' })).toThrow(
      /--dm-obs: '7o1' is not a finite number/,
    );
    expect(() => budgetRequestFromFlags({ dmObs: '701', dmIsm: '3', draws: '1.5' })).toThrow(/--draws/);
    expect(() =>
      budgetRequestFromFlags({ dmObs: '701', dmIsm: '3', budgetModel: '/nonexistent/b.json' }),
    ).toThrow(/--budget-model: cannot read \/nonexistent\/b.json/);
    expect(() => budgetRequestFromFlags({ dmObs: '701', dmIsm: '3', ra: '10' })).toThrow(InputError);
    expect(() => budgetRequestFromFlags({ dmObs: '701', dmIsm: '3', ra: '10' })).toThrow(/--dec/);
    expect(() => budgetRequestFromFlags({ dmObs: '701', dmIsm: '3', dmMwHaloErr: '5' })).toThrow(
      /--dm-mw-halo/,
    );
  });

  it('map request keys back to flags for error messages', () => {
    expect(flagForKey('z_source')).toBe('--z');
    expect(flagForKey('sightline.catalogs')).toBe('--catalog');
    expect(flagForKey('budget_model.f_d')).toBe('--budget-model');
    expect(flagForKey('dm_mw_halo.err')).toBe('--dm-mw-halo-err');
  });

  it('the readable table lists the components, the host posterior, P(DM_host < 0), the convention and the cautions', async () => {
    const body = await computeBudget(noSightline, {
      dm_obs: 800,
      dm_ism: 40,
      dm_ism_err: 5,
      z_source: 0.5,
      budget_model: { draws: 500 },
    });
    const text = budgetTable(body);
    for (const label of [
      'Milky Way ISM',
      'Milky Way halo',
      'Cosmic',
      'Foreground haloes',
      'Host DM, rest frame',
    ])
      expect(text).toContain(label);
    expect(text).toContain(`P(DM_host < 0) = ${body.p_negative_host?.toFixed(4)}`);
    expect(text).toContain(body.host_rest?.p50.toFixed(1));
    expect(text).toContain("cosmic_mode 'diffuse'");
    for (const c of body.cautions) expect(text).toContain(c);
    const noZ = budgetTable(
      await computeBudget(noSightline, { dm_obs: 800, dm_ism: 40, budget_model: { draws: 200 } }),
    );
    expect(noZ).toMatch(/redshift limit\s+z_s ≤ \d/);
    expect(noZ).toMatch(/z_s posterior\s+median/);
  });
});

describe('forehalo budget --json', () => {
  let ctx: Awaited<ReturnType<typeof demoApp>>;
  beforeAll(async () => {
    ctx = await demoApp();
  });
  afterAll(async () => ctx.cleanup());

  it('prints exactly the body POST /v1/budgets replies with for the same input (demo sightline)', async () => {
    const request = {
      dm_obs: DEMO_BURST.dmObs,
      dm_obs_err: DEMO_BURST.dmObsErr,
      dm_ism: DEMO_BURST.dmIsm,
      dm_ism_err: DEMO_BURST.dmIsmErr,
      z_source: DEMO_BURST.zSource,
      sightline: {
        ra: DEMO_BURST.raDeg,
        dec: DEMO_BURST.decDeg,
        host_id: DEMO_BURST.hostId,
        catalogs: ['kestrel-spec'],
        model: { draws: 300, seed: 4 },
      },
      budget_model: { draws: 3000, seed: 4 },
    };
    const http = await ctx.app.inject({ method: 'POST', url: '/v1/budgets', payload: request });
    expect(http.statusCode, http.body).toBe(200);
    // The sightline and budget models go in files, as the HTTP request carries them.
    const dir = mkdtempSync(join(tmpdir(), 'forehalo-budget-cli-'));
    const sightlineModel = join(dir, 'model.json');
    const budgetModel = join(dir, 'budget.json');
    writeFileSync(sightlineModel, JSON.stringify(request.sightline.model));
    writeFileSync(budgetModel, JSON.stringify(request.budget_model));
    const args = [
      'tsx',
      'src/cli/main.ts',
      ...['--db', ctx.dbPath, 'budget'],
      ...['--dm-obs', String(DEMO_BURST.dmObs), '--dm-obs-err', String(DEMO_BURST.dmObsErr)],
      ...['--dm-ism', String(DEMO_BURST.dmIsm), '--dm-ism-err', String(DEMO_BURST.dmIsmErr)],
      ...[
        '--z',
        String(DEMO_BURST.zSource),
        '--ra',
        String(DEMO_BURST.raDeg),
        '--dec',
        String(DEMO_BURST.decDeg),
      ],
      ...['--host-id', DEMO_BURST.hostId, '--catalog', 'kestrel-spec'],
      ...['--model', sightlineModel, '--budget-model', budgetModel, '--json'],
    ];
    try {
      const { stdout } = await run('npx', args, { cwd: process.cwd(), maxBuffer: 64 * 1024 * 1024 });
      expect(stdout).toBe(`${http.body}\n`);
      expect(JSON.parse(stdout).halos_source.kind).toBe('sightline');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 120_000);
});
