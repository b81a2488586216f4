/**
 * Seeded coverage of the EMA quantile intervals (core/flood/ema-intervals.ts: first-order EMA
 * variance after Cohn, Lane & Stedinger 2001, noncentral-t limits at the equivalent record length)
 * beside the plain normal (Wald) interval ŷ ± z√V on the same variance, for log-Pearson III records
 * drawn from a known population (log10 flows standardized: mean 0, sd 1, skew γ):
 *   - systematic records (n = 20, 30, 60; skews −0.3, 0, 0.3, 0.6; T = 10 and 100);
 *   - zero skew held by a regional skew of negligible MSE (1e-9): the exact noncentral-t case, a
 *     check of the harness (coverage must be nominal within Monte Carlo error);
 *   - a regional skew drawn afresh for each record, G_R ~ N(γ, MSE_R), MSE_R = 0.12;
 *   - a historical record: 40 systematic years + 100 historical years whose peaks are known only
 *     above the population's 0.95 quantile (the rest "below the threshold");
 *   - systematic years censored below a fixed low threshold (the population's 0.10 quantile);
 *   - a strong negative skew (−1.6, as the invented gauge's station skew), complete and censored
 *     below the 0.05 quantile.
 * Each record is fitted by the EMA (core/flood emaIterate, low outliers not tested: the design
 * is fixed) and the interval asks whether it holds the true quantile. The cases' records come
 * from createRng(SEED, case index); R records per case (default 2000: Monte Carlo s.e. of a 90 %
 * coverage 0.67 points).
 *
 * Run: nice -n 10 npx tsx scripts/flood-ema-ci-coverage.ts [R] > test/fixtures/flood-ema-ci-coverage.json
 * (about 2 minutes of CPU at R = 2000).
 */
import { emaIterate, type LogObservation } from '../core/flood/ema.js';
import { type EmaDesign } from '../core/flood/ema-covariance.js';
import { emaIntervals } from '../core/flood/ema-intervals.js';
import { weightSkew } from '../core/flood/regional-skew.js';
import { NORMAL_SKEW, Pearson3Distribution } from '../core/families/index.js';
import { createRng, type Rng } from '../core/random/index.js';
import { normalIsf } from '../core/special/index.js';

import { pathToFileURL } from 'node:url';

export const SEED = 20261205;
const CONFIDENCE = 0.9;

export interface Case {
  readonly label: string;
  readonly skew: number;
  readonly systematic: number;
  readonly period: number;
  /** Regional skew: 'held' (MSE 1e-9 at the true skew) or a drawn one with this MSE. */
  readonly regional?: 'held' | { mse: number };
  readonly historical?: { years: number; quantile: number };
  readonly lowCensor?: number;
}

export const CASES: Case[] = [
  { label: 'normal, zero skew held, n = 20, T = 100 (exact case)', skew: 0, systematic: 20, period: 100, regional: 'held' },
  { label: 'systematic n = 20, skew 0, T = 100', skew: 0, systematic: 20, period: 100 },
  { label: 'systematic n = 30, skew 0.3, T = 100', skew: 0.3, systematic: 30, period: 100 },
  { label: 'systematic n = 60, skew 0.3, T = 100', skew: 0.3, systematic: 60, period: 100 },
  { label: 'systematic n = 60, skew -0.3, T = 100', skew: -0.3, systematic: 60, period: 100 },
  { label: 'systematic n = 60, skew 0.6, T = 100', skew: 0.6, systematic: 60, period: 100 },
  { label: 'systematic n = 60, skew 0, T = 10', skew: 0, systematic: 60, period: 10 },
  { label: 'regional skew drawn (MSE 0.12), n = 30, skew 0.3, T = 100', skew: 0.3, systematic: 30, period: 100, regional: { mse: 0.12 } },
  { label: 'historical: 40 systematic + 100 years above the 0.95 quantile, skew 0.2, T = 100', skew: 0.2, systematic: 40, period: 100, historical: { years: 100, quantile: 0.95 } },
  { label: 'systematic n = 50 censored below the 0.10 quantile, skew -0.2, T = 100', skew: -0.2, systematic: 50, period: 100, lowCensor: 0.1 },
  { label: 'systematic n = 60, skew -1.6, T = 100 (strong negative skew)', skew: -1.6, systematic: 60, period: 100 },
  { label: 'systematic n = 60 censored below the 0.05 quantile, skew -1.6, T = 100 (strong negative skew)', skew: -1.6, systematic: 60, period: 100, lowCensor: 0.05 },
];

function draw(rng: Rng, skew: number): number {
  if (Math.abs(skew) < NORMAL_SKEW) return rng.normal();
  const alpha = 4 / (skew * skew);
  return (skew / 2) * (rng.gamma(alpha) - alpha);
}

/**
 * One record of a case's design, log10 flows standardized: the systematic years censored below
 * `low` (−∞: none), then the historical years known only above `high`.
 */
export function drawRecord(rng: Rng, c: Case, low: number, high: number): LogObservation[] {
  const obs: LogObservation[] = [];
  for (let i = 0; i < c.systematic; i++) {
    const y = draw(rng, c.skew);
    obs.push(y > low ? { kind: 'peak', y } : { kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: low });
  }
  if (c.historical) {
    for (let i = 0; i < c.historical.years; i++) {
      const y = draw(rng, c.skew);
      obs.push(y > high ? { kind: 'peak', y } : { kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: high });
    }
  }
  return obs;
}

/** The censoring thresholds of a case at its population (standardized log10 flows) and its EMA design. */
export function caseDesign(c: Case): { low: number; high: number; design: EmaDesign } {
  const pop = new Pearson3Distribution(0, 1, c.skew);
  const low = c.lowCensor !== undefined ? pop.quantile(c.lowCensor) : Number.NEGATIVE_INFINITY;
  const high = c.historical ? pop.quantile(c.historical.quantile) : Number.NaN;
  const design: EmaDesign = {
    thresholds: [{ years: c.systematic, threshold: low }, ...(c.historical ? [{ years: c.historical.years, threshold: high }] : [])],
  };
  return { low, high, design };
}

export function runCase(c: Case, index: number, R: number): Record<string, number | string> {
  const rng = createRng(SEED, index);
  const pop = new Pearson3Distribution(0, 1, c.skew);
  const truth = pop.isf(1 / c.period);
  const { low, high, design } = caseDesign(c);
  const z = normalIsf((1 - CONFIDENCE) / 2);
  let hits = 0;
  let wald = 0;
  let below = 0;
  let above = 0;
  let used = 0;
  let skipped = 0;
  let widthSum = 0;
  let nqSum = 0;
  for (let r = 0; r < R; r++) {
    const obs = drawRecord(rng, c, low, high);
    let regional: { skew: number; mse: number } | undefined;
    if (c.regional === 'held') regional = { skew: c.skew, mse: 1e-9 };
    else if (c.regional) regional = { skew: c.skew + Math.sqrt(c.regional.mse) * rng.normal(), mse: c.regional.mse };
    if (obs.filter((o) => o.kind === 'peak').length < 3) {
      skipped++;
      continue;
    }
    const fit = emaIterate(obs, regional);
    if (!fit.converged) {
      skipped++;
      continue;
    }
    const skewWeighting = weightSkew(fit.skew.stationSkew, obs.length, regional);
    const parameters = { mean: fit.mean, sd: fit.sd, skew: fit.skew.weightedSkew };
    const iv = emaIntervals({ parameters, skew: skewWeighting }, design, [c.period], CONFIDENCE).levels[0];
    if (!iv || iv.lower === null || iv.upper === null) {
      skipped++;
      continue;
    }
    used++;
    const lo = Math.log10(iv.lower);
    const hi = Math.log10(iv.upper);
    if (truth < lo) below++;
    else if (truth > hi) above++;
    else hits++;
    const y = Math.log10(iv.estimate);
    const se = Math.sqrt(iv.varianceLog10);
    if (Math.abs(y - truth) <= z * se) wald++;
    widthSum += hi - lo;
    nqSum += iv.equivalentYears ?? Number.NaN;
  }
  const row = {
    label: c.label,
    records: used,
    skipped,
    coverage: hits / used,
    truthBelowLower: below / used,
    truthAboveUpper: above / used,
    waldCoverage: wald / used,
    meanWidthLog10: widthSum / used,
    meanEquivalentYears: nqSum / used,
    monteCarloSe: Math.sqrt((CONFIDENCE * (1 - CONFIDENCE)) / used),
  };
  if (!quiet) process.stderr.write(`${c.label}: ${(100 * row.coverage).toFixed(1)} % (below ${(100 * row.truthBelowLower).toFixed(1)}, above ${(100 * row.truthAboveUpper).toFixed(1)}), Wald ${(100 * row.waldCoverage).toFixed(1)} %\n`);
  return row;
}

let quiet = true;
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  quiet = false;
  const R = Number(process.argv[2] ?? 2000);
  const rows = CASES.map((c, i) => runCase(c, i, R));
  process.stdout.write(
    `${JSON.stringify({ generator: 'scripts/flood-ema-ci-coverage.ts', seed: SEED, recordsPerCase: R, confidence: CONFIDENCE, cases: rows }, null, 1)}\n`,
  );
}
