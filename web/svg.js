// Small helpers for hand-drawn SVG charts: element creation, linear scales and round tick values.
const SVG_NS = 'http://www.w3.org/2000/svg';

/** Creates an SVG element with attributes and optional children or text. */
export function svgEl(name, attrs = {}, children = []) {
  const node = document.createElementNS(SVG_NS, name);
  for (const [key, value] of Object.entries(attrs)) {
    if (value !== undefined && value !== null) node.setAttribute(key, String(value));
  }
  for (const child of [].concat(children)) {
    node.append(typeof child === 'string' ? document.createTextNode(child) : child);
  }
  return node;
}

/** Maps [d0, d1] linearly onto [r0, r1]. */
export function linearScale(d0, d1, r0, r1) {
  const span = d1 - d0 || 1;
  const scale = (v) => r0 + ((v - d0) / span) * (r1 - r0);
  scale.domain = [d0, d1];
  return scale;
}

/** About `count` round tick values covering [lo, hi] (steps of 1, 2 or 5 × 10ⁿ). */
export function niceTicks(lo, hi, count = 5) {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step)
    ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

/** Draws a horizontal and a vertical axis with ticks, labels and light grid lines. */
export function drawAxes(svg, { x, y, box, xTicks, yTicks, xLabel, yLabel, format = (v) => String(v) }) {
  const grid = svgEl('g', { class: 'grid' });
  const axis = svgEl('g', { class: 'axis' });
  for (const t of xTicks) {
    grid.append(svgEl('line', { x1: x(t), x2: x(t), y1: box.top, y2: box.bottom }));
    axis.append(svgEl('line', { x1: x(t), x2: x(t), y1: box.bottom, y2: box.bottom + 5 }));
    axis.append(
      svgEl('text', { x: x(t), y: box.bottom + 18, 'text-anchor': 'middle', 'font-size': 11 }, format(t)),
    );
  }
  for (const t of yTicks) {
    grid.append(svgEl('line', { x1: box.left, x2: box.right, y1: y(t), y2: y(t) }));
    axis.append(svgEl('line', { x1: box.left - 5, x2: box.left, y1: y(t), y2: y(t) }));
    axis.append(
      svgEl('text', { x: box.left - 8, y: y(t) + 4, 'text-anchor': 'end', 'font-size': 11 }, format(t)),
    );
  }
  axis.append(svgEl('path', { d: `M${box.left},${box.top}V${box.bottom}H${box.right}`, fill: 'none' }));
  axis.append(
    svgEl(
      'text',
      { x: (box.left + box.right) / 2, y: box.bottom + 36, 'text-anchor': 'middle', 'font-size': 12 },
      xLabel,
    ),
  );
  const cy = (box.top + box.bottom) / 2;
  axis.append(
    svgEl(
      'text',
      { x: 14, y: cy, 'text-anchor': 'middle', 'font-size': 12, transform: `rotate(-90 14 ${cy})` },
      yLabel,
    ),
  );
  svg.append(grid, axis);
}
