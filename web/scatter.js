// Per-galaxy median DM (with its 16–84 % range) against b / r_halo.
import { rampColour } from './colour.js';
import { drawAxes, linearScale, niceTicks, svgEl } from './svg.js';

export function drawScatter(container, galaxies, { onHover, onLeave, onSelect }) {
  const W = 460;
  const H = 250;
  const box = { left: 52, right: W - 14, top: 14, bottom: H - 46 };
  const X_LIMIT = 3;
  const usable = galaxies.filter((g) => Number.isFinite(g.b_over_rhalo) && g.dm);
  const points = usable.filter((g) => g.b_over_rhalo <= X_LIMIT);
  const beyond = usable.length - points.length;
  const xMax = Math.min(X_LIMIT, Math.max(1, ...points.map((g) => g.b_over_rhalo)) * 1.05);
  const yMax = Math.max(1, ...points.map((g) => g.dm.p84 ?? g.dm.p50)) * 1.08;
  const x = linearScale(0, xMax, box.left, box.right);
  const y = linearScale(0, yMax, box.bottom, box.top);
  const svg = svgEl('svg', {
    viewBox: `0 0 ${W} ${H}`,
    id: 'dm-scatter',
    role: 'img',
    'aria-label': 'Per-galaxy DM against impact parameter in units of the halo radius',
  });
  drawAxes(svg, {
    x,
    y,
    box,
    xTicks: niceTicks(0, xMax, 6),
    yTicks: niceTicks(0, yMax, 4),
    xLabel: 'b / r_halo',
    yLabel: 'DM [pc cm⁻³]',
  });
  const maxDm = Math.max(1e-9, ...points.map((g) => g.dm.p50 ?? 0));
  const layer = svgEl('g');
  for (const g of points) {
    const px = x(g.b_over_rhalo);
    layer.append(
      svgEl('line', {
        x1: px,
        x2: px,
        y1: y(g.dm.p16 ?? g.dm.p50),
        y2: y(g.dm.p84 ?? g.dm.p50),
        stroke: '#9aa1ae',
      }),
    );
    const dot = svgEl('circle', {
      cx: px,
      cy: y(g.dm.p50),
      r: 4,
      class: 'point',
      fill: rampColour((g.dm.p50 ?? 0) / maxDm),
      'data-scatter-id': g.id,
    });
    dot.addEventListener('mouseenter', (ev) => onHover(g, ev));
    dot.addEventListener('mouseleave', onLeave);
    dot.addEventListener('click', () => onSelect(g));
    layer.append(dot);
  }
  if (xMax > 1) {
    svg.append(
      svgEl('line', {
        x1: x(1),
        x2: x(1),
        y1: box.top,
        y2: box.bottom,
        stroke: '#1f5f8b',
        'stroke-dasharray': '2 3',
      }),
      svgEl('text', { x: x(1) + 3, y: box.top + 26, 'font-size': 10 }, 'b = r_halo'),
    );
  }
  svg.append(layer);
  if (beyond > 0) {
    svg.append(
      svgEl(
        'text',
        { x: box.right, y: box.top + 6, 'text-anchor': 'end', 'font-size': 10, fill: '#5b6273' },
        `${beyond} more beyond b/r_halo = ${X_LIMIT} (not shown)`,
      ),
    );
  }
  container.replaceChildren(svg);
}
