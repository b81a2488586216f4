/**
 * Rank regression: parameters from a straight line through the failures on probability paper,
 * offered beside maximum likelihood (which stays the default). The trade uses it for small
 * complete samples and when the fitted line must match the points on the plot; it ignores where
 * the suspensions lie except through the ranks, and gives no likelihood-based bounds.
 *  - Positions: Johnson's adjusted ranks for suspensions with Benard's median-rank approximation
 *    F = (j - 0.3)/(n + 0.4) (positions.ts; Benard & Bos-Levenbach 1953; Johnson 1964).
 *  - Regression of x (time scale) on y (probability scale): the times carry the scatter, the
 *    ranks are fixed (Abernethy 2006, "The New Weibull Handbook", 5th ed., §5.3 [from memory]).
 *      Weibull:     ln t = ln η + (1/β)·ln(-ln(1 - F))
 *      lognormal:   ln t = μ + σ·Φ⁻¹(F)
 *      normal:      t = μ + σ·Φ⁻¹(F)
 *      exponential: t = (1/λ)·(-ln(1 - F)), through the origin
 *    Gamma has no straight-line paper (its shape changes the curve), so it is not offered.
 * The result carries the correlation coefficient of the points and the censored log-likelihood at
 * the regression parameters (so it can be set beside the maximum; it is not a maximum).
 */
import { getFamily } from '../families/index.js';
import { normalQuantile } from '../special/index.js';
import type { LifeData } from './data.js';
import { censoredLogLikelihood } from './likelihood.js';
import type { LifeFamilyName } from './models.js';
import { johnsonBenardPositions } from './positions.js';

export type RankRegressionFamily = Exclude<LifeFamilyName, 'gamma'>;

export const RANK_REGRESSION_FAMILIES: readonly RankRegressionFamily[] = ['weibull', 'lognormal', 'normal', 'exponential'];

export interface RankRegressionFit {
  readonly ok: true;
  readonly family: RankRegressionFamily;
  readonly estimation: 'rank-regression';
  readonly parameters: Readonly<Record<string, number>>;
  /** Censored log-likelihood at these parameters (not maximised). */
  readonly logLikelihood: number;
  /** Correlation coefficient of (y, x) on the family's paper; r² is its square. */
  readonly correlation: number;
  readonly points: number;
  readonly method: string;
  readonly source: string;
}

export type RankRegressionOutcome = RankRegressionFit | { readonly ok: false; readonly family: LifeFamilyName; readonly estimation: 'rank-regression'; readonly reason: string };

export const RANK_REGRESSION_REASON =
  'Rank regression is offered for small complete samples and where the line must match the points on the plot; maximum likelihood remains the default because it uses where each suspension lies and gives likelihood-ratio bounds.';

/** Least squares of x on y: x = a + b·y (or x = b·y through the origin). */
function regressXonY(y: readonly number[], x: readonly number[], origin: boolean): { a: number; b: number; r: number } {
  const n = y.length;
  const my = origin ? 0 : y.reduce((s, v) => s + v, 0) / n;
  const mx = origin ? 0 : x.reduce((s, v) => s + v, 0) / n;
  let syy = 0;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    const dy = (y[i] as number) - my;
    const dx = (x[i] as number) - mx;
    syy += dy * dy;
    sxy += dy * dx;
    sxx += dx * dx;
  }
  const b = sxy / syy;
  return { a: mx - b * my, b, r: sxy / Math.sqrt(syy * sxx) };
}

export function fitRankRegression(family: LifeFamilyName, data: LifeData): RankRegressionOutcome {
  const estimation = 'rank-regression' as const;
  if (family === 'gamma') return { ok: false, family, estimation, reason: 'the gamma model has no straight-line probability paper, so it has no rank-regression fit' };
  const pts = johnsonBenardPositions(data, 0.9);
  const need = family === 'exponential' ? 1 : 2;
  if (pts.length < need || new Set(pts.map((p) => p.time)).size < need) {
    return { ok: false, family, estimation, reason: `rank regression for the ${family} model needs at least ${need} distinct failure time${need > 1 ? 's' : ''}` };
  }
  const F = pts.map((p) => p.F);
  const t = pts.map((p) => p.time);
  let parameters: Record<string, number>;
  let r: number;
  switch (family) {
    case 'weibull': {
      const g = regressXonY(F.map((f) => Math.log(-Math.log1p(-f))), t.map(Math.log), false);
      parameters = { shape: 1 / g.b, scale: Math.exp(g.a) };
      r = g.r;
      break;
    }
    case 'lognormal': {
      const g = regressXonY(F.map(normalQuantile), t.map(Math.log), false);
      parameters = { meanlog: g.a, sdlog: g.b };
      r = g.r;
      break;
    }
    case 'normal': {
      const g = regressXonY(F.map(normalQuantile), t, false);
      parameters = { mean: g.a, sd: g.b };
      r = g.r;
      break;
    }
    default: {
      const g = regressXonY(F.map((f) => -Math.log1p(-f)), t, true);
      parameters = { rate: 1 / g.b };
      r = g.r;
    }
  }
  let logLikelihood: number;
  try {
    logLikelihood = censoredLogLikelihood(getFamily(family).make(parameters), data);
  } catch {
    return { ok: false, family, estimation, reason: `the rank-regression line gives invalid ${family} parameters (${JSON.stringify(parameters)})` };
  }
  return {
    ok: true,
    family,
    estimation,
    parameters,
    logLikelihood,
    correlation: r,
    points: pts.length,
    method: `rank regression: least squares of ${family === 'normal' || family === 'exponential' ? 't' : 'ln t'} on the ${family} probability scale of Johnson–Benard median ranks${family === 'exponential' ? ', through the origin' : ''}`,
    source: 'Benard & Bos-Levenbach 1953; Johnson 1964; regression of x on y: Abernethy 2006, The New Weibull Handbook, §5.3 [from memory]',
  };
}
