import type { BudgetResponse } from '../budget-request/index.js';

/** A number for a table cell: fixed decimals, right-aligned to a width. */
function cell(v: number | null | undefined, width = 9, digits = 1): string {
  const text = v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits);
  return text.padStart(width);
}

const COMPONENT_LABELS: [keyof BudgetResponse['components'], string][] = [
  ['mw_ism', 'Milky Way ISM (your model)'],
  ['mw_halo', 'Milky Way halo'],
  ['cosmic', 'Cosmic (IGM)'],
  ['halos', 'Foreground haloes'],
];

function bullet(lines: readonly string[], prefix = '  • '): string[] {
  return lines.map((l) => `${prefix}${l}`);
}

function componentRows(b: BudgetResponse): string[] {
  const labelWidth = 30;
  const rows = [
    `${'Component (observer frame)'.padEnd(labelWidth)}${'mean'.padStart(9)}${'p16'.padStart(9)}${'p50'.padStart(9)}${'p84'.padStart(9)}`,
  ];
  for (const [key, label] of COMPONENT_LABELS) {
    const s = b.components[key];
    rows.push(
      s === null
        ? `${label.padEnd(labelWidth)}${'(needs z_s)'.padStart(36)}`
        : `${label.padEnd(labelWidth)}${cell(s.mean)}${cell(s.p16)}${cell(s.p50)}${cell(s.p84)}`,
    );
  }
  return rows;
}

function hostRows(b: BudgetResponse): string[] {
  const h = b.host_rest;
  if (h === null) return [];
  return [
    '',
    `${'Host DM, rest frame'.padEnd(20)}${['mean', 'p2.5', 'p16', 'p50', 'p84', 'p97.5'].map((k) => k.padStart(9)).join('')}`,
    `${''.padEnd(20)}${cell(h.mean)}${cell(h.p2_5)}${cell(h.p16)}${cell(h.p50)}${cell(h.p84)}${cell(h.p97_5)}`,
    `P(DM_host < 0) = ${b.p_negative_host?.toFixed(4)}`,
  ];
}

function redshiftRows(b: BudgetResponse): string[] {
  const l = b.redshift_limit;
  const p = b.redshift_posterior;
  if (l === null || p === null) return [];
  const limit =
    l.z_max === null
      ? `no z_s keeps P(DM_host ≥ 0) ≥ ${l.confidence} (see warnings)`
      : `z_s ≤ ${l.z_max.toFixed(4)}${l.bracketed ? '' : ' (search limit reached)'} keeps P(DM_host ≥ 0) ≥ ${l.confidence}`;
  return [
    '',
    'No source redshift given:',
    `  redshift limit      ${limit}`,
    `  upper bound         ${
      l.z_upper === null
        ? 'none (see warnings)'
        : `z_s ≤ ${l.z_upper.toFixed(4)} at ${l.confidence} confidence (beyond it P(DM_host ≥ 0) < ${(1 - l.confidence).toFixed(2)})`
    }`,
    `  z_s posterior       median ${p.median.toFixed(3)}, 68 % interval ${p.interval68[0].toFixed(3)}–${p.interval68[1].toFixed(3)}, mode ${p.mode.toFixed(3)}`,
    `  prior               ${p.prior}`,
    `  host prior          median ${p.host_prior.median_pc_cm3} pc cm⁻³, σ_ln ${p.host_prior.sigma_ln} (${p.host_prior.frame})`,
  ];
}

/** The readable report of `forehalo budget` (the --json output is the HTTP body instead). */
export function budgetTable(b: BudgetResponse): string {
  const head =
    b.z_source === null
      ? 'DM budget without a source redshift'
      : `DM budget at z_s = ${b.z_source}${b.sightline ? ` (sightline RA ${b.sightline.ra}°, Dec ${b.sightline.dec}°)` : ''}`;
  const lines = [
    head,
    `DM_obs = ${b.dm_obs.value} ± ${b.dm_obs.err} pc cm⁻³ · ${b.draws} draws, seed ${b.seed} · all DMs in pc cm⁻³`,
    '',
    ...componentRows(b),
  ];
  if (b.macquart_mean !== null) {
    lines.push(
      '',
      `⟨DM_cosmic⟩(z_s), Macquart relation with f_d in force: ${b.macquart_mean.toFixed(1)}` +
        `  (cosmic term uses a mean of ${b.cosmic_mean_in_force?.toFixed(1)})`,
    );
  }
  lines.push(...hostRows(b), ...redshiftRows(b));
  lines.push('', `Foreground haloes: ${b.halos_source.description}`);
  lines.push('', 'Conventions:', ...bullet(b.conventions));
  if (b.warnings.length > 0)
    lines.push('', 'Warnings:', ...bullet(b.warnings.map((w) => `[${w.source}/${w.code}] ${w.message}`)));
  lines.push('', 'Cautions:', ...bullet(b.cautions));
  return `${lines.join('\n')}\n`;
}
