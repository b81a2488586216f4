/**
 * Stability chart: the characteristic in time (or subgroup) order with its centre line and 3-sigma
 * limits, in the upper panel; the moving ranges or subgroup standard deviations with theirs, in the
 * lower panel (one frame, two panels sharing the x positions). Points beyond a limit are drawn as a
 * hollow brown ring and carry a title saying which limit they cross. A point that completes a run
 * (Western Electric Statistical Quality Control Handbook, 1956, rules 2-4: core/capability
 * run-rules.ts) is drawn as a filled teal diamond whose title names the rule in words; with any run
 * signal, the location panel also shows the faint 1- and 2-sigma lines the rules count in. A legend
 * says what each mark means. Everything comes from the core's StabilityChart (core/capability
 * control-chart.ts); nothing is computed here but positions.
 */
import { scaleLinear } from 'd3';
import { RUN_RULE_WORDS } from '../../core/capability/run-rules.js';
import type { ChartPanel, ChartPoint, StabilityChart } from '../../core/index.js';
import { sig } from '../src/format.js';
import { axisBottom, axisLeft, createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, pathThrough, type Frame, type Group } from './frame.js';
import { runSignalMark, type LegendItem } from './legend.js';
import type { ChartOptions } from './options.js';
import { INK } from './palette.js';
import { round, textWidth } from './text.js';

const GAP = 34;
/** Two panels of at least about 90 px each, however long the legend and notes in a narrow slot. */
const PLOT_MIN = 2 * 90 + GAP;

function yScale(p: ChartPanel, top: number, bottom: number) {
  const values = p.points.flatMap((q) => [q.value, q.lower, q.upper]).filter(Number.isFinite);
  return scaleLinear().domain([Math.min(...values), Math.max(...values)]).nice().range([bottom, top]);
}

/** What a point's marks mean, for its title: the limit it crosses, the run rules it completes. */
function pointText(q: ChartPoint): string {
  const parts: string[] = [];
  if (q.beyond !== null) parts.push(`${q.beyond} the ${q.beyond === 'above' ? 'upper' : 'lower'} limit ${sig(q.beyond === 'above' ? q.upper : q.lower)} (rule 1: a point beyond 3 sigma)`);
  for (const k of q.runRules ?? []) parts.push(`completes rule ${k}: ${RUN_RULE_WORDS[k]}`);
  return `${q.label}: ${sig(q.value)}${parts.length > 0 ? ` — ${parts.join('; ')}` : ''}`;
}

/** The centre ± k·sigma of each point, sigma of its statistic read from its 3-sigma limits. */
function zoneLine(p: ChartPanel, k: number, x: (i: number) => number, y: (v: number) => number): string {
  return pathThrough(p.points.map((q, i) => [x(i), y(p.center + (k * (q.upper - p.center)) / 3)] as const));
}

function drawPanel(frame: Frame, g: Group, p: ChartPanel, y: ReturnType<typeof yScale>, x: (i: number) => number): void {
  if (p.points.some((q) => (q.runRules?.length ?? 0) > 0)) {
    // the zones the run rules count in: 1 and 2 sigma of the plotted statistic on each side
    for (const k of [-2, -1, 1, 2]) {
      g.append('path').attr('data-kind', 'zone').attr('d', zoneLine(p, k, x, y)).attr('fill', 'none').attr('stroke', INK.zone).attr('stroke-width', 1).attr('stroke-dasharray', '1 3');
    }
  }
  for (const side of ['lower', 'upper'] as const) {
    g.append('path').attr('data-kind', `limit-${side}`).attr('d', pathThrough(p.points.map((q, i) => [x(i), y(q[side])] as const)))
      .attr('fill', 'none').attr('stroke', INK.reference).attr('stroke-dasharray', '6 3').attr('stroke-width', 1.2);
  }
  g.append('line').attr('data-kind', 'centre').attr('x1', 0).attr('x2', round(frame.innerWidth)).attr('y1', round(y(p.center))).attr('y2', round(y(p.center))).attr('stroke', INK.muted).attr('stroke-width', 1);
  g.append('path').attr('data-kind', 'series').attr('d', pathThrough(p.points.map((q, i) => [x(i), y(q.value)] as const))).attr('fill', 'none').attr('stroke', INK.data).attr('stroke-width', 1);
  p.points.forEach((q, i) => {
    const out = q.beyond !== null;
    const run = (q.runRules?.length ?? 0) > 0;
    const cx = round(x(i));
    const cy = round(y(q.value));
    if (out) {
      g.append('circle').attr('data-kind', 'beyond').attr('cx', cx).attr('cy', cy).attr('r', 4.5).attr('fill', 'none').attr('stroke', INK.reference).attr('stroke-width', 2).append('title').text(pointText(q));
    }
    if (run) {
      // drawn over the ring when a point does both, so each mark keeps its own meaning
      g.append('path').attr('data-kind', 'run-signal').attr('data-rules', (q.runRules ?? []).join(' ')).attr('d', runSignalMark(cx, cy)).attr('fill', INK.signal).attr('stroke', INK.signal).attr('stroke-width', 1).append('title').text(pointText(q));
    }
    if (!out && !run) {
      g.append('circle').attr('data-kind', 'point').attr('cx', cx).attr('cy', cy).attr('r', 2.2).attr('fill', INK.data).attr('stroke', INK.data).attr('stroke-width', 1).append('title').text(pointText(q));
    }
  });
}

/** The legend: the plain point always; the ring, the diamond and the zone lines only when drawn. */
function legendItems(chart: StabilityChart): LegendItem[] {
  const all = [...chart.location.points, ...chart.dispersion.points];
  const items: LegendItem[] = [{ key: 'point', label: chart.kind === 'individuals and moving range' ? 'value' : 'subgroup statistic', kind: 'point' }];
  if (all.some((q) => q.beyond !== null)) items.push({ key: 'beyond', label: 'beyond a 3σ limit (rule 1)', kind: 'beyond' });
  if (all.some((q) => (q.runRules?.length ?? 0) > 0)) {
    items.push({ key: 'run-signal', label: 'ends a run (rules 2–4, below)', kind: 'run-signal' });
    items.push({ key: 'zone', label: '1σ and 2σ lines', kind: 'zone' });
  }
  return items;
}

/** A note naming, in words, each run rule that some point completes (none: no note). */
function runRulesNote(chart: StabilityChart): string | null {
  const rules = [...new Set([...chart.location.points, ...chart.dispersion.points].flatMap((q) => q.runRules ?? []))].sort();
  if (rules.length === 0) return null;
  return `Diamonds end a run (Western Electric rules, 1956): ${rules.map((k) => `rule ${k}, ${RUN_RULE_WORDS[k]}`).join('; ')}.`;
}

export function controlChart(container: Element, chart: StabilityChart, options: ChartOptions): SVGSVGElement {
  const scale = chart.scale && chart.scale !== 'original' ? `, ${chart.scale} scale` : '';
  const individuals = chart.kind === 'individuals and moving range';
  const what = individuals ? 'Individual values and moving ranges' : chart.kind === 'subgroup means and ranges' ? 'Subgroup means and ranges' : 'Subgroup means and standard deviations';
  const title = `Is the process stable? ${what}${scale}`;
  const description = `Upper panel: each ${chart.location.statistic} in order with its centre line and dashed 3-sigma limits; lower panel: each ${chart.dispersion.statistic} with its limits. Hollow rings mark points beyond a limit; filled diamonds mark points that end a run (Western Electric rules 2-4). ${chart.statement}`;
  const runs = runRulesNote(chart);
  const notes = [`Limits: ${chart.source}. Sigma ${sig(chart.sigma)} from ${chart.sigmaMethod}.`, ...(runs ? [runs] : [])];
  const frame = createFrame(container, options, title, description, { legend: legendItems(chart), notes, minPlotHeight: PLOT_MIN });
  const half = (frame.innerHeight - GAP) / 2;
  const yTop = yScale(chart.location, 0, half);
  const yBottom = yScale(chart.dispersion, half + GAP, frame.innerHeight);
  // Ticks at least 18 px apart in each panel (a short panel gets fewer), so labels never touch.
  const topTicks = spacedTicks(yTop, 4, 18);
  const bottomTicks = spacedTicks(yBottom, 3, 18);
  const axTop = axisLeft(yTop).tickValues(topTicks).tickFormat(yTop.tickFormat(4));
  const axBottom = axisLeft(yBottom).tickValues(bottomTicks).tickFormat(yBottom.tickFormat(3));
  // the left margin fits the wider of the two panels' tick labels
  const wider = Math.max(...topTicks.map((t) => textWidth(yTop.tickFormat(4)(t), 11))) >= Math.max(...bottomTicks.map((t) => textWidth(yBottom.tickFormat(3)(t), 11))) ? axTop : axBottom;
  fitYAxis(frame, wider);
  const n = chart.location.points.length;
  const x = scaleLinear().domain([0, Math.max(1, n - 1)]).range([0, frame.innerWidth]);
  const xi = (i: number): number => x(i);
  drawGrid(frame, [...topTicks.map((t) => yTop(t)), ...bottomTicks.map((t) => yBottom(t))]);
  const u = options.units && !scale ? ` (${options.units})` : '';
  drawYAxis(frame, axTop, `${chart.location.statistic}${u}`);
  const lower = frame.plot.append('g').attr('data-kind', 'y-axis').attr('aria-hidden', 'true').attr('font-size', 11);
  lower.call(axBottom);
  frame.plot.append('text').attr('data-kind', 'panel-title').attr('x', 0).attr('y', round(half + GAP - 8)).attr('font-size', 12).text(`↑ ${chart.dispersion.statistic}`);
  const labels = chart.location.points.map((p) => String(p.label));
  const step = Math.max(1, Math.ceil(n / 10));
  const xAxis = axisBottom(x).tickValues(Array.from({ length: Math.ceil(n / step) }, (_, k) => k * step)).tickFormat((i) => labels[Math.round(Number(i))] ?? '');
  drawXAxis(frame, xAxis, individuals ? (chart.orderFrom === 'order column' ? 'Order (order column)' : 'Row') : 'Subgroup');
  // the dispersion panel of individuals charts starts at the second value
  const offset = chart.dispersion.points.length < n ? 1 : 0;
  drawPanel(frame, frame.plot.append('g').attr('data-panel', 'location') as Group, chart.location, yTop, xi);
  drawPanel(frame, frame.plot.append('g').attr('data-panel', 'dispersion') as Group, chart.dispersion, yBottom, (i) => xi(i + offset));
  return frame.svg.node() as SVGSVGElement;
}

/** The scale's ticks (about `count`), every k-th kept so that neighbours are at least `minPx` apart. */
function spacedTicks(y: { ticks(count: number): number[]; (v: number): number }, count: number, minPx: number): number[] {
  const all = y.ticks(count);
  if (all.length < 2) return all;
  const gap = Math.abs(y(all[1] as number) - y(all[0] as number));
  const every = Math.max(1, Math.ceil(minPx / Math.max(gap, 1e-9)));
  return all.filter((_, i) => i % every === 0);
}
