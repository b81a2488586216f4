/**
 * Histogram of the data on the selected candidate's equal-probability bins, on the density
 * scale (bar area = share of the data), with every candidate's fitted density overlaid and the
 * selected one drawn heavier. Heights and curves come from the core's evidence; this only draws.
 */
import { axisBottom, axisLeft, max as d3max, scaleLinear } from 'd3';
import type { FittedCurves, HistogramEvidence } from '../src/types.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawFittedCurves, noteIfCoarse, drawEmpty, drawGrid, drawLegend, drawXAxis, drawYAxis, nextId, round, type LegendItem } from './frame.js';
import type { ChartOptions } from './options.js';
import { INK } from './palette.js';

export interface HistogramChartData {
  readonly histogram: HistogramEvidence;
  readonly densities: FittedCurves;
  readonly xDomain: readonly [number, number];
  /** Family whose bins are drawn (its curve is emphasised). */
  readonly selected: string;
  readonly selectedLabel: string;
}

export function histogramChart(container: Element, data: HistogramChartData, options: ChartOptions): SVGSVGElement {
  const quantity = options.quantity ?? 'Value';
  const h = data.histogram;
  const title = `Histogram on ${data.selectedLabel} equal-probability bins`;
  const description =
    `${h.k} bins, each expected to hold the same share of the data under the ${data.selectedLabel} fit. ` +
    `Bar area is the observed share; curves are the fitted densities of ${data.densities.curves.map((c) => c.label).join(', ')}. ` +
    h.displayEdgeRule;
  const frame = createFrame(container, options, title, description);
  const items: LegendItem[] = [{ key: 'data', label: 'Observed (bar area = share)', kind: 'bar' }];
  const ordered = [...data.densities.curves].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected));
  for (const c of data.densities.curves) {
    items.push({ key: c.family, label: c.family === data.selected ? `${c.label} (selected)` : c.label, kind: 'line', emphasis: c.family === data.selected });
  }
  drawLegend(frame, items, options.width);
  if (h.bars.length === 0) {
    drawEmpty(frame, 'No bins to draw.');
    return frame.svg.node()!;
  }
  const x = scaleLinear().domain([data.xDomain[0], data.xDomain[1]]).range([0, frame.innerWidth]);
  const barTop = d3max(h.bars, (b) => b.density) ?? 0;
  const selectedCurve = data.densities.curves.find((c) => c.family === data.selected);
  const curveTop = d3max(selectedCurve?.y ?? [], (v) => (v === null ? 0 : v)) ?? 0;
  // Poles (e.g. a gamma density with shape < 1 at 0) would flatten the bars: cap the axis at
  // 1.6 x the tallest bar and clip the curves there.
  const top = Math.max(barTop, Math.min(curveTop, 1.6 * barTop)) * 1.08 || 1;
  const y = scaleLinear().domain([0, top]).range([frame.innerHeight, 0]).nice();
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
    // A bar wider than the drawn range is cut at the edge; say where it really starts or ends,
    // since its (low) height is its count spread over its full width.
    const [d0, d1] = data.xDomain;
    const yText = Math.max(12, y(b.density) - 4);
    if (b.lower < d0) {
      frame.plot.append('text').attr('data-kind', 'clip-note').attr('x', 3).attr('y', round(yText)).attr('font-size', 10).attr('fill', INK.muted)
        .text(`◂ bar starts at ${sig(b.lower, 4)}`);
    }
    if (b.upper > d1) {
      frame.plot.append('text').attr('data-kind', 'clip-note').attr('x', frame.innerWidth - 3).attr('y', round(yText)).attr('text-anchor', 'end')
        .attr('font-size', 10).attr('fill', INK.muted).text(`bar ends at ${sig(b.upper, 4)} ▸`);
    }
  });

  const curves = frame.plot.append('g').attr('clip-path', `url(#${clipId})`).attr('fill', 'none');
  const coarse = noteIfCoarse(frame, data.densities.x, data.xDomain);
  if (!coarse) drawFittedCurves(curves, data.densities.x, ordered, data.selected, x, y, 'fitted density');

  drawXAxis(frame, axisBottom(x).ticks(Math.max(3, Math.floor(frame.innerWidth / 80))), axisLabel(quantity, options.units));
  const yLabel = options.units.trim() ? `Density [per ${options.units.trim()}]` : 'Density';
  drawYAxis(frame, axisLeft(y).ticks(5), yLabel);
  return frame.svg.node()!;
}
