/**
 * Series drawn on a frame's plot: the fitted curves of every candidate (the selected one heavier),
 * and time marks along the bottom (failures as ticks, suspensions as open triangles).
 */
import type { Frame, Group } from './frame.js';
import { pathThrough } from './frame.js';
import { suspensionMark } from './legend.js';
import { INK, styleFor } from './palette.js';
import { round } from './text.js';

/**
 * Minimum number of curve points inside the drawn range for a curve to look smooth. With fewer,
 * straight segments between far-apart points would misrepresent the fit: the caller leaves the
 * curves out and puts `coarseNote`'s words in the chart's notes.
 */
export const FEW_CURVE_POINTS = 12;

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

export function coarseNote(gridX: readonly number[], domain: readonly [number, number]): string | null {
  let inside = 0;
  for (const v of gridX) if (v >= domain[0] && v <= domain[1]) inside++;
  if (inside >= FEW_CURVE_POINTS) return null;
  return `Fitted curves not drawn: only ${inside} curve point${inside === 1 ? '' : 's'} in this range.`;
}

/** Marks along the bottom of the plot at each x: failures as short ticks, suspensions as open
 *  right-pointing triangles (the unit outlived this time). */
export function drawTimeMarks(frame: Frame, xs: readonly number[], x: (v: number) => number, kind: 'failure' | 'suspension', what: string): void {
  const g = frame.plot.append('g').attr('data-kind', kind === 'failure' ? 'failure-marks' : 'suspension-marks');
  const y0 = frame.innerHeight;
  if (kind === 'failure') {
    let d = '';
    for (const v of xs) d += `M${round(x(v))},${round(y0)}V${round(y0 - 9)}`;
    g.append('path').attr('d', d).attr('stroke', INK.data).attr('stroke-width', 1.2).attr('fill', 'none').append('title').text(what);
  } else {
    let d = '';
    for (const v of xs) d += suspensionMark(x(v), y0 - 16);
    g.append('path').attr('d', d).attr('fill', '#ffffff').attr('fill-opacity', 0.8).attr('stroke', INK.suspension).attr('stroke-width', 1.3).append('title').text(what);
  }
}
