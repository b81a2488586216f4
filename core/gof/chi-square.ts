/**
 * Pearson's chi-square goodness-of-fit test on equiprobable bins under the fitted model.
 *
 * X² = Σ (O - E)² / E over k bins (compensated sum). With m parameters estimated by maximum
 * likelihood from the raw (ungrouped) data, the null distribution of X² lies between chi-square
 * with k - 1 - m and chi-square with k - 1 degrees of freedom (Chernoff & Lehmann 1954, Ann. Math.
 * Stat. 25:579-586): `pValue` uses k - 1 - m (slightly liberal), `pValueUpper` uses k - 1.
 * The decision uses `pValue` (the conventional k - 1 - m reference, NIST e-Handbook §1.3.5.15).
 */
import { CompensatedSum } from '../compensated.js';
import type { Distribution } from '../families/index.js';
import type { ChiSquareReport } from '../report.js';
import { chiSquareIsf, chiSquareSf } from '../special/index.js';
import { chooseBinCount, equiprobableBins } from './binning.js';
import { formatNumber } from '../format/index.js';

export interface ChiSquareOptions {
  /** Significance level, 0 < alpha < 1. */
  readonly alpha: number;
  /** Number of estimated parameters m. */
  readonly estimatedParameters: number;
  /** A user-chosen number of bins (validated: throws InputError if not allowed). */
  readonly bins?: number | null;
}

/** Σ (O - E)² / E of bin rows. */
export function pearsonStatistic(rows: readonly { observed: number; expected: number }[]): number {
  const s = new CompensatedSum();
  for (const r of rows) {
    const d = r.observed - r.expected;
    s.add((d * d) / r.expected);
  }
  return s.value;
}

/** The chi-square test of the sorted sample against `dist`. */
export function chiSquareTest(dist: Distribution, sorted: ArrayLike<number>, opts: ChiSquareOptions): ChiSquareReport {
  const n = sorted.length;
  const m = opts.estimatedParameters;
  const choice = chooseBinCount(n, m, opts.bins);
  if (!choice.computable) return { computable: false, reason: choice.reason };
  const { k, kRule } = choice;
  const bins = equiprobableBins(dist, sorted, k);
  const statistic = pearsonStatistic(bins);
  const dof = k - 1 - m;
  const dofUpper = k - 1;
  const pValue = chiSquareSf(statistic, dof);
  const pValueUpper = chiSquareSf(statistic, dofUpper);
  const alpha = opts.alpha;
  const criticalValue = chiSquareIsf(alpha, dof);
  const rejected = pValue < alpha;
  const a = formatNumber(alpha);
  const st = formatNumber(statistic);
  const cv = formatNumber(criticalValue);
  const dofWords = `${dof} degree${dof === 1 ? '' : 's'} of freedom`;
  const between = `the true p-value lies between ${formatNumber(pValue)} (dof ${dof}) and ${formatNumber(pValueUpper)} (dof ${dofUpper})`;
  let decision: string;
  if (!rejected) {
    decision = `Not rejected at α = ${a}: X² = ${st} is below the critical value ${cv} for ${dofWords}; ${between}.`;
  } else if (pValueUpper >= alpha) {
    decision = `Rejected at α = ${a}, but only narrowly: X² = ${st} exceeds the critical value ${cv} for ${dofWords}, yet with ${dofUpper} degrees of freedom it would not be rejected; ${between}.`;
  } else {
    decision = `Rejected at α = ${a}: X² = ${st} exceeds the critical value ${cv} for ${dofWords}; ${between}.`;
  }
  return {
    computable: true,
    statistic,
    dof,
    pValue,
    dofUpper,
    pValueUpper,
    criticalValue,
    alpha,
    rejected,
    decision,
    k,
    kRule,
    bins,
  };
}
