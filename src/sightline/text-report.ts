import type { SightlineResponse } from './schemas.js';

const f = (x: number | null, digits: number) => (x === null || !Number.isFinite(x) ? '—' : x.toFixed(digits));

function table(header: string[], rows: string[][]): string[] {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: string[]) =>
    cells.map((c, i) => (i < 3 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join('  ');
  return [line(header), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)];
}

/** A readable plain-text report of a sightline result: totals, galaxy table with units, priorities, cautions. */
export function sightlineTextReport(res: SightlineResponse): string {
  const s = res.sightline;
  const t = res.totals;
  const d = t.dm_halos;
  const out: string[] = [];
  out.push(
    `Sightline RA ${s.ra.toFixed(5)}°  Dec ${s.dec.toFixed(5)}°  z_source ${s.z_source}` +
      (s.z_source_err > 0 ? ` ± ${s.z_source_err}` : '') +
      (s.host_id ? `  host ${s.host_id}` : ''),
  );
  out.push(
    `Foreground haloes: DM = ${f(d.p50, 1)} (+${f(d.p84 - d.p50, 1)} / −${f(d.p50 - d.p16, 1)}) pc cm⁻³ ` +
      `[median, 16–84 %]; mean ${f(d.mean, 1)}; 95 % ${f(d.p2_5, 1)}–${f(d.p97_5, 1)}`,
  );
  out.push(
    `${t.n_candidates} candidates, ${t.n_intersected} intersected at central values; ${t.draws} draws, seed ${t.seed}; ` +
      `model ${String(res.model.shmr)} / ${String(res.model.mass_definition)} / ${String(res.model.concentration)} / ` +
      `${JSON.stringify(res.model.profile)}`,
  );
  out.push('');
  const header = [
    'id',
    'catalog',
    'kind',
    'z',
    'b [kpc]',
    'log M* [Msun]',
    'log Mh [Msun]',
    'b/r_halo',
    'p_fg',
    'DM_central [pc cm-3]',
    'DM p50 [pc cm-3]',
    'DM p16–p84 [pc cm-3]',
    'p_contrib',
  ];
  const rows = res.galaxies.map((g) => [
    g.id,
    g.catalog,
    g.z_kind,
    f(g.z, 4),
    f(g.b_kpc, 1),
    f(g.log_mstar, 2),
    f(g.log_mhalo, 2),
    f(g.b_over_rhalo, 2),
    f(g.p_fg, 3),
    f(g.dm_central, 1),
    f(g.dm.p50, 1),
    `${f(g.dm.p16, 1)}–${f(g.dm.p84, 1)}`,
    f(g.p_contributes, 2),
  ]);
  out.push(...(rows.length ? table(header, rows) : ['(no foreground candidates)']));
  if (res.environment.length) {
    out.push('', 'Burst environment (listed, not summed):');
    for (const e of res.environment) {
      out.push(
        `  ${e.id} (${e.catalog}) z ${f(e.z, 4)}  Δv ${f(e.dv_kms, 0)} km/s  b ${f(e.b_kpc, 1)} kpc${e.is_host ? '  [host]' : ''}`,
      );
    }
  }
  if (res.priorities.length) {
    out.push('', 'Spectroscopy priorities (expected drop of Var(total) if z were exact):');
    for (const p of res.priorities) {
      out.push(
        `  ${p.rank}. ${p.id} (${p.catalog}) z_phot ${f(p.z, 3)}  ΔVar ${f(p.var_reduction_pc2_cm6, 1)} (pc cm⁻³)²  (${f(100 * p.var_fraction, 1)} %)`,
      );
    }
  }
  out.push('', 'Cautions:');
  for (const w of res.warnings) out.push(`  - [${w.code}] ${w.message}`);
  return `${out.join('\n')}\n`;
}
