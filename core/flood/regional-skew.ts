/**
 * Weighting the station skew with a regional skew by their mean square errors (USGS Bulletin 17B,
 * IACWD 1982, eq. 5; kept in Bulletin 17C, England et al. 2018, §6 [from memory]):
 *   G_w = (MSE_R · G_s + MSE_s · G_R) / (MSE_R + MSE_s),
 * the minimum-variance combination of two independent unbiased estimates. The station skew's MSE
 * is Bulletin 17B's approximation (IACWD 1982, after Wallis, Matalas & Slack 1974
 * [from memory]):
 *   MSE_s ≈ 10^(A − B log10(n/10)),
 *   A = −0.33 + 0.08|G| (|G| ≤ 0.90), −0.52 + 0.30|G| (|G| > 0.90),
 *   B = 0.94 − 0.26|G| (|G| ≤ 1.50), 0.55 (|G| > 1.50),
 * with n the record length in years. Bulletin 17C computes the station skew's MSE from the EMA
 * moments and the record's censoring; this file uses the simpler 17B formula with the whole
 * record length, and the report says so.
 */
import { InputError } from '../errors.js';

export interface SkewWeighting {
  readonly stationSkew: number;
  readonly stationSkewMse: number;
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
  'Bulletin 17B approximation 10^(A − B log10(n/10)) with n the record length (Bulletin 17C instead derives it from the EMA moments)';

/** Bulletin 17B's approximate mean square error of a station skew from n years. */
export function stationSkewMse(skew: number, years: number): number {
  if (!(years > 0)) throw new InputError(`the record length must be positive (got ${String(years)})`, {}, 'bad-option');
  const g = Math.abs(skew);
  const a = g <= 0.9 ? -0.33 + 0.08 * g : -0.52 + 0.3 * g;
  const b = g <= 1.5 ? 0.94 - 0.26 * g : 0.55;
  return Math.pow(10, a - b * Math.log10(years / 10));
}

/** The weighted skew and the weights; without a regional skew, the station skew alone. */
export function weightSkew(stationSkew: number, years: number, regional?: { skew: number; mse: number }): SkewWeighting {
  const mseS = stationSkewMse(stationSkew, years);
  if (!regional) {
    return {
      stationSkew,
      stationSkewMse: mseS,
      regionalSkew: null,
      regionalSkewMse: null,
      stationWeight: 1,
      regionalWeight: 0,
      weightedSkew: stationSkew,
      mseMethod: STATION_SKEW_MSE_METHOD,
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
    regionalSkew: regional.skew,
    regionalSkewMse: regional.mse,
    stationWeight: ws,
    regionalWeight: wr,
    weightedSkew: ws * stationSkew + wr * regional.skew,
    mseMethod: STATION_SKEW_MSE_METHOD,
  };
}
