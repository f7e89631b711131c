// The host's rest-frame DM posterior as a histogram whose bins are the reply's own percentiles:
// 2.5–16 %, 16–50 %, 50–84 % and 84–97.5 % hold 13.5, 34, 34 and 13.5 % of the draws, so each bar's
// height is that share over the bin width (an exact density average, no draws needed).
import { fmt } from './format.js';
import { drawAxes, linearScale, niceTicks, svgEl } from './svg.js';

/** Bins [lo, hi, share, density] from a {p2_5, p16, p50, p84, p97_5} summary. */
export function quantileBins(h) {
  const edges = [
    [h.p2_5, h.p16, 0.135],
    [h.p16, h.p50, 0.34],
    [h.p50, h.p84, 0.34],
    [h.p84, h.p97_5, 0.135],
  ];
  return edges.map(([lo, hi, share]) => ({ lo, hi, share, density: hi > lo ? share / (hi - lo) : 0 }));
}

/** Draws the host posterior into container as <svg id="host-posterior">. */
export function drawHostPosterior(container, body) {
  const h = body.host_rest;
  if (!h) {
    container.replaceChildren(
      Object.assign(document.createElement('p'), {
        className: 'muted',
        textContent: 'No host posterior without a source redshift.',
      }),
    );
    return null;
  }
  const W = 360;
  const H = 210;
  const box = { left: 48, right: W - 12, top: 26, bottom: H - 46 };
  const bins = quantileBins(h);
  const lo = Math.min(0, h.p2_5);
  const hi = Math.max(0, h.p97_5);
  const pad = (hi - lo) * 0.05 || 1;
  const x = linearScale(lo - pad, hi + pad, box.left, box.right);
  const maxD = Math.max(...bins.map((b) => b.density)) * 1.1 || 1;
  const y = linearScale(0, maxD, box.bottom, box.top);
  const pNeg = body.p_negative_host;
  const svg = svgEl('svg', {
    viewBox: `0 0 ${W} ${H}`,
    id: 'host-posterior',
    role: 'img',
    'aria-label':
      `Host rest-frame DM posterior: median ${fmt(h.p50, 0)}, 16–84 % ${fmt(h.p16, 0)} to ${fmt(h.p84, 0)}, ` +
      `2.5–97.5 % ${fmt(h.p2_5, 0)} to ${fmt(h.p97_5, 0)} pc cm⁻³; P(DM_host < 0) = ${fmt(pNeg, 3)}`,
  });
  drawAxes(svg, {
    x,
    y,
    box,
    xTicks: niceTicks(lo - pad, hi + pad, 5),
    yTicks: [],
    xLabel: 'DM_host, rest frame [pc cm⁻³]',
    yLabel: 'density',
  });
  if (lo < 0) {
    svg.append(
      svgEl('rect', {
        class: 'negative-zone',
        x: box.left,
        y: box.top,
        width: Math.max(0, x(0) - box.left),
        height: box.bottom - box.top,
      }),
    );
  }
  for (const b of bins) {
    if (!(b.hi > b.lo)) continue;
    svg.append(
      svgEl('rect', {
        class: 'host-bin',
        x: x(b.lo),
        y: y(b.density),
        width: Math.max(0.5, x(b.hi) - x(b.lo)),
        height: box.bottom - y(b.density),
      }),
    );
  }
  svg.append(
    svgEl('line', { class: 'median', x1: x(h.p50), x2: x(h.p50), y1: box.top, y2: box.bottom }),
    svgEl('line', { class: 'zero', x1: x(0), x2: x(0), y1: box.top - 6, y2: box.bottom }),
    svgEl(
      'text',
      { x: box.right, y: 14, 'text-anchor': 'end', class: 'p-negative', 'data-p-negative': pNeg },
      `P(DM_host < 0) = ${fmt(pNeg, 3)}`,
    ),
  );
  container.replaceChildren(svg);
  return svg;
}
