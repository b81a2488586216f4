/**
 * The Turnbull nonparametric estimate drawn as it is known: for each innermost interval a box from
 * (its start, F before it) to (its end, F after it) — the data say how much probability lies in the
 * interval, not where inside it — joined by flat steps where F is known; a box that runs past the
 * last inspection is drawn to the right edge and left open. The selected model's fitted cdf is the
 * line through it. Everything drawn was computed by the core (turnbull.ts, curves.ts); this only draws.
 */
import { axisBottom, axisLeft, scaleLinear, scaleLog } from 'd3';
import type { RecordedLifeCandidate, TurnbullEstimate } from '../../core/index.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, keepApart, nextId, pathThrough } from './frame.js';
import { type LegendItem } from './legend.js';
import { logTicks } from './life-probability.js';
import type { ChartOptions } from './options.js';
import { INK, styleFor } from './palette.js';

export interface TurnbullChartData {
  readonly turnbull: TurnbullEstimate;
  /** The fitted model's curves (core lifeCurves), with its family and label; null: boxes only. */
  readonly fitted: ({ readonly family: string; readonly label: string } & Pick<RecordedLifeCandidate['curves'], 'time' | 'cdf'>) | null;
}

/** An end from the report: JSON turns an infinite end into null. */
const finite = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

export function turnbullChart(container: Element, data: TurnbullChartData, options: ChartOptions): SVGSVGElement {
  const title = 'Where the failures are known to lie';
  const items: LegendItem[] = [{ key: 'turnbull', label: 'Nonparametric estimate (box: mass known, place inside unknown)', kind: 'line' }];
  if (data.fitted) items.push({ key: data.fitted.family, label: `${data.fitted.label} fit`, kind: 'line', emphasis: true });
  const frame = createFrame(container, options, title, 'Turnbull nonparametric estimate of the fraction failed: each box spans an interval in which some units failed, from the fraction failed before it to the fraction after it; the fitted model is the line.', {
    legend: items,
  });
  const ivs = data.turnbull.intervals;
  const ends = ivs.flatMap((iv) => [iv.lower, iv.upper]).filter((v): v is number => finite(v) && v > 0);
  const fitTimes = data.fitted?.time ?? [];
  const lo = Math.min(...ends, ...fitTimes.filter((t) => t > 0)) || 1;
  const hi = Math.max(...ends, ...fitTimes) || lo * 10;
  const x = scaleLog().domain([lo, hi > lo ? hi : lo * 10]).range([0, frame.innerWidth]);
  const y = scaleLinear().domain([0, 1]).range([frame.innerHeight, 0]);
  const yAxis = axisLeft(y).ticks(5).tickFormat((v) => `${sig(100 * Number(v), 3)}%`);
  fitYAxis(frame, yAxis);
  x.range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(5).map((t) => y(t)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  const X = (t: number | null | undefined, side: 'left' | 'right'): number => (finite(t) && t > 0 ? x(t) : side === 'left' ? 0 : frame.innerWidth);
  const s = styleFor('turnbull');
  let prevX = 0;
  let prevF = 0;
  for (const iv of ivs) {
    const x0 = X(iv.lower, 'left');
    const x1 = X(iv.upper, 'right');
    // The flat step where F is known, from the end of the previous box to the start of this one.
    g.append('path').attr('data-kind', 'step').attr('d', pathThrough([[prevX, y(prevF)], [x0, y(prevF)]])).attr('fill', 'none').attr('stroke', INK.text).attr('stroke-width', 1.5);
    const open = !finite(iv.upper);
    g.append('rect')
      .attr('data-kind', 'box')
      .attr('data-open', open ? 'true' : null)
      .attr('x', Math.min(x0, x1))
      .attr('y', y(iv.cdfAfter))
      .attr('width', Math.max(1.5, Math.abs(x1 - x0)))
      .attr('height', Math.max(1, y(iv.cdfBefore) - y(iv.cdfAfter)))
      .attr('fill', s.colour)
      .attr('fill-opacity', 0.25)
      .attr('stroke', s.colour)
      .attr('stroke-dasharray', open ? '4 3' : null);
    prevX = x1;
    prevF = iv.cdfAfter;
  }
  if (data.fitted) {
    const f = data.fitted;
    g.append('path')
      .attr('data-kind', 'curve')
      .attr('data-family', f.family)
      .attr('d', pathThrough(f.time.map((t, i) => [x(t), y(f.cdf[i] as number)] as const)))
      .attr('fill', 'none')
      .attr('stroke', styleFor(f.family).colour)
      .attr('stroke-width', 2.5);
  }
  const xt = keepApart(logTicks(x.domain() as [number, number]), (v) => x(v), (v) => sig(v, 3));
  drawXAxis(frame, axisBottom(x).tickValues(xt).tickFormat((v) => sig(Number(v), 3)), `${axisLabel(options.quantity ?? 'Time', options.units)} (log scale)`);
  drawYAxis(frame, yAxis, 'Fraction failed');
  return frame.svg.node()!;
}
