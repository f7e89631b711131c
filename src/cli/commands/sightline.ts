import { readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { parse as parseCsv } from 'csv-parse/sync';
import { InputError } from '../../errors.js';
import {
  galaxyCsvHeader,
  galaxyCsvRows,
  parseSightlineRequest,
  runSightline,
  type SightlineDeps,
  sightlineTextReport,
} from '../../sightline/index.js';
import { coneSearch, openStore } from '../../store/index.js';
import { dbPath } from '../globals.js';

interface SightlineFlags {
  ra?: string;
  dec?: string;
  z?: string;
  zErr?: string;
  catalog?: string[];
  hostId?: string;
  model?: string;
  draws?: string;
  seed?: string;
  json?: boolean;
  csv?: boolean;
  batch?: string;
}

/** A number from a flag or a batch cell; the error names where it came from. */
function numberFrom(value: string | undefined, where: string): number | undefined {
  if (value === undefined || value === '') return undefined;
  const x = Number(value);
  if (!Number.isFinite(x)) throw new InputError('bad_argument', `${where}: '${value}' is not a number`);
  return x;
}

function readModelFile(path: string): Record<string, unknown> {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    throw new InputError('bad_argument', `--model ${path}: cannot read the file (${(e as Error).message})`);
  }
  try {
    const parsed = JSON.parse(text);
    if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed))
      throw new Error('not a JSON object');
    return parsed as Record<string, unknown>;
  } catch (e) {
    throw new InputError('bad_argument', `--model ${path}: not a JSON object (${(e as Error).message})`);
  }
}

interface Job {
  label: string;
  request: Record<string, unknown>;
}

/** Requests of a batch file (.ndjson: one request object per line; .csv: columns ra, dec, z_source|z, …). */
function readBatch(path: string, defaults: Record<string, unknown>): Job[] {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    throw new InputError('bad_argument', `--batch ${path}: cannot read the file (${(e as Error).message})`);
  }
  const jobs: Job[] = [];
  if (/\.ndjson$|\.jsonl$/i.test(path)) {
    text.split(/\r?\n/).forEach((line, i) => {
      if (!line.trim()) return;
      let obj: Record<string, unknown>;
      try {
        obj = JSON.parse(line);
      } catch (e) {
        throw new InputError('bad_batch', `${path} line ${i + 1}: not valid JSON (${(e as Error).message})`);
      }
      const { label, ...rest } = obj;
      jobs.push({ label: String(label ?? `line ${i + 1}`), request: { ...defaults, ...rest } });
    });
  } else if (/\.csv$/i.test(path)) {
    let records: Record<string, string>[];
    try {
      records = parseCsv(text, { columns: true, comment: '#', skip_empty_lines: true, trim: true });
    } catch (e) {
      throw new InputError('bad_batch', `${path}: ${(e as Error).message}`);
    }
    records.forEach((r, i) => {
      const where = `${path} data row ${i + 1}`;
      const request: Record<string, unknown> = { ...defaults };
      request.ra = numberFrom(r.ra, `${where} column ra`);
      request.dec = numberFrom(r.dec, `${where} column dec`);
      request.z_source = numberFrom(r.z_source ?? r.z, `${where} column z_source`);
      const err = numberFrom(r.z_source_err, `${where} column z_source_err`);
      if (err !== undefined) request.z_source_err = err;
      if (r.host_id) request.host_id = r.host_id;
      if (r.catalogs) request.catalogs = r.catalogs.split(';').filter(Boolean);
      jobs.push({ label: r.label || r.id || `row ${i + 1}`, request });
    });
  } else {
    throw new InputError('bad_batch', `--batch ${path}: use a .csv or .ndjson file`);
  }
  // Validate every request before running any, so a bad line stops the batch before output starts.
  for (const job of jobs) {
    try {
      parseSightlineRequest(job.request);
    } catch (e) {
      throw new InputError('bad_batch', `${path} ${job.label}: ${(e as Error).message}`);
    }
  }
  return jobs;
}

/**
 * `forehalo sightline --ra DEG --dec DEG --z ZS [--catalog NAME …] [--host-id ID] [--model FILE.json]
 * [--draws N] [--seed S] [--json|--csv] [--batch FILE.csv|.ndjson]` on the store named by the global --db.
 * `--json` prints exactly the HTTP response body (runSightline's result); `--csv` the galaxy table.
 */
export function register(program: Command): void {
  program
    .command('sightline')
    .description('foreground-halo DM along one burst sightline (or a batch of them)')
    .option('--ra <deg>', 'burst right ascension [deg]')
    .option('--dec <deg>', 'burst declination [deg]')
    .option('--z <zs>', 'burst (host) redshift')
    .option('--z-err <sigma>', '1σ error of the burst redshift')
    .option('--catalog <name...>', 'search only these catalogues (repeatable)')
    .option('--host-id <id>', 'catalogue id of the host galaxy (never counted as foreground)')
    .option('--model <file.json>', 'model choices as a JSON object (defaults for every missing key)')
    .option('--draws <n>', 'Monte Carlo draws (default 1000, at most 100000; overrides the model file)')
    .option('--seed <s>', 'random seed (default 1; overrides the model file)')
    .option('--json', 'print the JSON result (the HTTP response body)')
    .option('--csv', 'print the galaxy table as CSV with units in the header')
    .option('--batch <file>', 'run every sightline of a .csv (ra,dec,z_source,…) or .ndjson file')
    .action((flags: SightlineFlags, command: Command) => runCommand(flags, command));
}

function runCommand(flags: SightlineFlags, command: Command): void {
  if (flags.json && flags.csv) throw new InputError('bad_argument', 'choose one of --json and --csv');
  const model: Record<string, unknown> = flags.model ? readModelFile(flags.model) : {};
  const draws = numberFrom(flags.draws, '--draws');
  const seed = numberFrom(flags.seed, '--seed');
  if (draws !== undefined) model.draws = draws;
  if (seed !== undefined) model.seed = seed;
  const defaults: Record<string, unknown> = { model };
  if (flags.catalog?.length) defaults.catalogs = flags.catalog;
  if (flags.hostId) defaults.host_id = flags.hostId;
  let jobs: Job[];
  if (flags.batch) {
    jobs = readBatch(flags.batch, defaults);
  } else {
    const request = {
      ...defaults,
      ra: numberFrom(flags.ra, '--ra'),
      dec: numberFrom(flags.dec, '--dec'),
      z_source: numberFrom(flags.z, '--z'),
      ...(flags.zErr !== undefined ? { z_source_err: numberFrom(flags.zErr, '--z-err') } : {}),
    };
    if (request.ra === undefined || request.dec === undefined || request.z_source === undefined) {
      throw new InputError('bad_argument', 'give --ra, --dec and --z (or --batch FILE)');
    }
    parseSightlineRequest(request);
    jobs = [{ label: 'sightline', request }];
  }
  const path = dbPath(command);
  let store: ReturnType<typeof openStore>;
  try {
    store = openStore(path, { readonly: true });
  } catch (e) {
    throw new InputError('bad_argument', `cannot open the store ${path}: ${(e as Error).message}`);
  }
  try {
    const deps: SightlineDeps = { coneSearch: (q) => coneSearch(store, q) };
    const batch = jobs.length > 1 || flags.batch !== undefined;
    if (flags.csv) process.stdout.write(`${galaxyCsvHeader(batch)}\r\n`);
    jobs.forEach((job, i) => {
      const res = runSightline(deps, job.request);
      if (flags.json) process.stdout.write(`${JSON.stringify(res)}\n`);
      else if (flags.csv) {
        const rows = galaxyCsvRows(res.galaxies, batch ? job.label : undefined);
        if (rows.length) process.stdout.write(`${rows.join('\r\n')}\r\n`);
      } else {
        if (batch) process.stdout.write(`${i > 0 ? '\n' : ''}== ${job.label} ==\n`);
        process.stdout.write(sightlineTextReport(res));
      }
    });
  } finally {
    store.close();
  }
}
