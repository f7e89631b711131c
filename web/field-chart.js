// Field chart: galaxies around the sightline in the gnomonic (tangent-plane) projection, in arcmin,
// north up and east left. Each halo is drawn at its projected radius, filled by its median DM.
import { rampColour } from './colour.js';
import { drawAxes, linearScale, niceTicks, svgEl } from './svg.js';

const DEG = Math.PI / 180;
const ARCMIN_PER_RAD = (180 * 60) / Math.PI;

/**
 * Gnomonic projection of (ra, dec) about the tangent point (ra0, dec0), all in degrees.
 * Returns standard coordinates ξ (east) and η (north) in arcmin, or null behind the tangent plane.
 */
export function gnomonic(raDeg, decDeg, ra0Deg, dec0Deg) {
  const a = raDeg * DEG;
  const d = decDeg * DEG;
  const a0 = ra0Deg * DEG;
  const d0 = dec0Deg * DEG;
  const cosC = Math.sin(d0) * Math.sin(d) + Math.cos(d0) * Math.cos(d) * Math.cos(a - a0);
  if (cosC <= 0) return null;
  const xi = (Math.cos(d) * Math.sin(a - a0)) / cosC;
  const eta = (Math.cos(d0) * Math.sin(d) - Math.sin(d0) * Math.cos(d) * Math.cos(a - a0)) / cosC;
  return { xi: xi * ARCMIN_PER_RAD, eta: eta * ARCMIN_PER_RAD };
}

/** Projected halo radius in arcmin: r_halo scaled by the galaxy's own arcsec-per-kpc (sep / b). */
export function haloRadiusArcmin(g) {
  if (g.kpc_per_arcsec > 0) return g.r_halo_kpc / g.kpc_per_arcsec / 60;
  if (g.b_kpc > 0 && g.sep_arcsec > 0 && g.r_halo_kpc > 0)
    return (g.r_halo_kpc * g.sep_arcsec) / g.b_kpc / 60;
  return 0;
}

const dmOf = (g) => g.dm?.p50 ?? g.dm?.mean ?? 0;

export function drawFieldChart(container, result, { onHover, onLeave, onSelect }) {
  const { ra, dec } = result.sightline;
  const W = 560;
  const side = W - 58 - 92;
  const H = 14 + side + 50;
  const box = { left: 58, right: 58 + side, top: 14, bottom: 14 + side };
  const galaxies = result.galaxies.map((g) => ({
    g,
    p: gnomonic(g.ra, g.dec, ra, dec),
    r: haloRadiusArcmin(g),
  }));
  const env = (result.environment ?? [])
    .filter((e) => Number.isFinite(e.ra) && Number.isFinite(e.dec))
    .map((e) => ({ e, p: gnomonic(e.ra, e.dec, ra, dec) }));
  let reach = 1;
  for (const { p, r } of galaxies) if (p) reach = Math.max(reach, Math.hypot(p.xi, p.eta) + r);
  for (const { p } of env) if (p) reach = Math.max(reach, Math.hypot(p.xi, p.eta) * 1.05);
  reach *= 1.05;
  // East is to the left: x decreases with ξ.
  const x = linearScale(reach, -reach, box.left, box.right);
  const y = linearScale(-reach, reach, box.bottom, box.top);
  const pxPerArcmin = side / (2 * reach);

  const svg = svgEl('svg', {
    viewBox: `0 0 ${W} ${H}`,
    role: 'img',
    'aria-label': `Field chart with ${galaxies.length} candidate haloes around the sightline`,
    id: 'field-svg',
  });
  const ticks = niceTicks(-reach, reach, 6);
  drawAxes(svg, {
    x,
    y,
    box,
    xTicks: ticks,
    yTicks: ticks,
    xLabel: '← east   offset ξ [arcmin]',
    yLabel: 'offset η [arcmin]   north →',
    format: (v) => String(v),
  });

  const maxDm = Math.max(1e-9, ...galaxies.map(({ g }) => dmOf(g)));
  const clip = svgEl('clipPath', { id: 'field-clip' }, [
    svgEl('rect', { x: box.left, y: box.top, width: side, height: side }),
  ]);
  svg.append(svgEl('defs', {}, [clip]));
  const layer = svgEl('g', { 'clip-path': 'url(#field-clip)' });
  // Haloes that add nothing are drawn first and faint; contributing ones on top, largest first.
  const contributes = ({ g }) => (g.p_contributes ?? 0) > 0;
  const order = galaxies
    .filter(({ p }) => p)
    .sort((a, b) => Number(contributes(a)) - Number(contributes(b)) || b.r - a.r);
  for (const { g, p, r } of order) {
    const circle = svgEl('circle', {
      cx: x(p.xi).toFixed(2),
      cy: y(p.eta).toFixed(2),
      r: Math.max(2.5, r * pxPerArcmin).toFixed(2),
      class: `halo ${g.z_kind === 'photo' ? 'photo' : 'spec'}${(g.p_contributes ?? 0) > 0 ? '' : ' outside'}`,
      fill: rampColour(dmOf(g) / maxDm),
      'fill-opacity': 0.6,
      'data-galaxy-id': g.id,
      tabindex: 0,
      role: 'button',
      'aria-label': `${g.id}, z = ${g.z}, median DM ${dmOf(g).toFixed(1)} pc cm⁻³`,
    });
    circle.addEventListener('mouseenter', (ev) => onHover(g, ev));
    circle.addEventListener('mousemove', (ev) => onHover(g, ev));
    circle.addEventListener('mouseleave', onLeave);
    circle.addEventListener('focus', (ev) => onHover(g, ev));
    circle.addEventListener('blur', onLeave);
    circle.addEventListener('click', () => onSelect(g));
    circle.addEventListener('keydown', (ev) => {
      if (ev.key === 'Enter' || ev.key === ' ') {
        ev.preventDefault();
        onSelect(g);
      }
    });
    layer.append(circle);
  }
  for (const { e, p } of env) {
    if (!p) continue;
    const cx = x(p.xi);
    const cy = y(p.eta);
    const mark = svgEl('path', {
      d: `M${cx},${cy - 6}L${cx + 6},${cy}L${cx},${cy + 6}L${cx - 6},${cy}Z`,
      class: 'environment',
      'data-environment-id': e.id,
      tabindex: 0,
      'aria-label': `environment galaxy ${e.id}`,
    });
    mark.addEventListener('mouseenter', (ev) => onHover({ ...e, environment: true }, ev));
    mark.addEventListener('mouseleave', onLeave);
    layer.append(mark);
  }
  const cx = x(0);
  const cy = y(0);
  const cross = (className) =>
    svgEl('g', { class: className }, [
      svgEl('line', { x1: cx - 11, x2: cx - 3, y1: cy, y2: cy }),
      svgEl('line', { x1: cx + 3, x2: cx + 11, y1: cy, y2: cy }),
      svgEl('line', { x1: cx, x2: cx, y1: cy - 11, y2: cy - 3 }),
      svgEl('line', { x1: cx, x2: cx, y1: cy + 3, y2: cy + 11 }),
    ]);
  const marker = svgEl('g', { 'aria-label': 'burst sightline', id: 'sightline-mark' }, [
    cross('sightline-under'),
    cross('sightline'),
  ]);
  layer.append(marker);
  svg.append(layer);
  drawColourBar(svg, { left: box.right + 22, top: box.top + 10, height: side - 20, maxDm });
  container.replaceChildren(svg);
}

function drawColourBar(svg, { left, top, height, maxDm }) {
  const steps = 40;
  const g = svgEl('g', { class: 'colour-bar', 'aria-label': 'colour scale: median DM' });
  for (let i = 0; i < steps; i++) {
    const t0 = i / steps;
    g.append(
      svgEl('rect', {
        x: left,
        y: top + height * (1 - (i + 1) / steps),
        width: 14,
        height: height / steps + 0.5,
        fill: rampColour(t0 + 0.5 / steps),
      }),
    );
  }
  g.append(svgEl('rect', { x: left, y: top, width: 14, height, fill: 'none', stroke: '#6b7280' }));
  const scale = linearScale(0, maxDm, top + height, top);
  for (const t of niceTicks(0, maxDm, 5)) {
    g.append(svgEl('text', { x: left + 18, y: scale(t) + 4, 'font-size': 10 }, String(t)));
  }
  g.append(svgEl('text', { x: left + 7, y: top - 4, 'text-anchor': 'middle', 'font-size': 10 }, 'DM₅₀'));
  g.append(
    svgEl('text', { x: left + 7, y: top + height + 14, 'text-anchor': 'middle', 'font-size': 9 }, 'pc cm⁻³'),
  );
  svg.append(g);
}
