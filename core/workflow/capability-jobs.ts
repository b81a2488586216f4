/**
 * The capability bootstrap (core/capability/bootstrap.ts: the percentile indices' interval,
 * refitting the model on every replicate) as jobs of the one pipeline (pipeline.ts), so that the
 * server's worker pool and the CLI run it in ranges with progress instead of inline.
 *
 * Which model the interval is for is only certain at the finish: with a transformation it is the
 * transformation fitted to the data (known now), without one it is the best-ranked non-normal
 * candidate that no test rejects, and some tests are decided by the Anderson–Darling bootstrap that
 * runs beside this one. So, walking the non-normal candidates in ranking order (AICc, known now),
 * a job is planned for the first one and for every later one that may turn out to be the first to
 * pass (its tests still pending, or passing on their table/asymptotic decisions, which ends the
 * walk); none when the normal model passes its table Anderson–Darling test (then there is no
 * percentile method). The finish uses the job of the model it chose; a model with no job (a
 * decision this walk could not foresee) is computed inline as before, within INLINE_BOOTSTRAP_WORK.
 * Either way the numbers are those of analyzeDataset for the same seed.
 */
import type { AdPValue } from '../gof/index.js';
import {
  CAPABILITY_BOOTSTRAP_REPLICATES,
  POOL_BOOTSTRAP_WORK,
  capabilityBootstrapJob,
  combineCapabilityBootstrap,
  intervalWithheld,
  runCapabilityBootstrapRange,
  sameCapabilityJob,
  transformTarget,
  type CapabilityBootstrapJob,
  type CapabilityBootstrapValues,
  type ModelSpec,
  type SpecLimits,
} from '../capability/index.js';
import { PlumblineError } from '../errors.js';
import { compareCandidates, informationCriteria } from '../rank.js';
import type { CompletePlan } from './complete.js';

/** One capability bootstrap job [start, end); `family` names it in progress lines ('capability', one word as the families' names are). */
export interface CapabilityJob extends CapabilityBootstrapJob {
  readonly kind: 'capability';
  readonly family: string;
}

/** Largest n·B planned as a job (worker pool or CLI); beyond it no job, and the report says why there is no interval. */
export const POOL_CAPABILITY_WORK = POOL_BOOTSTRAP_WORK;

/** The table Anderson–Darling decision (core/analyze.ts: an upper bound rejects at p ≤ α, an estimate at p < α). */
function tableRejects(t: AdPValue, alpha: number): boolean {
  return t.pValueIs === 'upper-bound' ? t.pValue <= alpha : t.pValue < alpha;
}

function job(model: ModelSpec, n: number, limits: SpecLimits, seed: number, replicates: number): CapabilityJob {
  return { ...capabilityBootstrapJob(model, n, limits, seed, replicates), kind: 'capability', family: 'capability' };
}

/** The capability bootstrap jobs of a complete-sample plan (full ranges [0, B)). */
export function planCapabilityJobs(p: CompletePlan): CapabilityJob[] {
  const { settings, options, plan } = p;
  if (!settings.capability) return [];
  const sorted = plan.sample.sorted;
  const n = sorted.length;
  const replicates = options.capabilityReplicates ?? CAPABILITY_BOOTSTRAP_REPLICATES;
  if (n * replicates > POOL_CAPABILITY_WORK) return [];
  const limits: SpecLimits = { lsl: settings.lsl, usl: settings.usl };
  const { seed, alpha } = plan.options;
  const transform = options.transform ?? 'none';
  if (transform !== 'none') {
    try {
      const t = transformTarget(sorted, transform, limits, alpha);
      // no job for a model whose interval is withheld (a Johnson curve: bootstrap.ts intervalWithheld)
      return intervalWithheld(t.fitted.model) !== null ? [] : [job(t.fitted.model, n, t.limits, seed, replicates)];
    } catch (e) {
      if (e instanceof PlumblineError && e.code !== 'cancelled') return [];
      throw e;
    }
  }
  const ranked = plan.candidates
    .map((c) => ({ c, family: c.family.name, estimatedParameters: c.family.estimatedParameters, aicc: informationCriteria(c.fit.logLikelihood, c.family.estimatedParameters, n).aicc }))
    .sort(compareCandidates);
  const normal = ranked.find((r) => r.family === 'normal');
  if (normal && normal.c.table !== null && !tableRejects(normal.c.table, alpha)) return [];
  // The finish takes the first candidate that passes, else the first candidate: a job for the
  // first one, and for each later one that may be the first to pass (pending, or settled passing).
  const jobs: CapabilityJob[] = [];
  let first = true;
  for (const { c, family } of ranked) {
    if (family === 'normal') continue;
    const settled = c.table !== null && c.chiSquareBootstrapReason === null;
    const passes = settled && !tableRejects(c.table as AdPValue, alpha) && !(c.chiSquare.computable && c.chiSquare.rejected);
    const spec: ModelSpec = { kind: 'family', family, parameters: c.fit.parameters };
    // no job for a model whose interval is withheld (an exponential with both limits: bootstrap.ts intervalWithheld)
    if ((first || !settled || passes) && intervalWithheld(spec, limits) === null) jobs.push(job(spec, n, limits, seed, replicates));
    first = false;
    if (passes) break;
  }
  return jobs;
}

/** Run replicates [job.start, job.end) of a capability job (pure: same job, same values). */
export function runCapabilityJob(j: CapabilityJob, opts: { signal?: { readonly aborted: boolean }; onProgress?: (done: number, total: number) => void } = {}): CapabilityBootstrapValues {
  return runCapabilityBootstrapRange(j, opts);
}

/** The finish's look-up: the combined values of the job asking for the same replicates, or null. */
export function capabilityLookup(jobs: readonly CapabilityJob[], results: readonly CapabilityBootstrapValues[]): (j: CapabilityBootstrapJob) => CapabilityBootstrapValues | null {
  return (wanted) => {
    const i = jobs.findIndex((j) => sameCapabilityJob(j, wanted));
    return i >= 0 ? (results[i] ?? null) : null;
  };
}

export { combineCapabilityBootstrap };
