import type { Command } from 'commander';
import { InputError } from '../../errors.js';
import {
  dropCatalog,
  estimateRowCount,
  getCatalog,
  type IngestDefaults,
  type LoadMode,
  listCatalogs,
  loadCatalog,
  openStore,
} from '../../store/index.js';
import { dbPath } from '../globals.js';
import { createProgress } from '../progress.js';

interface LoadFlags {
  name: string;
  format?: 'csv' | 'tsv' | 'fits' | 'votable';
  delimiter?: string;
  map?: string;
  skipInvalid?: boolean;
  replace?: boolean;
  append?: boolean;
  description?: string;
  zKind?: 'spec' | 'photo';
  zErr?: string;
  massUnit?: 'log' | 'linear';
  zerrKind?: 'sigma' | 'sigma_over_1pz';
  mhaloDef?: '200c' | '200m' | 'vir';
}

function oneOf<T extends string>(
  flag: string,
  allowed: readonly T[],
  value: string | undefined,
): T | undefined {
  if (value === undefined) return undefined;
  if (!(allowed as readonly string[]).includes(value)) {
    throw new InputError('bad_option', `${flag} must be one of ${allowed.join(', ')}, got '${value}'`, {
      option: flag,
    });
  }
  return value as T;
}

function parseLoadFlags(f: LoadFlags): { mode: LoadMode; defaults: IngestDefaults } {
  if (f.replace && f.append)
    throw new InputError('bad_option', '--replace and --append exclude each other', {});
  oneOf('--format', ['csv', 'tsv', 'fits', 'votable'] as const, f.format);
  let zErr: number | undefined;
  if (f.zErr !== undefined) {
    zErr = Number(f.zErr);
    if (!(Number.isFinite(zErr) && zErr >= 0))
      throw new InputError('bad_option', `--z-err must be a number ≥ 0, got '${f.zErr}'`, {});
  }
  return {
    mode: f.replace ? 'replace' : f.append ? 'append' : 'create',
    defaults: {
      zKind: oneOf('--z-kind', ['spec', 'photo'] as const, f.zKind),
      zErr,
      massUnit: oneOf('--mass-unit', ['log', 'linear'] as const, f.massUnit),
      zErrKind: oneOf('--zerr-kind', ['sigma', 'sigma_over_1pz'] as const, f.zerrKind),
      mhaloDef: oneOf('--mhalo-def', ['200c', '200m', 'vir'] as const, f.mhaloDef),
    },
  };
}

function table(rows: string[][]): string {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  return rows
    .map((r) =>
      r
        .map((cell, c) => cell.padEnd(widths[c]))
        .join('  ')
        .trimEnd(),
    )
    .join('\n');
}

/** `forehalo catalog load|list|show|drop`: manage the galaxy catalogues in the store. */
export function register(program: Command): void {
  const catalog = program.command('catalog').description('load, list, show and drop galaxy catalogues');

  catalog
    .command('load')
    .description(
      'load a CSV, TSV, FITS or VOTable galaxy catalogue (all rows or nothing, unless --skip-invalid)',
    )
    .argument('<file>', 'catalogue file')
    .requiredOption('--name <name>', 'catalogue name (letters, digits, . _ -)')
    .option('--format <format>', 'csv | tsv | fits | votable (default: from the content)')
    .option('--delimiter <char>', "CSV field separator when it is not ','")
    .option('--map <pairs>', 'column mapping, e.g. ra=ALPHA_J2000,dec=DELTA_J2000,z=ZPHOT')
    .option('--skip-invalid', 'store the good rows and a report of the bad ones')
    .option('--replace', 'replace an existing catalogue of this name (atomic swap)')
    .option('--append', 'merge rows into an existing catalogue by id')
    .option('--description <text>', 'free-text description')
    .option('--z-kind <kind>', 'spec | photo, for files without a z_kind column')
    .option('--z-err <sigma>', 'redshift error for rows without one')
    .option('--mass-unit <unit>', 'log | linear stellar masses (default: from unit, name or values)')
    .option('--zerr-kind <kind>', 'photometric z errors given as sigma (default) or sigma_over_1pz')
    .option('--mhalo-def <def>', '200c | 200m | vir, for a halo-mass column without mhalo_def')
    .action(async (file: string, flags: LoadFlags, command: Command) => {
      const { mode, defaults } = parseLoadFlags(flags);
      const store = openStore(dbPath(command));
      const progress = createProgress(estimateRowCount(file));
      try {
        const summary = await loadCatalog(store, {
          source: file,
          format: flags.format,
          delimiter: flags.delimiter,
          name: flags.name,
          description: flags.description,
          map: flags.map,
          skipInvalid: flags.skipInvalid,
          mode,
          defaults,
          onProgress: (rows) => progress.update(rows),
        });
        progress.stop();
        console.log(summary.message);
        if (summary.duplicatePairs > 0)
          console.log(`${summary.duplicatePairs} object(s) linked to the same galaxy in other catalogues`);
        for (const w of summary.warnings) console.log(`warning: ${w}`);
        if (summary.report.problemCount > 0) {
          console.log(
            `skipped rows (${summary.report.problems.length} of ${summary.report.problemCount} problems shown):`,
          );
          for (const p of summary.report.problems)
            console.log(
              `  ${p.positionKind} ${p.position}, column ${p.column}: ${p.reason} (value '${p.value}')`,
            );
        }
      } finally {
        progress.stop();
        store.close();
      }
    });

  catalog
    .command('list')
    .description('list the stored catalogues')
    .option('--json', 'machine-readable output')
    .action((flags: { json?: boolean }, command: Command) => {
      const store = openStore(dbPath(command));
      try {
        const all = listCatalogs(store);
        if (flags.json) {
          console.log(
            JSON.stringify(
              all.map(({ mapping, report, ...rest }) => rest),
              null,
              2,
            ),
          );
        } else if (all.length === 0) {
          console.log('no catalogues loaded');
        } else {
          const rows = all.map((c) => [
            c.name,
            String(c.rows),
            String(c.rowsSkipped),
            c.format,
            c.loadedAt.slice(0, 19).replace('T', ' '),
            c.sourceFile,
          ]);
          console.log(table([['NAME', 'ROWS', 'SKIPPED', 'FORMAT', 'LOADED (UTC)', 'SOURCE'], ...rows]));
        }
      } finally {
        store.close();
      }
    });

  catalog
    .command('show')
    .description('show one catalogue: source, checksum, column mapping, units, warnings and row report')
    .argument('<name>', 'catalogue name')
    .option('--json', 'machine-readable output')
    .action((name: string, flags: { json?: boolean }, command: Command) => {
      const store = openStore(dbPath(command));
      try {
        const c = getCatalog(store, name);
        if (flags.json) {
          console.log(JSON.stringify(c, null, 2));
          return;
        }
        const report = c.report as { warnings?: string[]; problemCount?: number };
        console.log(
          [
            `name:          ${c.name}`,
            `description:   ${c.description || '—'}`,
            `source:        ${c.sourceFile} (${c.format}, SHA-256 ${c.sha256})`,
            `loaded (UTC):  ${c.loadedAt}`,
            `rows:          ${c.rows} (${c.spectroscopic} spectroscopic, ${c.photometric} photometric z; ${c.massesEstimated} colour-based masses)`,
            `skipped rows:  ${c.rowsSkipped}${report.problemCount ? ` (${report.problemCount} problems; see --json)` : ''}`,
            `linked pairs:  ${c.duplicatePairs} (same galaxy in another catalogue)`,
            `mapping:       ${JSON.stringify(c.mapping)}`,
            ...(report.warnings ?? []).map((w) => `warning:       ${w}`),
          ].join('\n'),
        );
      } finally {
        store.close();
      }
    });

  catalog
    .command('drop')
    .description('remove a catalogue and its galaxies')
    .argument('<name>', 'catalogue name')
    .action((name: string, _flags: unknown, command: Command) => {
      const store = openStore(dbPath(command));
      try {
        const r = dropCatalog(store, name);
        console.log(`dropped catalogue '${r.name}' (${r.rows} rows)`);
      } finally {
        store.close();
      }
    });
}
