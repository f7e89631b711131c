import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_BURST } from '../server/demo-app.js';
import { type BrowserFixture, startBrowserFixture } from './browser-fixture.js';

const OUT = new URL('../../test-output/', import.meta.url);

describe('the DM-budget panel in a real browser (Debian chromium, headless)', () => {
  let fixture: BrowserFixture;
  let server: BrowserFixture['server'];
  let browser: BrowserFixture['browser'];

  beforeAll(async () => {
    fixture = await startBrowserFixture('forehalo-web-budget-');
    ({ server, browser } = fixture);
  });

  afterAll(async () => {
    await fixture?.close();
  });

  it('posts the traced sightline with DM_obs and DM_ISM, draws the waterfall and the host posterior with P(DM_host < 0)', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const errors: string[] = [];
    page.on('pageerror', (err) => errors.push(err.message));
    const query = `ra=${DEMO_BURST.raDeg}&dec=${DEMO_BURST.decDeg}&z_source=${DEMO_BURST.zSource}&host_id=${DEMO_BURST.hostId}`;
    await page.goto(`${server.url}/?${query}`);
    await page.waitForSelector('body[data-ready="true"]');
    await page.waitForSelector('#budget-panel[data-ready="true"]');

    await page.fill('#draws', '300');
    await page.click('#run');
    await page.waitForSelector('body[data-state="done"]');
    await expect(page.locator('#budget-source').textContent()).resolves.toContain('sightline traced');

    // Inputs by their visible labels (accessibility: every input is labelled).
    await page.getByLabel('DMobs [pc cm⁻³]').fill(String(DEMO_BURST.dmObs));
    await page.fill('#budget-dm-obs-err', String(DEMO_BURST.dmObsErr));
    await page.getByLabel('DMMW,ISM [pc cm⁻³]').fill(String(DEMO_BURST.dmIsm));
    await page.fill('#budget-dm-ism-err', String(DEMO_BURST.dmIsmErr));
    const answer = page.waitForResponse(
      (r) => r.url().endsWith('/v1/budgets') && r.request().method() === 'POST',
    );
    // Keyboard: submit from the last input with Enter.
    await page.locator('#budget-dm-ism-err').press('Enter');
    const response = await answer;
    const sent = response.request().postDataJSON();
    const reply = await response.json();
    expect(response.status(), JSON.stringify(reply)).toBe(200);
    await page.waitForSelector('#budget-panel[data-state="done"]');

    // The request carries the traced sightline: position, z_s, host and the form's model.
    expect(sent.z_source).toBe(DEMO_BURST.zSource);
    expect(sent.sightline.ra).toBe(DEMO_BURST.raDeg);
    expect(sent.sightline.host_id).toBe(DEMO_BURST.hostId);
    expect(sent.sightline.model.draws).toBe(300);
    expect(reply.halos_source.kind).toBe('sightline');

    // One waterfall segment per term (4 components + host) and the observed-DM bar.
    const bar = page.locator('#budget-bar');
    await expect(bar.count()).resolves.toBe(1);
    const keys = await bar
      .locator('.budget-segment')
      .evaluateAll((els) => els.map((e) => e.getAttribute('data-component')));
    expect(keys).toEqual(['mw_ism', 'mw_halo', 'cosmic', 'halos', 'host']);
    expect(await bar.locator('[data-component="dm_obs"]').count()).toBe(1);
    expect(await bar.locator('line.whisker').count()).toBe(5 * 3);
    // Segment widths are proportional to the reply's medians (same scale for every row).
    const widths = await bar
      .locator('.budget-segment')
      .evaluateAll((els) => els.map((e) => Number(e.getAttribute('width'))));
    const medians = [reply.components.mw_ism.p50, reply.components.mw_halo.p50, reply.components.cosmic.p50];
    expect(widths[1] / widths[0]).toBeCloseTo(medians[1] / medians[0], 2);
    expect(widths[2] / widths[0]).toBeCloseTo(medians[2] / medians[0], 2);

    // Host posterior: four percentile bins and the P(DM_host < 0) label from the reply.
    const host = page.locator('#host-posterior');
    expect(await host.locator('rect.host-bin').count()).toBe(4);
    expect(Number(await host.locator('.p-negative').getAttribute('data-p-negative'))).toBe(
      reply.p_negative_host,
    );
    await expect(page.locator('#budget-p-negative').textContent()).resolves.toBe(
      reply.p_negative_host.toFixed(3),
    );
    const notes = await page.locator('#budget-notes').textContent();
    expect(notes).toContain("cosmic_mode 'diffuse'");
    expect(notes).toContain('no Galactic electron-density model');

    // Keyboard reaches the waterfall rows, each with an accessible description.
    const firstRow = bar.locator('.budget-row').first();
    await firstRow.focus();
    expect(await firstRow.getAttribute('aria-label')).toMatch(/Milky Way ISM \(your model\): median/);

    mkdirSync(OUT, { recursive: true });
    await page.locator('#budget-panel').screenshot({ path: new URL('budget-panel.png', OUT).pathname });
    expect(errors).toEqual([]);
    await page.close();
  }, 120_000);

  it('a missing DM_ISM shows the server’s field-level reason', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.url}/?z_source=0.3&dm_obs=500`);
    await page.waitForSelector('#budget-panel[data-ready="true"]');
    await page.click('#budget-run');
    await page.waitForSelector('#budget-status.error');
    expect(await page.locator('#budget-status').textContent()).toContain('dm_ism');
    await page.close();
  });
});
