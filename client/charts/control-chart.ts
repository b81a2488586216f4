/**
 * Stability chart: the characteristic in time (or subgroup) order with its centre line and 3-sigma
 * limits, above; the moving ranges or subgroup standard deviations with theirs, below. Points beyond
 * a limit are drawn hollow and larger and carry a title saying which limit they cross. Everything
 * comes from the core's StabilityChart (core/capability control-chart.ts); nothing is computed here
 * but positions.
 */
import { axisBottom, axisLeft, scaleLinear, select } from 'd3';
import type { ChartPanel, StabilityChart } from '../../core/index.js';
import { sig } from '../src/format.js';
import type { ChartOptions } from './options.js';
import { INK } from './palette.js';

const r3 = (v: number): number => Math.round(v * 1000) / 1000;

function panel(
  g: ReturnType<typeof select<SVGGElement, unknown>>,
  p: ChartPanel,
  width: number,
  height: number,
  label: string,
): void {
  const pts = p.points;
  const values = pts.flatMap((q) => [q.value, q.lower, q.upper]).filter(Number.isFinite);
  const y = scaleLinear().domain([Math.min(...values), Math.max(...values)]).nice().range([height, 0]);
  const x = scaleLinear().domain([0, Math.max(1, pts.length - 1)]).range([0, width]);
  g.append('g').attr('transform', `translate(0,${height})`).call(axisBottom(x).ticks(Math.min(10, pts.length)).tickFormat((i) => String(pts[Math.round(Number(i))]?.label ?? '')));
  g.append('g').call(axisLeft(y).ticks(4));
  g.append('text').attr('x', 0).attr('y', -6).attr('font-size', 12).attr('fill', INK.text).text(label);
  // limits (they may vary by subgroup size: drawn as steps through each point's limits)
  for (const side of ['lower', 'upper'] as const) {
    const d = pts.map((q, i) => `${i === 0 ? 'M' : 'L'}${r3(x(i))},${r3(y(q[side]))}`).join('');
    g.append('path').attr('data-kind', `limit-${side}`).attr('d', d).attr('fill', 'none').attr('stroke', INK.reference).attr('stroke-dasharray', '6 3').attr('stroke-width', 1.2);
  }
  g.append('line').attr('data-kind', 'centre').attr('x1', 0).attr('x2', width).attr('y1', r3(y(p.center))).attr('y2', r3(y(p.center))).attr('stroke', INK.muted).attr('stroke-width', 1);
  g.append('path').attr('data-kind', 'series').attr('d', pts.map((q, i) => `${i === 0 ? 'M' : 'L'}${r3(x(i))},${r3(y(q.value))}`).join('')).attr('fill', 'none').attr('stroke', INK.data).attr('stroke-width', 1);
  pts.forEach((q, i) => {
    const out = q.beyond !== null;
    g.append('circle').attr('data-kind', out ? 'beyond' : 'point').attr('cx', r3(x(i))).attr('cy', r3(y(q.value))).attr('r', out ? 4.5 : 2.2)
      .attr('fill', out ? 'none' : INK.data).attr('stroke', out ? INK.reference : INK.data).attr('stroke-width', out ? 2 : 1)
      .append('title').text(`${q.label}: ${sig(q.value)}${out ? ` — ${q.beyond} the ${q.beyond === 'above' ? 'upper' : 'lower'} limit ${sig(q.beyond === 'above' ? q.upper : q.lower)}` : ''}`);
  });
}

export function controlChart(container: Element, chart: StabilityChart, options: ChartOptions): SVGSVGElement {
  const { width, height } = options;
  const m = { top: 36, right: 16, bottom: 28, left: 64 };
  const gap = 44;
  const innerW = width - m.left - m.right;
  const innerH = (height - m.top - m.bottom - gap) / 2;
  const svg = select(container).append('svg').attr('width', width).attr('height', height).attr('viewBox', `0 0 ${width} ${height}`).attr('role', 'img').attr('data-chart', 'control-chart');
  const scale = chart.scale && chart.scale !== 'original' ? ` (${chart.scale} scale)` : '';
  const title = `${chart.kind === 'individuals and moving range' ? 'Individual values and moving ranges' : 'Subgroup means and standard deviations'}${scale}`;
  svg.append('title').text(`${title}. ${chart.statement}`);
  svg.append('text').attr('x', m.left).attr('y', 16).attr('font-size', 14).attr('font-weight', 600).attr('fill', INK.text).text(title);
  const u = options.units ? ` (${options.units})` : '';
  const top = svg.append('g').attr('transform', `translate(${m.left},${m.top})`);
  panel(top, chart.location, innerW, innerH, `${chart.location.statistic}${scale ? '' : u}, centre ${sig(chart.location.center)}, 3-sigma limits dashed`);
  const bottom = svg.append('g').attr('transform', `translate(${m.left},${m.top + innerH + gap})`);
  panel(bottom, chart.dispersion, innerW, innerH, `${chart.dispersion.statistic}, centre ${sig(chart.dispersion.center)}`);
  return svg.node() as SVGSVGElement;
}
