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
 *  - censored life data: the censored Anderson–Darling bootstrap still runs at planning, in one
 *    piece (it has no range form yet); `replicates` says how much of it there is.
 */
import type { BootstrapCounts, BootstrapJob } from '../gof/index.js';
import { LIFE_FAMILIES } from '../life/index.js';
import { route } from './analyze-dataset.js';
import { finishComplete, planComplete, type CompletePlan } from './complete.js';
import { DEFAULT_LIFE_REPLICATES } from './life.js';
import { workflowSettings } from './options.js';
import type { AnyDatasetReport, DatasetInput, DatasetOptions, DatasetReport } from './types.js';

export type DatasetPlan =
  /** The report is ready (nothing left to run elsewhere). */
  | { readonly kind: 'done'; readonly report: AnyDatasetReport }
  /** A complete sample: run `jobs` (one full range [0, B) per family that needs the bootstrap), then finish. */
  | { readonly kind: 'complete'; readonly plan: CompletePlan; readonly jobs: readonly BootstrapJob[] };

/** Everything before the bootstrap. Throws the core's InputError on bad input or options. */
export function planDataset(input: DatasetInput, options: DatasetOptions = {}): DatasetPlan {
  const settings = workflowSettings(options);
  const r = route(input, options, settings);
  if (r.kind !== 'complete') return { kind: 'done', report: r.run() };
  const plan = planComplete(r.input, options, settings);
  return { kind: 'complete', plan, jobs: plan.plan.bootstrapJobs };
}

/**
 * Sampled values the censored bootstrap of life data will draw at planning (replicates × units ×
 * families; each replicate refits a censored MLE), 0 for other data, so a caller can bound the
 * work before it starts.
 */
export function censoredBootstrapWork(input: DatasetInput, options: DatasetOptions = {}): number {
  if (input.grouped || !input.values || !input.status) return 0;
  const families = options.families?.length ?? LIFE_FAMILIES.length;
  return (options.bootstrapReplicates ?? DEFAULT_LIFE_REPLICATES) * input.values.length * families;
}

/** The report of a complete-sample plan from its jobs' counts (one per job, each over its whole range). */
export function finishDataset(plan: Extract<DatasetPlan, { kind: 'complete' }>, counts: readonly BootstrapCounts[]): DatasetReport {
  return finishComplete(plan.plan, counts);
}
