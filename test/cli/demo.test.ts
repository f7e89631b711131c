import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { runDemo } from '../../src/cli/commands/demo.js';
import { DEMO_BURST } from '../../src/cli/demo/scenario.js';

// The demo runs the whole chain on the invented field (scripts/demo/make-field.ts); these checks are
// about the demo's plumbing and its consistency with its own JSON, not about reference values.
describe('forehalo demo', () => {
  const out = mkdtempSync(join(tmpdir(), 'forehalo-demo-test-'));
  afterAll(() => rmSync(out, { recursive: true, force: true }));

  it('writes the HTTP bodies, the galaxy table and one SVG mark per candidate galaxy', async () => {
    let printed = '';
    const write = vi.spyOn(process.stdout, 'write').mockImplementation((chunk) => {
      printed += String(chunk);
      return true;
    });
    try {
      await runDemo({ out, draws: '300', seed: '5' });
    } finally {
      write.mockRestore();
    }
    expect(printed).toContain('http://127.0.0.1:8080/');
    expect(printed).toContain('Host DM, rest frame');

    const sightline = JSON.parse(readFileSync(join(out, 'sightline.json'), 'utf8'));
    expect(sightline.sightline.z_source).toBe(DEMO_BURST.zSource);
    expect(sightline.totals.draws).toBe(300);
    expect(sightline.galaxies.length).toBe(sightline.totals.n_candidates);

    const field = readFileSync(join(out, 'field.svg'), 'utf8');
    expect(field.startsWith('<?xml')).toBe(true);
    // One halo mark per foreground candidate, one distinct mark per environment galaxy (host included).
    expect((field.match(/data-galaxy-id="/g) ?? []).length).toBe(sightline.galaxies.length);
    expect((field.match(/data-environment-id="/g) ?? []).length).toBe(sightline.environment.length);

    const budget = JSON.parse(readFileSync(join(out, 'budget.json'), 'utf8'));
    expect(Object.keys(budget.components).sort()).toEqual(['cosmic', 'halos', 'mw_halo', 'mw_ism']);
    expect(budget.macquart_mean).toBeGreaterThan(0);

    const csv = readFileSync(join(out, 'galaxies.csv'), 'utf8').trim().split('\n');
    expect(csv.length).toBe(sightline.galaxies.length + 1);
    for (const f of ['halo-dm-draws.svg', 'dm-vs-impact.svg', 'budget.svg', 'host-posterior.svg']) {
      expect(readFileSync(join(out, f), 'utf8')).toContain('<svg');
    }
  }, 120_000);
});
