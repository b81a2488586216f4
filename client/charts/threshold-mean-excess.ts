/**
 * Threshold choice for peaks over a threshold, first view: the mean excess of the event peaks
 * above each candidate threshold. Above a threshold where the generalized Pareto model holds the
 * points lie near a straight line (slope ξ/(1 − ξ); Coles 2001 §4.3.1 [from memory]). The chosen
 * threshold is marked. Data from the core's thresholdDiagnostics.
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import type { ThresholdDiagnostic } from '../../core/index.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, pathThrough } from './frame.js';
import type { ChartOptions } from './options.js';
import { sig } from '../src/format.js';
import { INK } from './palette.js';
import { round } from './text.js';

export interface ThresholdChartData {
  readonly diagnostics: readonly ThresholdDiagnostic[];
  readonly chosen: number;
}

export function thresholdMeanExcessChart(container: Element, data: ThresholdChartData, options: ChartOptions): SVGSVGElement {
  const pts = data.diagnostics.filter((d) => Number.isFinite(d.meanExcess));
  const frame = createFrame(
    container,
    options,
    'Is the mean excess close to a straight line above the threshold?',
    `Mean excess of the event peaks above each candidate threshold (${pts.length} thresholds); the chosen threshold ${sig(data.chosen)} is marked. Points with few events scatter.`,
    { legend: [{ key: 'data', label: 'mean excess (number of events in the tooltip)', kind: 'point' }, { key: 'ref', label: 'chosen threshold', kind: 'reference' }] },
  );
  const xs = [...pts.map((d) => d.threshold), data.chosen];
  const x = scaleLinear().domain([Math.min(...xs), Math.max(...xs)]).nice();
  const y = scaleLinear().domain([0, Math.max(...pts.map((d) => d.meanExcess)) * 1.1]).range([frame.innerHeight, 0]).nice();
  const yAxis = axisLeft(y).ticks(5);
  fitYAxis(frame, yAxis);
  x.range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(5).map((t) => y(t)));
  frame.plot.append('path').attr('data-kind', 'curve').attr('d', pathThrough(pts.map((d) => [x(d.threshold), y(d.meanExcess)] as const))).attr('fill', 'none').attr('stroke', INK.data).attr('stroke-width', 1);
  for (const d of pts) {
    frame.plot.append('circle').attr('data-kind', 'point').attr('cx', round(x(d.threshold))).attr('cy', round(y(d.meanExcess))).attr('r', 3.5).attr('fill', INK.data)
      .append('title').text(`threshold ${d.threshold.toPrecision(4)}: mean excess ${d.meanExcess.toPrecision(4)} from ${d.clusters} events`);
  }
  const cx = round(x(data.chosen));
  frame.plot.append('line').attr('data-kind', 'chosen').attr('x1', cx).attr('x2', cx).attr('y1', 0).attr('y2', frame.innerHeight).attr('stroke', INK.reference).attr('stroke-dasharray', '4 3');
  drawXAxis(frame, axisBottom(x).ticks(6), `Threshold${options.units ? ` [${options.units}]` : ''}`);
  drawYAxis(frame, yAxis, `Mean excess${options.units ? ` [${options.units}]` : ''}`);
  return frame.svg.node()!;
}
