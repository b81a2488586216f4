/**
 * Return-period plot: the annual maxima at the chosen plotting positions on the Gumbel reduced
 * variate -ln(-ln(1 - 1/T)), and each candidate's return levels at the periods asked for with
 * their intervals (whiskers), joined by lines. Positions and levels come from the core.
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import type { DatasetCandidate, FloodSection } from '../../core/index.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, keepApart, nextId, pathThrough } from './frame.js';
import { type LegendItem } from './legend.js';
import { round } from './text.js';
import type { ChartOptions } from './options.js';
import { INK, styleFor } from './palette.js';

export interface ReturnPeriodData {
  readonly flood: FloodSection;
  readonly candidates: readonly Pick<DatasetCandidate, 'family' | 'label' | 'returnLevels'>[];
  readonly selected: string;
}

/** Gumbel reduced variate of a return period T (the axis the core's gumbelVariate uses). */
function variate(T: number): number {
  return -Math.log(-Math.log1p(-1 / T));
}

const PERIOD_TICKS = [1.1, 2, 5, 10, 20, 50, 100, 200, 500, 1000, 10000];

export function returnPeriodChart(container: Element, data: ReturnPeriodData, options: ChartOptions): SVGSVGElement {
  const f = data.flood;
  const title = 'Annual maxima and return levels';
  const edge = 2 * f.recordLength;
  const items: LegendItem[] = [{ key: 'data', label: `Annual maxima (${f.plottingPositions.formula})`, kind: 'point' }];
  const shown = data.candidates.filter((c) => c.returnLevels && c.returnLevels.length > 0);
  for (const c of shown) items.push({ key: c.family, label: `${c.label}${c.family === data.selected ? ' (selected)' : ''}`, kind: 'line', emphasis: c.family === data.selected });
  const maxT0 = Math.max(...f.periods, ...f.plottingPositions.points.map((p) => p.returnPeriod));
  if (edge < maxT0) items.push({ key: 'ref', label: `2 × record (${edge} y): beyond it the model's tail decides`, kind: 'reference' });
  const frame = createFrame(container, options, title, `Points: the ${f.recordLength} annual maxima at ${f.plottingPositions.description}. Lines: return levels of each model at the periods asked for, whiskers their ${Math.round(f.confidence * 100)} % intervals.`, { legend: items });
  const pts = f.plottingPositions.points;
  const sel = shown.find((c) => c.family === data.selected);
  const levels = [...pts.map((p) => p.value), ...(sel?.returnLevels ?? []).flatMap((r) => [r.estimate, r.upper ?? r.estimate, r.lower ?? r.estimate])];
  const y = scaleLinear().domain([Math.min(...levels), Math.max(...levels)]).range([frame.innerHeight, 0]).nice();
  const yAxis = axisLeft(y).ticks(5);
  fitYAxis(frame, yAxis);
  const x = scaleLinear().domain([Math.min(variate(1.1), ...pts.map((p) => p.gumbelVariate)), variate(maxT0) + 0.3]).range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(5).map((t) => y(t)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  for (const c of [...shown].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected))) {
    const s = styleFor(c.family);
    const emph = c.family === data.selected;
    const rows = c.returnLevels ?? [];
    g.append('path').attr('data-kind', 'curve').attr('data-family', c.family)
      .attr('d', pathThrough(rows.map((r) => [x(variate(r.period)), y(r.estimate)] as const)))
      .attr('fill', 'none').attr('stroke', s.colour).attr('stroke-width', emph ? 3 : 1.5).attr('stroke-dasharray', s.dash || null);
    if (emph) {
      for (const r of rows) {
        const px = round(x(variate(r.period)));
        const lo = r.lower ?? y.domain()[0]!;
        const hi = r.upper ?? y.domain()[1]!;
        g.append('line').attr('data-kind', 'interval').attr('x1', px).attr('x2', px).attr('y1', round(y(lo))).attr('y2', round(y(hi))).attr('stroke', s.colour).attr('stroke-width', 2)
          .append('title').text(`T = ${r.period} years: ${sig(r.estimate)} ${options.units} (${r.lower === null ? 'open' : sig(r.lower)} to ${r.upper === null ? 'unbounded' : sig(r.upper)})`);
        g.append('rect').attr('data-kind', 'level').attr('x', px - 4).attr('y', round(y(r.estimate)) - 4).attr('width', 8).attr('height', 8).attr('fill', s.colour);
      }
    }
  }
  for (const p of pts) {
    g.append('circle').attr('data-kind', 'point').attr('cx', round(x(p.gumbelVariate))).attr('cy', round(y(p.value))).attr('r', 3).attr('fill', INK.data)
      .append('title').text(`${sig(p.value)} ${options.units}: plotted at T = ${sig(p.returnPeriod, 3)} years`);
  }
  // Record-length marker: periods beyond twice the record rest on the model's tail.
  // Record-length marker (named in the legend, not on the plot): periods beyond twice the record rest on the model's tail.
  if (variate(edge) < x.domain()[1]!) {
    const px = round(x(variate(edge)));
    frame.plot.append('line').attr('data-kind', 'record-edge').attr('x1', px).attr('x2', px).attr('y1', 0).attr('y2', frame.innerHeight).attr('stroke', INK.reference).attr('stroke-width', 1.2).attr('stroke-dasharray', '3 3')
      .append('title').text(`2 × record (${edge} years)`);
  }
  const inRange = PERIOD_TICKS.filter((T) => variate(T) >= x.domain()[0]! && variate(T) <= x.domain()[1]!);
  const ticks = keepApart(inRange, (T) => x(variate(T)), (T) => String(T));
  drawXAxis(frame, axisBottom(x).tickValues(ticks.map(variate)).tickFormat((_v, i) => String(ticks[i])), 'Return period T [years] (Gumbel scale)');
  drawYAxis(frame, yAxis, axisLabel(options.quantity ?? 'Annual maximum', options.units));
  return frame.svg.node()!;
}
