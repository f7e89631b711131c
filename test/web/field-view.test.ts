import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_BURST } from '../server/demo-app.js';
import { type BrowserFixture, startBrowserFixture } from './browser-fixture.js';

const OUT = new URL('../../test-output/', import.meta.url);

describe('the web field view in a real browser (Debian chromium, headless)', () => {
  let fixture: BrowserFixture;
  let server: BrowserFixture['server'];
  let browser: BrowserFixture['browser'];

  beforeAll(async () => {
    fixture = await startBrowserFixture('forehalo-web-');
    ({ server, browser } = fixture);
  });

  afterAll(async () => {
    await fixture?.close();
  });

  it('draws one mark per candidate galaxy and the draws histogram, and saves a screenshot', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    const errors: string[] = [];
    page.on('pageerror', (err) => errors.push(err.message));
    const query = `ra=${DEMO_BURST.raDeg}&dec=${DEMO_BURST.decDeg}&z_source=${DEMO_BURST.zSource}&host_id=${DEMO_BURST.hostId}`;
    await page.goto(`${server.url}/?${query}`);
    await page.waitForSelector('body[data-ready="true"]');
    // The form offers every SHMR the server accepts (read from the OpenAPI document).
    const shmrOptions = await page.locator('#shmr option').allTextContents();
    expect(shmrOptions).toContain('moster2013');
    expect(await page.locator('#catalog-list input[type=checkbox]').count()).toBe(3);

    await page.fill('#draws', '400');
    const answer = page.waitForResponse(
      (r) => r.url().endsWith('/v1/sightlines') && r.request().method() === 'POST',
    );
    await page.click('#run');
    const reply = await (await answer).json();
    await page.waitForSelector('body[data-state="done"]');

    expect(reply.galaxies.length).toBeGreaterThan(0);
    expect(await page.locator('[data-galaxy-id]').count()).toBe(reply.galaxies.length);
    const ids = await page
      .locator('[data-galaxy-id]')
      .evaluateAll((els) => els.map((e) => e.getAttribute('data-galaxy-id')));
    expect(new Set(ids)).toEqual(new Set(reply.galaxies.map((g: { id: string }) => g.id)));
    // Photometric haloes are dashed, spectroscopic solid.
    const photo = reply.galaxies.filter((g: { z_kind: string }) => g.z_kind === 'photo').length;
    expect(await page.locator('[data-galaxy-id].photo').count()).toBe(photo);

    expect(reply.draws_dm).toHaveLength(400);
    const histogram = page.locator('#dm-histogram');
    await expect(histogram.count()).resolves.toBe(1);
    expect(await histogram.locator('rect.bar').count()).toBeGreaterThan(3);
    expect(await histogram.locator('[data-marker]').count()).toBe(3);
    expect(await page.locator('#galaxy-table tbody tr').count()).toBe(reply.galaxies.length);
    expect(await page.locator('#n-candidates').textContent()).toBe(String(reply.totals.n_candidates));

    // Keyboard: focusing a halo shows its row in the tooltip.
    await page.locator('[data-galaxy-id]').last().focus();
    await expect(page.locator('#tooltip').isVisible()).resolves.toBe(true);
    expect(await page.locator('#tooltip').textContent()).toContain('DM =');
    await page.locator('body').click({ position: { x: 5, y: 5 } });
    await page.locator('#tooltip').evaluate((el) => {
      el.setAttribute('hidden', '');
    });

    // Sorting the table by a column header.
    await page.click('#galaxy-table th:nth-child(6) button');
    const sorted = await page.locator('#galaxy-table tbody tr td:nth-child(6)').allTextContents();
    const values = sorted.map(Number);
    expect(values).toEqual([...values].sort((a, b) => b - a));

    mkdirSync(OUT, { recursive: true });
    await page.screenshot({ path: new URL('field-view.png', OUT).pathname, fullPage: true });
    await page.locator('#field-svg').screenshot({ path: new URL('field-chart.png', OUT).pathname });
    await histogram.screenshot({ path: new URL('dm-histogram.png', OUT).pathname });
    expect(errors).toEqual([]);
    await page.close();
  });

  it('a bad input shows the server’s field-level reason next to the form', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.url}/?ra=400&dec=0&z_source=0.3`);
    await page.waitForSelector('body[data-ready="true"]');
    await page.click('#run');
    await page.waitForSelector('#form-status.error');
    expect(await page.locator('#form-status').textContent()).toContain('ra');
    await page.close();
  });
});
