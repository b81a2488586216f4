/**
 * The decision number of every series with its interval, one mark per series sorted by the
 * estimate: where the series agree, which stand out, and how wide each one's uncertainty is. Series
 * whose best model a test rejects are drawn hollow; series with no number are counted in a note.
 * Thinned past `maxMarks` series: every k-th in sorted order plus the two ends (the note says so).
 */
import { scaleLinear } from 'd3';
import { axisBottom, axisLeft } from 'd3';
import type { SeriesSummary } from '../../core/index.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, type ChartSize } from './frame.js';
import { INK } from './palette.js';

export interface SeriesDecisionChart {
  /** Marks drawn (after thinning) and series with a number. */
  readonly drawn: number;
  readonly withNumber: number;
}

export function drawSeriesDecisions(container: Element, rows: readonly SeriesSummary[], size: ChartSize, maxMarks = 1500): SeriesDecisionChart {
  const withNumber = rows.filter((r) => r.estimate !== null && Number.isFinite(r.estimate)).sort((a, b) => (a.estimate as number) - (b.estimate as number));
  const quantity = withNumber[0]?.quantity ?? 'decision number';
  let shown = withNumber;
  const notes: string[] = [];
  if (withNumber.length > maxMarks) {
    const step = withNumber.length / maxMarks;
    shown = Array.from({ length: maxMarks }, (_, i) => withNumber[Math.min(withNumber.length - 1, Math.round(i * step))] as SeriesSummary);
    shown[shown.length - 1] = withNumber[withNumber.length - 1] as SeriesSummary;
    notes.push(`${withNumber.length} series with a number; every ${step.toFixed(1)}th in order is drawn, the largest included.`);
  }
  const missing = rows.length - withNumber.length;
  if (missing > 0) notes.push(`${missing} series have no ${quantity} (not analysed, or no model ranked).`);
  notes.push('Hollow marks: the best model of that series is rejected by a goodness-of-fit test.');
  const frame = createFrame(container, size, `${quantity} of each series, smallest to largest, with its interval`, `One mark per series; ${withNumber.length} series.`, { notes });
  const lo = Math.min(...shown.map((r) => r.lower ?? (r.estimate as number)));
  const hi = Math.max(...shown.map((r) => r.upper ?? (r.estimate as number)));
  const y = scaleLinear().domain(shown.length > 0 ? [lo, hi] : [0, 1]).nice();
  const yAxis = axisLeft(y).ticks(6);
  fitYAxis(frame, yAxis);
  y.range([frame.innerHeight, 0]);
  const x = scaleLinear().domain([0, Math.max(1, shown.length - 1)]).range([4, frame.innerWidth - 4]);
  drawGrid(frame, y.ticks(6).map((t) => y(t)));
  const g = frame.plot.append('g').attr('data-kind', 'marks');
  shown.forEach((r, i) => {
    const cx = x(i);
    if (r.lower !== null && r.upper !== null) {
      g.append('line').attr('x1', cx).attr('x2', cx).attr('y1', y(r.lower)).attr('y2', y(r.upper)).attr('stroke', INK.muted).attr('stroke-width', 1);
    }
    const rejected = r.chiSquare === 'rejected' || r.andersonDarling === 'rejected';
    g.append('circle')
      .attr('cx', cx)
      .attr('cy', y(r.estimate as number))
      .attr('r', shown.length > 400 ? 1.6 : 3)
      .attr('fill', rejected ? INK.paper : INK.text)
      .attr('stroke', INK.text)
      .append('title')
      .text(`${r.series}: ${r.estimate}`);
  });
  drawXAxis(frame, axisBottom(x).ticks(0), 'Series, sorted by the number');
  drawYAxis(frame, yAxis, quantity);
  return { drawn: shown.length, withNumber: withNumber.length };
}
