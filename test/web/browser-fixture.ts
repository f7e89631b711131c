import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type Browser, chromium } from 'playwright-core';
import { loadServerConfig } from '../../server/config.js';
import { type RunningServer, startServer } from '../../server/server.js';
import { DEMO_FILES } from '../server/demo-app.js';

/** Debian's chromium; never a browser downloaded by a test tool. */
export const CHROMIUM = '/usr/bin/chromium';
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface BrowserFixture {
  server: RunningServer;
  browser: Browser;
  close(): Promise<void>;
}

/**
 * A real server on 127.0.0.1 (random port) with the invented demo field loaded through PUT
 * /v1/catalogs, and a headless chromium. `close` stops both and deletes the temporary database.
 */
export async function startBrowserFixture(prefix: string): Promise<BrowserFixture> {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  const config = loadServerConfig({}, { dbPath: join(dir, 'web.db'), port: 0, logLevel: 'silent' });
  const server = await startServer(config, { signals: false });
  for (const [name, file] of DEMO_FILES) {
    const res = await fetch(`${server.url}/v1/catalogs/${name}?file_name=${file}`, {
      method: 'PUT',
      headers: { 'content-type': 'text/csv' },
      body: readFileSync(new URL(`../../fixtures/demo/${file}`, import.meta.url)),
    });
    if (res.status !== 201) throw new Error(`demo load failed: ${await res.text()}`);
  }
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS });
  return {
    server,
    browser,
    async close() {
      await browser.close();
      await server.shutdown('test done');
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
