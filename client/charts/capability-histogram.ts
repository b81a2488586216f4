/**
 * Capability picture: the data's histogram (the selected model's bins, from the core's evidence)
 * with the specification limits and target as vertical lines and the fitted densities on top,
 * over a range that always shows both limits.
 */
import { axisBottom, axisLeft, max as d3max, scaleLinear } from 'd3';
import type { FittedCurves, HistogramEvidence } from '../src/types.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawGrid, drawLegend, drawXAxis, drawYAxis, nextId, pathThrough, round, type LegendItem } from './frame.js';
import type { ChartOptions } from './options.js';
import { INK, styleFor } from './palette.js';

export interface CapabilityHistogramData {
  readonly histogram: HistogramEvidence;
  readonly densities: FittedCurves;
  readonly lsl: number | null;
  readonly usl: number | null;
  readonly target: number | null;
  readonly dataMin: number;
  readonly dataMax: number;
  readonly selected: string;
}

const LIMIT_INK = '#8a1c1c';

export function capabilityHistogramChart(container: Element, data: CapabilityHistogramData, options: ChartOptions): SVGSVGElement {
  const title = 'Spread of the process against the tolerance';
  const frame = createFrame(container, options, title, 'Histogram of the measurements (bar area = share), the specification limits and target as vertical lines, and the fitted densities.');
  const items: LegendItem[] = [{ key: 'data', label: 'Measured (bar area = share)', kind: 'bar' }];
  for (const c of data.densities.curves) items.push({ key: c.family, label: `${c.label}${c.family === data.selected ? ' (selected)' : ''}`, kind: 'line', emphasis: c.family === data.selected });
  drawLegend(frame, items, options.width);
  const marks = [data.lsl, data.usl, data.target].filter((v): v is number => v !== null);
  let lo = Math.min(data.dataMin, ...marks);
  let hi = Math.max(data.dataMax, ...marks);
  const pad = (hi - lo) * 0.06 || 1;
  lo -= pad;
  hi += pad;
  const x = scaleLinear().domain([lo, hi]).range([0, frame.innerWidth]);
  const bars = data.histogram.bars;
  const sel = data.densities.curves.find((c) => c.family === data.selected);
  const top = Math.max(d3max(bars, (b) => b.density) ?? 0, d3max(sel?.y ?? [], (v) => v ?? 0) ?? 0) * 1.12 || 1;
  const y = scaleLinear().domain([0, top]).range([frame.innerHeight, 0]).nice();
  drawGrid(frame, y.ticks(5).map((t) => y(t)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  for (const b of bars) {
    const x0 = x(Math.max(b.lower, lo));
    const x1 = x(Math.min(b.upper, hi));
    g.append('rect').attr('data-kind', 'bar').attr('x', round(x0)).attr('y', round(y(b.density))).attr('width', round(Math.max(0, x1 - x0)))
      .attr('height', round(Math.max(0, y(0) - y(b.density)))).attr('fill', INK.barFill).attr('stroke', INK.barStroke);
  }
  for (const c of [...data.densities.curves].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected))) {
    const s = styleFor(c.family);
    const emph = c.family === data.selected;
    g.append('path').attr('data-kind', 'curve').attr('data-family', c.family)
      .attr('d', pathThrough(data.densities.x.map((xv, i) => [x(xv), c.y[i] === null || c.y[i] === undefined ? Number.NaN : y(c.y[i] as number)] as const)))
      .attr('fill', 'none').attr('stroke', s.colour).attr('stroke-width', emph ? 3 : 1.4).attr('stroke-dasharray', s.dash || null);
  }
  const mark = (v: number | null, label: string, dash: string | null): void => {
    if (v === null) return;
    const px = round(x(v));
    frame.plot.append('line').attr('data-kind', 'limit').attr('x1', px).attr('x2', px).attr('y1', 0).attr('y2', frame.innerHeight).attr('stroke', LIMIT_INK).attr('stroke-width', 2).attr('stroke-dasharray', dash);
    frame.plot.append('text').attr('x', px).attr('y', -4).attr('text-anchor', 'middle').attr('font-size', 11).attr('font-weight', 600).attr('fill', LIMIT_INK).text(`${label} ${sig(v, 6)}`);
  };
  mark(data.lsl, 'LSL', null);
  mark(data.usl, 'USL', null);
  mark(data.target, 'Target', '5 3');
  drawXAxis(frame, axisBottom(x).ticks(Math.max(3, Math.floor(frame.innerWidth / 90))), axisLabel(options.quantity ?? 'Value', options.units));
  drawYAxis(frame, axisLeft(y).ticks(5), options.units.trim() ? `Density [per ${options.units.trim()}]` : 'Density');
  return frame.svg.node()!;
}
