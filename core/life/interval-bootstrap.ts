/**
 * Parametric bootstrap p-value of the interval-data Anderson–Darling statistic
 * (interval-anderson-darling.ts), reproducing the inspection scheme unit by unit: each unit gets a
 * lifetime drawn from the fitted model and is observed through the inspection times the scheme of
 * interval-inspection-scheme.ts gives it — every time of a common schedule up to its end of
 * follow-up when the rows fit one, else its own recorded times with the inspection a left row or a
 * suspension does not record imputed once from the interval rows' widths (case-2 interval censoring; Ren
 * 2003, Scand. J. Statist. 30:211-226 [from memory], keeps each unit's inspection times and redraws
 * its life); exact rows are watched continuously up to the last time in the data.
 * Earlier, replicates used only each row's own times, which a row records only around its failure:
 * the test then rejected 0.5 % and 0 % at α = 5 % (coarser replicates than data). Measured size now
 * (test/fixtures/life-interval-size.json, scripts/life-interval-size.ts; INTERVAL_GOF_SIZE below):
 * on a common schedule 5.3 % (2000 samples, SE 0.49 points): its p-value decides; with each unit at
 * its own two inspection times 2.4 % (1000 samples, SE 0.69): still conservative, the cause not found
 * (not the refits: warm and cold starts agree, none failed; not the Turnbull iteration: converged),
 * so there the p-value is reported for information and decides nothing.
 * Each replicate is refitted by the same interval maximum likelihood (warm start at the fitted
 * parameters) and its statistic computed on its own Turnbull estimate against its own fit, so the
 * p-value accounts for estimated parameters (as bootstrap.ts does for right-censored data).
 * By replicate range: replicate b always draws from `createRng(seed, b)` (one uniform per unit for
 * its life, in row order) and the imputed inspections from one stream of their own, so counts over
 * any split add up to the one-piece run. A replicate that cannot be refitted counts as exceeding
 * (conservative): p = (1 + #{A²_b ≥ A²_obs} + #{unrefittable}) / (1 + B), reject at p ≤ α.
 */
import { getFamily, type Parameters } from '../families/index.js';
import type { BootstrapCounts } from '../gof/index.js';
import { createRng } from '../random/index.js';
import type { CensoredGofResult } from './bootstrap.js';
import { censoredGofFromCounts } from './bootstrap-range.js';
import { countReplicates, type ReplicateRangeOptions } from './replicate-counts.js';
import { intervalAndersonDarling } from './interval-anderson-darling.js';
import { imputeInspections, inspectionScheme, inspectionSchemeKind, observeUnit, type InspectionSchemeKind } from './interval-inspection-scheme.js';
import { prepareIntervalLifeData, type IntervalLifeData } from './interval-likelihood-data.js';
import { fitInterval } from './interval-likelihood-fit.js';
import type { LifeFamilyName } from './models.js';
import { turnbull, type TurnbullOptions } from './turnbull.js';

/** The random stream of the imputed inspections (replicate b uses stream b; B never comes near 2^40). */
const IMPUTATION_STREAM = 2 ** 40;

/** The Turnbull settings of the statistic, the same for the data and every replicate. */
export const INTERVAL_AD_TURNBULL: TurnbullOptions = { tolerance: 1e-9, maxIterations: 20000 };

export const INTERVAL_AD_METHOD =
  'Anderson–Darling A² on the Turnbull estimate (inside each innermost interval the estimate taken nearest the model; cf. Ren 2003), p-value by parametric bootstrap that refits every replicate and reproduces the inspection scheme unit by unit: each unit gets a lifetime from the fitted model and is seen at the inspections the scheme gives it (a common schedule when the rows fit one, every time up to its end of follow-up; else its own recorded times, the inspection a left row or suspension does not record imputed once from the interval rows’ widths; exact rows watched to the last time in the data); replicates that cannot be refitted count as exceeding (conservative). Assumes inspection times independent of the lives';

/** The observed statistic of a fitted model. */
export function intervalStatistic(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData): number {
  return intervalAndersonDarling(getFamily(family).make(parameters), turnbull(data, INTERVAL_AD_TURNBULL), data.n);
}

export type IntervalRangeOptions = ReplicateRangeOptions;

/** Run replicates [start, end) of the inspection-scheme bootstrap. Pure: same arguments, same counts. */
export function runIntervalReplicates(
  family: LifeFamilyName,
  parameters: Parameters,
  data: IntervalLifeData,
  observed: number,
  seed: number,
  start: number,
  end: number,
  opts: IntervalRangeOptions = {},
): BootstrapCounts {
  const fam = getFamily(family);
  const dist = fam.make(parameters);
  const scheme = inspectionScheme(data, dist);
  // The missing inspections, imputed once from a stream no replicate uses, so every range sees one scheme.
  const imputer = createRng(seed, IMPUTATION_STREAM);
  const extra = imputeInspections(scheme, data, () => imputer.uniform());
  const tau = data.maxTime;
  const rows = data.lower.length;
  const n = data.n;
  const lo = new Float64Array(n);
  const hi = new Float64Array(n);
  return countReplicates(start, end, observed, (b) => {
    const rng = createRng(seed, b);
    let k = 0;
    for (let r = 0; r < rows; r++) {
      const L = data.lower[r] as number;
      const R = data.upper[r] as number;
      const kind = data.kinds[r]!;
      for (let c = 0; c < (data.counts[r] as number); c++) {
        // Inversion of the model's own quantile (tails by isf): one uniform per unit, in row order.
        const u = rng.uniform();
        const T = u < 0.5 ? dist.quantile(u) : dist.isf(1 - u);
        const [a, z] = observeUnit(scheme, kind, L, R, T, tau, extra[k] as number);
        lo[k] = a;
        hi[k++] = z;
      }
    }
    try {
      const sim = prepareIntervalLifeData({ start: lo, end: hi }, { trusted: true });
      const rf = fitInterval(family, sim, { warmStart: parameters });
      return rf.ok && Number.isFinite(rf.logLikelihood) ? intervalStatistic(family, rf.parameters, sim) : Number.NaN;
    } catch {
      return Number.NaN; // a replicate whose fit throws is unrefittable
    }
  }, opts);
}

/**
 * The measured size of the test by scheme (scripts/life-interval-size.ts -> test/fixtures/life-interval-size.json,
 * Weibull n = 50, B = 39, α = 5 %; test/life/interval-gof-size.test.ts checks these words against the fixture).
 * Only where it was measured near α does the p-value decide.
 */
export const INTERVAL_GOF_SIZE: Readonly<Record<InspectionSchemeKind, { readonly calibrated: boolean; readonly text: string }>> = {
  'common-schedule': {
    calibrated: true,
    text: 'size measured on a common schedule (every unit inspected every 25 h to 150 h): 106 of 2000 seeded samples rejected at α = 5 % (5.3 %, SE 0.49 points; Weibull n = 50, B = 39)',
  },
  'own-times': {
    calibrated: false,
    text: 'not size-calibrated for rows that do not fit one common inspection schedule: with each unit at its own two inspection times it rejected 24 of 1000 seeded samples at α = 5 % (2.4 %, SE 0.69 points; Weibull n = 50, B = 39), far below 5 %, so its p-value is shown for information and decides nothing',
  },
};

/** The interval test's result: the bootstrap's, with the scheme it reproduced and whether its p-value may decide. */
export interface IntervalGofResult extends CensoredGofResult {
  readonly scheme: InspectionSchemeKind;
  /** true only where the size was measured near α (INTERVAL_GOF_SIZE); otherwise the p-value decides nothing. */
  readonly sizeCalibrated: boolean;
  readonly sizeNote: string;
}

/** The p-value from the observed statistic and the counts over the whole range (the rule of bootstrap-range.ts). */
export function intervalGofFromCounts(observed: number, counts: BootstrapCounts, data: IntervalLifeData): IntervalGofResult {
  const scheme = inspectionSchemeKind(data);
  const size = INTERVAL_GOF_SIZE[scheme];
  return { ...censoredGofFromCounts(observed, counts), method: INTERVAL_AD_METHOD, scheme, sizeCalibrated: size.calibrated, sizeNote: size.text };
}

export interface IntervalGofOptions {
  readonly replicates?: number;
  readonly seed?: number;
}

/** The whole bootstrap in one piece. */
export function intervalGofBootstrap(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData, opts: IntervalGofOptions = {}): IntervalGofResult {
  const B = opts.replicates ?? 999;
  const seed = opts.seed ?? 20261201;
  const observed = intervalStatistic(family, parameters, data);
  return intervalGofFromCounts(observed, runIntervalReplicates(family, parameters, data, observed, seed, 0, B), data);
}

/** A hook that gives the test's result for a fitted family (the default runs the whole bootstrap here; the pipeline records jobs). */
export type IntervalGofHook = (family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData, replicates: number, seed: number) => IntervalGofResult | null;

/** The inspection-scheme bootstrap of one family as a job run by replicate range (core/workflow/pipeline.ts, the server's pool). */
export interface IntervalGofJob {
  readonly kind: 'interval';
  readonly family: LifeFamilyName;
  /** The fitted parameters (the model the replicates are drawn from, the refits' warm start and the gap weights). */
  readonly parameters: Parameters;
  /** The prepared rows (plain arrays, so the job crosses to a worker thread as it is). */
  readonly rows: { readonly start: readonly number[]; readonly end: readonly number[]; readonly counts: readonly number[] };
  readonly observed: number;
  readonly seed: number;
  readonly start: number;
  readonly end: number;
}

/** The job of a family (replicates [0, replicates)). */
export function intervalGofJob(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData, replicates: number, seed: number): IntervalGofJob {
  const observed = intervalStatistic(family, parameters, data);
  return { kind: 'interval', family, parameters, rows: { start: Array.from(data.lower), end: Array.from(data.upper), counts: Array.from(data.counts) }, observed, seed, start: 0, end: replicates };
}

/** The job's rows as interval data again (already checked and merged: the same data). */
export function intervalJobData(job: IntervalGofJob): IntervalLifeData {
  return prepareIntervalLifeData({ start: job.rows.start, end: job.rows.end, counts: job.rows.counts }, { trusted: true });
}

/** Run replicates [job.start, job.end) of a job (pure). */
export function runIntervalGofRange(job: IntervalGofJob, opts: IntervalRangeOptions = {}): BootstrapCounts {
  return runIntervalReplicates(job.family, job.parameters, intervalJobData(job), job.observed, job.seed, job.start, job.end, opts);
}
