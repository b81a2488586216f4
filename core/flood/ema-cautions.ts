/**
 * The cautions every log-Pearson III / EMA result carries (the kind Bulletin 17C itself gives
 * about its procedures, in our own words), and the deference to the governing agency.
 */
export const EMA_CAUTIONS: readonly string[] = Object.freeze([
  'A design flood is a safety decision: these numbers support, and do not replace, the procedures of the governing agency (for example Bulletin 17C where it applies), local regulations and review by a licensed engineer or hydrologist.',
  'The analysis assumes the annual peaks are independent and come from one unchanging distribution; regulation, urbanization, land-use or climate change and mixed flood causes (snowmelt, rain, dam failure) break that assumption.',
  'Historical information, perception thresholds, low-outlier decisions and the regional skew and its mean square error come from judgement and regional studies; state their sources. Defaults used here are listed as assumptions.',
  'Quantiles far beyond the record length (e.g. the 500-year flood from 70 years of data) rest mainly on the fitted curve and on the skew; their intervals are wide and are themselves approximate.',
  'The station-skew mean square error is Griffis & Stedinger\'s (2009) formula with the record length, or, when years are censored or historical, with the effective record length of the skew (as Bulletin 17C does; its exact formula was not checked here): in a seeded check that length still understates the skew\'s error of records censored at the low end (simulated MSE 1.3-1.6 times the formula\'s, 1.6-1.8 times at a skew of -1.6), so the station skew gets too much weight there. The intervals come from the EMA\'s first-order variance after Cohn, Lane & Stedinger (2001), derived here without the paper\'s text, with noncentral-t limits: exact only for a normal record with the skew held; in a seeded check their nominal 90 % interval of the 100-year flow held the true value 86-96 % of the time over ten record designs (least in short or low-censored records). A parametric-bootstrap interval is given beside it. Check against the agency\'s procedure before any design use.',
]);
