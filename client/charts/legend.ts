/**
 * The chart legend: rows of entries above the plot, wrapped to the chart's width on estimated
 * text widths, each with a small sample of what it names (line, bar, band, point, step, suspension
 * triangle, out-of-tolerance region, reference line).
 */
import type { Svg } from './frame.js';
import { INK, styleFor, type SeriesStyle } from './palette.js';
import { round, textWidth } from './text.js';

const LEGEND_ROW = 17;

export interface LegendItem {
  readonly key: string;
  readonly label: string;
  /** 'line' (a curve), 'bar' (data bars), 'band' (a shaded band), 'point' (markers), 'step',
   *  'suspension' (open triangle), 'region' (shaded out-of-tolerance region), 'reference';
   *  on stability charts 'beyond' (a hollow ring: a point beyond a 3-sigma limit), 'run-signal' (a filled
   *  diamond: a point completing a run rule) and 'zone' (the faint 1- and 2-sigma lines). */
  readonly kind: 'line' | 'bar' | 'band' | 'point' | 'step' | 'reference' | 'suspension' | 'region' | 'beyond' | 'run-signal' | 'zone';
  readonly style?: SeriesStyle;
  readonly emphasis?: boolean;
}

/**
 * The legend: rows of entries above the plot, wrapped to the width, each entry as wide as its
 * estimated text plus a gap. Returns the y of its last row.
 */
export function drawLegend(svg: Svg, items: readonly LegendItem[], width: number, top: number): number {
  const g = svg.append('g').attr('data-kind', 'legend').attr('transform', `translate(8,${top})`).attr('font-size', 11);
  let x = 0;
  let y = 0;
  for (const item of items) {
    const w = 30 + textWidth(item.label, 11) + 16;
    if (x > 0 && x + w > width - 16) {
      x = 0;
      y += LEGEND_ROW;
    }
    const cell = g.append('g').attr('data-kind', 'legend-entry').attr('transform', `translate(${round(x)},${y})`);
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
      case 'suspension':
        cell.append('path').attr('d', suspensionMark(12, 0)).attr('fill', '#ffffff').attr('stroke', INK.suspension).attr('stroke-width', 1.3);
        break;
      case 'step':
        cell.append('path').attr('d', 'M0,4H8V0H16V-4H24').attr('fill', 'none').attr('stroke', INK.data).attr('stroke-width', 1.6);
        break;
      case 'region':
        cell.append('rect').attr('x', 0).attr('y', -5).attr('width', 24).attr('height', 10).attr('fill', INK.outside).attr('fill-opacity', 0.55).attr('stroke', INK.outsideEdge);
        break;
      case 'beyond':
        cell.append('circle').attr('cx', 12).attr('cy', 0).attr('r', 4.5).attr('fill', 'none').attr('stroke', INK.reference).attr('stroke-width', 2);
        break;
      case 'run-signal':
        cell.append('path').attr('d', runSignalMark(12, 0)).attr('fill', INK.signal).attr('stroke', INK.signal).attr('stroke-width', 1);
        break;
      case 'zone':
        cell.append('line').attr('x1', 0).attr('x2', 24).attr('y1', 0).attr('y2', 0).attr('stroke', INK.zone).attr('stroke-width', 1).attr('stroke-dasharray', '1 3');
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
  return top + y;
}

/** An open triangle pointing right (a unit still running past this time), centred at (x, y). */
export function suspensionMark(x: number, y: number): string {
  return `M${round(x - 4)},${round(y - 4.5)}L${round(x + 4.5)},${round(y)}L${round(x - 4)},${round(y + 4.5)}Z`;
}

/** A filled diamond (a point that completes a run rule on a stability chart), centred at (x, y). */
export function runSignalMark(x: number, y: number): string {
  return `M${round(x)},${round(y - 5)}L${round(x + 5)},${round(y)}L${round(x)},${round(y + 5)}L${round(x - 5)},${round(y)}Z`;
}
