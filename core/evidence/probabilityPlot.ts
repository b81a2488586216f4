/**
 * Probability plot of a candidate on its linearising scale, with plotting positions, the fitted
 * line and a pointwise order-statistic band.
 *
 * Scales (the fitted model is a straight line on each):
 *   normal       z = Φ⁻¹(p) against x
 *   lognormal    z = Φ⁻¹(p) against ln x
 *   Weibull      ln(-ln(1 - p)) against ln x
 *   exponential  -ln(1 - p) against x
 *   gamma        fitted quantile Q(p) against x (Q–Q; the fitted line is y = x)
 * Plotting positions p_i for the i-th smallest of n:
 *   Blom (1958), Statistical Estimates and Transformed Beta-Variables: (i - 3/8)/(n + 1/4), for
 *     the normal-type scales and the Q–Q plot;
 *   Benard & Bos-Levenbach (1953), median ranks: (i - 0.3)/(n + 0.4), for the Weibull and
 *     exponential (reliability) scales.
 * 1 - p_i is computed directly from its own formula so the upper tail keeps its digits.
 * The band: see orderStatistic.ts. Points are thinned for drawing only (thin.ts); the band and
 * the fitted line are evaluated at the plotted points.
 */
import type { Distribution, FamilyName } from '../families/index.js';
import { normalQuantile } from '../special/index.js';
import { orderStatisticInterval } from './orderStatistic.js';
import { finiteOrNull, quantileOfPair } from './quantileMap.js';
import { thinMonotone } from './thin.js';
import type { PlottingPosition, ProbabilityPlotEvidence, ProbabilityScale, ProbabilityTick } from './types.js';

export const BLOM: PlottingPosition = {
  name: 'Blom',
  formula: '(i - 3/8)/(n + 1/4)',
  source: 'Blom (1958), Statistical Estimates and Transformed Beta-Variables, Wiley',
};
export const BERNARD: PlottingPosition = {
  name: 'Benard (median ranks)',
  formula: '(i - 0.3)/(n + 0.4)',
  source: 'Benard & Bos-Levenbach (1953), Statistica Neerlandica 7:163-173 [from memory]',
};

/** Plotting position p_i and 1 - p_i (1-based i), each from its own formula. */
export function plottingPosition(pos: PlottingPosition, i: number, n: number): { p: number; q: number } {
  if (pos === BERNARD) return { p: (i - 0.3) / (n + 0.4), q: (n - i + 0.7) / (n + 0.4) };
  return { p: (i - 0.375) / (n + 0.25), q: (n - i + 0.625) / (n + 0.25) };
}

interface ScaleSpec {
  readonly scale: ProbabilityScale;
  readonly xTransform: 'identity' | 'ln';
  readonly position: PlottingPosition;
  readonly yLabel: string;
}

export function scaleFor(family: FamilyName): ScaleSpec {
  switch (family) {
    case 'normal':
      return { scale: 'normal', xTransform: 'identity', position: BLOM, yLabel: 'z = Φ⁻¹(p)' };
    case 'lognormal':
      return { scale: 'lognormal', xTransform: 'ln', position: BLOM, yLabel: 'z = Φ⁻¹(p)' };
    case 'weibull':
      return { scale: 'weibull', xTransform: 'ln', position: BERNARD, yLabel: 'ln(−ln(1 − p))' };
    case 'exponential':
      return { scale: 'exponential', xTransform: 'identity', position: BERNARD, yLabel: '−ln(1 − p)' };
    default:
      return { scale: 'quantile-quantile', xTransform: 'identity', position: BLOM, yLabel: 'fitted quantile' };
  }
}

/** Vertical coordinate of probability (p, q = 1 - p) on a scale; the Q–Q scale needs the model. */
export function scaleY(scale: ProbabilityScale, p: number, q: number, dist: Distribution): number {
  switch (scale) {
    case 'normal':
    case 'lognormal':
      return p <= 0.5 ? normalQuantile(p) : -normalQuantile(q);
    case 'weibull':
      return Math.log(p <= 0.5 ? -Math.log1p(-p) : -Math.log(q));
    case 'exponential':
      return p <= 0.5 ? -Math.log1p(-p) : -Math.log(q);
    default:
      return quantileOfPair(dist, p, q);
  }
}

const TICKS = [0.0001, 0.001, 0.01, 0.02, 0.05, 0.1, 0.2, 0.3, 0.5, 0.632, 0.7, 0.8, 0.9, 0.95, 0.98, 0.99, 0.999, 0.9999];

/** Probability ticks between the smallest and largest plotted position (none on the Q–Q scale;
 *  63.2 %, the characteristic life, only on the Weibull and exponential scales). */
export function probabilityTicks(scale: ProbabilityScale, pLo: number, pHi: number, dist: Distribution): ProbabilityTick[] {
  const ticks: ProbabilityTick[] = [];
  if (scale === 'quantile-quantile') return ticks;
  for (const t of TICKS) {
    if (t === 0.632 && scale !== 'weibull' && scale !== 'exponential') continue;
    if (t >= pLo && t <= pHi) ticks.push({ p: t, y: scaleY(scale, t, 1 - t, dist) });
  }
  return ticks;
}

export function probabilityPlot(
  dist: Distribution,
  sorted: Float64Array,
  logs: Float64Array | null,
  cap: number,
  bandAlpha: number,
  bandCache: Map<number, ReturnType<typeof orderStatisticInterval>> = new Map(),
): ProbabilityPlotEvidence {
  const n = sorted.length;
  const spec = scaleFor(dist.family);
  const tx = (v: number): number => (spec.xTransform === 'ln' ? Math.log(v) : v);
  // Horizontal coordinate of every point; points whose transform is undefined are left out.
  const hx = spec.xTransform === 'ln' && logs !== null ? logs : spec.xTransform === 'ln' ? sorted.map((v) => Math.log(v)) : sorted;
  let first = 0;
  while (first < n && !Number.isFinite(hx[first] as number)) first++;
  const m = n - first;
  // Cheap monotone vertical proxy for thinning: logit of the Blom position (spreads both tails).
  // The same proxy for every scale, so candidates with the same x transform plot the same ranks
  // and share the band computations (bandCache, keyed by rank).
  const px = hx.subarray(first);
  const proxy = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    const { p, q } = plottingPosition(BLOM, first + j + 1, n);
    proxy[j] = Math.log(p / q);
  }
  const keep = m > 0 ? thinMonotone(px, proxy, cap) : [];
  const xs: number[] = [];
  const ys: number[] = [];
  const ranks: number[] = [];
  const lineX: number[] = [];
  const lineY: number[] = [];
  const bandY: number[] = [];
  let omitted = first;
  const bandLower: (number | null)[] = [];
  const bandUpper: (number | null)[] = [];
  for (const j of keep) {
    const i = first + j + 1;
    const { p, q } = plottingPosition(spec.position, i, n);
    const y = scaleY(spec.scale, p, q, dist);
    if (!Number.isFinite(y)) {
      omitted++;
      continue;
    }
    xs.push(px[j] as number);
    ys.push(y);
    ranks.push(i);
    // The fitted line and the band have their own y arrays: a rank where the fitted quantile is
    // not finite on this scale (e.g. ln of a quantile that underflows to 0) is left out of the line.
    const lx = tx(quantileOfPair(dist, p, q));
    if (Number.isFinite(lx)) {
      lineX.push(lx);
      lineY.push(y);
    }
    bandY.push(y);
    let band = bandCache.get(i);
    if (band === undefined) {
      band = orderStatisticInterval(i, n, bandAlpha);
      bandCache.set(i, band);
    }
    bandLower.push(finiteOrNull(tx(quantileOfPair(dist, band.lower.x, band.lower.y))));
    bandUpper.push(finiteOrNull(tx(quantileOfPair(dist, band.upper.x, band.upper.y))));
  }
  const ticks = n > 0 ? probabilityTicks(spec.scale, plottingPosition(spec.position, 1, n).p, plottingPosition(spec.position, n, n).p, dist) : [];
  const level = 1 - bandAlpha;
  return {
    scale: spec.scale,
    xTransform: spec.xTransform,
    xLabel: spec.xTransform === 'ln' ? 'ln x' : 'x',
    yLabel: spec.yLabel,
    plottingPosition: spec.position,
    points: { x: xs, y: ys, rank: ranks },
    fittedLine: { x: lineX, y: lineY },
    band: {
      level,
      y: bandY,
      lower: bandLower,
      upper: bandUpper,
      description: `Pointwise ${fmtPct(level)} band for each order statistic: the i-th of n uniform order statistics is Beta(i, n + 1 - i); its ${fmtPct(bandAlpha / 2)} and ${fmtPct(1 - bandAlpha / 2)} quantiles mapped through the fitted quantile function. Not a simultaneous band.`,
    },
    probabilityTicks: ticks,
    suspensions: [],
    thinned: keep.length < m,
    total: n,
    omitted,
  };
}

function fmtPct(v: number): string {
  const s = (v * 100).toFixed(2).replace(/\.?0+$/, '');
  return `${s}%`;
}
