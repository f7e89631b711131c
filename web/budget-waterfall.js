// Horizontal waterfall of the DM budget: each term's median starts where the previous one ended, with
// a 16–84 % whisker at its end; the observed DM closes the chart. Every number comes from the reply.
import { fmt } from './format.js';
import { drawAxes, linearScale, niceTicks, svgEl } from './svg.js';

/** Categorical colours for the terms (our own palette; each ≥ 3:1 against white, dark outlines). */
export const TERM_COLOURS = {
  mw_ism: '#3b5b92',
  mw_halo: '#2a7f7a',
  cosmic: '#a86a12',
  halos: '#b4472c',
  host: '#6b3a78',
};

/**
 * The rows of the waterfall, observer frame. The host row is host_rest / (1 + z_s): its quantiles
 * scale by the same positive factor, so this is a change of frame, not a new estimate.
 */
export function budgetRows(body) {
  const c = body.components;
  const rows = [
    { key: 'mw_ism', label: 'Milky Way ISM (your model)', s: c.mw_ism },
    { key: 'mw_halo', label: 'Milky Way halo', s: c.mw_halo },
    { key: 'cosmic', label: 'Cosmic (IGM)', s: c.cosmic },
    { key: 'halos', label: 'Foreground haloes', s: c.halos },
  ].filter((r) => r.s);
  if (body.host_rest && body.z_source) {
    const f = 1 / (1 + body.z_source);
    const h = body.host_rest;
    rows.push({
      key: 'host',
      label: 'Host (observer frame)',
      s: { p16: h.p16 * f, p50: h.p50 * f, p84: h.p84 * f },
    });
  }
  let start = 0;
  for (const r of rows) {
    r.start = start;
    r.end = start + r.s.p50;
    start = r.end;
  }
  return rows;
}

/** Draws the waterfall into container as <svg id="budget-bar">. */
export function drawBudgetWaterfall(container, body) {
  const rows = budgetRows(body);
  const W = 620;
  const rowH = 30;
  const labelW = 190;
  const box = { left: labelW, right: W - 20, top: 12, bottom: 12 + rowH * (rows.length + 1) };
  const H = box.bottom + 46;
  const obs = body.dm_obs.value;
  const ends = rows.flatMap((r) => [r.start, r.end, r.start + r.s.p16, r.start + r.s.p84]);
  const lo = Math.min(0, ...ends);
  const hi = Math.max(obs, ...ends) * 1.04;
  const x = linearScale(lo, hi, box.left, box.right);
  const y = (i) => box.top + i * rowH + 4;

  const svg = svgEl('svg', {
    viewBox: `0 0 ${W} ${H}`,
    id: 'budget-bar',
    role: 'group',
    'aria-label': `DM budget waterfall: medians of each term with 16–84 % whiskers; observed DM ${fmt(obs, 1)} pc cm⁻³`,
  });
  drawAxes(svg, {
    x,
    y: linearScale(0, 1, box.bottom, box.top),
    box,
    xTicks: niceTicks(lo, hi, 6),
    yTicks: [],
    xLabel: 'cumulative DM [pc cm⁻³], observer frame',
    yLabel: '',
  });
  rows.forEach((r, i) => {
    const left = x(Math.min(r.start, r.end));
    const width = Math.max(1, Math.abs(x(r.end) - x(r.start)));
    const text = `${r.label}: median ${fmt(r.s.p50, 1)}, 16–84 % ${fmt(r.s.p16, 1)} to ${fmt(r.s.p84, 1)} pc cm⁻³`;
    const g = svgEl('g', { class: 'budget-row', tabindex: 0, role: 'img', 'aria-label': text });
    g.append(
      svgEl('title', {}, text),
      svgEl(
        'text',
        { x: labelW - 8, y: y(i) + rowH / 2, 'text-anchor': 'end', class: 'budget-label' },
        r.label,
      ),
      svgEl('rect', {
        class: `budget-segment${r.s.p50 < 0 ? ' negative' : ''}`,
        'data-component': r.key,
        x: left,
        y: y(i),
        width,
        height: rowH - 10,
        fill: TERM_COLOURS[r.key],
      }),
    );
    const wy = y(i) + (rowH - 10) / 2;
    const w0 = x(r.start + r.s.p16);
    const w1 = x(r.start + r.s.p84);
    g.append(
      svgEl('line', { class: 'whisker', x1: w0, x2: w1, y1: wy, y2: wy }),
      svgEl('line', { class: 'whisker', x1: w0, x2: w0, y1: wy - 6, y2: wy + 6 }),
      svgEl('line', { class: 'whisker', x1: w1, x2: w1, y1: wy - 6, y2: wy + 6 }),
    );
    if (i + 1 < rows.length) {
      g.append(
        svgEl('line', { class: 'connector', x1: x(r.end), x2: x(r.end), y1: y(i) + rowH - 10, y2: y(i + 1) }),
      );
    }
    svg.append(g);
  });
  const iObs = rows.length;
  const obsText = `Observed DM: ${fmt(obs, 1)} ± ${fmt(body.dm_obs.err, 1)} pc cm⁻³`;
  svg.append(
    svgEl('g', { class: 'budget-row', tabindex: 0, role: 'img', 'aria-label': obsText }, [
      svgEl('title', {}, obsText),
      svgEl(
        'text',
        { x: labelW - 8, y: y(iObs) + rowH / 2, 'text-anchor': 'end', class: 'budget-label strong' },
        'Observed DM',
      ),
      svgEl('rect', {
        class: 'budget-total',
        'data-component': 'dm_obs',
        x: x(0),
        y: y(iObs),
        width: Math.max(1, x(obs) - x(0)),
        height: rowH - 10,
      }),
    ]),
  );
  container.replaceChildren(svg);
  return svg;
}
