/**
 * The data's distribution function against every candidate's fitted CDF, the selected one drawn
 * heavier. A complete sample: the empirical step at each distinct value. A censored sample: the
 * core's Kaplan–Meier step 1 − Ŝ(t) at the failure times (it stays below 100 % when the largest
 * time is a suspension), with each suspension marked as an open triangle on the step. The widest
 * vertical gap between the steps and a curve is what a Kolmogorov–Smirnov-type reading looks at;
 * the tails are where Anderson–Darling puts its weight.
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import type { CdfEvidence } from '../src/types.js';
import { axisLabel } from '../src/format.js';
import { createFrame, drawEmpty, drawGrid, drawXAxis, drawYAxis, fitYAxis, nextId } from './frame.js';
import { suspensionMark, type LegendItem } from './legend.js';
import { coarseNote, drawFittedCurves } from './marks.js';
import { round } from './text.js';
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
  const km = e.estimator === 'kaplan-meier';
  const curves = data.cdf.fitted.curves;
  const sel = curves.find((c) => c.family === data.selected);
  const title = km ? 'Does the Kaplan–Meier step track the fitted curves?' : 'Does the step of the data track the fitted curves?';
  const description =
    (km
      ? `Steps: Kaplan–Meier estimate of the share failed by each time, at ${e.total} distinct failure times${e.thinned ? ` (thinned to ${e.x.length} for drawing)` : ''}; it ends at ${Math.round((e.p[e.p.length - 1] ?? 0) * 1000) / 10} %. ${e.suspensions.total} suspensions marked as open triangles on the step. `
      : `Steps: share of the data at or below each value (${e.total} distinct values${e.thinned ? `, thinned to ${e.x.length} for drawing` : ''}). `) +
    `Curves: fitted cumulative distribution functions of ${curves.map((c) => c.label).join(', ')}${sel ? `; ${sel.label} is selected` : ''}.`;
  const items: LegendItem[] = [{ key: 'data', label: km ? 'Kaplan–Meier (failures)' : 'Observed (empirical)', kind: 'step' }];
  if (km && e.suspensions.total > 0) items.push({ key: 'suspension', label: `Suspensions (${e.suspensions.total})`, kind: 'suspension' });
  for (const c of curves) items.push({ key: c.family, label: c.family === data.selected ? `${c.label} (selected)` : c.label, kind: 'line', emphasis: c.family === data.selected });
  const coarse = coarseNote(data.cdf.fitted.x, data.xDomain);
  const frame = createFrame(container, options, title, description, { legend: items, notes: coarse ? [coarse] : [] });
  const y = scaleLinear().domain([0, 1]).range([frame.innerHeight, 0]);
  const yAxis = axisLeft(y).ticks(5, '.0%');
  fitYAxis(frame, yAxis);
  if (e.x.length === 0) {
    drawEmpty(frame, 'No data to draw.');
    return frame.svg.node()!;
  }
  const x = scaleLinear().domain([data.xDomain[0], data.xDomain[1]]).range([0, frame.innerWidth]);
  drawGrid(frame, [0.25, 0.5, 0.75, 1].map((t) => y(t)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight + 1);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`).attr('fill', 'none');

  const ordered = [...curves].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected));
  if (!coarse) drawFittedCurves(g, data.cdf.fitted.x, ordered, data.selected, x, y, 'fitted CDF');

  // Right-continuous steps: flat at the previous level up to x[j], then up to p[j].
  let d = `M${round(x(data.xDomain[0]))},${round(y(0))}`;
  e.x.forEach((xv, j) => {
    d += `H${round(x(xv))}V${round(y(e.p[j] ?? 0))}`;
  });
  d += `H${round(x(data.xDomain[1]))}`;
  g.append('path').attr('data-kind', 'ecdf').attr('d', d).attr('stroke', INK.data).attr('stroke-width', 1.6);
  if (e.suspensions.x.length > 0) {
    let m = '';
    e.suspensions.x.forEach((xv, j) => {
      m += suspensionMark(x(xv), y(e.suspensions.p[j] ?? 0));
    });
    const u = options.units ? ` ${options.units}` : '';
    g.append('path').attr('data-kind', 'suspension').attr('d', m).attr('fill', '#ffffff').attr('stroke', INK.suspension).attr('stroke-width', 1.3)
      .append('title').text(`${e.suspensions.total} suspensions: units still running at these times${u}, at the step's height`);
  }

  drawXAxis(frame, axisBottom(x).ticks(Math.max(3, Math.floor(frame.innerWidth / 80))), axisLabel(quantity, options.units));
  drawYAxis(frame, yAxis, km ? 'Share failed (Kaplan–Meier)' : 'Share at or below');
  return frame.svg.node()!;
}
