/**
 * Threshold choice for peaks over a threshold, second view: the maximum-likelihood shape ξ of the
 * generalized Pareto fit at each candidate threshold. Where the model holds, ξ stays about
 * constant as the threshold rises (Coles 2001 §4.3.1 [from memory]); thresholds with fewer than
 * 10 events are left out by the core. Data from the core's thresholdDiagnostics.
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, pathThrough } from './frame.js';
import type { ChartOptions } from './options.js';
import { sig } from '../src/format.js';
import { INK } from './palette.js';
import { round } from './text.js';
import type { ThresholdChartData } from './threshold-mean-excess.js';

export function thresholdStabilityChart(container: Element, data: ThresholdChartData, options: ChartOptions): SVGSVGElement {
  const pts = data.diagnostics.filter((d): d is typeof d & { shape: number } => d.shape !== null);
  const frame = createFrame(
    container,
    options,
    'Does the fitted shape stay steady as the threshold rises?',
    `Maximum-likelihood generalized Pareto shape at each candidate threshold with at least 10 events (${pts.length} thresholds); the chosen threshold ${sig(data.chosen)} is marked.`,
    { legend: [{ key: 'data', label: 'fitted shape ξ', kind: 'point' }, { key: 'ref', label: 'chosen threshold', kind: 'reference' }] },
  );
  const xs = [...data.diagnostics.map((d) => d.threshold), data.chosen];
  const x = scaleLinear().domain([Math.min(...xs), Math.max(...xs)]).nice();
  const shapes = pts.map((d) => d.shape);
  const y = scaleLinear().domain([Math.min(-0.2, ...shapes), Math.max(0.2, ...shapes)]).range([frame.innerHeight, 0]).nice();
  const yAxis = axisLeft(y).ticks(5);
  fitYAxis(frame, yAxis);
  x.range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(5).map((t) => y(t)));
  frame.plot.append('line').attr('data-kind', 'zero').attr('x1', 0).attr('x2', frame.innerWidth).attr('y1', round(y(0))).attr('y2', round(y(0))).attr('stroke', INK.muted).attr('stroke-width', 0.8);
  frame.plot.append('path').attr('data-kind', 'curve').attr('d', pathThrough(pts.map((d) => [x(d.threshold), y(d.shape)] as const))).attr('fill', 'none').attr('stroke', INK.data).attr('stroke-width', 1);
  for (const d of pts) {
    frame.plot.append('circle').attr('data-kind', 'point').attr('cx', round(x(d.threshold))).attr('cy', round(y(d.shape))).attr('r', 3.5).attr('fill', INK.data)
      .append('title').text(`threshold ${d.threshold.toPrecision(4)}: shape ${d.shape.toPrecision(3)} from ${d.clusters} events`);
  }
  const cx = round(x(data.chosen));
  frame.plot.append('line').attr('data-kind', 'chosen').attr('x1', cx).attr('x2', cx).attr('y1', 0).attr('y2', frame.innerHeight).attr('stroke', INK.reference).attr('stroke-dasharray', '4 3');
  drawXAxis(frame, axisBottom(x).ticks(6), `Threshold${options.units ? ` [${options.units}]` : ''}`);
  drawYAxis(frame, yAxis, 'Shape ξ');
  return frame.svg.node()!;
}
