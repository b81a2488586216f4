/**
 * Capability picture: the data's histogram (the selected model's bins, from the core's evidence)
 * and the fitted densities, with the tolerance drawn as what it means: everything beyond a
 * specification limit is a shaded out-of-tolerance region, and the share the selected model puts
 * there (ppm, computed by the core) is written inside it. The target is a dashed line named in the
 * legend. The range always shows both limits with room for their regions.
 */
import { axisBottom, axisLeft, max as d3max, scaleLinear } from 'd3';
import type { FittedCurves, HistogramEvidence } from '../src/types.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, nextId } from './frame.js';
import { type LegendItem } from './legend.js';
import { drawFittedCurves } from './marks.js';
import { round, textWidth } from './text.js';
import type { ChartOptions } from './options.js';
import { INK } from './palette.js';

export interface CapabilityHistogramData {
  readonly histogram: HistogramEvidence;
  readonly densities: FittedCurves;
  readonly lsl: number | null;
  readonly usl: number | null;
  readonly target: number | null;
  readonly dataMin: number;
  readonly dataMax: number;
  readonly selected: string;
  /** The selected model's expected parts per million beyond each limit (core/capability), when known. */
  readonly ppm?: { readonly belowLsl: number; readonly aboveUsl: number; readonly total: number } | null;
}

/** A ppm figure in words: whole numbers from 10 up, 3 significant figures below, '< 0.001' for less. */
export function ppmText(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  if (v >= 10) return `${Math.round(v).toLocaleString('en-US')} ppm`;
  if (v >= 0.001) return `${sig(v, 3)} ppm`;
  return v === 0 ? '0 ppm' : '< 0.001 ppm';
}

export function capabilityHistogramChart(container: Element, data: CapabilityHistogramData, options: ChartOptions): SVGSVGElement {
  const title = 'How much of the fitted spread falls outside the tolerance?';
  const ppm = data.ppm ?? null;
  const description =
    'Histogram of the measurements (bar area = share) and the fitted densities; shaded regions lie outside the specification limits' +
    (ppm ? `, each with the parts per million the selected model puts there (total ${ppmText(ppm.total)}).` : '.') +
    (data.target !== null ? ` Dashed line: target ${sig(data.target, 6)}.` : '');
  const items: LegendItem[] = [{ key: 'data', label: 'Measured (bar area = share)', kind: 'bar' }];
  if (data.lsl !== null || data.usl !== null) items.push({ key: 'outside', label: 'Outside tolerance', kind: 'region' });
  if (data.target !== null) items.push({ key: 'target', label: `Target ${sig(data.target, 6)}`, kind: 'reference', style: { colour: INK.outsideEdge, dash: '5 3', pattern: 'dashes' } });
  for (const c of data.densities.curves) items.push({ key: c.family, label: `${c.label}${c.family === data.selected ? ' (selected)' : ''}`, kind: 'line', emphasis: c.family === data.selected });
  const frame = createFrame(container, options, title, description, { legend: items });
  const limits = [data.lsl, data.usl, data.target].filter((v): v is number => v !== null);
  let lo = Math.min(data.dataMin, ...limits);
  let hi = Math.max(data.dataMax, ...limits);
  const span = hi - lo || Math.abs(lo) * 0.1 || 1;
  // Room beyond each limit for its shaded region and the words in it.
  lo -= span * (data.lsl !== null && data.lsl <= data.dataMin + span * 0.1 ? 0.16 : 0.06);
  hi += span * (data.usl !== null && data.usl >= data.dataMax - span * 0.1 ? 0.16 : 0.06);
  const bars = data.histogram.bars;
  const sel = data.densities.curves.find((c) => c.family === data.selected);
  const top = Math.max(d3max(bars, (b) => b.density) ?? 0, d3max(sel?.y ?? [], (v) => v ?? 0) ?? 0) * 1.12 || 1;
  const y = scaleLinear().domain([0, top]).range([frame.innerHeight, 0]).nice();
  const yAxis = axisLeft(y).ticks(5);
  fitYAxis(frame, yAxis);
  const x = scaleLinear().domain([lo, hi]).range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(5).map((t) => y(t)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);

  // Out-of-tolerance regions under everything else.
  const region = (from: number, to: number, name: string, limit: number, share: number | null, side: 'below' | 'above'): void => {
    const x0 = round(x(from));
    const x1 = round(x(to));
    const w = Math.max(0, x1 - x0);
    const g = frame.plot.append('g').attr('data-kind', 'out-of-spec');
    g.append('rect').attr('x', x0).attr('y', 0).attr('width', w).attr('height', frame.innerHeight).attr('fill', INK.outside).attr('fill-opacity', 0.55)
      .append('title').text(`${side === 'below' ? 'Below' : 'Above'} ${name} ${sig(limit, 6)}${share !== null ? `: ${ppmText(share)} under the selected model` : ''}`);
    const edge = side === 'below' ? x1 : x0;
    g.append('line').attr('data-kind', 'limit').attr('x1', edge).attr('x2', edge).attr('y1', 0).attr('y2', frame.innerHeight).attr('stroke', INK.outsideEdge).attr('stroke-width', 1.5);
    const lines = [`${name} ${sig(limit, 6)}`, ...(share !== null ? [ppmText(share)] : [])];
    const wide = Math.max(...lines.map((l) => textWidth(l, 11)));
    const t = g.append('text').attr('data-kind', 'region-label').attr('font-size', 11).attr('fill', INK.outsideText);
    if (wide + 8 <= w) {
      // Horizontal, at the top of the region, against the limit.
      const tx = side === 'below' ? edge - 4 : edge + 4;
      t.attr('text-anchor', side === 'below' ? 'end' : 'start');
      lines.forEach((l, i) => t.append('tspan').attr('x', round(tx)).attr('y', 14 + i * 14).attr('font-weight', i === 0 ? 600 : 400).text(l));
    } else {
      // Narrow region: one line read upwards along the limit, inside the region, set smaller when
      // the plot is too short for it.
      const text = lines.join(': ');
      const size = Math.max(8, Math.min(11, (11 * (frame.innerHeight - 12)) / textWidth(text, 11, true)));
      const tx = side === 'below' ? edge - 5 : edge + 4 + size;
      t.attr('text-anchor', 'end').attr('font-size', round(size)).attr('transform', `translate(${round(tx)},6) rotate(-90)`).attr('font-weight', 600).text(text);
    }
  };
  if (data.lsl !== null) region(lo, data.lsl, 'LSL', data.lsl, ppm ? ppm.belowLsl : null, 'below');
  if (data.usl !== null) region(data.usl, hi, 'USL', data.usl, ppm ? ppm.aboveUsl : null, 'above');

  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  for (const b of bars) {
    const x0 = x(Math.max(b.lower, lo));
    const x1 = x(Math.min(b.upper, hi));
    g.append('rect').attr('data-kind', 'bar').attr('x', round(x0)).attr('y', round(y(b.density))).attr('width', round(Math.max(0, x1 - x0)))
      .attr('height', round(Math.max(0, y(0) - y(b.density)))).attr('fill', INK.barFill).attr('stroke', INK.barStroke).attr('fill-opacity', 0.9);
  }
  const curves = [...data.densities.curves].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected));
  drawFittedCurves(g.append('g').attr('fill', 'none'), data.densities.x, curves, data.selected, x, y, 'fitted density');
  if (data.target !== null) {
    const px = round(x(data.target));
    frame.plot.append('line').attr('data-kind', 'target').attr('x1', px).attr('x2', px).attr('y1', 0).attr('y2', frame.innerHeight).attr('stroke', INK.outsideEdge).attr('stroke-width', 1.2).attr('stroke-dasharray', '5 3')
      .append('title').text(`Target ${sig(data.target, 6)}`);
  }
  drawXAxis(frame, axisBottom(x).ticks(Math.max(3, Math.floor(frame.innerWidth / 90))), axisLabel(options.quantity ?? 'Value', options.units));
  drawYAxis(frame, yAxis, options.units.trim() ? `Density [per ${options.units.trim()}]` : 'Density');
  return frame.svg.node()!;
}
