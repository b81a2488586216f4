/**
 * Seeded simulation: how close is the published first-order variance of a Pearson III quantile
 * estimated by moments — Kite (2004), Frequency and Risk Analyses in Hydrology, eq. 9-54, the δ of
 * Australian Rainfall and Runoff (1987) Book IV, as quoted by T. Ladson (2015), "Delta values for
 * flood frequency confidence limits", tonyladson.wordpress.com —
 *   Var(ŷ_p) ≈ δ² S²/n,
 *   δ² = 1 + Kg + (K²/2)(3g²/4 + 1) + 3K (∂K/∂g)(g + g³/4) + 3 (∂K/∂g)² (2 + 3g² + 5g⁴/8),
 * to the variance of our EMA estimator on a systematic record (the moments of log10 Q with the
 * bias-corrected station skew, core/flood emaIterate) in records of the lengths hydrologists have?
 * core/flood/ema-variance.ts and ema-covariance.ts give exactly this δ² (test/flood/ema-kite.test.ts).
 *
 * Kite's skew term 3(∂K/∂g)²(2 + 3g² + 5g⁴/8)/n is (∂K/∂g)² times the large-sample variance of the
 * sample skew, 6(1 + 3g²/2 + 5g⁴/16)/n. Beside it the script records the variant with that term
 * replaced by (∂K/∂g)² times Griffis & Stedinger's (2009) finite-n variance of the bias-corrected
 * station skew (core/flood regional-skew.ts stationSkewMse; coefficients from memory), to say which
 * skew variance gives the better quantile variance at finite n.
 *
 * Population: standardized log-Pearson III of log10 flows (mean 0, sd 1, skew γ), T-year quantile
 * y_T = K(γ, 1/T). Estimator: ŷ_T = M̂ + Ŝ K(Ĝ, 1/T). Simulated variance over R records with its
 * Monte Carlo s.e. (sd of the squared deviations / √R). Case i draws from createRng(SEED, 200 + i)
 * (SEED of scripts/flood-ema-ci-coverage.ts; its draw via drawRecord).
 *
 * Run: nice -n 10 npx tsx scripts/flood-kite-variance.ts [R] > test/fixtures/flood-kite-variance.json
 * (R = 4000 by default; under a minute of CPU).
 */
import { pathToFileURL } from 'node:url';
import { emaIterate } from '../core/flood/ema.js';
import { stationSkewMse } from '../core/flood/regional-skew.js';
import { Pearson3Distribution } from '../core/families/index.js';
import { createRng } from '../core/random/index.js';
import { caseDesign, drawRecord, SEED, type Case } from './flood-ema-ci-coverage.js';

export const KITE_CASES: Case[] = [
  { label: 'systematic n = 20, skew 0, T = 100', skew: 0, systematic: 20, period: 100 },
  { label: 'systematic n = 30, skew 0, T = 100', skew: 0, systematic: 30, period: 100 },
  { label: 'systematic n = 30, skew 0.5, T = 100', skew: 0.5, systematic: 30, period: 100 },
  { label: 'systematic n = 30, skew -0.5, T = 100', skew: -0.5, systematic: 30, period: 100 },
  { label: 'systematic n = 60, skew 0, T = 100', skew: 0, systematic: 60, period: 100 },
  { label: 'systematic n = 60, skew 0.5, T = 100', skew: 0.5, systematic: 60, period: 100 },
  { label: 'systematic n = 60, skew -0.5, T = 100', skew: -0.5, systematic: 60, period: 100 },
  { label: 'systematic n = 100, skew 0.5, T = 100', skew: 0.5, systematic: 100, period: 100 },
  { label: 'systematic n = 100, skew -0.5, T = 100', skew: -0.5, systematic: 100, period: 100 },
  { label: 'systematic n = 400, skew 0.5, T = 100 (long record: first order should hold)', skew: 0.5, systematic: 400, period: 100 },
];

/** K(g, q) of the standardized Pearson III. */
export function frequencyFactor(g: number, exceedance: number): number {
  return new Pearson3Distribution(0, 1, g).isf(exceedance);
}

/** ∂K/∂g by Richardson extrapolation of central differences (h = 1e-3 and 5e-4; independent of core's single step). */
export function frequencyFactorSlope(g: number, exceedance: number): number {
  const d = (h: number): number => (frequencyFactor(g + h, exceedance) - frequencyFactor(g - h, exceedance)) / (2 * h);
  return (4 * d(5e-4) - d(1e-3)) / 3;
}

/** Kite's (2004, eq. 9-54) δ² at skew g and exceedance chance q. */
export function kiteDeltaSquared(g: number, exceedance: number): number {
  const K = frequencyFactor(g, exceedance);
  const dK = frequencyFactorSlope(g, exceedance);
  return 1 + K * g + ((K * K) / 2) * ((3 * g * g) / 4 + 1) + 3 * K * dK * (g + (g * g * g) / 4) + 3 * dK * dK * (2 + 3 * g * g + (5 * g ** 4) / 8);
}

export function runKiteCase(c: Case, index: number, R: number): Record<string, number | string> {
  const rng = createRng(SEED, 200 + index);
  const { low, high } = caseDesign(c);
  const q = 1 / c.period;
  const truth = frequencyFactor(c.skew, q);
  const est = new Float64Array(R);
  let used = 0;
  for (let r = 0; r < R; r++) {
    const fit = emaIterate(drawRecord(rng, c, low, high));
    if (!fit.converged) continue;
    est[used++] = fit.mean + fit.sd * frequencyFactor(fit.skew.stationSkew, q);
  }
  const ys = est.slice(0, used);
  const mean = ys.reduce((a, b) => a + b, 0) / used;
  const sq = Array.from(ys, (y) => (y - mean) ** 2);
  const variance = sq.reduce((a, b) => a + b, 0) / (used - 1);
  const sdSq = Math.sqrt(sq.reduce((a, s) => a + (s - variance) ** 2, 0) / (used - 1));
  const n = c.systematic;
  const kite = kiteDeltaSquared(c.skew, q) / n;
  const dK = frequencyFactorSlope(c.skew, q);
  const g = c.skew;
  const skewTermAsymptotic = (3 * dK * dK * (2 + 3 * g * g + (5 * g ** 4) / 8)) / n;
  const withGriffisStedinger = kite - skewTermAsymptotic + dK * dK * stationSkewMse(g, n);
  return {
    label: c.label,
    skew: c.skew,
    n,
    period: c.period,
    replicates: used,
    skipped: R - used,
    simulatedVariance: variance,
    se: sdSq / Math.sqrt(used),
    bias: mean - truth,
    kite,
    kiteRatio: kite / variance,
    withGriffisStedinger,
    withGriffisStedingerRatio: withGriffisStedinger / variance,
  };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const R = Number(process.argv[2] ?? 4000);
  const cases = KITE_CASES.map((c, i) => runKiteCase(c, i, R));
  process.stdout.write(`${JSON.stringify({ seed: SEED, streams: '200 + case index', R, cases }, null, 1)}\n`);
}
