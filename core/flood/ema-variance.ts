/**
 * First-order (delta-method) variance of a log-Pearson III quantile estimated by the method of
 * moments on log10 flows — the expected moments algorithm on a systematic record with no
 * censored years, where EMA reduces to the sample moments (ema.ts) — and the interval it gives.
 *
 * With W = (Y − μ)/σ standardized Pearson III of skew γ, its raw moments a_k = E[W^k] follow from
 * the gamma cumulants: κ_r/σ^r = (r − 1)! α^{1 − r/2}, α = 4/γ² (κ3* = γ, κ4* = 1.5γ², κ5* = 3γ³,
 * κ6* = 7.5γ⁴; the normal's for γ = 0), and the moment–cumulant relations
 *   a4 = κ4* + 3, a5 = κ5* + 10κ3*, a6 = κ6* + 15κ4* + 10κ3*² + 15.
 * The sample raw moments (Ȳ, mean Y², mean Y³) have covariance Σ_ij = (a_{i+j} − a_i a_j)/n
 * (in σ units). The quantile ŷ_p = m + s K(g, p) is a smooth function of them; at the population,
 *   ∂m = (1, 0, 0),  ∂s = (0, ½, 0),  ∂g = (−3, −3γ/2, 1)
 * (from var = a2 − a1², g = (a3 − 3a1a2 + 2a1³)/var^{3/2}), so with K_γ = ∂K/∂γ
 *   ∇ = (1 − 3 w K_γ,  K/2 − (3/2) γ w K_γ,  w K_γ),   Var(ŷ_p) ≈ σ² ∇ᵀΣ∇ + σ² K_γ² (1 − w)² MSE_R,
 * where w is the weight of the station skew in the skew used (1 without a regional skew) and the
 * last term the regional skew's own mean square error (taken independent of the record). The
 * small-sample bias factors of s and g do not enter at first order. (Kendall & Stuart's
 * large-sample covariances of moments [from memory]; the same first-order approach underlies
 * the variance of EMA quantiles of Cohn, Lane & Stedinger 2001, WRR 37(6):1695-1706, which also
 * covers censored years — derived for censored records in ema-covariance.ts.)
 *
 * Published check: without a regional skew this is exactly the standard error of a Pearson III
 * T-year event by moments of Kite (2004, Frequency and Risk Analyses in Hydrology, eq. 9-54; the δ
 * of Australian Rainfall and Runoff 1987, Book IV), Var = δ²σ²/n with
 *   δ² = 1 + Kγ + (K²/2)(3γ²/4 + 1) + 3K K_γ(γ + γ³/4) + 3K_γ²(2 + 3γ² + 5γ⁴/8)
 * (equation read as quoted by T. Ladson 2015, "Delta values for flood frequency confidence limits";
 * test/flood/ema-kite.test.ts, skews −2 … 2, exceedance 0.5 … 0.002, to 1e-7). Kite's skew term
 * is the large-sample variance of the sample skew, as here. At finite n both overstate the real
 * variance of the estimator (seeded simulation, scripts/flood-kite-variance.ts, 20,000 records a
 * case, T = 100): by 3–7 % at skew 0 (n = 20 … 60), 7–15 % at skew 0.5 and 9–23 % at skew −0.5
 * (n = 30 … 100), 2.5 % at n = 400; Griffis & Stedinger's finite-n skew variance in its place
 * comes within −11 … +7 % (not adopted: the interval's coverage was measured with this one).
 *
 * The interval is ŷ_p ± z_{(1+c)/2} √Var on log10 Q, then 10^(·): a normal approximation, not
 * the report's EMA interval (ema-intervals.ts, which uses this variance — through the general
 * censored-record covariance of ema-covariance.ts, equal to this one without censoring — with
 * noncentral-t limits). Measured coverage of this normal interval at nominal 90 %, T = 100
 * (scripts/flood-ema-ci-coverage.ts, 2000 records a case): 87.5 % (skew +0.3, n = 30), 89.2 %
 * (+0.3, n = 60), 92.8 % (−0.3, n = 60), 90.5 % (0, n = 20). (Earlier figures of 98–100 % from
 * scripts/flood-ema-coverage.py came from a wrong Richardson factor there, 8 for 4, which made
 * ∂K/∂γ 2.3 times too large; fixed: rerun with SciPy, 1000 records a case, it gives 88.6 % (+0.3,
 * n = 60), 93.4 % (−0.3, n = 60), 87.4 % (+0.3, n = 30), 87.7 % (0, n = 60, T = 10).) test/flood/ema-variance.test.ts checks the variance
 * against an independent SciPy computation (raw moments from `pearson3.moment`) and against a
 * seeded SciPy simulation of the estimator (scripts/fixtures/flood-ema-variance.py).
 */
import { InputError } from '../errors.js';
import { Pearson3Distribution } from '../families/index.js';
import { normalIsf } from '../special/index.js';

/** Standardized Pearson III frequency factor K(γ, p): the quantile of W at non-exceedance 1 − q, from its exceedance q. */
function frequencyFactor(skew: number, exceedance: number): number {
  return new Pearson3Distribution(0, 1, skew).isf(exceedance);
}

/** ∂K/∂γ by a central difference (step 1e-4: truncation about 1e-9 relative for these smooth K). */
function frequencyFactorSlope(skew: number, exceedance: number): number {
  const h = 1e-4;
  return (frequencyFactor(skew + h, exceedance) - frequencyFactor(skew - h, exceedance)) / (2 * h);
}

/** Raw moments E[W^k], k = 0 … 6, of the standardized Pearson III of skew γ. */
export function standardizedRawMoments(skew: number): number[] {
  const k3 = skew;
  const k4 = 1.5 * skew * skew;
  const k5 = 3 * skew * skew * skew;
  const k6 = 7.5 * skew * skew * skew * skew;
  return [1, 0, 1, k3, k4 + 3, k5 + 10 * k3, k6 + 15 * k4 + 10 * k3 * k3 + 15];
}

export interface QuantileVariance {
  /** log10 quantile estimate m + s K. */
  readonly estimate: number;
  /** First-order variance of the log10 quantile estimate. */
  readonly variance: number;
  readonly frequencyFactor: number;
}

/**
 * Variance of the log10 T-year quantile of log-Pearson III fitted by moments to n years.
 * `skew` is the skew used (weighted or station); `stationWeight` its station share (1 = no regional skew).
 */
export function lp3QuantileVariance(
  fit: { readonly mean: number; readonly sd: number; readonly skew: number },
  years: number,
  exceedance: number,
  regional: { readonly stationWeight: number; readonly regionalSkewMse: number } | null = null,
): QuantileVariance {
  if (!(years > 3) || !(exceedance > 0 && exceedance < 1) || !(fit.sd > 0)) {
    throw new InputError('the quantile variance needs more than 3 years, an exceedance chance in (0, 1) and a positive sd', {}, 'bad-input');
  }
  const g = fit.skew;
  const w = regional ? regional.stationWeight : 1;
  const K = frequencyFactor(g, exceedance);
  const Kg = frequencyFactorSlope(g, exceedance);
  const a = standardizedRawMoments(g);
  const grad = [1 - 3 * w * Kg, K / 2 - 1.5 * g * w * Kg, w * Kg];
  let q = 0;
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      const cov = (a[i + j + 2] as number) - (a[i + 1] as number) * (a[j + 1] as number);
      q += (grad[i] as number) * cov * (grad[j] as number);
    }
  }
  const s2 = fit.sd * fit.sd;
  const regionalTerm = regional ? Kg * Kg * (1 - w) * (1 - w) * regional.regionalSkewMse : 0;
  return { estimate: fit.mean + fit.sd * K, variance: s2 * (q / years + regionalTerm), frequencyFactor: K };
}

/** Two-sided normal-approximation interval of the flow, 10^(ŷ ± z √Var). */
export function lp3QuantileInterval(v: QuantileVariance, confidence: number): { readonly lower: number; readonly upper: number } {
  const z = normalIsf((1 - confidence) / 2);
  const se = Math.sqrt(v.variance);
  return { lower: Math.pow(10, v.estimate - z * se), upper: Math.pow(10, v.estimate + z * se) };
}
