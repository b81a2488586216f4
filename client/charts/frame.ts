/**
 * Shared scaffolding for the evidence charts: an SVG with a title, a text description for
 * screen readers, a plotting area with margins, axes with labels, and a legend drawn inside
 * the SVG (so that a chart copied into the exported report is complete on its own).
 *
 * Charts set presentation attributes only (no `style` attributes, no CSS classes needed),
 * which keeps them valid under a strict Content-Security-Policy and self-contained in the export.
 */
import { axisBottom, axisLeft, select, type Axis, type NumberValue, type Selection } from 'd3';
import { FONT, INK, styleFor, type SeriesStyle } from './palette.js';

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
  readonly innerWidth: number;
  readonly innerHeight: number;
  readonly margins: Margins;
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

export function createFrame(
  container: Element,
  size: ChartSize,
  title: string,
  description: string,
  margins: Margins = { top: 56, right: 18, bottom: 52, left: 64 },
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
  svg.append('rect').attr('width', size.width).attr('height', size.height).attr('fill', '#ffffff');
  svg
    .append('text')
    .attr('x', 8)
    .attr('y', 18)
    .attr('font-size', 14)
    .attr('font-weight', 600)
    .text(title);
  const innerWidth = Math.max(40, size.width - margins.left - margins.right);
  const innerHeight = Math.max(40, size.height - margins.top - margins.bottom);
  const plot = svg.append('g').attr('transform', `translate(${margins.left},${margins.top})`) as Group;
  return { svg, plot, innerWidth, innerHeight, margins };
}

/** Draw the x axis along the bottom of the plot with its label. */
export function drawXAxis<D extends NumberValue>(frame: Frame, axis: Axis<D>, label: string): void {
  const g = frame.plot.append('g').attr('transform', `translate(0,${frame.innerHeight})`).attr('aria-hidden', 'true');
  g.call(axis);
  tidyAxis(g);
  frame.plot
    .append('text')
    .attr('x', frame.innerWidth / 2)
    .attr('y', frame.innerHeight + 40)
    .attr('text-anchor', 'middle')
    .attr('font-size', 12)
    .text(label);
}

/** Draw the y axis along the left of the plot with its (rotated) label. */
export function drawYAxis<D extends NumberValue>(frame: Frame, axis: Axis<D>, label: string): void {
  const g = frame.plot.append('g').attr('aria-hidden', 'true');
  g.call(axis);
  tidyAxis(g);
  frame.plot
    .append('text')
    .attr('transform', `translate(${-frame.margins.left + 16},${frame.innerHeight / 2}) rotate(-90)`)
    .attr('text-anchor', 'middle')
    .attr('font-size', 12)
    .text(label);
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

export interface LegendItem {
  readonly key: string;
  readonly label: string;
  /** 'line' (a curve), 'bar' (data bars), 'band' (a shaded band), 'point' (markers), 'step'. */
  readonly kind: 'line' | 'bar' | 'band' | 'point' | 'step' | 'reference';
  readonly style?: SeriesStyle;
  readonly emphasis?: boolean;
}

/**
 * A legend in one or two rows above the plot. Widths are estimated from the character count
 * (no text measurement, so that jsdom and the browser draw the same thing).
 */
export function drawLegend(frame: Frame, items: readonly LegendItem[], width: number): void {
  const g = frame.svg.append('g').attr('transform', 'translate(8,30)').attr('font-size', 11);
  let x = 0;
  let y = 0;
  for (const item of items) {
    const w = 30 + item.label.length * 6.2 + 14;
    if (x > 0 && x + w > width - 16) {
      x = 0;
      y += 15;
    }
    const cell = g.append('g').attr('transform', `translate(${round(x)},${y})`);
    const style = item.style ?? styleFor(item.key);
    switch (item.kind) {
      case 'line':
        cell
          .append('line')
          .attr('x1', 0)
          .attr('x2', 24)
          .attr('y1', 0)
          .attr('y2', 0)
          .attr('stroke', style.colour)
          .attr('stroke-width', item.emphasis ? 3 : 1.6)
          .attr('stroke-dasharray', style.dash || null);
        break;
      case 'bar':
        cell.append('rect').attr('x', 4).attr('y', -5).attr('width', 16).attr('height', 10).attr('fill', INK.barFill).attr('stroke', INK.barStroke);
        break;
      case 'band':
        cell.append('rect').attr('x', 0).attr('y', -5).attr('width', 24).attr('height', 10).attr('fill', style.colour).attr('fill-opacity', 0.2);
        break;
      case 'point':
        cell.append('circle').attr('cx', 12).attr('cy', 0).attr('r', 3).attr('fill', INK.data);
        break;
      case 'step':
        cell.append('path').attr('d', 'M0,4H8V0H16V-4H24').attr('fill', 'none').attr('stroke', INK.data).attr('stroke-width', 1.6);
        break;
      case 'reference':
        cell
          .append('line')
          .attr('x1', 0)
          .attr('x2', 24)
          .attr('y1', 0)
          .attr('y2', 0)
          .attr('stroke', INK.reference)
          .attr('stroke-width', 1.2)
          .attr('stroke-dasharray', '3 3');
        break;
    }
    cell.append('text').attr('x', 30).attr('y', 4).text(item.label);
    x += w;
  }
}

/** Round a coordinate to 0.01 px: keeps the SVG small and stable. */
export function round(v: number): number {
  return Math.round(v * 100) / 100;
}

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

/** Minimum number of curve points inside the drawn range for a curve to look smooth. */
export const FEW_CURVE_POINTS = 12;

/**
 * A note in the plot's top-right corner when the fitted curves have few points inside the
 * drawn range: straight segments between far-apart points would misrepresent the fit, so the
 * caller leaves the curves out and this note says why.
 */
/** One fitted curve per family on a shared x grid; the selected family drawn heavier. */
export function drawFittedCurves(
  g: Group,
  gridX: readonly number[],
  curves: readonly { readonly family: string; readonly label: string; readonly y: readonly (number | null)[] }[],
  selected: string,
  x: (v: number) => number,
  y: (v: number) => number,
  what: string,
): void {
  for (const c of curves) {
    const s = styleFor(c.family);
    const emph = c.family === selected;
    const pts = gridX.map((xv, i) => [x(xv), c.y[i] === null || c.y[i] === undefined ? Number.NaN : y(c.y[i] as number)] as const);
    g.append('path')
      .attr('data-kind', 'curve')
      .attr('data-family', c.family)
      .attr('d', pathThrough(pts))
      .attr('stroke', s.colour)
      .attr('stroke-width', emph ? 3 : 1.6)
      .attr('stroke-dasharray', s.dash || null)
      .attr('stroke-opacity', emph ? 1 : 0.85)
      .append('title')
      .text(`${c.label} ${what}`);
  }
}

export function noteIfCoarse(frame: Frame, gridX: readonly number[], domain: readonly [number, number]): boolean {
  let inside = 0;
  for (const v of gridX) if (v >= domain[0] && v <= domain[1]) inside++;
  if (inside >= FEW_CURVE_POINTS) return false;
  frame.plot
    .append('text')
    .attr('data-kind', 'coarse-note')
    .attr('x', frame.innerWidth - 4)
    .attr('y', 12)
    .attr('text-anchor', 'end')
    .attr('font-size', 11)
    .attr('fill', INK.reference)
    .text(`Fitted curves not drawn: only ${inside} curve point${inside === 1 ? '' : 's'} in this range`);
  return true;
}

/** A message drawn in place of a chart when there is nothing to draw, and why. */
export function drawEmpty(frame: Frame, message: string): void {
  frame.plot
    .append('text')
    .attr('x', frame.innerWidth / 2)
    .attr('y', frame.innerHeight / 2)
    .attr('text-anchor', 'middle')
    .attr('fill', INK.muted)
    .text(message);
}
