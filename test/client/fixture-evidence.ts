/**
 * A small, hand-made evidence object for the chart snapshots (not computed by the core, so the
 * snapshots change only when the drawing code changes). Shapes follow core/evidence/types.ts.
 * The numbers are illustrative: 20 values, 4 equal-probability bins, two candidates.
 */
import type { Evidence, ProbabilityPlotEvidence } from '../../core/index.js';

const grid = Array.from({ length: 19 }, (_, i) => 10 + 5 * i);
// Illustrative curve shapes on the grid (hand-made, rounded to 4 decimals; not fits).
const r4 = (v: number) => Math.round(v * 1e4) / 1e4;
const bump = (x: number, m: number, s: number) => r4(Math.exp(-0.5 * ((x - m) / s) ** 2) / (s * Math.sqrt(2 * Math.PI)));
const ramp = (x: number, m: number, s: number) => r4(1 / (1 + Math.exp(-(x - m) / s)));
const plot = (scale: ProbabilityPlotEvidence['scale'], xTransform: 'identity' | 'ln'): ProbabilityPlotEvidence => {
  const xs = [12, 25, 33, 41, 47, 52, 58, 66, 79, 95];
  const x = xTransform === 'ln' ? xs.map(Math.log) : xs;
  const y = [-1.6, -1.0, -0.62, -0.3, 0, 0.3, 0.62, 1.0, 1.32, 1.6];
  return {
    scale,
    xTransform,
    xLabel: xTransform === 'ln' ? 'ln x' : 'x',
    yLabel: 'z = Φ⁻¹(p)',
    plottingPosition: { name: 'Blom', formula: '(i - 3/8)/(n + 1/4)', source: 'Blom (1958)' },
    points: { x, y, rank: xs.map((_, i) => i + 1) },
    fittedLine: { x: [x[0]! - 0.1, x[9]! + 0.1], y: [-1.7, 1.7] },
    band: {
      level: 0.95,
      y,
      lower: x.map((v, i) => (i === 0 ? null : v - 0.15)),
      upper: x.map((v) => v + 0.15),
      description: 'pointwise 95% band from Beta order-statistic quantiles',
    },
    probabilityTicks: [
      { p: 0.05, y: -1.645 },
      { p: 0.1, y: -1.2816 },
      { p: 0.5, y: 0 },
      { p: 0.9, y: 1.2816 },
      { p: 0.95, y: 1.645 },
    ],
    suspensions: [],
    thinned: false,
    total: 10,
    omitted: 0,
  };
};

const bars = [
  { lower: 5, upper: 35, lowerEdge: null, upperEdge: 35, openLower: true, openUpper: false, observed: 6, expected: 5 },
  { lower: 35, upper: 50, lowerEdge: 35, upperEdge: 50, openLower: false, openUpper: false, observed: 4, expected: 5 },
  { lower: 50, upper: 65, lowerEdge: 50, upperEdge: 65, openLower: false, openUpper: false, observed: 5, expected: 5 },
  { lower: 65, upper: 105, lowerEdge: 65, upperEdge: null, openLower: false, openUpper: true, observed: 5, expected: 5 },
].map((b) => ({ ...b, density: b.observed / (20 * (b.upper - b.lower)), expectedDensity: b.expected / (20 * (b.upper - b.lower)) }));

const rows = bars.map((b, index) => ({
  index,
  lower: b.lowerEdge,
  upper: b.upperEdge,
  observed: b.observed,
  expected: b.expected,
  pearsonResidual: (b.observed - b.expected) / Math.sqrt(b.expected),
  contribution: (b.observed - b.expected) ** 2 / b.expected,
}));

export const EVIDENCE: Evidence = {
  n: 20,
  min: 12,
  max: 95,
  xDomain: [5, 105],
  maxPoints: 2000,
  densities: {
    x: grid,
    curves: [
      { family: 'normal', label: 'Normal', y: grid.map((x) => bump(x, 50, 22)) },
      { family: 'weibull', label: 'Weibull', y: grid.map((x, i) => (i === 0 ? null : bump(x, 46, 20))) },
    ],
  },
  cdf: {
    empirical: {
      estimator: 'empirical',
      suspensions: { x: [], p: [], thinned: false, total: 0 },
      x: [12, 25, 33, 41, 47, 52, 58, 66, 79, 95],
      cumulativeCount: [2, 4, 6, 8, 10, 12, 14, 16, 18, 20],
      p: [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1],
      thinned: false,
      total: 10,
    },
    fitted: {
      x: grid,
      curves: [
        { family: 'normal', label: 'Normal', y: grid.map((x) => ramp(x, 50, 13)) },
        { family: 'weibull', label: 'Weibull', y: grid.map((x) => ramp(x, 47, 12)) },
      ],
    },
  },
  candidates: [
    {
      family: 'weibull',
      label: 'Weibull',
      histogram: { source: 'report', notApplicable: null, k: 4, bars, displayEdgeRule: 'Open outer bins are drawn to the data extremes.' },
      probabilityPlot: plot('weibull', 'ln'),
      bins: { source: 'report', notApplicable: null, rows },
    },
    {
      family: 'normal',
      label: 'Normal',
      histogram: { source: 'report', notApplicable: null, k: 4, bars, displayEdgeRule: 'Open outer bins are drawn to the data extremes.' },
      probabilityPlot: plot('normal', 'identity'),
      bins: { source: 'report', notApplicable: null, rows },
    },
  ],
  censoring: null,
};
