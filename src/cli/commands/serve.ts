import type { Command } from 'commander';

interface ServeFlags {
  port?: string;
  host?: string;
  workers?: string;
}

/**
 * `forehalo serve [--port 8080] [--host 127.0.0.1] [--workers 1]` — runs the HTTP service and the web
 * view on the store named by the global --db (or FOREHALO_DB). Every setting can also come from the
 * environment (server/config.ts lists them); flags win. Binds to loopback unless told otherwise.
 */
export function register(program: Command): void {
  program
    .command('serve')
    .description('run the HTTP API (/v1) and the web view (/) on the catalogue store')
    .option('--port <port>', 'TCP port, 0 for any free port (env FOREHALO_PORT; default 8080)')
    .option('--host <address>', 'interface to bind (env FOREHALO_HOST; default 127.0.0.1)')
    .option('--workers <n>', 'HTTP worker processes sharing the port (env FOREHALO_WORKERS; default 1)')
    .action(async (flags: ServeFlags, command: Command) => {
      const globals = command.optsWithGlobals() as { db?: string };
      // Loaded on demand so other commands do not pay for fastify at start-up.
      const { loadServerConfig } = await import('../../../server/config.js');
      const { runServer } = await import('../../../server/server.js');
      const config = loadServerConfig(process.env, {
        port: flags.port,
        host: flags.host,
        workers: flags.workers,
        dbPath: globals.db,
      });
      await runServer(config);
    });
}
