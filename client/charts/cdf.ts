/**
 * The empirical distribution function of the data (a step at each distinct value) against
 * every candidate's fitted CDF, the selected one drawn heavier. The widest vertical gap between
 * the steps and a curve is what a Kolmogorov–Smirnov-type reading looks at; the tails are where
 * Anderson–Darling puts its weight.
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import type { CdfEvidence } from '../src/types.js';
import { axisLabel } from '../src/format.js';
import { createFrame, drawFittedCurves, noteIfCoarse, drawEmpty, drawGrid, drawLegend, drawXAxis, drawYAxis, nextId, round, type LegendItem } from './frame.js';
import type { ChartOptions } from './options.js';
import { INK } from './palette.js';

export interface CdfChartData {
  readonly cdf: CdfEvidence;
  readonly xDomain: readonly [number, number];
  readonly selected: string;
}

export function cdfChart(container: Element, data: CdfChartData, options: ChartOptions): SVGSVGElement {
  const quantity = options.quantity ?? 'Value';
  const e = data.cdf.empirical;
  const curves = data.cdf.fitted.curves;
  const sel = curves.find((c) => c.family === data.selected);
  const title = 'Empirical CDF vs fitted CDFs';
  const description =
    `Steps: share of the data at or below each value (${e.total} distinct values${e.thinned ? `, thinned to ${e.x.length} for drawing` : ''}). ` +
    `Curves: fitted cumulative distribution functions of ${curves.map((c) => c.label).join(', ')}${sel ? `; ${sel.label} is selected` : ''}.`;
  const frame = createFrame(container, options, title, description);
  const items: LegendItem[] = [{ key: 'data', label: 'Observed (empirical)', kind: 'step' }];
  for (const c of curves) items.push({ key: c.family, label: c.family === data.selected ? `${c.label} (selected)` : c.label, kind: 'line', emphasis: c.family === data.selected });
  drawLegend(frame, items, options.width);
  if (e.x.length === 0) {
    drawEmpty(frame, 'No data to draw.');
    return frame.svg.node()!;
  }
  const x = scaleLinear().domain([data.xDomain[0], data.xDomain[1]]).range([0, frame.innerWidth]);
  const y = scaleLinear().domain([0, 1]).range([frame.innerHeight, 0]);
  drawGrid(frame, [0.25, 0.5, 0.75, 1].map((t) => y(t)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight + 1);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`).attr('fill', 'none');

  const ordered = [...curves].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected));
  const coarse = noteIfCoarse(frame, data.cdf.fitted.x, data.xDomain);
  if (!coarse) drawFittedCurves(g, data.cdf.fitted.x, ordered, data.selected, x, y, 'fitted CDF');

  // Right-continuous steps: flat at the previous level up to x[j], then up to p[j].
  let d = `M${round(x(data.xDomain[0]))},${round(y(0))}`;
  e.x.forEach((xv, j) => {
    d += `H${round(x(xv))}V${round(y(e.p[j] ?? 0))}`;
  });
  d += `H${round(x(data.xDomain[1]))}`;
  g.append('path').attr('data-kind', 'ecdf').attr('d', d).attr('stroke', INK.data).attr('stroke-width', 1.6);

  drawXAxis(frame, axisBottom(x).ticks(Math.max(3, Math.floor(frame.innerWidth / 80))), axisLabel(quantity, options.units));
  drawYAxis(frame, axisLeft(y).ticks(5, '.0%'), 'Share at or below');
  return frame.svg.node()!;
}
