/**
 * Several failure modes: the reliability of each mode R_m(t) under its own fitted model and the
 * system's, their product (a unit survives only while it survives every mode), on the core's time
 * grid (core/life analyzeModes `system.curve`). The B-lives asked for are marked on the system
 * curve. The core computed every number; this only draws them.
 */
import { axisBottom, axisLeft, scaleLinear, scaleLog } from 'd3';
import type { CompetingModesReport } from '../../core/index.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, keepApart, nextId, pathThrough } from './frame.js';
import type { LegendItem } from './legend.js';
import { logTicks } from './life-probability.js';
import type { ChartOptions } from './options.js';
import { BY_FAMILY, INK, SPARE, type SeriesStyle } from './palette.js';
import { round } from './text.js';

/** The modes' line styles: the spare patterns first, then the family set (a mode is not a family; the styles only tell the lines apart). */
const MODE_STYLES: readonly SeriesStyle[] = [...SPARE, ...Object.values(BY_FAMILY)];
const SYSTEM_STYLE: SeriesStyle = { colour: INK.data, dash: '', pattern: 'solid' };

export interface ModesChartData {
  readonly modes: CompetingModesReport;
}

export function modesReliabilityChart(container: Element, data: ModesChartData, options: ChartOptions): SVGSVGElement | null {
  const sys = data.modes.system;
  if (!sys) return null;
  const names = data.modes.modes.map((m) => m.mode);
  const items: LegendItem[] = [
    { key: 'system', label: 'whole unit (product of the modes)', kind: 'line', style: SYSTEM_STYLE, emphasis: true },
    ...names.map((m, i): LegendItem => ({ key: `mode-${i}`, label: `mode ${m}`, kind: 'line', style: MODE_STYLES[i % MODE_STYLES.length]! })),
  ];
  const frame = createFrame(
    container,
    options,
    'Which mode takes the reliability down first?',
    `Reliability of each failure mode alone under its own fitted model, and of the whole unit, their product (${names.length} modes, treated as independent). Points on the unit's curve: its B-lives.`,
    { legend: items },
  );
  const t = sys.curve.time;
  const x = scaleLog().domain([t[0]!, t[t.length - 1]!]).range([0, frame.innerWidth]);
  const y = scaleLinear().domain([0, 1]).range([frame.innerHeight, 0]);
  const yAxis = axisLeft(y).ticks(5).tickFormat((v) => sig(Number(v), 2));
  fitYAxis(frame, yAxis);
  x.range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(5).map((v) => y(v)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  sys.curve.modes.forEach((r, i) => {
    const s = MODE_STYLES[i % MODE_STYLES.length]!;
    g.append('path')
      .attr('data-kind', 'mode-curve')
      .attr('data-mode', names[i] ?? '')
      .attr('d', pathThrough(t.map((ti, k) => [x(ti), y(r[k]!)] as const)))
      .attr('fill', 'none')
      .attr('stroke', s.colour)
      .attr('stroke-width', 1.6)
      .attr('stroke-dasharray', s.dash || null);
  });
  g.append('path')
    .attr('data-kind', 'system-curve')
    .attr('d', pathThrough(t.map((ti, k) => [x(ti), y(sys.curve.system[k]!)] as const)))
    .attr('fill', 'none')
    .attr('stroke', SYSTEM_STYLE.colour)
    .attr('stroke-width', 3);
  const [lo, hi] = x.domain() as [number, number];
  for (const b of sys.bLives) {
    if (!(b.estimate >= lo && b.estimate <= hi)) continue;
    g.append('circle')
      .attr('data-kind', 'system-blife')
      .attr('cx', round(x(b.estimate)))
      .attr('cy', round(y(1 - b.percent / 100)))
      .attr('r', 4)
      .attr('fill', INK.paper)
      .attr('stroke', SYSTEM_STYLE.colour)
      .attr('stroke-width', 1.5)
      .append('title')
      .text(`whole unit B${sig(b.percent, 3)}: ${sig(b.estimate)}${options.units ? ` ${options.units}` : ''} (point estimate)`);
  }
  const xt = keepApart(logTicks([lo, hi]), (v) => x(v), (v) => sig(v, 3));
  drawXAxis(frame, axisBottom(x).tickValues(xt).tickFormat((v) => sig(Number(v), 3)), `${axisLabel(options.quantity ?? 'Time', options.units)} (log scale)`);
  drawYAxis(frame, yAxis, 'Reliability R(t)');
  return frame.svg.node()!;
}
