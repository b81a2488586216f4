/**
 * Seeded simulation of the mean square error of the EMA station skew for records with censored or
 * historical years, beside the two values the skew weighting could use for it (core/flood
 * regional-skew.ts stationSkewMse, Griffis & Stedinger 2009 as in Bulletin 17C [from memory]):
 *   - with n = the record's years (what the weighting did before);
 *   - with n = the effective record length of the station skew (core/flood/ema-covariance.ts:
 *     the years of a censor-free record whose skew has the same asymptotic variance, capped at the
 *     record's years), what Bulletin 17C does for censored records [from memory] and what fitEma
 *     does; the uncapped asymptotic ratio is recorded beside it (asymptoticRatio).
 * Records are drawn from a known log-Pearson III population (log10 flows standardized: mean 0,
 * sd 1, skew γ) with the designs of scripts/flood-ema-ci-coverage.ts (drawRecord), fitted by
 * core/flood emaIterate without a regional skew; the simulated MSE is mean((Ĝ − γ)²) over R
 * records, with its Monte Carlo s.e. sd((Ĝ − γ)²)/√R. Case i draws from createRng(SEED, 100 + i).
 *
 * Run: nice -n 10 npx tsx scripts/flood-ema-skew-mse.ts [R] > test/fixtures/flood-ema-skew-mse.json
 * (R = 2000 by default; about a minute of CPU).
 */
import { pathToFileURL } from 'node:url';
import { emaIterate } from '../core/flood/ema.js';
import { asymptoticSkewRecordLength, effectiveRecordLength } from '../core/flood/ema-covariance.js';
import { stationSkewMse } from '../core/flood/regional-skew.js';
import { createRng } from '../core/random/index.js';
import { caseDesign, drawRecord, SEED, type Case } from './flood-ema-ci-coverage.js';

export const SKEW_MSE_CASES: Case[] = [
  { label: 'systematic n = 60, skew 0.3 (no censoring: the effective length is the record)', skew: 0.3, systematic: 60, period: 100 },
  { label: 'historical: 40 systematic + 100 years above the 0.95 quantile, skew 0.2', skew: 0.2, systematic: 40, period: 100, historical: { years: 100, quantile: 0.95 } },
  { label: 'historical: 60 systematic + 60 years above the 0.90 quantile, skew -1.0', skew: -1, systematic: 60, period: 100, historical: { years: 60, quantile: 0.9 } },
  { label: 'systematic n = 50 censored below the 0.10 quantile, skew -0.2', skew: -0.2, systematic: 50, period: 100, lowCensor: 0.1 },
  { label: 'systematic n = 80 censored below the 0.30 quantile, skew 0.4', skew: 0.4, systematic: 80, period: 100, lowCensor: 0.3 },
  { label: 'systematic n = 60 censored below the 0.05 quantile, skew -1.6 (strong negative skew)', skew: -1.6, systematic: 60, period: 100, lowCensor: 0.05 },
  {
    label: 'the invented gauge\'s design: 73 systematic censored below the 0.04 quantile + 62 historical above the 0.95 quantile, skew -1.6 (strong negative skew)',
    skew: -1.6,
    systematic: 73,
    period: 100,
    lowCensor: 0.04,
    historical: { years: 62, quantile: 0.95 },
  },
  { label: 'systematic n = 60, skew -1.6 (no censoring, strong negative skew)', skew: -1.6, systematic: 60, period: 100 },
];

export function runSkewMseCase(c: Case, index: number, R: number): Record<string, number | string> {
  const rng = createRng(SEED, 100 + index);
  const { low, high, design } = caseDesign(c);
  let used = 0;
  let skipped = 0;
  let sum = 0;
  let sumSq = 0;
  let bias = 0;
  for (let r = 0; r < R; r++) {
    const obs = drawRecord(rng, c, low, high);
    if (obs.filter((o) => o.kind === 'peak').length < 3) {
      skipped++;
      continue;
    }
    const fit = emaIterate(obs);
    if (!fit.converged) {
      skipped++;
      continue;
    }
    const e = fit.skew.stationSkew - c.skew;
    sum += e * e;
    sumSq += e * e * e * e;
    bias += e;
    used++;
  }
  const mse = sum / used;
  const se = Math.sqrt((sumSq / used - mse * mse) / used);
  const years = design.thresholds.reduce((a, t) => a + t.years, 0);
  const erl = effectiveRecordLength(design, { mean: 0, sd: 1, skew: c.skew });
  const asymptotic = asymptoticSkewRecordLength(design, { mean: 0, sd: 1, skew: c.skew });
  return {
    label: c.label,
    skew: c.skew,
    years,
    records: used,
    skipped,
    simulatedMse: mse,
    monteCarloSe: se,
    bias: bias / used,
    effectiveRecordLength: erl,
    asymptoticRatio: asymptotic,
    mseAtEffectiveLength: stationSkewMse(c.skew, erl),
    mseAtRecordYears: stationSkewMse(c.skew, years),
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const R = Number(process.argv[2] ?? 2000);
  const rows = SKEW_MSE_CASES.map((c, i) => {
    const row = runSkewMseCase(c, i, R);
    process.stderr.write(
      `${c.label}: simulated ${(row.simulatedMse as number).toFixed(4)} ± ${(row.monteCarloSe as number).toFixed(4)}, at n_e = ${(row.effectiveRecordLength as number).toFixed(1)}: ${(row.mseAtEffectiveLength as number).toFixed(4)}, at n = ${row.years}: ${(row.mseAtRecordYears as number).toFixed(4)}\n`,
    );
    return row;
  });
  process.stdout.write(`${JSON.stringify({ generator: 'scripts/flood-ema-skew-mse.ts', seed: SEED, recordsPerCase: R, cases: rows }, null, 1)}\n`);
}
