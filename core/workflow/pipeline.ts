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
 *    as one job per family (core/life/bootstrap-range.ts), the report from their counts.
 */
import { getFamily } from '../families/index.js';
import { runBootstrapRange, type BootstrapCounts, type BootstrapJob, type BootstrapRunOptions } from '../gof/index.js';
import { censoredAndersonDarling, censoredGofFromCounts, LIFE_FAMILIES, runCensoredGofRange, type CensoredGofJob, type CensoredGofResult, type LifeFamilyName } from '../life/index.js';
import { route } from './analyze-dataset.js';
import { finishComplete, planComplete, type CompletePlan } from './complete.js';
import { DEFAULT_LIFE_REPLICATES } from './life.js';
import { workflowSettings } from './options.js';
import type { AnyDatasetReport, DatasetInput, DatasetOptions, DatasetReport } from './types.js';

/** One full-range job [0, B) of either bootstrap; ranges of it are `{ ...job, start, end }`. */
export type DatasetJob = BootstrapJob | CensoredGofJob;

export type DatasetPlan =
  /** The report is ready (nothing left to run elsewhere). */
  | { readonly kind: 'done'; readonly report: AnyDatasetReport }
  /** A complete sample: run `jobs` (one full range [0, B) per family that needs the bootstrap), then finish. */
  | { readonly kind: 'complete'; readonly plan: CompletePlan; readonly jobs: readonly BootstrapJob[] }
  /** Censored life data: run `jobs` (one censored range [0, B) per fitted family), then finish. */
  | { readonly kind: 'life'; readonly jobs: readonly CensoredGofJob[]; readonly report: (results: ReadonlyMap<LifeFamilyName, CensoredGofResult>) => DatasetReport };

/** Run replicates [job.start, job.end) of either kind of job (pure: same job, same counts). */
export function runDatasetJob(job: DatasetJob, opts: BootstrapRunOptions = {}): BootstrapCounts {
  return 'kind' in job && job.kind === 'censored' ? runCensoredGofRange(job, opts) : runBootstrapRange(job as BootstrapJob, opts);
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
  return 'kind' in job && job.kind === 'censored' ? job.times.length : (job as BootstrapJob).n;
}

/** Everything before the bootstrap. Throws the core's InputError on bad input or options. */
export function planDataset(input: DatasetInput, options: DatasetOptions = {}): DatasetPlan {
  const settings = workflowSettings(options);
  const r = route(input, options, settings);
  if (r.kind === 'grouped') return { kind: 'done', report: r.run() };
  if (r.kind === 'life') {
    const times = Array.from(r.times);
    const failed = Array.from(r.status);
    const jobs: CensoredGofJob[] = [];
    // The fits and bounds run here once to learn each family's fit (the job); the report is then
    // made again with the results (same deterministic fits).
    const first = r.run((fit, data, replicates, seed) => {
      const observed = censoredAndersonDarling(getFamily(fit.family).make(fit.parameters), data);
      jobs.push({ kind: 'censored', family: fit.family, parameters: fit.parameters, times, failed, observed, seed, start: 0, end: replicates });
      return null;
    });
    if (jobs.length === 0) return { kind: 'done', report: first };
    return { kind: 'life', jobs, report: (results) => r.run((fit) => results.get(fit.family) ?? null) };
  }
  const plan = planComplete(r.input, options, settings);
  return { kind: 'complete', plan, jobs: plan.plan.bootstrapJobs };
}

export function censoredBootstrapWork(input: DatasetInput, options: DatasetOptions = {}): number {
  if (input.grouped || !input.values || !input.status) return 0;
  const families = options.families?.length ?? LIFE_FAMILIES.length;
  return (options.bootstrapReplicates ?? DEFAULT_LIFE_REPLICATES) * input.values.length * families;
}

/** The report of a plan from its jobs' counts (one per job, in order, each over the job's whole range). */
export function finishDataset(plan: Exclude<DatasetPlan, { kind: 'done' }>, counts: readonly BootstrapCounts[]): DatasetReport {
  if (plan.kind === 'complete') return finishComplete(plan.plan, counts);
  const results = new Map<LifeFamilyName, CensoredGofResult>();
  plan.jobs.forEach((job, i) => results.set(job.family, censoredGofFromCounts(job.observed, counts[i] as BootstrapCounts)));
  return plan.report(results);
}
