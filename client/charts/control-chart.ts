/**
 * Stability chart: the characteristic in time (or subgroup) order with its centre line and 3-sigma
 * limits, in the upper panel; the moving ranges or subgroup standard deviations with theirs, in the
 * lower panel (one frame, two panels sharing the x positions). Points beyond a limit are drawn hollow
 * and larger and carry a title saying which limit they cross. Everything comes from the core's
 * StabilityChart (core/capability control-chart.ts); nothing is computed here but positions.
 */
import { scaleLinear } from 'd3';
import type { ChartPanel, StabilityChart } from '../../core/index.js';
import { sig } from '../src/format.js';
import { axisBottom, axisLeft, createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, pathThrough, type Frame, type Group } from './frame.js';
import type { ChartOptions } from './options.js';
import { INK } from './palette.js';
import { round, textWidth } from './text.js';

const GAP = 34;

function yScale(p: ChartPanel, top: number, bottom: number) {
  const values = p.points.flatMap((q) => [q.value, q.lower, q.upper]).filter(Number.isFinite);
  return scaleLinear().domain([Math.min(...values), Math.max(...values)]).nice().range([bottom, top]);
}

function drawPanel(frame: Frame, g: Group, p: ChartPanel, y: ReturnType<typeof yScale>, x: (i: number) => number): void {
  for (const side of ['lower', 'upper'] as const) {
    g.append('path').attr('data-kind', `limit-${side}`).attr('d', pathThrough(p.points.map((q, i) => [x(i), y(q[side])] as const)))
      .attr('fill', 'none').attr('stroke', INK.reference).attr('stroke-dasharray', '6 3').attr('stroke-width', 1.2);
  }
  g.append('line').attr('data-kind', 'centre').attr('x1', 0).attr('x2', round(frame.innerWidth)).attr('y1', round(y(p.center))).attr('y2', round(y(p.center))).attr('stroke', INK.muted).attr('stroke-width', 1);
  g.append('path').attr('data-kind', 'series').attr('d', pathThrough(p.points.map((q, i) => [x(i), y(q.value)] as const))).attr('fill', 'none').attr('stroke', INK.data).attr('stroke-width', 1);
  p.points.forEach((q, i) => {
    const out = q.beyond !== null;
    g.append('circle').attr('data-kind', out ? 'beyond' : 'point').attr('cx', round(x(i))).attr('cy', round(y(q.value))).attr('r', out ? 4.5 : 2.2)
      .attr('fill', out ? 'none' : INK.data).attr('stroke', out ? INK.reference : INK.data).attr('stroke-width', out ? 2 : 1)
      .append('title').text(`${q.label}: ${sig(q.value)}${out ? ` — ${q.beyond} the ${q.beyond === 'above' ? 'upper' : 'lower'} limit ${sig(q.beyond === 'above' ? q.upper : q.lower)}` : ''}`);
  });
}

export function controlChart(container: Element, chart: StabilityChart, options: ChartOptions): SVGSVGElement {
  const scale = chart.scale && chart.scale !== 'original' ? `, ${chart.scale} scale` : '';
  const individuals = chart.kind === 'individuals and moving range';
  const what = individuals ? 'Individual values and moving ranges' : chart.kind === 'subgroup means and ranges' ? 'Subgroup means and ranges' : 'Subgroup means and standard deviations';
  const title = `Is the process stable? ${what}${scale}`;
  const description = `Upper panel: each ${chart.location.statistic} in order with its centre line and dashed 3-sigma limits; lower panel: each ${chart.dispersion.statistic} with its limits. Hollow points lie beyond a limit. ${chart.statement}`;
  const frame = createFrame(container, options, title, description, { notes: [`Limits: ${chart.source}. Sigma ${sig(chart.sigma)} from ${chart.sigmaMethod}.`] });
  const half = (frame.innerHeight - GAP) / 2;
  const yTop = yScale(chart.location, 0, half);
  const yBottom = yScale(chart.dispersion, half + GAP, frame.innerHeight);
  // Ticks at least 18 px apart in each panel (a short panel gets fewer), so labels never touch.
  const topTicks = spacedTicks(yTop, 4, 18);
  const bottomTicks = spacedTicks(yBottom, 3, 18);
  const axTop = axisLeft(yTop).tickValues(topTicks).tickFormat(yTop.tickFormat(4));
  const axBottom = axisLeft(yBottom).tickValues(bottomTicks).tickFormat(yBottom.tickFormat(3));
  // the left margin fits the wider of the two panels' tick labels
  const wider = Math.max(...topTicks.map((t) => textWidth(yTop.tickFormat(4)(t), 11))) >= Math.max(...bottomTicks.map((t) => textWidth(yBottom.tickFormat(3)(t), 11))) ? axTop : axBottom;
  fitYAxis(frame, wider);
  const n = chart.location.points.length;
  const x = scaleLinear().domain([0, Math.max(1, n - 1)]).range([0, frame.innerWidth]);
  const xi = (i: number): number => x(i);
  drawGrid(frame, [...topTicks.map((t) => yTop(t)), ...bottomTicks.map((t) => yBottom(t))]);
  const u = options.units && !scale ? ` (${options.units})` : '';
  drawYAxis(frame, axTop, `${chart.location.statistic}${u}`);
  const lower = frame.plot.append('g').attr('data-kind', 'y-axis').attr('aria-hidden', 'true').attr('font-size', 11);
  lower.call(axBottom);
  frame.plot.append('text').attr('data-kind', 'panel-title').attr('x', 0).attr('y', round(half + GAP - 8)).attr('font-size', 12).text(`↑ ${chart.dispersion.statistic}`);
  const labels = chart.location.points.map((p) => String(p.label));
  const step = Math.max(1, Math.ceil(n / 10));
  const xAxis = axisBottom(x).tickValues(Array.from({ length: Math.ceil(n / step) }, (_, k) => k * step)).tickFormat((i) => labels[Math.round(Number(i))] ?? '');
  drawXAxis(frame, xAxis, individuals ? (chart.orderFrom === 'order column' ? 'Order (order column)' : 'Row') : 'Subgroup');
  // the dispersion panel of individuals charts starts at the second value
  const offset = chart.dispersion.points.length < n ? 1 : 0;
  drawPanel(frame, frame.plot.append('g').attr('data-panel', 'location') as Group, chart.location, yTop, xi);
  drawPanel(frame, frame.plot.append('g').attr('data-panel', 'dispersion') as Group, chart.dispersion, yBottom, (i) => xi(i + offset));
  return frame.svg.node() as SVGSVGElement;
}

/** The scale's ticks (about `count`), every k-th kept so that neighbours are at least `minPx` apart. */
function spacedTicks(y: { ticks(count: number): number[]; (v: number): number }, count: number, minPx: number): number[] {
  const all = y.ticks(count);
  if (all.length < 2) return all;
  const gap = Math.abs(y(all[1] as number) - y(all[0] as number));
  const every = Math.max(1, Math.ceil(minPx / Math.max(gap, 1e-9)));
  return all.filter((_, i) => i % every === 0);
}
