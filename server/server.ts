import cluster from 'node:cluster';
import type { FastifyInstance } from 'fastify';
import { buildApp } from './app.js';
import type { ServerConfig } from './config.js';
import { createServices } from './services/index.js';
import type { AppServices } from './services/types.js';

export interface RunningServer {
  app: FastifyInstance;
  /** The address actually bound, e.g. http://127.0.0.1:8080. */
  url: string;
  /** Stop accepting, let in-flight requests finish (up to shutdownGraceMs), close SQLite. */
  shutdown(reason?: string): Promise<void>;
}

/** pino options: request ids on every line, no secrets (Authorization headers are redacted). */
export function loggerOptions(config: ServerConfig) {
  return {
    level: config.logLevel,
    redact: { paths: ['req.headers.authorization'], censor: '[redacted]' },
  };
}

/**
 * Opens the store, builds the app, listens on config.host:config.port. Installs SIGTERM/SIGINT
 * handlers (unless `signals: false`) that shut down gracefully.
 */
export async function startServer(
  config: ServerConfig,
  options: { signals?: boolean; web?: boolean; services?: AppServices } = {},
): Promise<RunningServer> {
  const services = options.services ?? (await createServices(config));
  const app = await buildApp({
    config,
    services,
    web: options.web,
    logger: loggerOptions(config),
  });
  const address = await app.listen({ host: config.host, port: config.port });
  // Keep-alive must outlast typical proxy idle timeouts but not hold shutdown forever.
  app.server.keepAliveTimeout = 5_000;

  let closing: Promise<void> | undefined;
  const shutdown = (reason = 'shutdown') => {
    closing ??= (async () => {
      app.log.info({ reason }, 'shutting down: finishing in-flight requests');
      const timer = setTimeout(() => {
        app.log.warn('grace period over: closing remaining connections');
        app.server.closeAllConnections();
      }, config.shutdownGraceMs);
      timer.unref();
      await app.close(); // waits for in-flight requests, then onClose hooks close SQLite
      clearTimeout(timer);
      app.log.info('stopped');
    })();
    return closing;
  };

  if (options.signals ?? true) {
    const onSignal = (signal: NodeJS.Signals) => {
      shutdown(signal).then(
        () => process.exit(0),
        (err) => {
          app.log.error({ err }, 'shutdown failed');
          process.exit(1);
        },
      );
    };
    process.once('SIGTERM', onSignal);
    process.once('SIGINT', onSignal);
  }
  return { app, url: address, shutdown };
}

/**
 * Runs `config.workers` HTTP processes sharing one port (node:cluster); SQLite in WAL mode lets
 * them read concurrently. With workers = 1 the server runs in this process.
 */
export async function runServer(config: ServerConfig): Promise<void> {
  if (config.workers <= 1) {
    await startServer(config);
    return;
  }
  if (cluster.isPrimary) {
    const forward = (signal: NodeJS.Signals) => {
      for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill(signal);
    };
    process.once('SIGTERM', () => forward('SIGTERM'));
    process.once('SIGINT', () => forward('SIGINT'));
    for (let i = 0; i < config.workers; i++) cluster.fork({ FOREHALO_WORKER_ID: String(i) });
    cluster.on('exit', (worker, code, signal) => {
      if (code !== 0 && signal === null)
        console.error(`forehalo worker ${worker.id} exited with code ${code}`);
    });
    return;
  }
  await startServer(config);
}
