import { describe, expect, it } from 'vitest';
import { loadServerConfig } from '../../server/config.js';
import { startServer } from '../../server/server.js';
import { recordingServices } from './helpers.js';

describe('graceful shutdown', () => {
  it('finishes an in-flight request, refuses new ones, then closes the store', async () => {
    const services = recordingServices();
    let release: () => void = () => {};
    const gate = new Promise<void>((resolve) => {
      release = resolve;
    });
    const run = services.sightlines.run;
    services.sightlines.run = async (request: unknown) => {
      await gate;
      return run(request);
    };
    const config = loadServerConfig({}, { port: 0, logLevel: 'silent', shutdownGraceMs: 5000 });
    const server = await startServer(config, { signals: false, services, web: false });
    const inFlight = fetch(`${server.url}/v1/sightlines`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ ra: 5, dec: 0, z_source: 0.5 }),
    });
    await new Promise((r) => setTimeout(r, 100));
    const closing = server.shutdown('test');
    await new Promise((r) => setTimeout(r, 50));
    expect(services.closed).toBe(false); // still serving the first request
    release();
    const res = await inFlight;
    expect(res.status).toBe(200);
    expect((await res.json()).sightline.ra).toBe(5);
    await closing;
    expect(services.closed).toBe(true);
    await expect(fetch(`${server.url}/v1/health`)).rejects.toThrow();
  });

  it('the config rejects a bad port and a short API key, naming the variable', () => {
    expect(() => loadServerConfig({ FOREHALO_PORT: '70000' })).toThrow(/port \(FOREHALO_PORT\)/);
    expect(() => loadServerConfig({ FOREHALO_API_KEY: 'short' })).toThrow(/FOREHALO_API_KEY/);
    expect(() => loadServerConfig({ FOREHALO_PROTECT_READS: 'maybe' })).toThrow(/FOREHALO_PROTECT_READS/);
  });

  it('flags override the environment and defaults are safe', () => {
    const config = loadServerConfig({ FOREHALO_PORT: '9000', FOREHALO_HOST: '0.0.0.0' }, { port: 9100 });
    expect(config.port).toBe(9100);
    expect(config.host).toBe('0.0.0.0');
    const defaults = loadServerConfig({});
    expect(defaults.host).toBe('127.0.0.1');
    expect(defaults.uploadLimitBytes).toBe(2 * 1024 ** 3);
    expect(defaults.apiKey).toBeUndefined();
  });
});
