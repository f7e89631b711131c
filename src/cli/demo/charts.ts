import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { BudgetResponse } from '../../budget-request/index.js';
import type { SightlineResponse } from '../../sightline/index.js';
import { ShimElement, shimDocument, standaloneSvg } from './svg-document.js';

// The chart modules are the web view's own plain-JS files; they are loaded at run time (not compiled),
// so the demo's SVG files are drawn by exactly the code the browser runs.
type DrawFn = (container: ShimElement, ...args: unknown[]) => void;

async function webModule(root: string, file: string): Promise<Record<string, DrawFn>> {
  return (await import(pathToFileURL(join(root, 'web', file)).href)) as Record<string, DrawFn>;
}

export interface ChartFiles {
  name: string;
  title: string;
  svg: string;
}

/** Draws the field chart, the draws histogram, DM vs b/r_halo, the budget waterfall and the host posterior. */
export async function drawDemoCharts(
  root: string,
  sightline: SightlineResponse & { draws_dm?: number[] },
  budget: BudgetResponse,
): Promise<ChartFiles[]> {
  const g = globalThis as unknown as { document?: unknown };
  const previous = g.document;
  g.document = shimDocument;
  try {
    const css = ['style.css', 'budget.css'].map((f) => readFileSync(join(root, 'web', f), 'utf8')).join('\n');
    const noop = { onHover() {}, onLeave() {}, onSelect() {} };
    const field = await webModule(root, 'field-chart.js');
    const histogram = await webModule(root, 'histogram.js');
    const scatter = await webModule(root, 'scatter.js');
    const waterfall = await webModule(root, 'budget-waterfall.js');
    const posterior = await webModule(root, 'host-posterior-chart.js');
    const jobs: [string, string, (c: ShimElement) => void][] = [
      ['field.svg', 'Field around the sightline', (c) => field.drawFieldChart(c, sightline, noop)],
      [
        'halo-dm-draws.svg',
        'Total foreground-halo DM over the Monte Carlo draws',
        (c) => histogram.drawHistogram(c, sightline.draws_dm ?? [], sightline.totals.dm_halos),
      ],
      ['dm-vs-impact.svg', 'DM versus b/r_halo', (c) => scatter.drawScatter(c, sightline.galaxies, noop)],
      ['budget.svg', 'DM budget', (c) => waterfall.drawBudgetWaterfall(c, budget)],
      ['host-posterior.svg', 'Host rest-frame DM posterior', (c) => posterior.drawHostPosterior(c, budget)],
    ];
    const out: ChartFiles[] = [];
    for (const [name, title, draw] of jobs) {
      const container = new ShimElement('div');
      draw(container);
      const svg = standaloneSvg(container, css, title);
      if (svg) out.push({ name, title, svg });
    }
    return out;
  } finally {
    g.document = previous;
  }
}
