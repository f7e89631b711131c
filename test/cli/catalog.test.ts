import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// Spawning the real CLI is slow (a tsx start-up per call), so these few tests cover the exit codes
// and the printed row report; the behaviour behind them is tested in test/store.
const dir = mkdtempSync(join(tmpdir(), 'forehalo-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function forehalo(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync('npx', ['tsx', 'src/cli/main.ts', ...args], {
    cwd: join(import.meta.dirname, '../..'),
    encoding: 'utf8',
    env: { ...process.env, FOREHALO_DB: '', ...env },
  });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

describe('forehalo catalog', () => {
  const db = join(dir, 'cli.db');
  const good = join(dir, 'good.csv');
  writeFileSync(
    good,
    'id,ra,dec,z,z_err,z_kind,log_mstar\nc1,150,2,0.1,0.0002,spec,10.2\nc2,150.01,2.01,0.3,0.03,photo,9.9\n',
  );

  it('loads a file, lists it through FOREHALO_DB and exits 0', () => {
    const load = forehalo(['--db', db, 'catalog', 'load', good, '--name', 'cli-field']);
    expect(load.err).not.toMatch(/forehalo:/);
    expect(load.code).toBe(0);
    expect(load.out).toMatch(/loaded catalogue 'cli-field': 2 rows stored/);
    const list = forehalo(['catalog', 'list', '--json'], { FOREHALO_DB: db });
    expect(list.code).toBe(0);
    expect(JSON.parse(list.out)).toEqual([expect.objectContaining({ name: 'cli-field', rows: 2 })]);
  });

  it('exits 2 and prints the row report for a bad file, storing nothing', () => {
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'id,ra,dec,z,z_err,z_kind,log_mstar\nb1,150,95,0.1,0.0002,spec,10.2\n');
    const r = forehalo(['--db', db, 'catalog', 'load', bad, '--name', 'bad']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(
      /row report \(1 of 1 problem\(s\)\):\n {2}line 2, column dec: must be in \[-90, 90\] degrees \(value '95'\)/,
    );
    expect(forehalo(['--db', db, 'catalog', 'show', 'bad']).code).toBe(2);
  });

  it('exits 2 on a bad option and 0 for --version and --help', () => {
    expect(forehalo(['--db', db, 'catalog', 'load', good, '--name', 'x', '--z-kind', 'maybe']).code).toBe(2);
    const v = forehalo(['--version']);
    expect(v.code).toBe(0);
    expect(v.out.trim()).toMatch(/^\d+\.\d+\.\d+$/);
    expect(forehalo(['catalog', 'drop', '--help']).code).toBe(0);
  });

  it('exits 1 when the database cannot be used for reasons other than input', () => {
    const notADb = join(dir, 'not-a-db');
    writeFileSync(
      notADb,
      'this is not SQLite, just text that is long enough to fill a header page..........',
    );
    const r = forehalo(['--db', notADb, 'catalog', 'list']);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/forehalo: unexpected failure/);
  });
});
