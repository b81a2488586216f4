/**
 * analyzeDataset in two steps, so that its bootstrap can run elsewhere (the server's worker
 * threads, with progress and cancellation): planDataset does everything before the bootstrap and
 * returns the bootstrap jobs; finishDataset builds the report from their counts. For any input,
 * planDataset → run every job's replicates [start, end) → finishDataset gives the report that
 * analyzeDataset gives (same fits, same seeded replicate streams, same counts).
 *
 *  - complete samples (with or without flood, capability or trend options): the issue-2 plan
 *    (core/analyze planAnalysis) with the workflow sections added at the finish;
 *  - grouped counts: no bootstrap, the report is made at planning;
 *  - censored life data: the fits and bounds at planning, the censored Anderson–Darling bootstrap
 *    as one job per family (core/life/bootstrap-range.ts), the report from their counts;
 *  - capability: the percentile indices' bootstrap interval as jobs beside the complete sample's
 *    (capability-jobs.ts), each job's result its replicate values instead of counts;
 *  - interval rows of life data: the fits and bounds at planning, the inspection-scheme
 *    Anderson–Darling bootstrap as one job per family (core/life/interval-bootstrap.ts), the report
 *    from their counts.
 */
import { PlumblineError } from '../errors.js';
import { combineBootstrapCounts, runBootstrapRange, type BootstrapCounts, type BootstrapJob, type BootstrapRunOptions } from '../gof/index.js';
import type { CapabilityBootstrapValues } from '../capability/index.js';
import { capabilityLookup, combineCapabilityBootstrap, planCapabilityJobs, runCapabilityJob, type CapabilityJob } from './capability-jobs.js';
import { censoredGofObserved, censoringDesign } from '../life/bootstrap.js';
import { prepareLifeData } from '../life/data.js';
import {
  censoredGofFromCounts,
  intervalGofFromCounts,
  intervalGofJob,
  intervalJobData,
  INTERVAL_GOF_REPLICATES,
  LIFE_FAMILIES,
  runCensoredGofRange,
  runIntervalGofRange,
  type CensoredGofJob,
  type CensoredGofResult,
  type IntervalGofJob,
  type IntervalGofResult,
  type LifeFamilyName,
} from '../life/index.js';
import { route } from './analyze-dataset.js';
import { finishComplete, planComplete, type CompletePlan } from './complete.js';
import { DEFAULT_LIFE_REPLICATES } from './life.js';
import { workflowSettings } from './options.js';
import type { AnyDatasetReport, DatasetInput, DatasetOptions, DatasetReport } from './types.js';

/** One full-range job [0, B) of any bootstrap; ranges of it are `{ ...job, start, end }`. */
export type DatasetJob = BootstrapJob | CensoredGofJob | IntervalGofJob | CapabilityJob;

/** What a job's range gives: counts (the goodness-of-fit bootstraps) or replicate values (capability). */
export type DatasetJobResult = BootstrapCounts | CapabilityBootstrapValues;

/** The result of a range of a job of type J. */
export type DatasetJobResultOf<J extends DatasetJob> = J extends CapabilityJob ? CapabilityBootstrapValues : BootstrapCounts;

function isCapabilityJob(job: DatasetJob): job is CapabilityJob {
  return 'kind' in job && job.kind === 'capability';
}

function isCapabilityResult(r: DatasetJobResult): r is CapabilityBootstrapValues {
  return 'values' in r;
}

export type DatasetPlan =
  /** The report is ready (nothing left to run elsewhere). */
  | { readonly kind: 'done'; readonly report: AnyDatasetReport }
  /**
   * A complete sample: run `jobs` (one full range [0, B) per family that needs the bootstrap, then
   * the capability jobs, `capabilityJobs`), then finish.
   */
  | { readonly kind: 'complete'; readonly plan: CompletePlan; readonly jobs: readonly (BootstrapJob | CapabilityJob)[]; readonly capabilityJobs: readonly CapabilityJob[] }
  /** Censored life data: run `jobs` (one censored range [0, B) per fitted family), then finish. */
  | { readonly kind: 'life'; readonly jobs: readonly CensoredGofJob[]; readonly report: (results: ReadonlyMap<LifeFamilyName, CensoredGofResult>) => DatasetReport }
  /** Interval rows of life data: run `jobs` (one inspection-scheme range [0, B) per fitted family), then finish. */
  | { readonly kind: 'interval'; readonly jobs: readonly IntervalGofJob[]; readonly report: (results: ReadonlyMap<LifeFamilyName, IntervalGofResult>) => DatasetReport };

/** Run replicates [job.start, job.end) of any kind of job (pure: same job, same result). */
export function runDatasetJob<J extends DatasetJob>(job: J, opts: BootstrapRunOptions = {}): DatasetJobResultOf<J> {
  const j: DatasetJob = job;
  if (isCapabilityJob(j)) return runCapabilityJob(j, opts) as DatasetJobResultOf<J>;
  if ('kind' in j && j.kind === 'interval') return runIntervalGofRange(j, opts) as DatasetJobResultOf<J>;
  return ('kind' in j && j.kind === 'censored' ? runCensoredGofRange(j, opts) : runBootstrapRange(j as BootstrapJob, opts)) as DatasetJobResultOf<J>;
}

/** Combine the results of the disjoint ranges of one job (counts added, capability values concatenated in replicate order). */
export function combineDatasetJobResults(parts: readonly DatasetJobResult[]): DatasetJobResult {
  if (parts.length > 0 && parts.every(isCapabilityResult)) return combineCapabilityBootstrap(parts as CapabilityBootstrapValues[]);
  if (parts.some(isCapabilityResult)) throw new PlumblineError('not-computable', 'Bootstrap ranges of different kinds cannot be combined.');
  return combineBootstrapCounts(parts as BootstrapCounts[]);
}

/** Split a job's replicates [start, end) into `parts` contiguous ranges of the same job (as splitBootstrapJob). */
export function splitDatasetJob<J extends DatasetJob>(job: J, parts: number): J[] {
  const b = job.end - job.start;
  const p = Math.max(1, Math.min(parts, b));
  const out: J[] = [];
  for (let j = 0; j < p; j++) {
    const start = job.start + Math.floor((j * b) / p);
    const end = job.start + Math.floor(((j + 1) * b) / p);
    if (end > start) out.push({ ...job, start, end });
  }
  return out;
}

/** Sampled values one job draws per replicate (its n). */
export function jobSampleSize(job: DatasetJob): number {
  if ('kind' in job && job.kind === 'interval') return job.rows.counts.reduce((a, c) => a + c, 0);
  return 'kind' in job && job.kind === 'censored' ? job.times.length : (job as BootstrapJob | CapabilityJob).n;
}

/** Everything before the bootstrap. Throws the core's InputError on bad input or options. */
export function planDataset(input: DatasetInput, options: DatasetOptions = {}): DatasetPlan {
  const settings = workflowSettings(options);
  const r = route(input, options, settings);
  if (r.kind === 'grouped' || r.kind === 'pot' || r.kind === 'flood-record') return { kind: 'done', report: r.run() };
  if (r.kind === 'interval') {
    const jobs: IntervalGofJob[] = [];
    // As for the status column: the fits and bounds run here once to learn each family's job; the
    // report is made again with the results (same deterministic fits).
    const first = r.run((family, parameters, data, replicates, seed) => {
      jobs.push(intervalGofJob(family, parameters, data, replicates, seed));
      return null;
    });
    if (jobs.length === 0) return { kind: 'done', report: first };
    return { kind: 'interval', jobs, report: (results) => r.run((family) => results.get(family) ?? null) };
  }
  if (r.kind === 'life') {
    const times = Array.from(r.times);
    const failed = Array.from(r.status);
    const jobs: CensoredGofJob[] = [];
    // The fits and bounds run here once to learn each family's fit (the job); the report is then
    // made again with the results (same deterministic fits).
    const first = r.run((fit, data, replicates, seed) => {
      const observed = censoredGofObserved(fit, data);
      jobs.push({ kind: 'censored', family: fit.family, parameters: fit.parameters, times, failed, observed, seed, start: 0, end: replicates });
      return null;
    });
    if (jobs.length === 0) return { kind: 'done', report: first };
    return { kind: 'life', jobs, report: (results) => r.run((fit) => results.get(fit.family) ?? null) };
  }
  const plan = planComplete(r.input, options, settings);
  const capabilityJobs = planCapabilityJobs(plan);
  return { kind: 'complete', plan, jobs: [...plan.plan.bootstrapJobs, ...capabilityJobs], capabilityJobs };
}

export function censoredBootstrapWork(input: DatasetInput, options: DatasetOptions = {}): number {
  if (input.interval) {
    // Interval rows: the inspection-scheme bootstrap (core/life/interval-bootstrap.ts), one refit per replicate and family.
    const units = input.interval.counts ? Array.from(input.interval.counts).reduce((a, c) => a + c, 0) : input.interval.start.length;
    return (options.bootstrapReplicates ?? INTERVAL_GOF_REPLICATES) * units * (options.families?.length ?? LIFE_FAMILIES.length);
  }
  if (input.grouped || !input.values || !input.status) return 0;
  const families = options.families?.length ?? LIFE_FAMILIES.length;
  return (options.bootstrapReplicates ?? DEFAULT_LIFE_REPLICATES) * input.values.length * families;
}

/** The report of a plan from its jobs' results (one per job, in order, each over the job's whole range). */
export function finishDataset(plan: Exclude<DatasetPlan, { kind: 'done' }>, counts: readonly DatasetJobResult[]): DatasetReport {
  if (plan.kind === 'complete') {
    const k = plan.plan.plan.bootstrapJobs.length;
    const fit = counts.slice(0, k);
    const cap = counts.slice(k);
    if (fit.some(isCapabilityResult) || !cap.every(isCapabilityResult)) throw new PlumblineError('not-computable', 'The bootstrap results do not match the plan\'s jobs.');
    return finishComplete(plan.plan, fit as BootstrapCounts[], capabilityLookup(plan.capabilityJobs, cap as CapabilityBootstrapValues[]));
  }
  if (plan.kind === 'interval') {
    const results = new Map<LifeFamilyName, IntervalGofResult>();
    plan.jobs.forEach((job, i) => {
      const c = counts[i];
      if (c === undefined || isCapabilityResult(c)) throw new PlumblineError('not-computable', `No inspection-scheme bootstrap counts for ${job.family}.`);
      results.set(job.family, intervalGofFromCounts(job.observed, c, intervalJobData(job)));
    });
    return plan.report(results);
  }
  const results = new Map<LifeFamilyName, CensoredGofResult>();
  plan.jobs.forEach((job, i) => {
    const c = counts[i];
    if (c === undefined || isCapabilityResult(c)) throw new PlumblineError('not-computable', `No censored bootstrap counts for ${job.family}.`);
    results.set(job.family, censoredGofFromCounts(job.observed, c, censoringDesign(prepareLifeData({ times: job.times, failed: job.failed }))));
  });
  return plan.report(results);
}
