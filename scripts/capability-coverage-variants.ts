/**
 * Why does the Johnson capability interval over-cover at n = 50? One seeded simulation, several
 * interval rules computed from the same bootstrap replicates of each sample (so their differences
 * are not Monte Carlo noise between runs):
 *  - report:     BCa with the jackknife acceleration and the small-sample expanded z (what the report gives);
 *  - bca:        BCa, plain z (no expansion);
 *  - bc:         bias-corrected only (acceleration 0), expanded z;
 *  - bc-plain:   bias-corrected only, plain z;
 *  - percentile: plain percentile ends (no bias correction, no acceleration), plain z;
 *  - same-type:  as report, but only the replicates whose refitted Johnson curve has the sample's type
 *                (a diagnostic of the type switching, not a method: it conditions on the type);
 *  - nonparametric (with --nonparametric): BCa as report, but the replicates resample the data with
 *                replacement instead of drawing from the fitted curve;
 * and two diagnostics: the share of bootstrap replicates whose refitted Johnson curve is of another
 * type than the sample's (first 50 samples), and the mean |acceleration|.
 *
 * Run: npx tsx scripts/capability-coverage-variants.ts N SIMULATIONS REPLICATES [--boxcox] [--nonparametric]
 * (the Johnson setup of scripts/capability-coverage.ts by default). Prints JSON. The committed run
 * (1000 samples × 999 replicates at n = 50 and 125) is test/fixtures/capability-coverage-johnson-variants.json.
 *
 * What it showed (Johnson SU process, nominal 95 %, Monte Carlo se about 0.7 point):
 *  - the rule does not explain the n = 50 over-coverage: report 97.8/97.1/95.4/97.3 (Pp/Ppk/Ppu/Ppl),
 *    without the expansion 97.1/96.2/95.0/96.6, without acceleration 97.2/96.7/95.6/96.9, plain
 *    percentile 95.4/97.1/94.0/95.7; the mean |acceleration| is only 0.03;
 *  - the misses are one-sided: the truth lies below the interval in 2.1-4.5 % of samples at n = 50
 *    and 4.5-5.8 % at n = 125, above it in 0.1-0.2 % and 0.6-1.0 % (nominal 2.5 % each side);
 *  - the cause is the Johnson type fitted to the sample. The truth is SU, but the four-quantile
 *    ratio picks SB for 37 % of samples at n = 50 and 30 % at n = 125. Split by that type: samples
 *    fitted SU are covered 98.5-99.8 % (their replicates switch type 21-28 % of the time, which
 *    stretches the replicate distribution), samples fitted SB only 81-94 %, the truth below the
 *    interval in 5.8-18.8 % (a bounded SB curve has short tails, so its replicates give indices that
 *    are too high). The two-sided rate is a mixture of the two, over at n = 50 and about nominal at 125;
 *  - conditioning on the type (keeping only replicates of the sample's type) is far worse
 *    (71-86 %): the type switching is part of the estimator's real variability and must stay.
 *  - resampling the data instead (nonparametric bootstrap, same BCa ends) is no fix either: n = 50
 *    96.1/94.5/96.9/95.3, n = 125 93.9/91.6/94.8/92.2 (Ppk 3.4 points short at the larger n).
 * The estimator itself is close to median-unbiased (51-53 % of 4000 samples above the true index).
 * Not fixed here, nor by the rules of scripts/capability-coverage-calibration.ts (smoothed resampling,
 * a double bootstrap, a bootstrap-t): the report withholds the Johnson interval and says why
 * (JOHNSON_INTERVAL_WITHHELD, core/capability/bootstrap.ts).
 */
import { capabilityBootstrapIntervals, fitModelSpec, jackknifeIndices, makeModel, percentileCapability, runCapabilityBootstrapRange, type ModelSpec, type PercentileIndexName } from '../core/capability/index.js';
import { PlumblineError } from '../core/errors.js';
import { createRng } from '../core/random/index.js';
import { normalCdf, normalQuantile } from '../core/special/index.js';
import { COVERAGE_SETUP, JOHNSON_SETUP } from './capability-coverage.js';

const args = process.argv.slice(2).filter((a) => !a.startsWith('--'));
const n = Number(args[0] ?? 50);
const simulations = Number(args[1] ?? 400);
const replicates = Number(args[2] ?? 499);
const setup = process.argv.includes('--boxcox') ? COVERAGE_SETUP : JOHNSON_SETUP;
const kind = setup.truth.kind === 'johnson' ? 'johnson' : 'boxcox';
const { truth, limits, alpha, dataSeed, bootstrapSeedBase } = setup;
const trueIndices = Object.fromEntries(percentileCapability(makeModel(truth), limits).indices.map((i) => [i.name, i.estimate])) as Record<PercentileIndexName, number>;
const rules = ['report', 'bca', 'bc', 'bc-plain', 'percentile', 'same-type', 'nonparametric'] as const;
const NONPARAMETRIC = process.argv.includes('--nonparametric');
const covered: Record<string, Record<string, number>> = {};
const samplesOf: Record<string, number> = {};
const below: Record<string, Record<string, number>> = {};
let counted = 0;
// the report's rule split by the Johnson type fitted to the sample: [covered, truth below, samples] per index
const byType: Record<string, Record<string, [number, number, number]>> = {};
let typeOther = 0;
let typeAll = 0;
let accSum = 0;
let accCount = 0;

function orderStatistic(sorted: readonly number[], p: number): number {
  const b = sorted.length;
  const k = Math.min(b, Math.max(1, Math.ceil((b + 1) * p - 1e-9)));
  return sorted[k - 1] as number;
}

const t0 = Date.now();
for (let s = 0; s < simulations; s++) {
  const x = makeModel(truth).draw(createRng(dataSeed, s), n).sort();
  let spec: ModelSpec;
  try {
    spec = fitModelSpec({ kind }, x);
  } catch (e) {
    if (e instanceof PlumblineError) continue;
    throw e;
  }
  const seed = bootstrapSeedBase + s;
  const values = runCapabilityBootstrapRange({ model: spec, n, lsl: limits.lsl, usl: limits.usl, seed, start: 0, end: replicates });
  const est: Partial<Record<PercentileIndexName, number>> = {};
  for (const ix of percentileCapability(makeModel(spec), limits).indices) est[ix.name] = ix.estimate;
  const jk = jackknifeIndices(spec, x, limits);
  // the same replicates again, keeping only those whose refitted curve has the sample's type
  const sameType: Partial<Record<PercentileIndexName, number[]>> = {};
  for (let i = 0; i < replicates; i++) {
    let keep: Partial<Record<PercentileIndexName, number>> = {};
    try {
      const r = makeModel(spec).draw(createRng(seed, i), n).sort();
      const f = fitModelSpec({ kind }, r);
      if (f.kind !== 'johnson' || spec.kind !== 'johnson' || f.type === spec.type) {
        for (const ix of percentileCapability(makeModel(f), limits).indices) keep[ix.name] = ix.estimate;
      }
    } catch {
      keep = {};
    }
    for (const name of Object.keys(values.values) as PercentileIndexName[]) (sameType[name] ??= []).push(keep[name] ?? Number.NaN);
  }
  let intervals: Record<string, { name: string; lower: number; upper: number; acceleration?: number }[]>;
  try {
    const report = capabilityBootstrapIntervals(values, alpha, est, jk, n);
    intervals = {
      report,
      bca: capabilityBootstrapIntervals(values, alpha, est, jk, null),
      bc: capabilityBootstrapIntervals(values, alpha, est, {}, n),
      'bc-plain': capabilityBootstrapIntervals(values, alpha, est, {}, null),
      percentile: Object.entries(values.values).map(([name, list]) => {
        const ok = (list as number[]).filter((v) => !Number.isNaN(v)).sort((a, b) => a - b);
        const z = -normalQuantile(alpha / 2);
        return { name, lower: orderStatistic(ok, normalCdf(-z)), upper: orderStatistic(ok, normalCdf(z)) };
      }),
    };
    for (const iv of report) {
      accSum += Math.abs(iv.acceleration);
      accCount++;
    }
    if (NONPARAMETRIC) {
      // resampling the data (with replacement) instead of drawing from the fitted curve, refitting each
      const np: Partial<Record<PercentileIndexName, number[]>> = {};
      for (let i = 0; i < replicates; i++) {
        const rng = createRng(seed + 500_000_000, i);
        const r = new Float64Array(n);
        for (let k = 0; k < n; k++) r[k] = x[Math.min(n - 1, Math.floor(rng.uniform() * n))] as number;
        r.sort();
        let got: Partial<Record<PercentileIndexName, number>> = {};
        try {
          for (const ix of percentileCapability(makeModel(fitModelSpec({ kind }, r)), limits).indices) got[ix.name] = ix.estimate;
        } catch {
          got = {};
        }
        for (const name of Object.keys(values.values) as PercentileIndexName[]) (np[name] ??= []).push(got[name] ?? Number.NaN);
      }
      try {
        intervals.nonparametric = capabilityBootstrapIntervals({ ...values, values: np }, alpha, est, jk, n);
      } catch (e) {
        if (!(e instanceof PlumblineError)) throw e;
      }
    }
    // apart: too few replicates of the sample's type gives no interval for this rule only
    try {
      intervals['same-type'] = capabilityBootstrapIntervals({ ...values, values: sameType }, alpha, est, jk, n);
    } catch (e) {
      if (!(e instanceof PlumblineError)) throw e;
    }
  } catch (e) {
    if (e instanceof PlumblineError) continue;
    throw e;
  }
  counted++;
  for (const rule of rules) {
    if (intervals[rule]) samplesOf[rule] = (samplesOf[rule] ?? 0) + 1;
    for (const iv of intervals[rule] ?? []) {
      const t = trueIndices[iv.name as PercentileIndexName];
      (covered[rule] ??= {})[iv.name] = (covered[rule]?.[iv.name] ?? 0) + (iv.lower <= t && t <= iv.upper ? 1 : 0);
      (below[rule] ??= {})[iv.name] = (below[rule]?.[iv.name] ?? 0) + (t < iv.lower ? 1 : 0);
    }
  }
  const sampleType = spec.kind === 'johnson' ? spec.type : spec.kind;
  for (const iv of intervals.report ?? []) {
    const t = trueIndices[iv.name as PercentileIndexName];
    const cell = ((byType[sampleType] ??= {})[iv.name] ??= [0, 0, 0]);
    cell[0] += iv.lower <= t && t <= iv.upper ? 1 : 0;
    cell[1] += t < iv.lower ? 1 : 0;
    cell[2] += 1;
  }
  if (s < 50 && spec.kind === 'johnson') {
    for (let i = 0; i < replicates; i++) {
      const r = makeModel(spec).draw(createRng(seed, i), n).sort();
      try {
        const f = fitModelSpec({ kind }, r);
        typeAll++;
        if (f.kind === 'johnson' && f.type !== spec.type) typeOther++;
      } catch {
        /* an unrefittable replicate: not counted */
      }
    }
  }
}
const pct = (k: number, m = counted): number => Math.round((1000 * k) / m) / 10;
const out = {
  generator: 'scripts/capability-coverage-variants.ts',
  setup: { ...setup, simulations, replicates },
  n,
  samples: counted,
  standardErrorAt95: Math.round(1000 * Math.sqrt((0.95 * 0.05) / counted)) / 10,
  samplesWithInterval: samplesOf,
  coverage: Object.fromEntries(rules.map((r) => [r, Object.fromEntries(Object.entries(covered[r] ?? {}).map(([k, v]) => [k, pct(v, samplesOf[r])]))])),
  truthBelowInterval: Object.fromEntries(rules.map((r) => [r, Object.fromEntries(Object.entries(below[r] ?? {}).map(([k, v]) => [k, pct(v, samplesOf[r])]))])),
  reportBySampleType: Object.fromEntries(
    Object.entries(byType).map(([type, cells]) => [
      type,
      Object.fromEntries(Object.entries(cells).map(([k, [c, b, m]]) => [k, { samples: m, coverage: Math.round((1000 * c) / m) / 10, truthBelow: Math.round((1000 * b) / m) / 10 }])),
    ]),
  ),
  replicatesOfAnotherJohnsonType: typeAll > 0 ? typeOther / typeAll : null,
  meanAbsoluteAcceleration: accCount > 0 ? accSum / accCount : null,
  seconds: (Date.now() - t0) / 1000,
};
process.stdout.write(JSON.stringify(out, null, 1) + '\n');
