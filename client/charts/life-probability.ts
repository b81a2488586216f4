/**
 * Life-data probability plot: failures at suspension-aware plotting positions (the core's
 * Johnson–Benard or Kaplan–Meier positions) on a Weibull (ln(-ln(1 - F))) or lognormal (Φ⁻¹(F))
 * scale against ln t, with the core's pointwise band as whiskers and each candidate's fitted line.
 * Everything drawn was computed by the core; this only draws.
 */
import { axisBottom, axisLeft, scaleLinear, scaleLog } from 'd3';
import type { LifeSection } from '../../core/index.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, keepApart, nextId, pathThrough } from './frame.js';
import { type LegendItem } from './legend.js';
import { round } from './text.js';
import type { ChartOptions } from './options.js';
import { INK, styleFor } from './palette.js';

export type LifeScale = 'weibull' | 'lognormal';

export interface LifeProbabilityData {
  readonly plot: LifeSection['plot'];
  readonly curves: LifeSection['curves'];
  readonly labels: Readonly<Record<string, string>>;
  readonly scale: LifeScale;
  readonly selected: string;
  readonly suspensions: number;
}

/** 1-2-5 ticks over a positive range (at least the decades). */
export function logTicks([lo, hi]: readonly [number, number]): number[] {
  const out: number[] = [];
  for (let d = Math.floor(Math.log10(lo)); d <= Math.ceil(Math.log10(hi)); d++) {
    for (const m of [1, 2, 5]) {
      const v = m * 10 ** d;
      if (v >= lo && v <= hi) out.push(Number(v.toPrecision(3)));
    }
  }
  return out;
}

const PERCENTS = [0.1, 0.5, 1, 2, 5, 10, 20, 30, 50, 70, 90, 99];

/** F on the chosen scale (tick positions only; the points come from the core). */
function scaleY(F: number, scale: LifeScale): number {
  if (scale === 'weibull') return Math.log(-Math.log1p(-F));
  // Φ⁻¹ for tick placement only: Acklam's rational approximation is ample for placing a tick label.
  return probit(F);
}

function probit(p: number): number {
  const a = [-39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716, 2.506628277459239];
  const b = [-54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572];
  const c = [-0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];
  const lo = 0.02425;
  if (p < lo) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (((((c[0]! * q + c[1]!) * q + c[2]!) * q + c[3]!) * q + c[4]!) * q + c[5]!) / ((((d[0]! * q + d[1]!) * q + d[2]!) * q + d[3]!) * q + 1);
  }
  if (p > 1 - lo) return -probit(1 - p);
  const q = p - 0.5;
  const r = q * q;
  return ((((((a[0]! * r + a[1]!) * r + a[2]!) * r + a[3]!) * r + a[4]!) * r + a[5]!) * q) / (((((b[0]! * r + b[1]!) * r + b[2]!) * r + b[3]!) * r + b[4]!) * r + 1);
}

export function lifeProbabilityChart(container: Element, data: LifeProbabilityData, options: ChartOptions): SVGSVGElement {
  const scaleName = data.scale === 'weibull' ? 'Weibull' : 'lognormal';
  const title = `Do the failures follow the lines on ${scaleName} paper?`;
  const description =
    `Each failure at its plotting position (${data.plot.description}); ${data.suspensions} suspended units are not plotted but move the positions of later failures. ` +
    `Whiskers: pointwise ${Math.round(data.plot.bandLevel * 100)} % band. Lines: fitted models.`;
  const pts = data.plot[data.scale];
  // No points (interval rows: each failure is known only within its interval): the legend says so instead of "Failures (0)".
  const items: LegendItem[] = pts.length > 0 ? [{ key: 'data', label: `Failures (${pts.length})`, kind: 'point' }] : [];
  for (const c of data.curves) items.push({ key: c.family, label: `${data.labels[c.family] ?? c.family}${c.family === data.selected ? ' (selected)' : ''}`, kind: 'line', emphasis: c.family === data.selected });
  const frame = createFrame(container, options, title, description, {
    legend: items,
    ...(pts.length === 0 ? { notes: ['No failure is plotted: none has a point on the paper here (a failure known only within an inspection interval is drawn as a Turnbull box in the recorded-life section).'] } : {}),
  });
  const xs = [...pts.map((p) => p.x), ...data.curves.flatMap((c) => c.time.map((t) => Math.log(t)))];
  const ysPts = pts.flatMap((p) => [p.yLower, p.yUpper, p.y]).filter(Number.isFinite);
  const y0 = Math.min(...ysPts, scaleY(0.01, data.scale));
  const y1 = Math.max(...ysPts, scaleY(0.9, data.scale));
  const y = scaleLinear().domain([y0, y1]).range([frame.innerHeight, 0]);
  const ticks: number[] = [];
  for (const p of PERCENTS) {
    const at = y(scaleY(p / 100, data.scale));
    if (scaleY(p / 100, data.scale) < y0 || scaleY(p / 100, data.scale) > y1) continue;
    if (ticks.length === 0 || Math.abs(at - y(scaleY(ticks[ticks.length - 1]! / 100, data.scale))) >= 14) ticks.push(p);
  }
  const yAxis = axisLeft(y).tickValues(ticks.map((p) => scaleY(p / 100, data.scale))).tickFormat((_v, i) => `${ticks[i]} %`);
  fitYAxis(frame, yAxis);
  const x = scaleLog().domain([Math.exp(Math.min(...xs)), Math.exp(Math.max(...xs))]).range([0, frame.innerWidth]);
  drawGrid(frame, ticks.map((p) => y(scaleY(p / 100, data.scale))));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  for (const c of [...data.curves].sort((a, b) => Number(a.family === data.selected) - Number(b.family === data.selected))) {
    const s = styleFor(c.family);
    const emph = c.family === data.selected;
    const ys = data.scale === 'weibull' ? c.weibullY : c.lognormalY;
    g.append('path')
      .attr('data-kind', 'curve')
      .attr('data-family', c.family)
      .attr('d', pathThrough(c.time.map((t, i) => [x(t), Number.isFinite(ys[i]!) ? y(ys[i]!) : Number.NaN] as const)))
      .attr('fill', 'none')
      .attr('stroke', s.colour)
      .attr('stroke-width', emph ? 3 : 1.5)
      .attr('stroke-dasharray', s.dash || null);
  }
  pts.forEach((p, i) => {
    const px = round(x(Math.exp(p.x)));
    if (Number.isFinite(p.yLower) && Number.isFinite(p.yUpper)) {
      g.append('line').attr('data-kind', 'band').attr('x1', px).attr('x2', px).attr('y1', round(y(p.yLower))).attr('y2', round(y(p.yUpper))).attr('stroke', INK.barStroke).attr('stroke-width', 1);
    }
    const pp = data.plot.points[i];
    g.append('circle').attr('data-kind', 'point').attr('cx', px).attr('cy', round(y(p.y))).attr('r', 3.5).attr('fill', INK.data)
      .append('title').text(pp ? `Failure at ${sig(pp.time)} ${options.units}: F = ${sig(pp.F, 3)} (band ${sig(pp.lower, 3)} to ${sig(pp.upper, 3)})` : '');
  });
  const xt = keepApart(logTicks(x.domain() as [number, number]), (v) => x(v), (v) => sig(v, 3));
  drawXAxis(frame, axisBottom(x).tickValues(xt).tickFormat((v) => sig(Number(v), 3)), `${axisLabel(options.quantity ?? 'Time', options.units)} (log scale)`);
  drawYAxis(frame, yAxis, 'Fraction failed');
  return frame.svg.node()!;
}
