/**
 * L-moment ratio diagram: L-skewness τ3 (x) against L-kurtosis τ4 (y), each three-parameter
 * family's curve, the two-parameter families as marked points, the bound below which no
 * distribution lies, and the sample's point. All coordinates come from the core (ratioDiagram);
 * the chart only draws them. Reading: the family whose curve passes nearest the sample's point
 * describes the sample's shape best (Hosking & Wallis 1997 §2.5).
 */
import { axisBottom, axisLeft, scaleLinear } from 'd3';
import type { RatioDiagram } from '../../core/index.js';
import { createFrame, drawGrid, drawXAxis, drawYAxis, fitYAxis, nextId, pathThrough } from './frame.js';
import type { LegendItem } from './legend.js';
import type { ChartOptions } from './options.js';
import { INK, styleFor } from './palette.js';
import { round } from './text.js';

function style(family: string) {
  if (family === 'bound') return { colour: INK.reference, dash: '3 3', pattern: 'dashes' };
  return styleFor(family);
}

export function lmomentDiagramChart(container: Element, data: RatioDiagram, options: ChartOptions): SVGSVGElement {
  const title = 'Which family has the shape of the sample? (L-moment ratios)';
  const items: LegendItem[] = [
    { key: 'sample', label: `this sample (n = ${data.sample.n})`, kind: 'point' },
    ...data.curves.map((c) => ({ key: c.family, label: c.label, kind: c.family === 'bound' ? ('reference' as const) : ('line' as const) })),
  ];
  const frame = createFrame(
    container,
    options,
    title,
    `L-skewness against L-kurtosis: the sample's point (τ3 = ${data.sample.t3.toFixed(3)}, τ4 = ${data.sample.t4.toFixed(3)}), the curves of four three-parameter families and the points of the normal, Gumbel, exponential and logistic distributions. A small sample's point scatters widely about its family's curve.`,
    { legend: items },
  );
  const x = scaleLinear().domain([-0.6, 0.9]).range([0, frame.innerWidth]);
  const y = scaleLinear().domain([-0.25, 0.8]).range([frame.innerHeight, 0]);
  const yAxis = axisLeft(y).ticks(6);
  fitYAxis(frame, yAxis);
  x.range([0, frame.innerWidth]);
  drawGrid(frame, y.ticks(6).map((t) => y(t)));
  const clipId = nextId('clip');
  frame.plot.append('clipPath').attr('id', clipId).append('rect').attr('width', frame.innerWidth).attr('height', frame.innerHeight);
  const g = frame.plot.append('g').attr('clip-path', `url(#${clipId})`);
  for (const c of data.curves) {
    const s = style(c.family);
    g.append('path').attr('data-kind', 'curve').attr('data-family', c.family)
      .attr('d', pathThrough(c.points.map((p) => [x(p.t3), y(p.t4)] as const)))
      .attr('fill', 'none').attr('stroke', s.colour).attr('stroke-width', c.family === 'bound' ? 1.2 : 1.8).attr('stroke-dasharray', s.dash || null)
      .append('title').text(c.label);
  }
  for (const p of data.points) {
    const px = round(x(p.t3));
    const py = round(y(p.t4));
    g.append('rect').attr('data-kind', 'family-point').attr('data-family', p.family).attr('x', px - 3.5).attr('y', py - 3.5).attr('width', 7).attr('height', 7)
      .attr('fill', INK.paper).attr('stroke', INK.text).append('title').text(`${p.label}: τ3 = ${p.t3.toFixed(4)}, τ4 = ${p.t4.toFixed(4)}`);
    // Neighbours alternate above and below their points so that the labels never touch: the normal
    // (0, 0.123) sits under the logistic (0, 0.167), the Gumbel (0.170, 0.150) between the logistic
    // and the exponential (0.333, 0.167), only about 45 px from each on a half-width chart.
    const below = p.family === 'normal' || p.family === 'gumbel';
    g.append('text').attr('data-kind', 'family-label').attr('x', px + 6).attr('y', below ? py + 14 : py - 5).attr('font-size', 10.5).attr('fill', INK.muted).text(p.label);
  }
  g.append('circle').attr('data-kind', 'sample').attr('cx', round(x(data.sample.t3))).attr('cy', round(y(data.sample.t4))).attr('r', 5).attr('fill', INK.data)
    .append('title').text(`this sample: τ3 = ${data.sample.t3.toFixed(4)}, τ4 = ${data.sample.t4.toFixed(4)} (n = ${data.sample.n})`);
  drawXAxis(frame, axisBottom(x).ticks(6), 'L-skewness τ3');
  drawYAxis(frame, yAxis, 'L-kurtosis τ4');
  return frame.svg.node()!;
}
