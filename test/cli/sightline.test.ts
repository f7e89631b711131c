import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Command } from 'commander';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { register } from '../../src/cli/commands/sightline.js';
import { InputError } from '../../src/errors.js';
import { runSightline, sightlineResponseSchema } from '../../src/sightline/index.js';
import { coneSearch, loadCatalog, openStore } from '../../src/store/index.js';

// The invented demo field (fixtures/demo, scripts/demo/make-field.ts) loaded into a temporary store.
const BURST = { ra: 162.71834, dec: 31.40862, z_source: 0.4275, host_id: 'KDF-S-0001' };
let dir: string;
let db: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'forehalo-cli-sightline-'));
  db = join(dir, 'demo.db');
  const store = openStore(db);
  for (const name of ['kestrel_spec', 'kestrel_groups']) {
    await loadCatalog(store, { source: `fixtures/demo/${name}.csv`, name });
  }
  store.close();
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Run `forehalo --db DB sightline ARGS…` in process and capture stdout. */
async function cli(args: string[]): Promise<string> {
  const program = new Command('forehalo').option('--db <path>').exitOverride();
  register(program);
  let out = '';
  const spy = vi.spyOn(process.stdout, 'write').mockImplementation((chunk: string | Uint8Array) => {
    out += String(chunk);
    return true;
  });
  try {
    await program.parseAsync(['node', 'forehalo', '--db', db, 'sightline', ...args]);
  } finally {
    spy.mockRestore();
  }
  return out;
}

const burstArgs = ['--ra', String(BURST.ra), '--dec', String(BURST.dec), '--z', String(BURST.z_source)];

describe('forehalo sightline', () => {
  it('prints with --json exactly the body runSightline returns for the same request', async () => {
    const text = await cli([...burstArgs, '--host-id', BURST.host_id, '--draws', '300', '--json']);
    const body = JSON.parse(text);
    expect(sightlineResponseSchema.safeParse(body).success).toBe(true);
    const store = openStore(db, { readonly: true });
    try {
      const direct = runSightline(
        { coneSearch: (q) => coneSearch(store, q) },
        { ...BURST, model: { draws: 300 } },
      );
      expect(body).toEqual(JSON.parse(JSON.stringify(direct)));
    } finally {
      store.close();
    }
    expect(body.totals.draws).toBe(300);
    expect(body.environment.some((e: { is_host: boolean }) => e.is_host)).toBe(true);
  });

  it('prints the galaxy table as CSV with units in the header', async () => {
    const text = await cli([...burstArgs, '--draws', '200', '--csv']);
    const lines = text.trimEnd().split('\r\n');
    expect(lines[0]).toContain('b [kpc]');
    expect(lines[0]).toContain('dm_p50 [pc cm^-3]');
    const body = JSON.parse(await cli([...burstArgs, '--draws', '200', '--json']));
    expect(lines.length - 1).toBe(body.galaxies.length);
  });

  it('prints a readable report with the totals and the cautions by default', async () => {
    const text = await cli([...burstArgs, '--draws', '200']);
    expect(text).toMatch(/Foreground haloes: DM = .* pc cm⁻³/);
    expect(text).toContain('b [kpc]');
    expect(text).toContain('[model_dependence]');
  });

  it('runs a batch file, one JSON line per sightline, and stops on a bad line before printing anything', async () => {
    const nd = join(dir, 'batch.ndjson');
    writeFileSync(
      nd,
      `${JSON.stringify({ ...BURST, label: 'a' })}\n${JSON.stringify({ ra: 162.7, dec: 31.4, z_source: 0.3 })}\n`,
    );
    const lines = (await cli(['--batch', nd, '--draws', '100', '--json'])).trim().split('\n');
    expect(lines).toHaveLength(2);
    expect(JSON.parse(lines[1]).sightline.z_source).toBe(0.3);

    const bad = join(dir, 'batch.csv');
    writeFileSync(bad, 'label,ra,dec,z_source\nfirst,162.7,31.4,0.3\nsecond,162.7,95,0.3\n');
    let out = '';
    await expect(
      (async () => {
        out = await cli(['--batch', bad, '--json']);
      })(),
    ).rejects.toThrow(/second: .*dec/);
    expect(out).toBe('');
  });

  it('names the missing or malformed flag', async () => {
    await expect(cli(['--ra', '10', '--dec', '5'])).rejects.toThrow(InputError);
    await expect(cli(['--ra', '10', '--dec', '5'])).rejects.toThrow(/--z/);
    await expect(cli([...burstArgs.slice(0, 4), '--z', 'abc'])).rejects.toThrow(/--z: 'abc' is not a number/);
    await expect(cli([...burstArgs, '--model', join(dir, 'missing.json')])).rejects.toThrow(/--model/);
  });
});
