/**
 * Hazard rate h(t) = f(t)/S(t) of each fitted life model on the core's time grid: rising for
 * wear-out, flat for random failures, falling for early failures. The core computed the curves.
 */
import { axisBottom, axisLeft, max as d3max, scaleLinear, scaleLog } from 'd3';
import type { LifeSection } from '../../core/index.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, keepApart, nextId, pathThrough } from './frame.js';
import { type LegendItem } from './legend.js';
import type { ChartOptions } from './options.js';
import { styleFor } from './palette.js';
import { logTicks } from './life-probability.js';

export interface HazardData {
  readonly curves: LifeSection['curves'];
  readonly labels: Readonly<Record<string, string>>;
  readonly selected: string;
}

export function hazardChart(container: Element, data: HazardData, options: ChartOptions): SVGSVGElement {
  const u = options.units.trim();
  const title = 'Is the failure rate rising, flat or falling?';
  const items: LegendItem[] = data.curves.map((c) => ({ key: c.family, label: `${data.labels[c.family] ?? c.family}${c.family === data.selected ? ' (selected)' : ''}`, kind: 'line', emphasis: c.family === data.selected }));
  const frame = createFrame(container, options, title, 'Instantaneous failure rate of units still running, h(t) = f(t)/S(t), for each fitted model. Rising: wear-out; flat: random; falling: early failures.', { legend: items });
  const times = data.curves[0]?.time ?? [1, 2];
  const sel = data.curves.find((c) => c.family === data.selected) ?? data.curves[0];
  const top = (d3max(sel?.hazard ?? [1], (v) => (Number.isFinite(v) ? v : 0)) ?? 1) * 1.5 || 1;
  const y = scaleLinear().domain([0, top]).range([frame.innerHeight, 0]).nice();
  const yAxis = axisLeft(y).ticks(5).tickFormat((v) => sig(Number(v), 3));
  fitYAxis(frame, yAxis);
  const x = scaleLog().domain([times[0]!, times[times.length - 1]!]).range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(5).map((t) => y(t)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  for (const c of [...data.curves].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected))) {
    const s = styleFor(c.family);
    const emph = c.family === data.selected;
    g.append('path')
      .attr('data-kind', 'curve')
      .attr('data-family', c.family)
      .attr('d', pathThrough(c.time.map((t, i) => [x(t), Number.isFinite(c.hazard[i]!) ? y(c.hazard[i]!) : Number.NaN] as const)))
      .attr('fill', 'none')
      .attr('stroke', s.colour)
      .attr('stroke-width', emph ? 3 : 1.5)
      .attr('stroke-dasharray', s.dash || null);
  }
  const xt = keepApart(logTicks(x.domain() as [number, number]), (v) => x(v), (v) => sig(v, 3));
  drawXAxis(frame, axisBottom(x).tickValues(xt).tickFormat((v) => sig(Number(v), 3)), `${axisLabel(options.quantity ?? 'Time', options.units)} (log scale)`);
  drawYAxis(frame, yAxis, u ? `Failures per unit per ${u}` : 'Hazard rate');
  return frame.svg.node()!;
}
