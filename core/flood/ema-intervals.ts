/**
 * Confidence intervals of EMA log-Pearson III quantiles from the EMA's asymptotic variance, in the
 * manner of Cohn, Lane & Stedinger (2001, WRR 37(6):1695-1706), the method Bulletin 17C (England
 * et al. 2018, TM 4-B5) adopts. The paper's and the Bulletin's text were not available here: the
 * variance is derived in ema-covariance.ts, and the interval's form below is ours, chosen so that
 * it reduces to the exact interval where one exists. That the paper's interval has this form is
 * NOT claimed.
 *
 * Form. For a normal population (zero skew known, systematic record of n years) the exact limits
 * of y_p = μ + σ K_p are M + S t′/√n, t′ the (1 ∓ c)/2 quantiles of the noncentral t with n − 1
 * degrees of freedom and noncentrality √n K_p (e.g. Stedinger 1983, J. Hydraul. Eng. 109(1):13-27;
 * the normal tolerance-limit factor [from memory]). Its first-order variance is
 * σ²(1 + K²/2)/n. Here the record's first-order variance of ŷ_p, V = S² v (ema-covariance.ts:
 * censored and historical years, the skew's own uncertainty and the regional skew's MSE), sets an
 * equivalent record length for the quantile, n_q = (1 + K̂²/2)/v, and the limits are
 *   ŷ_{lower, upper} = M + S · t′_{(1 ∓ c)/2}(n_q − 1, √n_q K̂)/√n_q,   then 10^(·).
 * With zero skew held (regional skew of negligible MSE) and no censoring, v = (1 + K²/2)/n, n_q = n
 * and the limits are the exact noncentral-t ones (test/flood/ema-intervals.test.ts against SciPy's
 * `nct`). Elsewhere it is an approximation whose coverage was measured in a seeded simulation
 * (scripts/flood-ema-ci-coverage.ts → test/fixtures/flood-ema-ci-coverage.json; 2000 records a
 * case, Monte Carlo s.e. 0.67 points; nominal 90 %, T = 100 unless said):
 *   exact case (zero skew held, n = 20) 89.3 %; systematic n = 20 skew 0: 96.2 % (the asymptotic
 *   skew variance overstates a 20-year record's); n = 30 skew 0.3: 92.2 %; n = 60 skew 0.3: 90.5 %,
 *   skew −0.3: 94.4 %, skew 0.6: 90.5 %; n = 60 skew 0 T = 10: 89.1 %; regional skew drawn with
 *   MSE 0.12, n = 30: 89.8 %; 40 systematic + 100 historical years (threshold at the 0.95
 *   quantile): 90.1 %; n = 50 censored below the 0.10 quantile, skew −0.2: 86.4 % (11.7 % of true
 *   quantiles above the upper limit); n = 60 skew −1.6: 92.3 %; the same censored below the 0.05
 *   quantile: 82.7 % (12.1 % above the upper limit; the first-order variance is far too small for a
 *   strongly skewed record censored at the low end, see scripts/flood-ema-skew-mse.ts). The plain
 *   normal interval on the same variance covered 82.8–96.2 % in the same cases.
 * The variance behind n_q is, for a record without censoring or regional skew, exactly Kite's
 * (2004, eq. 9-54) published variance of the moment quantile (test/flood/ema-kite.test.ts); at
 * 20–100 years it overstates the estimator's real variance by 3–23 % (scripts/flood-kite-variance.ts),
 * in the direction of the wide cases above (96.2 %, 94.4 %) but not their whole size (a 7 % larger
 * variance alone would take a 90 % normal interval to about 91 %).
 */
import { Pearson3Distribution } from '../families/index.js';
import { emaCovariance, emaQuantileVariance, effectiveRecordLength, type EmaDesign } from './ema-covariance.js';
import type { EmaFit } from './ema.js';
import { noncentralTQuantile } from './noncentral-t.js';

export const EMA_INTERVAL_METHOD =
  'first-order EMA variance (after Cohn, Lane & Stedinger 2001; censored and historical years, skew and regional-skew uncertainty) with noncentral-t limits at the equivalent record length';

export interface EmaQuantileInterval {
  readonly period: number;
  /** Flow estimate 10^(M + S K). */
  readonly estimate: number;
  readonly lower: number | null;
  readonly upper: number | null;
  /** First-order variance of the log10 quantile. */
  readonly varianceLog10: number;
  /** n_q = (1 + K²/2) S²/Var: the years of a normal record giving the same variance (null where not computed). */
  readonly equivalentYears: number | null;
}

export interface EmaIntervals {
  readonly levels: readonly EmaQuantileInterval[];
  /** Effective record length of the station skew (= the years for a record without censoring). */
  readonly effectiveRecordLength: number;
  readonly method: string;
}

/** Below this equivalent length (1 degree of freedom) no interval is given. */
const MIN_EQUIVALENT_YEARS = 2;

/** The EMA intervals of a fit at two-sided confidence c for the periods (years > 1); the design from ema-covariance.ts emaDesign. */
export function emaIntervals(
  fit: Pick<EmaFit, 'parameters' | 'skew'>,
  design: EmaDesign,
  periods: readonly number[],
  confidence: number,
): EmaIntervals {
  const { mean, sd, skew } = fit.parameters;
  const regional = fit.skew.regionalSkew !== null ? { stationWeight: fit.skew.stationWeight, regionalSkewMse: fit.skew.regionalSkewMse as number } : null;
  const cov = emaCovariance(design, fit.parameters, regional);
  const d = new Pearson3Distribution(mean, sd, skew);
  const levels = periods.map((period) => {
    const { variance, frequencyFactor: K } = emaQuantileVariance(cov, skew, 1 / period);
    const nq = (1 + (K * K) / 2) / variance;
    const y = d.isf(1 / period);
    let lower: number | null = null;
    let upper: number | null = null;
    if (nq >= MIN_EQUIVALENT_YEARS && Number.isFinite(nq)) {
      const root = Math.sqrt(nq);
      const t = (p: number): number => noncentralTQuantile(p, nq - 1, root * K) / root;
      lower = Math.pow(10, mean + sd * t((1 - confidence) / 2));
      upper = Math.pow(10, mean + sd * t((1 + confidence) / 2));
    }
    return { period, estimate: Math.pow(10, y), lower, upper, varianceLog10: variance * sd * sd, equivalentYears: nq };
  });
  return { levels, effectiveRecordLength: effectiveRecordLength(design, fit.parameters), method: EMA_INTERVAL_METHOD };
}
