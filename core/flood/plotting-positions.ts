/**
 * Plotting positions for a return-period plot of annual maxima. With the values sorted ascending
 * (rank i = 1..n) the non-exceedance probability is p_i = (i - a)/(n + 1 - 2a):
 * - Weibull a = 0: i/(n + 1) (unbiased for the exceedance probability of every distribution);
 * - Gringorten a = 0.44: (i - 0.44)/(n + 0.12) (Gringorten 1963, J. Geophys. Res. 68:813-814;
 *   nearly unbiased quantiles for the Gumbel);
 * - Cunnane a = 0.4: (i - 0.4)/(n + 0.2) (Cunnane 1978, J. Hydrology 37:205-222; an approximately
 *   quantile-unbiased compromise for many distributions).
 * The exceedance probability 1 - p_i = (n + 1 - a - i)/(n + 1 - 2a) is formed directly, the return
 * period is T = 1/(1 - p_i), and the Gumbel reduced variate -ln(-ln p_i) gives the usual
 * straight-line axis for a Gumbel fit.
 */
import { InputError } from '../errors.js';

export type PlottingFormula = 'weibull' | 'gringorten' | 'cunnane';

export const PLOTTING_CONSTANTS: Readonly<Record<PlottingFormula, number>> = Object.freeze({
  weibull: 0,
  gringorten: 0.44,
  cunnane: 0.4,
});

export interface PlottingPoint {
  readonly value: number;
  /** 1-based rank in ascending order. */
  readonly rank: number;
  readonly nonExceedance: number;
  readonly exceedance: number;
  readonly returnPeriod: number;
  readonly gumbelVariate: number;
}

export interface PlottingPositions {
  readonly formula: PlottingFormula;
  /** The formula in words. */
  readonly description: string;
  readonly a: number;
  readonly points: readonly PlottingPoint[];
}

const DESCRIPTIONS: Readonly<Record<PlottingFormula, string>> = Object.freeze({
  weibull: 'Weibull i/(n + 1)',
  gringorten: 'Gringorten (i - 0.44)/(n + 0.12)',
  cunnane: 'Cunnane (i - 0.4)/(n + 0.2)',
});

/** `sorted` ascending (e.g. Sample.sorted). */
export function plottingPositions(sorted: ArrayLike<number>, formula: PlottingFormula = 'weibull'): PlottingPositions {
  const a = PLOTTING_CONSTANTS[formula];
  if (a === undefined) {
    throw new InputError(`Unknown plotting position "${String(formula)}"; use weibull, gringorten or cunnane.`, { value: String(formula) }, 'bad-option');
  }
  const n = sorted.length;
  const denom = n + 1 - 2 * a;
  const points: PlottingPoint[] = [];
  for (let i = 1; i <= n; i++) {
    const p = (i - a) / denom;
    const q = (n + 1 - a - i) / denom;
    points.push({
      value: sorted[i - 1] as number,
      rank: i,
      nonExceedance: p,
      exceedance: q,
      returnPeriod: 1 / q,
      gumbelVariate: -Math.log(-Math.log(p)),
    });
  }
  return { formula, description: DESCRIPTIONS[formula], a, points };
}
