/**
 * The likelihood-ratio goodness-of-fit statistic for inspection data: how much better the
 * nonparametric maximum-likelihood estimate (Turnbull 1976, JRSS B 38:290-295; turnbull.ts) explains
 * the rows than the fitted parametric model does,
 *   LR = 2 (ln L̂_Turnbull − ln L̂_model) ≥ 0,
 * both log-likelihoods over the same rows: a left row (0, R] has probability F(R), an interval row
 * (L, R] F(R) − F(L), a suspension at L S(L), under the model and under the estimate alike (Meeker &
 * Escobar 1998, Statistical Methods for Reliability Data, §2.4.3).
 * The statistic has no standard null distribution (the nonparametric side is not a finite-dimensional
 * model), so its p-value comes from the parametric bootstrap of interval-bootstrap.ts, which refits
 * each replicate and recomputes both sides.
 * Exact rows are excluded by construction: the model gives an exact failure a density, the estimate a
 * point mass, so their ratio has a unit of time and no meaning as a likelihood ratio.
 * Measured as a candidate for rows with each unit at its own inspection times and not adopted
 * (interval-gof-design.ts: its size there, scripts/life-interval-size.ts).
 */
import type { IntervalLifeData } from './interval-likelihood-data.js';
import { turnbull, type TurnbullOptions } from './turnbull.js';

/** The Turnbull settings of the statistic, the same for the data and every replicate. */
export const INTERVAL_LR_TURNBULL: TurnbullOptions = { tolerance: 1e-9, maxIterations: 20000, accelerate: true };

/** True when the statistic is defined for `data` (no exact rows). */
export function likelihoodRatioApplies(data: IntervalLifeData): boolean {
  return data.exact === 0;
}

/**
 * LR of a model whose maximised log-likelihood on `data` is `modelLogLikelihood`. Throws on exact
 * rows (see above). A Turnbull iteration that stops a hair short of the maximum can give a value a
 * little below 0; it is returned as computed (the bootstrap compares like with like).
 */
export function intervalLikelihoodRatio(modelLogLikelihood: number, data: IntervalLifeData): number {
  if (!likelihoodRatioApplies(data)) throw new Error('the likelihood-ratio statistic is not defined for exact rows (a density against a point mass)');
  return 2 * (turnbull(data, INTERVAL_LR_TURNBULL).logLikelihood - modelLogLikelihood);
}
