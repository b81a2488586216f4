/**
 * Observed against expected counts in each of the selected candidate's equal-probability bins:
 * grey bars are what was counted, the coloured marks what the fitted model expects (equal in
 * every bin by construction), and the dashed line is 5 expected, the usual minimum for the
 * chi-square approximation (Cochran 1954; common practice).
 */
import { axisBottom, axisLeft, max as d3max, scaleBand, scaleLinear } from 'd3';
import type { BinCountsRow } from '../src/types.js';
import { sig } from '../src/format.js';
import { createFrame, drawEmpty, drawGrid, drawXAxis, drawYAxis, fitYAxis } from './frame.js';
import { round } from './text.js';
import type { ChartOptions } from './options.js';
import { INK, styleFor } from './palette.js';

/** A bin's counts; residual and contribution are shown when the core gave them (grouped cells carry only counts). */
export type BinCountsChartRow = Omit<BinCountsRow, 'pearsonResidual' | 'contribution'> & Partial<Pick<BinCountsRow, 'pearsonResidual' | 'contribution'>>;

export interface BinCountsChartData {
  /** `notApplicable` (a censored sample): no bins; the chart says why instead. */
  readonly bins: { readonly rows: readonly BinCountsChartRow[]; readonly notApplicable?: { readonly reason: string } | null };
  readonly family: string;
  readonly label: string;
  /** What a bar is: 'bin' (equal-probability bins, the default) or 'class' (grouped counts, merged classes). */
  readonly cell?: 'bin' | 'class';
}

export const MIN_EXPECTED = 5;

export function binCountsChart(container: Element, data: BinCountsChartData, options: ChartOptions): SVGSVGElement {
  const rows = data.bins.rows;
  const style = styleFor(data.family);
  const cell = data.cell ?? 'bin';
  const Cell = cell === 'bin' ? 'Bin' : 'Class';
  const title = data.bins.notApplicable ? `Counts per bin: not applicable (censored)` : `Does each ${cell} hold what ${data.label} expects?`;
  const worst = rows.every((r) => r.pearsonResidual !== undefined)
    ? [...rows].sort((a, b) => Math.abs(b.pearsonResidual ?? 0) - Math.abs(a.pearsonResidual ?? 0))[0]
    : undefined;
  const description =
    `${rows.length} ${cell === 'bin' ? 'bins' : 'classes'}. Bars: observed counts; marks: counts expected under the ${data.label} fit. ` +
    (worst ? `Largest departure in ${cell} ${worst.index + 1}: observed ${worst.observed}, expected ${sig(worst.expected, 3)}.` : '');
  const na = data.bins.notApplicable ?? null;
  const frame = createFrame(
    container,
    options,
    title,
    na ? na.reason : description,
    na
      ? {}
      : {
          legend: [
            { key: 'data', label: 'Observed count', kind: 'bar' },
            { key: data.family, label: `Expected (${data.label})`, kind: 'line', emphasis: true, style: { ...style, dash: '' } },
            { key: 'ref', label: `${MIN_EXPECTED} expected (minimum)`, kind: 'reference' },
          ],
        },
  );
  if (na || rows.length === 0) {
    drawEmpty(frame, na ? na.reason : `No ${cell === 'bin' ? 'bins' : 'classes'} to draw.`);
    return frame.svg.node()!;
  }
  const top = Math.max(d3max(rows, (r) => Math.max(r.observed, r.expected)) ?? 0, MIN_EXPECTED) * 1.1;
  const y = scaleLinear().domain([0, top]).range([frame.innerHeight, 0]).nice();
  const yAxis = axisLeft(y).ticks(5);
  fitYAxis(frame, yAxis);
  const x = scaleBand<number>()
    .domain(rows.map((r) => r.index))
    .range([0, frame.innerWidth])
    .paddingInner(0.18)
    .paddingOuter(0.1);
  drawGrid(frame, y.ticks(5).map((t) => y(t)));
  const g = frame.plot.append('g');
  for (const r of rows) {
    const x0 = x(r.index) ?? 0;
    const bw = x.bandwidth();
    const bar = g
      .append('rect')
      .attr('data-kind', 'bar')
      .attr('x', round(x0))
      .attr('y', round(y(r.observed)))
      .attr('width', round(bw))
      .attr('height', round(Math.max(0, y(0) - y(r.observed))))
      .attr('fill', INK.barFill)
      .attr('stroke', INK.barStroke);
    const lo = r.lower === null ? '−∞' : sig(r.lower);
    const hi = r.upper === null ? '∞' : sig(r.upper);
    bar
      .append('title')
      .text(
        `${Cell} ${r.index + 1}: ${cell === 'bin' ? '[' : '('}${lo}, ${hi}${cell === 'bin' ? ')' : ']'} ${options.units}: observed ${r.observed}, expected ${sig(r.expected, 3)}` +
          (r.pearsonResidual !== undefined && r.contribution !== undefined ? `, residual ${sig(r.pearsonResidual, 3)}, adds ${sig(r.contribution, 3)} to chi-square` : ''),
      );
    g.append('line')
      .attr('data-kind', 'expected')
      .attr('x1', round(x0 - bw * 0.08))
      .attr('x2', round(x0 + bw * 1.08))
      .attr('y1', round(y(r.expected)))
      .attr('y2', round(y(r.expected)))
      .attr('stroke', style.colour)
      .attr('stroke-width', 3);
  }
  g.append('line')
    .attr('data-kind', 'reference')
    .attr('x1', 0)
    .attr('x2', frame.innerWidth)
    .attr('y1', round(y(MIN_EXPECTED)))
    .attr('y2', round(y(MIN_EXPECTED)))
    .attr('stroke', INK.reference)
    .attr('stroke-width', 1.2)
    .attr('stroke-dasharray', '3 3');
  const every = Math.max(1, Math.ceil(rows.length / Math.max(4, Math.floor(frame.innerWidth / 28))));
  const axis = axisBottom(x)
    .tickValues(rows.map((r) => r.index).filter((i) => i % every === 0))
    .tickFormat((i) => String(Number(i) + 1));
  drawXAxis(frame, axis, cell === 'bin' ? 'Bin number (low to high values; edges in the bins table)' : 'Class after merging (low to high; limits in the table)');
  drawYAxis(frame, yAxis, `Count per ${cell}`);
  return frame.svg.node()!;
}
