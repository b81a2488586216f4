/**
 * Shared scaffolding for the evidence charts: an SVG with a title, a text description for
 * screen readers, a plotting area with margins, axes with labels, and a legend drawn inside
 * the SVG (so that a chart copied into the exported report is complete on its own).
 *
 * Layout, top to bottom, so that no two texts can meet: the title (wrapped), the legend rows
 * (legend.ts), the y-axis title on its own row above the plot, the plot (its left margin sized
 * to the widest y tick label by fitYAxis), the x tick labels, the x-axis title, and notes.
 *
 * Charts set presentation attributes only (no `style` attributes, no CSS classes needed),
 * which keeps them valid under a strict Content-Security-Policy and self-contained in the export.
 */
import { axisBottom, axisLeft, select, type Axis, type NumberValue, type Selection } from 'd3';
import { drawLegend, type LegendItem } from './legend.js';
import { FONT, INK } from './palette.js';
import { round, textWidth, wrapText } from './text.js';

export type Svg = Selection<SVGSVGElement, unknown, null, undefined>;
export type Group = Selection<SVGGElement, unknown, null, undefined>;

export interface ChartSize {
  readonly width: number;
  readonly height: number;
}

export interface Margins {
  readonly top: number;
  readonly right: number;
  readonly bottom: number;
  readonly left: number;
}

export interface Frame {
  readonly svg: Svg;
  /** The plotting area, translated by the margins. */
  readonly plot: Group;
  /** Set by fitYAxis (the left margin is as wide as the y tick labels need). */
  innerWidth: number;
  readonly innerHeight: number;
  margins: Margins;
  /** Baseline of the y-axis title, which sits above the plot, level with its left edge (never
   *  beside the tick labels, so the two cannot overlap). */
  readonly yTitleY: number;
  readonly width: number;
}

/** What createFrame lays out around the plot: legend rows at the top, notes under the x axis. */
export interface FrameLayout {
  readonly legend?: readonly LegendItem[];
  /** Short notes printed under the x-axis title (e.g. a bar cut at the drawn range), never on the data. */
  readonly notes?: readonly string[];
  /** Room for labels drawn just above the plot area (e.g. limit names), in px. */
  readonly headroom?: number;
  /** The least height of the plotting area: when the title, legend and notes leave less, the chart
   *  is drawn taller than asked instead of squeezing the plot (a narrow slot with long notes). */
  readonly minPlotHeight?: number;
}

let idCounter = 0;
/** Unique ids for aria-labelledby inside one document (a chart may be drawn many times). */
export function nextId(prefix: string): string {
  idCounter += 1;
  return `${prefix}-${idCounter}`;
}
/** Tests reset the counter so snapshots do not depend on test order. */
export function resetIds(): void {
  idCounter = 0;
}

const TITLE_SIZE = 14;
const NOTE_ROW = 14;
const LEFT_MIN = 40;
const RIGHT = 26;

export function createFrame(
  container: Element,
  size: ChartSize,
  title: string,
  description: string,
  layout: FrameLayout = {},
): Frame {
  const root = select(container);
  root.selectAll(':scope > svg').remove();
  const titleId = nextId('chart-title');
  const descId = nextId('chart-desc');
  const svg = root
    .append('svg')
    .attr('xmlns', 'http://www.w3.org/2000/svg')
    .attr('viewBox', `0 0 ${size.width} ${size.height}`)
    .attr('width', size.width)
    .attr('height', size.height)
    .attr('role', 'img')
    .attr('aria-labelledby', `${titleId} ${descId}`)
    .attr('font-family', FONT)
    .attr('font-size', 12)
    .attr('fill', INK.text) as Svg;
  svg.append('title').attr('id', titleId).text(title);
  svg.append('desc').attr('id', descId).text(description);
  svg.append('rect').attr('width', size.width).attr('height', size.height).attr('fill', INK.paper);
  // Title, wrapped to the width.
  const titleLines = wrapText(title, size.width - 16, TITLE_SIZE, true);
  const t = svg.append('text').attr('data-kind', 'chart-title').attr('x', 8).attr('y', 18).attr('font-size', TITLE_SIZE).attr('font-weight', 600);
  titleLines.forEach((line, i) => t.append('tspan').attr('x', 8).attr('dy', i === 0 ? 0 : 17).text(line));
  let y = 18 + (titleLines.length - 1) * 17 + 8;
  if (layout.legend && layout.legend.length > 0) y = drawLegend(svg, layout.legend, size.width, y + 10) + 6;
  const yTitleY = y + 14;
  const top = yTitleY + 12 + (layout.headroom ?? 0);
  const notes = layout.notes ?? [];
  const noteLines = notes.flatMap((n) => wrapText(n, size.width - 16, 10.5));
  const bottom = 50 + noteLines.length * NOTE_ROW;
  const margins: Margins = { top, right: RIGHT, bottom, left: LEFT_MIN };
  const innerWidth = Math.max(40, size.width - margins.left - margins.right);
  const innerHeight = Math.max(40, layout.minPlotHeight ?? 0, size.height - margins.top - margins.bottom);
  const height = Math.max(size.height, margins.top + innerHeight + margins.bottom);
  if (height > size.height) {
    svg.attr('viewBox', `0 0 ${size.width} ${height}`).attr('height', height);
    svg.select('rect').attr('height', height);
  }
  if (noteLines.length > 0) {
    const g = svg.append('g').attr('data-kind', 'notes').attr('font-size', 10.5).attr('fill', INK.muted);
    noteLines.forEach((line, i) => g.append('text').attr('x', 8).attr('y', round(top + innerHeight + 48 + (i + 1) * NOTE_ROW - 2)).text(line));
  }
  const plot = svg.append('g').attr('data-kind', 'plot').attr('transform', `translate(${margins.left},${margins.top})`) as Group;
  return { svg, plot, innerWidth, innerHeight, margins, yTitleY, width: size.width };
}

/**
 * Size the left margin to the y axis's tick labels (estimated widths) and move the plot: call
 * after the y scale is made and before anything is drawn that depends on the plot's width.
 */
export function fitYAxis<D extends NumberValue>(frame: Frame, axis: Axis<D>): void {
  const widest = Math.max(0, ...tickLabels(axis).map((l) => textWidth(l, 11)));
  const left = Math.max(LEFT_MIN, Math.ceil(widest + 9 + 10));
  frame.margins = { ...frame.margins, left };
  frame.innerWidth = Math.max(40, frame.width - left - frame.margins.right);
  frame.plot.attr('transform', `translate(${left},${frame.margins.top})`);
}

/** The tick labels an axis will draw (its tick values or its scale's ticks, formatted as it will). */
export function tickLabels<D extends NumberValue>(axis: Axis<D>): string[] {
  const scale = axis.scale() as unknown as { ticks?: (...a: unknown[]) => D[]; tickFormat?: (...a: unknown[]) => (d: D) => string; domain: () => D[] };
  const args = axis.tickArguments();
  const values = axis.tickValues() ?? (scale.ticks ? scale.ticks(...args) : scale.domain());
  const fmt = axis.tickFormat() ?? (scale.tickFormat ? scale.tickFormat(...args) : (d: D) => String(d));
  return [...values].map((v, i) => (fmt as (d: D, i: number) => string)(v, i));
}

/** Horizontal-axis tick values whose labels (centred on their ticks) keep at least 6 px apart,
 *  kept greedily from the left. */
export function keepApart(values: readonly number[], at: (v: number) => number, label: (v: number) => string): number[] {
  const kept: number[] = [];
  let right = -Infinity;
  for (const v of [...values].sort((a, b) => at(a) - at(b))) {
    const half = textWidth(label(v), 11) / 2;
    if (at(v) - half >= right + 6) {
      kept.push(v);
      right = at(v) + half;
    }
  }
  return kept;
}

/** Draw the x axis along the bottom of the plot with its title under the tick labels. */
export function drawXAxis<D extends NumberValue>(frame: Frame, axis: Axis<D>, label: string): void {
  const g = frame.plot.append('g').attr('data-kind', 'x-axis').attr('transform', `translate(0,${frame.innerHeight})`).attr('aria-hidden', 'true');
  g.call(axis);
  tidyAxis(g);
  // A title wider than the chart is set smaller (down to 9 px) and centred on the whole chart.
  const room = frame.width - 16;
  const size = Math.max(9, Math.min(12, (12 * room) / Math.max(1, textWidth(label, 12))));
  const half = textWidth(label, size) / 2;
  const centre = Math.min(Math.max(frame.innerWidth / 2, 8 + half - frame.margins.left), frame.width - 8 - half - frame.margins.left);
  frame.plot
    .append('text')
    .attr('data-kind', 'axis-title')
    .attr('x', round(centre))
    .attr('y', frame.innerHeight + 42)
    .attr('text-anchor', 'middle')
    .attr('font-size', round(size))
    .text(label);
}

/** Draw the y axis along the left of the plot; its title sits above the plot, starting at the
 *  SVG's left edge, with an arrow pointing up the axis. */
export function drawYAxis<D extends NumberValue>(frame: Frame, axis: Axis<D>, label: string): void {
  const g = frame.plot.append('g').attr('data-kind', 'y-axis').attr('aria-hidden', 'true');
  g.call(axis);
  tidyAxis(g);
  frame.svg
    .append('text')
    .attr('data-kind', 'axis-title')
    .attr('x', 8)
    .attr('y', frame.yTitleY)
    .attr('font-size', 12)
    .text(`↑ ${label}`);
}

/** Light horizontal grid lines at the y ticks. */
export function drawGrid(frame: Frame, ys: readonly number[]): void {
  const g = frame.plot.append('g').attr('aria-hidden', 'true');
  for (const y of ys) {
    g.append('line')
      .attr('x1', 0)
      .attr('x2', frame.innerWidth)
      .attr('y1', y)
      .attr('y2', y)
      .attr('stroke', INK.grid)
      .attr('stroke-width', 1);
  }
}

function tidyAxis(g: Group): void {
  g.attr('font-family', FONT).attr('font-size', 11);
  g.selectAll('path.domain').attr('stroke', INK.axis);
  g.selectAll('.tick line').attr('stroke', INK.axis);
  g.selectAll('.tick text').attr('fill', INK.text);
}

export { axisBottom, axisLeft };

/** An SVG path through points, skipping non-finite ones (a gap starts a new segment). */
export function pathThrough(points: readonly (readonly [number, number])[]): string {
  let d = '';
  let pen = false;
  for (const [x, y] of points) {
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      pen = false;
      continue;
    }
    d += `${pen ? 'L' : 'M'}${round(x)},${round(y)}`;
    pen = true;
  }
  return d;
}

/** A message drawn in place of a chart when there is nothing to draw, and why (wrapped). */
export function drawEmpty(frame: Frame, message: string): void {
  const lines = wrapText(message, Math.max(120, frame.innerWidth - 20), 12);
  const t = frame.plot
    .append('text')
    .attr('data-kind', 'empty-note')
    .attr('x', round(frame.innerWidth / 2))
    .attr('y', round(frame.innerHeight / 2 - ((lines.length - 1) * 16) / 2))
    .attr('text-anchor', 'middle')
    .attr('fill', INK.muted);
  lines.forEach((line, i) => t.append('tspan').attr('x', round(frame.innerWidth / 2)).attr('dy', i === 0 ? 0 : 16).text(line));
}
