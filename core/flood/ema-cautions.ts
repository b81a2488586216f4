/**
 * The cautions every log-Pearson III / EMA result carries (the kind Bulletin 17C itself gives
 * about its procedures, in our own words), and the deference to the governing agency.
 */
import { formatNumber } from '../format/index.js';

export const EMA_CAUTIONS: readonly string[] = Object.freeze([
  'A design flood is a safety decision: these numbers support, and do not replace, the procedures of the governing agency (for example Bulletin 17C where it applies), local regulations and review by a licensed engineer or hydrologist.',
  'The analysis assumes the annual peaks are independent and come from one unchanging distribution; regulation, urbanization, land-use or climate change and mixed flood causes (snowmelt, rain, dam failure) break that assumption.',
  'Historical information, perception thresholds, low-outlier decisions and the regional skew and its mean square error come from judgement and regional studies; state their sources. Defaults used here are listed as assumptions.',
  'Quantiles far beyond the record length (e.g. the 500-year flood from 70 years of data) rest mainly on the fitted curve and on the skew; their intervals are wide and are themselves approximate.',
  'The station-skew mean square error is Griffis & Stedinger\'s (2009) formula with the record length, or, when years are censored or historical, with the effective record length of the skew (as Bulletin 17C does; its exact formula was not checked here): in a seeded check that length still understates the skew\'s error of records censored at the low end (simulated MSE 1.3-1.6 times the formula\'s, 1.6-1.8 times at a skew of -1.6), so the station skew gets too much weight there. The intervals come from the EMA\'s first-order variance after Cohn, Lane & Stedinger (2001), derived here without the paper\'s text, with noncentral-t limits: exact only for a normal record with the skew held; in a seeded check their nominal 90 % interval of the 100-year flow held the true value 86-96 % of the time over eleven record designs, but only 83 % for a strongly negatively skewed record (skew -1.6) censored at the low end (least in short or low-censored records). A parametric-bootstrap interval is given beside it. Check against the agency\'s procedure before any design use.',
]);

/** |station skew| from which a record with censored low years gets the record-specific caution below. */
export const STRONG_SKEW = 1;

/**
 * The cautions of one EMA fit: EMA_CAUTIONS, plus a record-specific one where the record is in the
 * regime where the seeded checks found the intervals and the skew's MSE too optimistic — a strongly
 * skewed station skew (|G| ≥ 1) with years censored at the low end (low outliers or zero flows).
 * Measured at skew −1.6 (scripts/flood-ema-ci-coverage.ts, scripts/flood-ema-skew-mse.ts); the
 * threshold |G| ≥ 1 is ours (no source), where the moment skew's variance grows fast with |G|.
 */
export function emaCautions(fit: { readonly skew: { readonly stationSkew: number }; readonly counts: { readonly lowOutliers: number; readonly zeros: number } }): readonly string[] {
  const lowCensored = fit.counts.lowOutliers + fit.counts.zeros;
  if (!(Math.abs(fit.skew.stationSkew) >= STRONG_SKEW) || lowCensored === 0) return EMA_CAUTIONS;
  return [
    ...EMA_CAUTIONS,
    `This record is strongly skewed (station skew ${formatNumber(fit.skew.stationSkew, 3)}) and has ${lowCensored} low ${lowCensored === 1 ? 'year' : 'years'} censored: in a seeded check of such a record (skew -1.6, 60 years, the lowest 5 % censored) the nominal 90 % interval held the true 100-year flow only 83 % of the time and the station skew's error was 1.6 times what its mean square error says. Treat the interval as too narrow and the station skew as less certain than reported; the bootstrap interval is given beside it.`,
  ];
}
