/**
 * Histogram of the data on the selected candidate's equal-probability bins, on the density
 * scale (bar area = share of the data), with every candidate's fitted density overlaid and the
 * selected one drawn heavier. Heights and curves come from the core's evidence; this only draws.
 *
 * A censored sample has no bars (the core says why): the chart shows the fitted densities with
 * each failure as a tick and each suspension as an open triangle along the bottom.
 */
import { axisBottom, axisLeft, max as d3max, scaleLinear } from 'd3';
import type { CensoringEvidence, FittedCurves, HistogramEvidence } from '../../core/index.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawEmpty, drawGrid, drawXAxis, drawYAxis, fitYAxis, nextId } from './frame.js';
import { type LegendItem } from './legend.js';
import { coarseNote, drawFittedCurves, drawTimeMarks } from './marks.js';
import { round } from './text.js';
import type { ChartOptions } from './options.js';
import { INK } from './palette.js';

export interface HistogramChartData {
  readonly histogram: HistogramEvidence;
  readonly densities: FittedCurves;
  readonly xDomain: readonly [number, number];
  /** Family whose bins are drawn (its curve is emphasised). */
  readonly selected: string;
  readonly selectedLabel: string;
  /** The sample's censoring (failure and suspension times), null or absent when complete. */
  readonly censoring?: CensoringEvidence | null;
}

/** Words for bars cut at the drawn range: where they really start or end (their low height is
 *  their count spread over the full width). Printed under the axis, never on the plot. */
export function cutBarNotes(h: HistogramEvidence, domain: readonly [number, number]): string[] {
  const notes: string[] = [];
  const first = h.bars[0];
  const last = h.bars[h.bars.length - 1];
  if (first && first.lower < domain[0]) notes.push(`◂ The first bar starts at ${sig(first.lower, 4)}, left of the drawn range.`);
  if (last && last.upper > domain[1]) notes.push(`▸ The last bar ends at ${sig(last.upper, 4)}, right of the drawn range.`);
  return notes;
}

export function histogramChart(container: Element, data: HistogramChartData, options: ChartOptions): SVGSVGElement {
  const quantity = options.quantity ?? 'Value';
  const h = data.histogram;
  const censored = h.source === 'not-applicable';
  const title = censored ? `Where do failures and suspensions fall under the ${data.selectedLabel} density?` : `Do the bars follow the ${data.selectedLabel} curve?`;
  const description = censored
    ? `Fitted densities of ${data.densities.curves.map((c) => c.label).join(', ')}, with each failure marked by a tick and each suspension by an open triangle along the bottom. ${h.notApplicable?.reason ?? ''}`
    : `${h.k} bins, each expected to hold the same share of the data under the ${data.selectedLabel} fit. ` +
      `Bar area is the observed share; curves are the fitted densities of ${data.densities.curves.map((c) => c.label).join(', ')}. ` +
      h.displayEdgeRule;
  const items: LegendItem[] = [];
  if (censored) {
    items.push({ key: 'data', label: `Failures (${data.censoring?.failures ?? 0})`, kind: 'point' });
    if ((data.censoring?.suspensions ?? 0) > 0) items.push({ key: 'suspension', label: `Suspensions (${data.censoring?.suspensions ?? 0}, still running)`, kind: 'suspension' });
  } else items.push({ key: 'data', label: 'Observed (bar area = share)', kind: 'bar' });
  const ordered = [...data.densities.curves].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected));
  for (const c of data.densities.curves) {
    items.push({ key: c.family, label: c.family === data.selected ? `${c.label} (selected)` : c.label, kind: 'line', emphasis: c.family === data.selected });
  }
  const coarse = coarseNote(data.densities.x, data.xDomain);
  const notes = [...(censored ? ['No bars: a censored sample cannot be binned (a suspension is known only to outlast its time).'] : cutBarNotes(h, data.xDomain)), ...(coarse ? [coarse] : [])];
  const frame = createFrame(container, options, title, description, { legend: items, notes });
  if (!censored && h.bars.length === 0) {
    drawEmpty(frame, 'No bins to draw.');
    return frame.svg.node()!;
  }
  const barTop = d3max(h.bars, (b) => b.density) ?? 0;
  const selectedCurve = data.densities.curves.find((c) => c.family === data.selected);
  const curveTop = d3max(selectedCurve?.y ?? [], (v) => (v === null ? 0 : v)) ?? 0;
  // Poles (e.g. a gamma density with shape < 1 at 0) would flatten the bars: cap the axis at
  // 1.6 x the tallest bar and clip the curves there. Without bars, the selected curve's top.
  const top = (censored ? curveTop : Math.max(barTop, Math.min(curveTop, 1.6 * barTop))) * 1.08 || 1;
  const y = scaleLinear().domain([0, top]).range([frame.innerHeight, 0]).nice();
  const yAxis = axisLeft(y).ticks(5);
  fitYAxis(frame, yAxis);
  const x = scaleLinear().domain([data.xDomain[0], data.xDomain[1]]).range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(5).map((t) => y(t)));

  const clipId = nextId('clip');
  frame.plot
    .append('clipPath')
    .attr('id', clipId)
    .append('rect')
    .attr('x', 0)
    .attr('y', 0)
    .attr('width', frame.innerWidth)
    .attr('height', frame.innerHeight);

  const bars = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  h.bars.forEach((b, i) => {
    const x0 = x(b.lower);
    const x1 = x(b.upper);
    const rect = bars
      .append('rect')
      .attr('data-kind', 'bar')
      .attr('x', round(x0))
      .attr('y', round(y(b.density)))
      .attr('width', round(Math.max(0, x1 - x0)))
      .attr('height', round(Math.max(0, y(0) - y(b.density))))
      .attr('fill', INK.barFill)
      .attr('stroke', INK.barStroke)
      .attr('stroke-width', 1)
      .attr('stroke-dasharray', b.openLower || b.openUpper ? '3 2' : null);
    const lo = b.lowerEdge === null ? '−∞' : sig(b.lowerEdge);
    const hi = b.upperEdge === null ? '∞' : sig(b.upperEdge);
    rect.append('title').text(`Bin ${i + 1}: [${lo}, ${hi}) ${options.units}: observed ${b.observed}, expected ${sig(b.expected, 3)}`);
  });

  const curves = frame.plot.append('g').attr('clip-path', `url(#${clipId})`).attr('fill', 'none');
  if (!coarse) drawFittedCurves(curves, data.densities.x, ordered, data.selected, x, y, 'fitted density');
  if (censored && data.censoring) {
    const u = options.units ? ` ${options.units}` : '';
    drawTimeMarks(frame, data.censoring.failureTimes.x, x, 'failure', `${data.censoring.failures} failure times${u}`);
    drawTimeMarks(frame, data.censoring.suspensionTimes.x, x, 'suspension', `${data.censoring.suspensions} suspensions (units still running at these times${u})`);
  }

  drawXAxis(frame, axisBottom(x).ticks(Math.max(3, Math.floor(frame.innerWidth / 80))), axisLabel(quantity, options.units));
  const yLabel = options.units.trim() ? `Density [per ${options.units.trim()}]` : 'Density';
  drawYAxis(frame, yAxis, yLabel);
  return frame.svg.node()!;
}
