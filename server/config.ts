import { z } from 'zod';
import { InputError } from '../src/errors.js';

const MIB = 1024 * 1024;
const GIB = 1024 * MIB;

/** Environment values arrive as strings; flags may arrive as numbers. Both are coerced here. */
const integer = (min: number, max: number) => z.coerce.number().int().min(min).max(max);
const flag = z
  .union([z.boolean(), z.enum(['1', '0', 'true', 'false', 'yes', 'no', ''])])
  .transform((v) => v === true || v === '1' || v === 'true' || v === 'yes');

/**
 * Every setting of the HTTP service, in one place. Each key lists the environment variable that
 * sets it; command-line flags (forehalo serve --port …) override the environment.
 */
export const serverConfigSchema = z
  .object({
    /** FOREHALO_DB — path of the SQLite store file. */
    dbPath: z.string().min(1).default('forehalo.db'),
    /** FOREHALO_HOST — interface to bind. Loopback by default: expose deliberately. */
    host: z.string().min(1).default('127.0.0.1'),
    /** FOREHALO_PORT — TCP port; 0 picks a free one. */
    port: integer(0, 65535).default(8080),
    /** FOREHALO_API_KEY — when set, writes need `Authorization: Bearer <key>`. At least 12 characters. */
    apiKey: z.string().min(12, 'API key must be at least 12 characters').optional(),
    /** FOREHALO_PROTECT_READS — when true (and a key is set) reads need the key too. */
    protectReads: flag.default(false),
    /** FOREHALO_BODY_LIMIT — largest JSON or NDJSON request body, bytes (default 1 MiB). */
    bodyLimitBytes: integer(1024, 1 * GIB).default(1 * MIB),
    /** FOREHALO_UPLOAD_LIMIT — largest catalogue upload, bytes (default 2 GiB). */
    uploadLimitBytes: integer(1024, 64 * GIB).default(2 * GIB),
    /** FOREHALO_REQUEST_TIMEOUT_MS — time allowed to receive a whole request (uploads included). */
    requestTimeoutMs: integer(1000, 24 * 3600 * 1000).default(15 * 60 * 1000),
    /** FOREHALO_WRITE_RATE_LIMIT — catalogue writes allowed per client per minute. */
    writeRateLimitPerMinute: integer(1, 100_000).default(30),
    /** FOREHALO_MAX_DRAWS — largest Monte Carlo draw count a request may ask for. */
    maxDraws: integer(1, 1_000_000).default(20_000),
    /** FOREHALO_MAX_BATCH_LINES — most sightlines in one NDJSON batch request. */
    maxBatchLines: integer(1, 1_000_000).default(10_000),
    /** FOREHALO_SHUTDOWN_GRACE_MS — how long in-flight requests may run after SIGTERM/SIGINT. */
    shutdownGraceMs: integer(0, 10 * 60 * 1000).default(10_000),
    /** FOREHALO_WORKERS — HTTP worker processes (node:cluster); 1 runs in-process. */
    workers: integer(1, 64).default(1),
    /** FOREHALO_LOG_LEVEL — pino level. */
    logLevel: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  })
  .strict();

export type ServerConfig = z.output<typeof serverConfigSchema>;
export type ServerConfigInput = z.input<typeof serverConfigSchema>;

/** Environment variable → config key. */
const ENV_KEYS: Record<string, keyof ServerConfig> = {
  FOREHALO_DB: 'dbPath',
  FOREHALO_HOST: 'host',
  FOREHALO_PORT: 'port',
  FOREHALO_API_KEY: 'apiKey',
  FOREHALO_PROTECT_READS: 'protectReads',
  FOREHALO_BODY_LIMIT: 'bodyLimitBytes',
  FOREHALO_UPLOAD_LIMIT: 'uploadLimitBytes',
  FOREHALO_REQUEST_TIMEOUT_MS: 'requestTimeoutMs',
  FOREHALO_WRITE_RATE_LIMIT: 'writeRateLimitPerMinute',
  FOREHALO_MAX_DRAWS: 'maxDraws',
  FOREHALO_MAX_BATCH_LINES: 'maxBatchLines',
  FOREHALO_SHUTDOWN_GRACE_MS: 'shutdownGraceMs',
  FOREHALO_WORKERS: 'workers',
  FOREHALO_LOG_LEVEL: 'logLevel',
};

/**
 * Builds the checked configuration from an environment (pass `process.env`) and explicit flags.
 * Unset or empty variables fall back to defaults; flags that are `undefined` are ignored.
 * Throws InputError('bad_config') naming each offending setting and its variable.
 */
export function loadServerConfig(
  env: Record<string, string | undefined>,
  flags: Partial<ServerConfigInput> = {},
): ServerConfig {
  const raw: Record<string, unknown> = {};
  for (const [variable, key] of Object.entries(ENV_KEYS)) {
    const value = env[variable];
    if (value !== undefined && value !== '') raw[key] = value;
  }
  for (const [key, value] of Object.entries(flags)) {
    if (value !== undefined) raw[key] = value;
  }
  const parsed = serverConfigSchema.safeParse(raw);
  if (!parsed.success) {
    const byKey = Object.fromEntries(Object.entries(ENV_KEYS).map(([v, k]) => [k, v]));
    const issues = parsed.error.issues.map((issue) => {
      const key = String(issue.path[0] ?? '');
      return { setting: key, variable: byKey[key], reason: issue.message };
    });
    const summary = issues.map((i) => `${i.setting} (${i.variable ?? 'flag'}): ${i.reason}`).join('; ');
    throw new InputError('bad_config', `Server configuration is invalid: ${summary}`, { issues });
  }
  return Object.freeze(parsed.data);
}
