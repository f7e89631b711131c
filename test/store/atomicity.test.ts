import { type ChildProcess, spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createRng } from '../../src/math/index.js';
import { listCatalogs, loadCatalog, openStore } from '../../src/store/index.js';

const ROOT = join(import.meta.dirname, '../..');
const dir = mkdtempSync(join(tmpdir(), 'forehalo-kill-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function bigCsv(n: number): string {
  const rng = createRng(99);
  const lines = ['id,ra,dec,z,z_err,z_kind,log_mstar'];
  for (let k = 0; k < n; k++) {
    lines.push(
      `b${k},${(360 * rng.uniform()).toFixed(6)},${(170 * rng.uniform() - 85).toFixed(6)},${rng.uniform().toFixed(4)},0.03,photo,10.0`,
    );
  }
  return `${lines.join('\n')}\n`;
}

function startChild(db: string, file: string, name: string, mode: string) {
  const child: ChildProcess = spawn(
    process.execPath,
    ['--import', 'tsx', 'test/store/load-child.ts', db, file, name, mode],
    {
      cwd: ROOT,
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  let out = '';
  const ready = new Promise<number>((resolve, reject) => {
    child.stdout!.on('data', (d) => {
      out += String(d);
      if (out.includes('ready')) resolve(performance.now());
    });
    child.once('exit', () => reject(new Error(`child exited before ready: ${out}`)));
  });
  const exited = new Promise<{ code: number | null; signal: string | null; out: string }>((resolve) =>
    child.once('exit', (code, signal) => resolve({ code, signal, out })),
  );
  return { child, ready, exited };
}

describe('a load killed with SIGKILL', () => {
  it('never leaves a partial catalogue and never harms earlier ones (11 kills at random moments)', async () => {
    const N_BIG = 120_000;
    const db = join(dir, 'kill.db');
    const big = join(dir, 'big.csv');
    const base = join(dir, 'base.csv');
    writeFileSync(big, bigCsv(N_BIG));
    writeFileSync(
      base,
      'id,ra,dec,z,z_err,z_kind,log_mstar\nk1,10,10,0.1,0.001,spec,10\nk2,11,10,0.2,0.001,spec,10\n',
    );
    const seed = openStore(db);
    await loadCatalog(seed, { source: base, name: 'base' });
    seed.close();

    // One undisturbed run of the child to learn how long a load takes on this machine.
    const timing = startChild(db, big, 'timing', 'create');
    const t0 = await timing.ready;
    const first = await timing.exited;
    expect(first.out).toContain('done');
    const loadMs = performance.now() - t0;

    const rng = createRng(4242);
    const outcomes: string[] = [];
    for (let k = 0; k < 11; k++) {
      // Alternate a new catalogue and an atomic replace of the earlier one.
      const [name, mode] = k % 2 === 0 ? ['big', 'create'] : ['base', 'replace'];
      const run = startChild(db, big, name, mode);
      await run.ready;
      const delay = rng.uniform() * loadMs * 1.05;
      await new Promise((r) => setTimeout(r, delay));
      run.child.kill('SIGKILL');
      const end = await run.exited;
      outcomes.push(end.out.includes('done') ? 'finished' : `killed after ${Math.round(delay)} ms`);

      const store = openStore(db);
      try {
        expect(store.db.pragma('integrity_check', { simple: true })).toBe('ok');
        expect(store.db.pragma('foreign_key_check')).toEqual([]);
        const cats = new Map(listCatalogs(store).map((c) => [c.name, c.rows]));
        expect(cats.get('timing')).toBe(N_BIG);
        // base is either the original two rows or the complete replacement, never in between.
        expect([2, N_BIG]).toContain(cats.get('base'));
        if (cats.has('big')) expect(cats.get('big')).toBe(N_BIG);
        // Stored rows agree with the catalogue table: nothing orphaned, nothing half-written.
        const counts = store.db
          .prepare(
            'SELECT c.name, COUNT(g.object_id) AS n FROM catalog c LEFT JOIN galaxy g USING (catalog_id) GROUP BY c.name',
          )
          .all() as { name: string; n: number }[];
        for (const c of counts) expect(c.n).toBe(cats.get(c.name));
        expect(
          store.db
            .prepare(
              'SELECT COUNT(*) AS n FROM galaxy WHERE catalog_id NOT IN (SELECT catalog_id FROM catalog)',
            )
            .get(),
        ).toEqual({ n: 0 });
        // A killed 'create' leaves no name behind: drop a completed one so the next create starts fresh.
        if (cats.has('big')) store.db.prepare("DELETE FROM catalog WHERE name = 'big'").run();
      } finally {
        store.close();
      }
    }
    console.log(`load takes ≈ ${Math.round(loadMs)} ms; outcomes: ${outcomes.join(', ')}`);
    expect(outcomes.filter((o) => o.startsWith('killed')).length).toBeGreaterThanOrEqual(8);
  }, 600_000);
});
