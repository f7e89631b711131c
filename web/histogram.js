// Histogram of the total foreground-halo DM over the Monte Carlo draws, with the median and the
// 16th/84th percentiles marked.
import { drawAxes, linearScale, niceTicks, svgEl } from './svg.js';

/** Percentile of a sorted array by linear interpolation between order statistics. */
export function percentileSorted(sorted, q) {
  if (sorted.length === 0) return Number.NaN;
  const pos = (sorted.length - 1) * q;
  const lo = Math.floor(pos);
  const hi = Math.min(sorted.length - 1, lo + 1);
  return sorted[lo] + (pos - lo) * (sorted[hi] - sorted[lo]);
}

export function drawHistogram(container, draws, summary) {
  const W = 460;
  const H = 250;
  const box = { left: 52, right: W - 14, top: 14, bottom: H - 46 };
  if (!Array.isArray(draws) || draws.length === 0) {
    container.replaceChildren(
      Object.assign(document.createElement('p'), { className: 'muted', textContent: 'No draws returned.' }),
    );
    return;
  }
  const sorted = [...draws].sort((a, b) => a - b);
  const lo = sorted[0];
  const hi = sorted[sorted.length - 1];
  const nBins = Math.min(60, Math.max(10, Math.round(Math.sqrt(sorted.length))));
  const width = hi > lo ? (hi - lo) / nBins : 1;
  const counts = new Array(nBins).fill(0);
  for (const v of sorted) counts[Math.min(nBins - 1, Math.floor((v - lo) / width))]++;
  const x0 = hi > lo ? lo : lo - 0.5;
  const x1 = hi > lo ? hi : lo + 0.5;
  const x = linearScale(x0, x1, box.left, box.right);
  const maxCount = Math.max(...counts);
  const y = linearScale(0, maxCount * 1.08, box.bottom, box.top);

  const svg = svgEl('svg', {
    viewBox: `0 0 ${W} ${H}`,
    id: 'dm-histogram',
    role: 'img',
    'aria-label': `Histogram of ${sorted.length} Monte Carlo draws of the total foreground-halo DM`,
  });
  drawAxes(svg, {
    x,
    y,
    box,
    xTicks: niceTicks(x0, x1, 6),
    yTicks: niceTicks(0, maxCount * 1.08, 4),
    xLabel: 'DM from foreground haloes [pc cm⁻³] (observer frame)',
    yLabel: 'draws',
  });
  const bars = svgEl('g', { class: 'bars' });
  counts.forEach((count, i) => {
    if (count === 0) return;
    const left = hi > lo ? x(lo + i * width) : box.left;
    const right = hi > lo ? x(lo + (i + 1) * width) : box.right;
    bars.append(
      svgEl('rect', {
        class: 'bar',
        x: left + 0.5,
        y: y(count),
        width: Math.max(0.5, right - left - 1),
        height: box.bottom - y(count),
      }),
    );
  });
  svg.append(bars);
  const p16 = summary?.p16 ?? percentileSorted(sorted, 0.16);
  const p50 = summary?.p50 ?? percentileSorted(sorted, 0.5);
  const p84 = summary?.p84 ?? percentileSorted(sorted, 0.84);
  const marks = [
    [p16, 'band', '16%'],
    [p50, 'median', 'median'],
    [p84, 'band', '84%'],
  ];
  marks.forEach(([value, kind, label], row) => {
    const px = x(value);
    // Labels on staggered rows so close percentiles never overlap; left of the line near the right edge.
    const right = px < box.right - 90;
    svg.append(
      svgEl('line', {
        class: `marker ${kind}`,
        x1: px,
        x2: px,
        y1: box.top,
        y2: box.bottom,
        'data-marker': label,
      }),
      svgEl(
        'text',
        {
          x: right ? px + 4 : px - 4,
          y: box.top + 10 + 13 * row,
          'font-size': 10,
          'text-anchor': right ? 'start' : 'end',
          'paint-order': 'stroke',
          stroke: '#ffffff',
          'stroke-width': 3,
        },
        `${label} ${value.toFixed(1)}`,
      ),
    );
  });
  container.replaceChildren(svg);
}
