/**
 * Evidence for a right-censored sample (a status column: 1 failed, 0 suspended). Suspensions are
 * never drawn as failures:
 * - probability plot: failures only, at core/life's suspension-aware positions (Johnson's adjusted
 *   ranks with Benard's approximation, or Kaplan–Meier plotted halfway up each step), with the
 *   rank band of those positions mapped through the fitted quantile; suspensions are listed by
 *   time for marks along the axis (they have no plotting position);
 * - distribution function: the Kaplan–Meier product-limit step 1 − Ŝ(t) (Kaplan & Meier 1958,
 *   JASA 53:457-481), which stays below 1 when the largest time is a suspension, with each
 *   suspension marked at the step's height at its time;
 * - no histogram bars, chi-square bins or observed-vs-expected bins: a "not applicable" value
 *   with its reason instead.
 */
import { InputError } from '../errors.js';
import type { Distribution } from '../families/index.js';
import { drawingPositions, prepareLifeData, type DrawingPositions, type LifeData, type LifeInput, type PlotPositionMethod } from '../life/index.js';
import { finiteOrNull, quantileOfPair } from './quantileMap.js';
import { probabilityTicks, scaleFor, scaleY } from './probabilityPlot.js';
import { thinMonotone } from './thin.js';
import type { CdfEvidence, CensoringEvidence, NotApplicableEvidence, PlottingPosition, ProbabilityPlotEvidence, TimeMarks } from './types.js';

/** The censored sample as computeEvidence takes it: the times (the values given to prepareSample,
 *  in the same order) and the status of each; optionally the plotting positions to use. */
export interface CensoredEvidenceInput extends LifeInput {
  readonly positions?: PlotPositionMethod;
}

export const CENSORED_BINS: NotApplicableEvidence = {
  cause: 'censored',
  reason:
    'Not applicable: censored. Bins need every unit in a known class, and a suspension is known only to lie beyond its run time, so a censored sample gets no histogram bars, chi-square bins or observed-vs-expected counts. Its fit is judged on the probability plot, the Kaplan–Meier step and the censored Anderson–Darling statistic.',
};

export const JOHNSON_POSITIONS: PlottingPosition = {
  name: 'Johnson adjusted ranks (Benard)',
  formula: '(j - 0.3)/(n + 0.4), j = adjusted rank',
  source: 'Johnson (1964), The Statistical Treatment of Fatigue Experiments, Elsevier; Benard & Bos-Levenbach (1953) [from memory]',
};
export const KAPLAN_MEIER_POSITIONS: PlottingPosition = {
  name: 'Kaplan–Meier (midpoint of each step)',
  formula: '1 - (Ŝ(t−) + Ŝ(t))/2',
  source: 'Kaplan & Meier (1958), JASA 53:457-481; midpoint plotting, Meeker & Escobar (1998) §6.4 [from memory]',
};

/** Validate the censored input against the prepared sample (same values) and sort it. */
export function prepareCensored(sorted: Float64Array, input: CensoredEvidenceInput): LifeData {
  if (input.times.length !== sorted.length) {
    throw new InputError(`The censored times (${input.times.length}) are not the ${sorted.length} values of the sample.`, {}, 'bad-input');
  }
  const life = prepareLifeData(input);
  for (let i = 0; i < sorted.length; i++) {
    if (life.times[i] !== sorted[i]) throw new InputError('The censored times are not the values of the sample.', { value: String(life.times[i]) }, 'bad-input');
  }
  return life;
}

function marks(times: Float64Array, cap: number): TimeMarks {
  const idx = new Float64Array(times.length);
  for (let i = 0; i < idx.length; i++) idx[i] = i;
  const keep = times.length > 0 ? thinMonotone(times, idx, cap) : [];
  return { x: keep.map((i) => times[i] as number), thinned: keep.length < times.length, total: times.length };
}

export function censoringEvidence(life: LifeData, method: PlotPositionMethod, cap: number): CensoringEvidence {
  return {
    failures: life.failures,
    suspensions: life.suspensions,
    method,
    plottingPosition: method === 'kaplan-meier' ? KAPLAN_MEIER_POSITIONS : JOHNSON_POSITIONS,
    failureTimes: marks(life.failureTimes, cap),
    suspensionTimes: marks(life.suspensionTimes, cap),
    binsNotApplicable: CENSORED_BINS,
  };
}

/**
 * The Kaplan–Meier estimate of the distribution function, 1 − Ŝ(t), as a right-continuous step at
 * each distinct failure time (Ŝ(t) = Π over failure times tᵢ ≤ t of (1 − dᵢ/nᵢ), nᵢ at risk just
 * before tᵢ, dᵢ failing at tᵢ; Ŝ carried as a running product of log1p terms), with every
 * suspension marked at the step's height at its time. Thinned for drawing (extremes kept).
 */
export function kaplanMeierCdf(life: LifeData, cap: number): CdfEvidence['empirical'] {
  const xs: number[] = [];
  const ps: number[] = [];
  const cs: number[] = [];
  let logS = 0;
  let failed = 0;
  // Distinct (time, status) groups in time order, failures first among ties: the units at risk
  // just before a failure group are those not yet passed.
  const g = life.groups;
  let atRisk = life.n;
  for (let k = 0; k < g.times.length; k++) {
    const count = g.counts[k] as number;
    if (g.failed[k]) {
      logS += Math.log1p(-count / atRisk);
      failed += count;
      xs.push(g.times[k] as number);
      ps.push(-Math.expm1(logS));
      cs.push(failed);
    }
    atRisk -= count;
  }
  const keep = xs.length > 0 ? thinMonotone(xs, ps, cap) : [];
  // Height of the step at each suspension: the last failure time ≤ it (failures sort first among ties).
  const st = life.suspensionTimes;
  const sp = new Float64Array(st.length);
  for (let i = 0, j = -1; i < st.length; i++) {
    while (j + 1 < xs.length && (xs[j + 1] as number) <= (st[i] as number)) j++;
    sp[i] = j < 0 ? 0 : (ps[j] as number);
  }
  const sKeep = st.length > 0 ? thinMonotone(st, sp, cap) : [];
  return {
    estimator: 'kaplan-meier',
    x: keep.map((i) => xs[i] as number),
    cumulativeCount: keep.map((i) => cs[i] as number),
    p: keep.map((i) => ps[i] as number),
    thinned: keep.length < xs.length,
    total: xs.length,
    suspensions: { x: sKeep.map((i) => st[i] as number), p: sKeep.map((i) => sp[i] as number), thinned: sKeep.length < st.length, total: st.length },
  };
}

/**
 * Probability plot of a censored sample on the candidate's scale: failures at the given positions
 * (core/life plotPositions), the fitted line x = Q(F), and the positions' pointwise band [F_lo, F_hi]
 * mapped through the fitted quantile at each plotted height (for Johnson's ranks the Beta(j, n + 1 − j)
 * rank band; for Kaplan–Meier Greenwood's band), so a point outside it is unusual at its height.
 */
export function censoredProbabilityPlot(dist: Distribution, life: LifeData, points: DrawingPositions, method: PlotPositionMethod, cap: number, bandLevel: number): ProbabilityPlotEvidence {
  const spec = scaleFor(dist.family);
  const tx = (v: number): number => (spec.xTransform === 'ln' ? Math.log(v) : v);
  const hx = points.time.map(tx);
  const hy = points.F;
  // Thinned for drawing first, so only the drawn failures' bands are computed (each a pair of Beta
  // quantiles for Johnson's ranks): bounded work however many units there are.
  const keep = points.count > 0 ? thinMonotone(hx, hy, cap) : [];
  const xs: number[] = [];
  const ys: number[] = [];
  const ranks: number[] = [];
  const lineX: number[] = [];
  const lineY: number[] = [];
  const bandY: number[] = [];
  const bandLower: (number | null)[] = [];
  const bandUpper: (number | null)[] = [];
  let omitted = 0;
  for (const j of keep) {
    const F = points.F[j] as number;
    const y = scaleY(spec.scale, F, 1 - F, dist);
    const x = hx[j] as number;
    if (!Number.isFinite(y) || !Number.isFinite(x)) {
      omitted++;
      continue;
    }
    xs.push(x);
    ys.push(y);
    ranks.push(points.rank[j] as number);
    const lx = tx(quantileOfPair(dist, F, 1 - F));
    if (Number.isFinite(lx)) {
      lineX.push(lx);
      lineY.push(y);
    }
    const band = points.band(j);
    bandY.push(y);
    bandLower.push(finiteOrNull(tx(quantileOfPair(dist, band.lower, 1 - band.lower))));
    bandUpper.push(finiteOrNull(tx(quantileOfPair(dist, band.upper, 1 - band.upper))));
  }
  const ticks = points.count > 0 ? probabilityTicks(spec.scale, points.F[0] as number, points.F[points.count - 1] as number, dist) : [];
  const sx: number[] = [];
  for (const v of marks(life.suspensionTimes, cap).x) {
    const t = tx(v);
    if (Number.isFinite(t)) sx.push(t);
  }
  const pct = `${Number((bandLevel * 100).toFixed(2))}%`;
  const description =
    method === 'kaplan-meier'
      ? `Pointwise ${pct} band for each failure: Greenwood's variance of the Kaplan–Meier estimate on the ln(−ln S) scale, mapped through the fitted quantile function. Not a simultaneous band.`
      : `Pointwise ${pct} band for each failure: the Beta(j, n + 1 − j) distribution of its adjusted rank j, mapped through the fitted quantile function. Not a simultaneous band.`;
  return {
    scale: spec.scale,
    xTransform: spec.xTransform,
    xLabel: spec.xTransform === 'ln' ? 'ln x' : 'x',
    yLabel: spec.yLabel,
    plottingPosition: method === 'kaplan-meier' ? KAPLAN_MEIER_POSITIONS : JOHNSON_POSITIONS,
    points: { x: xs, y: ys, rank: ranks },
    fittedLine: { x: lineX, y: lineY },
    band: { level: bandLevel, y: bandY, lower: bandLower, upper: bandUpper, description },
    probabilityTicks: ticks,
    suspensions: sx,
    thinned: keep.length < points.count,
    total: points.count,
    omitted,
  };
}

/**
 * The failures' plotting positions for every candidate of one sample, bands at `bandLevel` computed
 * only for the failures a plot draws (shared by the candidates, so each band is computed once).
 */
export function censoredPositions(life: LifeData, method: PlotPositionMethod, bandLevel: number): DrawingPositions {
  return drawingPositions(life, method, bandLevel);
}
