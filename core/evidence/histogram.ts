/**
 * Histogram bars on a candidate's equiprobable bin edges, and the observed-vs-expected table.
 * The bins are the candidate's chi-square bins from the report when that test was computed;
 * otherwise they are made here the same way (equiprobable under the fit, core/gof) for display.
 *
 * Display edges of open outer bins (edge ±Infinity): the data extreme, or the inner edge minus
 * (plus) the width of the neighbouring bin when that reaches further, so an empty or sparse outer
 * bin is still drawn with a visible width. Finite edges (e.g. a support bound at 0) are kept.
 * Common practice, no source.
 */
import type { Distribution } from '../families/index.js';
import { equiprobableBins, maxBinCount, mooreBinCount } from '../gof/index.js';
import type { BinRow, ChiSquareReport } from '../report.js';
import type { BinCountsEvidence, HistogramBar, HistogramEvidence, NotApplicableEvidence } from './types.js';

export const DISPLAY_EDGE_RULE =
  'An open outer bin (edge at ±infinity, or a support edge such as 0 lying further from the data than the data\'s own range) is drawn from its inner edge to the data extreme, or one neighbouring-bin width beyond the inner edge when that reaches further; other finite edges are drawn where they are.';

/** A finite outer edge further from the data than the data's own range is drawn like an open one. */
export function farFromData(edge: number, dataMin: number, dataMax: number): boolean {
  const spread = safeSpan(dataMin, dataMax);
  if (!(spread > 0)) return false;
  return edge < dataMin ? safeSpan(edge, dataMin) > spread : edge > dataMax ? safeSpan(dataMax, edge) > spread : false;
}

/** k for display-only bins when the chi-square test was not computable: Moore's rule capped so each bin expects ≥ 5, at least 2. */
export function displayBinCount(n: number): number {
  return Math.max(2, Math.min(mooreBinCount(n), Math.max(2, maxBinCount(n))));
}

export function candidateBins(dist: Distribution, sorted: Float64Array, chiSquare: ChiSquareReport | undefined): { source: 'report' | 'display'; rows: readonly BinRow[] } {
  if (chiSquare && chiSquare.computable && chiSquare.bins.length > 0) return { source: 'report', rows: chiSquare.bins };
  return { source: 'display', rows: equiprobableBins(dist, sorted, displayBinCount(sorted.length)) };
}

/** Keep a display edge a finite double (data near ±1.8e308 must not push an edge to ±Infinity). */
function clampFinite(x: number): number {
  return Math.min(Number.MAX_VALUE, Math.max(-Number.MAX_VALUE, x));
}

/** b - a without overflow to Infinity (capped at the largest double). */
export function safeSpan(a: number, b: number): number {
  const d = b - a;
  return Number.isFinite(d) ? d : Number.MAX_VALUE;
}

/** count / (n · (upper - lower)), computed on halves when the width overflows. */
function densityOf(count: number, n: number, lower: number, upper: number): number {
  const w = upper - lower;
  if (Number.isFinite(w)) return count / (n * w);
  return count / n / 2 / (upper / 2 - lower / 2);
}

export function histogramBars(rows: readonly BinRow[], n: number, dataMin: number, dataMax: number): HistogramBar[] {
  const k = rows.length;
  const inner: number[] = [];
  for (let j = 1; j < k; j++) inner.push((rows[j] as BinRow).lower ?? Number.NaN);
  const spread = safeSpan(dataMin, dataMax);
  const fallback = spread > 0 ? spread : Math.abs(dataMin) > 0 ? Math.abs(dataMin) * 0.1 : 1;
  const widthNear = (edge: number, neighbour: number | undefined): number => {
    const w = neighbour !== undefined && Number.isFinite(neighbour) ? Math.abs(neighbour - edge) : Number.NaN;
    return w > 0 ? w : fallback / Math.max(1, k);
  };
  return rows.map((r, j) => {
    let lower: number;
    let upper: number;
    // A support edge (e.g. 0 for a positive family) far below the data is drawn like an open edge,
    // so a sample at 25 ± 0.003 does not get a first bar reaching down to 0. Only the outer bars.
    const openLower = r.lower === null || (j === 0 && k > 1 && farFromData(r.lower, dataMin, dataMax));
    const openUpper = r.upper === null || (j === k - 1 && k > 1 && farFromData(r.upper, dataMin, dataMax));
    if (!openLower) lower = r.lower as number;
    else if (r.upper === null || k === 1) lower = dataMin - fallback * 0.05;
    else lower = Math.min(dataMin, r.upper - widthNear(r.upper, inner[j + 1]));
    if (!openUpper) upper = r.upper as number;
    else if (r.lower === null || k === 1) upper = dataMax + fallback * 0.05;
    else upper = Math.max(dataMax, r.lower + widthNear(r.lower, inner[j - 2]));
    // A far support edge drawn like an open one never reaches more than one data range beyond the data.
    if (openLower && r.lower !== null) lower = Math.max(lower, dataMin - fallback);
    if (openUpper && r.upper !== null) upper = Math.min(upper, dataMax + fallback);
    lower = clampFinite(lower);
    upper = clampFinite(upper);
    if (!(upper > lower)) upper = clampFinite(lower + fallback / Math.max(1, k));
    if (!(upper > lower)) lower = clampFinite(upper - fallback / Math.max(1, k));
    return {
      lower,
      upper,
      lowerEdge: r.lower,
      upperEdge: r.upper,
      openLower,
      openUpper,
      observed: r.observed,
      expected: r.expected,
      density: densityOf(r.observed, n, lower, upper),
      expectedDensity: densityOf(r.expected, n, lower, upper),
    };
  });
}

export function histogramEvidence(source: 'report' | 'display', rows: readonly BinRow[], n: number, dataMin: number, dataMax: number): HistogramEvidence {
  return { source, notApplicable: null, k: rows.length, bars: histogramBars(rows, n, dataMin, dataMax), displayEdgeRule: DISPLAY_EDGE_RULE };
}

export function binCounts(source: 'report' | 'display', rows: readonly BinRow[]): BinCountsEvidence {
  return {
    source,
    notApplicable: null,
    rows: rows.map((r, index) => {
      const d = r.observed - r.expected;
      return {
        index,
        lower: r.lower,
        upper: r.upper,
        observed: r.observed,
        expected: r.expected,
        pearsonResidual: r.expected > 0 ? d / Math.sqrt(r.expected) : 0,
        contribution: r.expected > 0 ? (d * d) / r.expected : 0,
      };
    }),
  };
}

/** A censored sample's histogram and bins: none, with the reason (`notApplicable`). */
export function notApplicableHistogram(na: NotApplicableEvidence): HistogramEvidence {
  return { source: 'not-applicable', notApplicable: na, k: 0, bars: [], displayEdgeRule: na.reason };
}

export function notApplicableBins(na: NotApplicableEvidence): BinCountsEvidence {
  return { source: 'not-applicable', notApplicable: na, rows: [] };
}
