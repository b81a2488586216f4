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
 * the test then rejected 0.5 % and 0 % at α = 5 % (coarser replicates than data). Measured size now,
 * and which test decides where: interval-gof-design.ts (A² decides on a common schedule, 5.3 %; with
 * each unit at its own inspection times no test decides). The statistic is A², or for a size study
 * the likelihood ratio against the Turnbull estimate (interval-likelihood-ratio.ts; `statistic`).
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
import { intervalLogLikelihood } from './interval-likelihood.js';
import { prepareIntervalLifeData, type IntervalLifeData } from './interval-likelihood-data.js';
import { INTERVAL_GOF_DEFAULT_STATISTIC, INTERVAL_GOF_METHOD, INTERVAL_GOF_SIZE, INTERVAL_GOF_STATISTIC_LABEL, type IntervalGofStatistic } from './interval-gof-design.js';
import { fitInterval } from './interval-likelihood-fit.js';
import { intervalLikelihoodRatio } from './interval-likelihood-ratio.js';
import type { LifeFamilyName } from './models.js';
import { turnbull, type TurnbullOptions } from './turnbull.js';

/** The random stream of the imputed inspections (replicate b uses stream b; B never comes near 2^40). */
const IMPUTATION_STREAM = 2 ** 40;

/** The Turnbull settings of the statistic, the same for the data and every replicate. */
export const INTERVAL_AD_TURNBULL: TurnbullOptions = { tolerance: 1e-9, maxIterations: 20000 };

/** The observed statistic of a fitted model. */
export function intervalStatistic(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData): number {
  return intervalAndersonDarling(getFamily(family).make(parameters), turnbull(data, INTERVAL_AD_TURNBULL), data.n);
}

/** The statistic `statistic` of the model `parameters` (maximised log-likelihood `logLikelihood`) on `data`. */
function statisticOf(statistic: IntervalGofStatistic, family: LifeFamilyName, parameters: Parameters, logLikelihood: number, data: IntervalLifeData): number {
  return statistic === 'likelihood-ratio' ? intervalLikelihoodRatio(logLikelihood, data) : intervalStatistic(family, parameters, data);
}

/** The observed statistic (A² unless a size study asks for the likelihood ratio) for the fitted `parameters`. */
export function intervalGofObserved(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData, statistic: IntervalGofStatistic = INTERVAL_GOF_DEFAULT_STATISTIC): number {
  const ll = statistic === 'likelihood-ratio' ? intervalLogLikelihood(getFamily(family).make(parameters), data) : Number.NaN;
  return statisticOf(statistic, family, parameters, ll, data);
}

export interface IntervalRangeOptions extends ReplicateRangeOptions {
  /** The statistic, when not A² (interval-gof-design.ts): for size studies of the likelihood ratio. */
  readonly statistic?: IntervalGofStatistic;
}

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
  const statistic = opts.statistic ?? INTERVAL_GOF_DEFAULT_STATISTIC;
  // The missing inspections, imputed once from a stream no replicate uses, so every range sees one scheme.
  const imputer = createRng(seed, IMPUTATION_STREAM);
  const extra = imputeInspections(scheme, data, () => imputer.uniform());
  const tau = data.maxTime;
  const rows = data.lower.length;
  const own = data.schedules;
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
        const [a, z] = observeUnit(scheme, kind, L, R, T, tau, extra[k] as number, own ? (own[r] as Float64Array) : null);
        lo[k] = a;
        hi[k++] = z;
      }
    }
    try {
      const sim = prepareIntervalLifeData({ start: lo, end: hi }, { trusted: true });
      const rf = fitInterval(family, sim, { warmStart: parameters });
      return rf.ok && Number.isFinite(rf.logLikelihood) ? statisticOf(statistic, family, rf.parameters, rf.logLikelihood, sim) : Number.NaN;
    } catch {
      return Number.NaN; // a replicate whose fit throws is unrefittable
    }
  }, opts);
}

/** The interval test's result: the bootstrap's, with the scheme it reproduced and whether its p-value may decide. */
export interface IntervalGofResult extends CensoredGofResult {
  readonly scheme: InspectionSchemeKind;
  /** The statistic bootstrapped (A², or the likelihood ratio in a size study) and its name in words. */
  readonly test: IntervalGofStatistic;
  readonly testLabel: string;
  /** true only where the size was measured near α (INTERVAL_GOF_SIZE); otherwise the p-value decides nothing. */
  readonly sizeCalibrated: boolean;
  readonly sizeNote: string;
}

/** The p-value from the observed statistic and the counts over the whole range (the rule of bootstrap-range.ts). */
export function intervalGofFromCounts(observed: number, counts: BootstrapCounts, data: IntervalLifeData, statistic: IntervalGofStatistic = INTERVAL_GOF_DEFAULT_STATISTIC): IntervalGofResult {
  const scheme = inspectionSchemeKind(data);
  const size = INTERVAL_GOF_SIZE[scheme];
  // Only A²'s size was measured where it decides; another statistic (a size study's choice) decides nothing.
  const calibrated = size.calibrated && statistic === INTERVAL_GOF_DEFAULT_STATISTIC;
  const sizeNote = statistic === INTERVAL_GOF_DEFAULT_STATISTIC ? size.text : `not size-calibrated where it would decide: ${INTERVAL_GOF_STATISTIC_LABEL[statistic]} is a size study's statistic (interval-gof-design.ts)`;
  return { ...censoredGofFromCounts(observed, counts), method: INTERVAL_GOF_METHOD[statistic], scheme, test: statistic, testLabel: INTERVAL_GOF_STATISTIC_LABEL[statistic], sizeCalibrated: calibrated, sizeNote };
}

export interface IntervalGofOptions {
  readonly replicates?: number;
  readonly seed?: number;
  /** The statistic, when not the one the data call for (size studies; the result then decides nothing). */
  readonly statistic?: IntervalGofStatistic;
}

/** The whole bootstrap in one piece. */
export function intervalGofBootstrap(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData, opts: IntervalGofOptions = {}): IntervalGofResult {
  const B = opts.replicates ?? 999;
  const seed = opts.seed ?? 20261201;
  const statistic = opts.statistic ?? INTERVAL_GOF_DEFAULT_STATISTIC;
  const observed = intervalGofObserved(family, parameters, data, statistic);
  return intervalGofFromCounts(observed, runIntervalReplicates(family, parameters, data, observed, seed, 0, B, { statistic }), data, statistic);
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
  readonly rows: { readonly start: readonly number[]; readonly end: readonly number[]; readonly counts: readonly number[]; readonly inspections?: readonly (readonly number[])[] };
  readonly observed: number;
  readonly seed: number;
  readonly start: number;
  readonly end: number;
}

/** The job of a family (replicates [0, replicates)). */
export function intervalGofJob(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData, replicates: number, seed: number): IntervalGofJob {
  const observed = intervalGofObserved(family, parameters, data);
  return { kind: 'interval', family, parameters, rows: { start: Array.from(data.lower), end: Array.from(data.upper), counts: Array.from(data.counts), ...(data.schedules ? { inspections: data.schedules.map((s) => Array.from(s)) } : {}) }, observed, seed, start: 0, end: replicates };
}

/** The job's rows as interval data again (already checked and merged: the same data). */
export function intervalJobData(job: IntervalGofJob): IntervalLifeData {
  return prepareIntervalLifeData({ start: job.rows.start, end: job.rows.end, counts: job.rows.counts, ...(job.rows.inspections ? { inspections: job.rows.inspections } : {}) }, { trusted: true });
}

/** Run replicates [job.start, job.end) of a job (pure). */
export function runIntervalGofRange(job: IntervalGofJob, opts: IntervalRangeOptions = {}): BootstrapCounts {
  return runIntervalReplicates(job.family, job.parameters, intervalJobData(job), job.observed, job.seed, job.start, job.end, opts);
}
