/**
 * Probability plot of the data on the selected candidate's linearising scale, with the fitted
 * model as a line and the core's pointwise band around it. A model that describes the data puts
 * the points along the line and mostly inside the band. The horizontal axis is labelled in data
 * units even when it is drawn on ln x; the vertical axis in probabilities (or, for a Q–Q plot,
 * in fitted quantiles).
 */
import { area, axisBottom, axisLeft, extent, scaleLinear, scaleLog } from 'd3';
import type { ProbabilityPlotEvidence } from '../src/types.js';
import { axisLabel, sig } from '../src/format.js';
import { createFrame, drawEmpty, drawGrid, drawXAxis, drawYAxis, fitYAxis, nextId, pathThrough } from './frame.js';
import { type LegendItem } from './legend.js';
import { drawTimeMarks } from './marks.js';
import { round, textWidth } from './text.js';
import type { ChartOptions } from './options.js';
import { INK, styleFor } from './palette.js';

export interface ProbabilityChartData {
  readonly plot: ProbabilityPlotEvidence;
  readonly family: string;
  readonly label: string;
}

function finite(values: readonly (number | null)[]): number[] {
  const out: number[] = [];
  for (const v of values) if (v !== null && Number.isFinite(v)) out.push(v);
  return out;
}

function probabilityText(p: number): string {
  const pct = p * 100;
  if (pct >= 1 && pct <= 99) return `${Number(pct.toPrecision(3))}%`;
  return `${Number(pct.toPrecision(2))}%`;
}

/**
 * Log-axis ticks at least `minGap` px apart: leading digit 1 first, then 2 and 5, then the rest,
 * each kept only if it is far enough from those already kept.
 */
export function spacedLogTicks(values: readonly number[], at: (v: number) => number, minGap: number): number[] {
  const lead = (v: number) => Number(v.toExponential().charAt(0));
  const classes = [(d: number) => d === 1, (d: number) => d === 2 || d === 5, (d: number) => d !== 1 && d !== 2 && d !== 5];
  const kept: number[] = [];
  for (const inClass of classes) {
    for (const v of values) {
      if (!inClass(lead(v))) continue;
      if (kept.every((k) => Math.abs(at(k) - at(v)) >= minGap)) kept.push(v);
    }
  }
  return kept.sort((a, b) => a - b);
}

export function probabilityPlotChart(container: Element, data: ProbabilityChartData, options: ChartOptions): SVGSVGElement {
  const quantity = options.quantity ?? 'Value';
  const p = data.plot;
  const style = styleFor(data.family);
  const qq = p.scale === 'quantile-quantile';
  const censored = p.suspensions.length > 0;
  const title = qq ? `Do the points stay on the ${data.label} quantile line?` : `Do the points stay on the ${data.label} line?`;
  const description =
    `${p.total} ${censored ? 'failures' : 'ordered values'} plotted at ${p.plottingPosition.name} positions ${p.plottingPosition.formula}` +
    `${p.thinned ? ` (thinned to ${p.points.x.length} for drawing)` : ''}. ` +
    (p.suspensions.length > 0 ? `Suspensions have no plotting position; they are marked by time as open triangles along the bottom. ` : '') +
    `The line is the fitted ${data.label} model; the band: ${p.band.description}` +
    (p.omitted > 0 ? ` ${p.omitted} values could not be placed on this scale and are left out.` : '');
  const items: LegendItem[] = [
    { key: 'data', label: censored ? 'Failures' : 'Observed (ordered)', kind: 'point' },
    ...(p.suspensions.length > 0 ? [{ key: 'suspension', label: 'Suspensions (time only)', kind: 'suspension' } as const] : []),
    { key: data.family, label: `${data.label} fit`, kind: 'line', emphasis: true },
    { key: data.family, label: `${Math.round(p.band.level * 100)}% pointwise band`, kind: 'band' },
  ];
  const frame = createFrame(container, options, title, description, { legend: items });
  const xs = [...p.points.x, ...finite(p.fittedLine.x), ...finite(p.band.lower), ...finite(p.band.upper)].filter(Number.isFinite);
  const ys = [...p.points.y, ...p.fittedLine.y, ...p.band.y].filter(Number.isFinite);
  if (p.points.x.length === 0 || xs.length === 0 || ys.length === 0) {
    drawEmpty(frame, 'No points can be drawn on this scale.');
    return frame.svg.node()!;
  }
  // The band spreads far at the extremes; keep the x domain to the points and suspension marks
  // (plus a margin) so the data stay readable, and clip the band.
  const [px0, px1] = extent([...p.points.x, ...p.suspensions]) as [number, number];
  const padX = (px1 - px0) * 0.08 || Math.abs(px0) * 0.1 || 1;
  const [y0, y1] = extent(ys) as [number, number];
  const padY = (y1 - y0) * 0.04 || 1;
  const y = scaleLinear().domain([y0 - padY, y1 + padY]).range([frame.innerHeight, 0]);
  let yAxis;
  if (qq) yAxis = axisLeft(y).ticks(6);
  else {
    const shown = p.probabilityTicks.filter((t) => t.y >= y.domain()[0]! && t.y <= y.domain()[1]!);
    // Drop ticks that would collide (closer than 14 px).
    const kept: typeof shown = [];
    for (const t of shown) {
      const last = kept[kept.length - 1];
      if (!last || Math.abs(y(t.y) - y(last.y)) >= 14) kept.push(t);
    }
    const byY = new Map(kept.map((t) => [t.y, t.p]));
    yAxis = axisLeft(y)
      .tickValues(kept.map((t) => t.y))
      .tickFormat((v) => probabilityText(byY.get(Number(v)) ?? Number.NaN));
  }
  fitYAxis(frame, yAxis);
  const x = scaleLinear().domain([px0 - padX, px1 + padX]).range([0, frame.innerWidth]);

  // Grid at the probability ticks (or the quantile ticks for a Q–Q plot).
  const ticks = qq ? y.ticks(6) : p.probabilityTicks.filter((t) => t.y >= y.domain()[0]! && t.y <= y.domain()[1]!).map((t) => t.y);
  drawGrid(frame, ticks.map((t) => y(t)));

  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);

  const bandRows = p.band.y.map((yy, i) => ({ y: yy, lo: p.band.lower[i] ?? null, hi: p.band.upper[i] ?? null }));
  const bandPath = area<{ y: number; lo: number | null; hi: number | null }>()
    .defined((r) => r.lo !== null && r.hi !== null && Number.isFinite(r.lo) && Number.isFinite(r.hi) && Number.isFinite(r.y))
    .y((r) => round(y(r.y)))
    .x0((r) => round(x(r.lo as number)))
    .x1((r) => round(x(r.hi as number)))(bandRows);
  g.append('path')
    .attr('data-kind', 'band')
    .attr('d', bandPath ?? '')
    .attr('fill', style.colour)
    .attr('fill-opacity', 0.2)
    .attr('stroke', 'none')
    .append('title')
    .text(p.band.description);

  const line = p.fittedLine.x.map((xv, i) => [x(xv), y(p.fittedLine.y[i] ?? Number.NaN)] as const);
  g.append('path').attr('data-kind', 'fitted-line').attr('d', pathThrough(line)).attr('fill', 'none').attr('stroke', style.colour).attr('stroke-width', 2.5);

  const r = p.points.x.length > 400 ? 1.6 : 2.6;
  const pts = g.append('g').attr('fill', INK.data).attr('fill-opacity', 0.85);
  p.points.x.forEach((xv, i) => {
    const yv = p.points.y[i];
    if (yv === undefined || !Number.isFinite(xv) || !Number.isFinite(yv)) return;
    pts.append('circle').attr('data-kind', 'point').attr('cx', round(x(xv))).attr('cy', round(y(yv))).attr('r', r);
  });
  if (p.suspensions.length > 0) drawTimeMarks(frame, p.suspensions, x, 'suspension', `${p.suspensions.length} suspensions: units still running at these times (no plotting position)`);

  // x axis: in data units. On an ln scale, ticks are nice data values placed at ln(value).
  const xLabel = axisLabel(p.xTransform === 'ln' ? `${quantity} (log scale)` : quantity, options.units);
  if (p.xTransform === 'ln') {
    const d = x.domain() as [number, number];
    const lg = scaleLog().domain([Math.exp(d[0]), Math.exp(d[1])]);
    // Enough significant figures that neighbouring labels differ (a narrow range such as
    // 24.995 to 25.010 needs five), and ticks far enough apart for their widest label.
    let gap = 46;
    let thin = spacedLogTicks(lg.ticks(12), (v) => x(Math.log(v)), gap);
    let digits = 3;
    for (let pass = 0; pass < 3; pass++) {
      digits = 3;
      while (digits < 10 && new Set(thin.map((v) => sig(v, digits))).size < thin.length) digits++;
      const need = Math.max(0, ...thin.map((v) => textWidth(sig(v, digits), 11))) + 10;
      if (need <= gap) break;
      gap = need;
      thin = spacedLogTicks(lg.ticks(12), (v) => x(Math.log(v)), gap);
    }
    const axis = axisBottom(x)
      .tickValues(thin.map((v) => Math.log(v)))
      .tickFormat((v) => sig(Math.exp(Number(v)), digits));
    drawXAxis(frame, axis, xLabel);
  } else {
    drawXAxis(frame, axisBottom(x).ticks(Math.max(3, Math.floor(frame.innerWidth / 80))), xLabel);
  }
  drawYAxis(frame, yAxis, qq ? axisLabel(`Fitted ${data.label} quantile`, options.units) : 'Cumulative probability');
  return frame.svg.node()!;
}
