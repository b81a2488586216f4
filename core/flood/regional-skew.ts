/**
 * Weighting the station skew with a regional skew by their mean square errors (USGS Bulletin 17B,
 * IACWD 1982, eq. 5; kept in Bulletin 17C, England et al. 2018 [from memory]):
 *   G_w = (MSE_R · G_s + MSE_s · G_R) / (MSE_R + MSE_s),
 * the minimum-variance combination of two independent unbiased estimates.
 *
 * The station skew's MSE is the variance of the bias-corrected sample skew of a Pearson III sample
 * of n values by Griffis & Stedinger (2009, J. Hydrologic Eng. 14(2):121-130), the approximation
 * Bulletin 17C uses in place of 17B's [both attributions and the coefficients from memory]:
 *   MSE_s ≈ (6/n + a(n)) [1 + (9/6 + b(n)) G² + (15/48 + c(n)) G⁴],
 *   a(n) = −17.75/n² + 50.06/n³,
 *   b(n) = 3.92/n^0.3 − 31.1/n^0.6 + 34.86/n^0.9,
 *   c(n) = −7.31/n^0.59 + 45.9/n^1.18 − 86.5/n^1.77.
 * Its leading term 6/n (1 + 3G²/2 + 5G⁴/16) is the large-sample variance of the sample skew of a
 * Pearson III population (test/flood/ema.test.ts derives it from the moment covariances of
 * ema-variance.ts); the corrections a, b, c were checked against a seeded SciPy simulation of the
 * estimator (scripts/fixtures/flood-ema.py "skewVariance": within 3 % for n = 20 to 100, skews −1
 * to 1, where the 17B formula is off by up to 14 %). G is the station skew and n the record length
 * in years; for a record with censored or historical years, n is the effective record length of
 * the station skew (ema-covariance.ts: the years of a censor-free record whose skew has the same
 * asymptotic variance), the way Bulletin 17C computes the station skew's MSE for such records
 * [from memory: the Bulletin's own text and formula for it were not available here; ema.ts fitEma
 * finds the length and the fit together, and test/flood/ema-skew-mse.test.ts checks the MSE it
 * gives against a seeded simulation of the EMA skew]. Bulletin 17B's approximation
 * (IACWD 1982, after Wallis, Matalas & Slack 1974; coefficients as printed in the TxDOT Hydraulic
 * Design Manual, ch. 4 sec. 9 "Skew", eq. 4-7, quoting 17B — read) stays available as
 * stationSkewMse17b. The two measure different things (seeded SciPy simulation of the
 * bias-corrected skew, n = 10 … 100, skew 0 … 2, scripts/fixtures/flood-skew-mse-17b.py; tested in
 * test/flood/skew-mse-17b.test.ts): Griffis & Stedinger's is the skew's variance (within 6 % in
 * every cell), 17B's is near its mean square error about the true skew (within −9.4 … +11.1 %),
 * which adds the skew's remaining downward bias; at |G| ≥ 1.5 and n ≤ 30 that MSE is 28–138 % above
 * the variance used here for the weighting (information only; the Bulletin 17C text, which would
 * say which one it weights by, was not available). Bulletin 17B's formula:
 *   MSE ≈ 10^(A − B log10(n/10)),
 *   A = −0.33 + 0.08|G| (|G| ≤ 0.90), −0.52 + 0.30|G| (|G| > 0.90),
 *   B = 0.94 − 0.26|G| (|G| ≤ 1.50), 0.55 (|G| > 1.50).
 */
import { InputError } from '../errors.js';

/** The years the station skew's MSE is computed from: the record's, or the effective record length of a censored record. */
export interface SkewYears {
  readonly years: number;
  readonly kind: 'record' | 'effective';
}

export interface SkewWeighting {
  readonly stationSkew: number;
  readonly stationSkewMse: number;
  /** n of the station skew's MSE: the record length, or the effective record length when years are censored (mseMethod says which). */
  readonly mseYears: number;
  readonly mseYearsKind: SkewYears['kind'];
  readonly regionalSkew: number | null;
  readonly regionalSkewMse: number | null;
  /** Weight of the station skew (1 without a regional skew). */
  readonly stationWeight: number;
  /** Weight of the regional skew (0 without one). */
  readonly regionalWeight: number;
  readonly weightedSkew: number;
  readonly mseMethod: string;
}

export const STATION_SKEW_MSE_METHOD =
  'Griffis & Stedinger (2009) variance of the station skew, (6/n + a(n))[1 + (3/2 + b(n))G² + (5/16 + c(n))G⁴], the Bulletin 17C approximation [from memory], with n the record length in years';

/** The method text for censored records: n is the effective record length (Bulletin 17C's use of it from memory). */
export const STATION_SKEW_MSE_METHOD_EFFECTIVE =
  'Griffis & Stedinger (2009) variance of the station skew, (6/n + a(n))[1 + (3/2 + b(n))G² + (5/16 + c(n))G⁴], the Bulletin 17C approximation [from memory], with n the effective record length of the station skew (censored or historical years count for less, and the length is at most the record\'s years; its use here after Bulletin 17C [from memory])';

function checkYears(years: number): void {
  if (!(years > 0)) throw new InputError(`the record length must be positive (got ${String(years)})`, {}, 'bad-option');
}

/** Griffis & Stedinger's (2009) mean square error of the station skew from n years (Bulletin 17C). */
export function stationSkewMse(skew: number, years: number): number {
  checkYears(years);
  const n = years;
  const a = -17.75 / (n * n) + 50.06 / (n * n * n);
  const b = 3.92 / Math.pow(n, 0.3) - 31.1 / Math.pow(n, 0.6) + 34.86 / Math.pow(n, 0.9);
  const c = -7.31 / Math.pow(n, 0.59) + 45.9 / Math.pow(n, 1.18) - 86.5 / Math.pow(n, 1.77);
  const g2 = skew * skew;
  return (6 / n + a) * (1 + (9 / 6 + b) * g2 + (15 / 48 + c) * g2 * g2);
}

/** Bulletin 17B's approximate mean square error of a station skew from n years (superseded by 17C). */
export function stationSkewMse17b(skew: number, years: number): number {
  checkYears(years);
  const g = Math.abs(skew);
  const a = g <= 0.9 ? -0.33 + 0.08 * g : -0.52 + 0.3 * g;
  const b = g <= 1.5 ? 0.94 - 0.26 * g : 0.55;
  return Math.pow(10, a - b * Math.log10(years / 10));
}

/** The weighted skew and the weights; without a regional skew, the station skew alone. */
export function weightSkew(stationSkew: number, years: number, regional?: { skew: number; mse: number }, yearsKind: SkewYears['kind'] = 'record'): SkewWeighting {
  const mseS = stationSkewMse(stationSkew, years);
  const mseMethod = yearsKind === 'record' ? STATION_SKEW_MSE_METHOD : STATION_SKEW_MSE_METHOD_EFFECTIVE;
  if (!regional) {
    return {
      stationSkew,
      stationSkewMse: mseS,
      mseYears: years,
      mseYearsKind: yearsKind,
      regionalSkew: null,
      regionalSkewMse: null,
      stationWeight: 1,
      regionalWeight: 0,
      weightedSkew: stationSkew,
      mseMethod,
    };
  }
  if (!Number.isFinite(regional.skew)) throw new InputError('the regional skew must be a finite number', {}, 'bad-option');
  if (!(regional.mse > 0) || !Number.isFinite(regional.mse)) {
    throw new InputError(`the regional skew's mean square error must be a positive number (got ${String(regional.mse)})`, {}, 'bad-option');
  }
  const ws = regional.mse / (regional.mse + mseS);
  const wr = mseS / (regional.mse + mseS);
  return {
    stationSkew,
    stationSkewMse: mseS,
    mseYears: years,
    mseYearsKind: yearsKind,
    regionalSkew: regional.skew,
    regionalSkewMse: regional.mse,
    stationWeight: ws,
    regionalWeight: wr,
    weightedSkew: ws * stationSkew + wr * regional.skew,
    mseMethod,
  };
}
