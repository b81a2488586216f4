/**
 * Parametric bootstrap p-value for the Anderson–Darling statistic with estimated parameters
 * (Stute, González Manteiga & Presedo Quindimil 1993, Test 2:113-124 [from memory]): draw n values
 * from the fitted model, refit the family to every replicate by maximum likelihood, recompute A²
 * at the refitted parameters, and count the replicates at least as large as the observed A²:
 *
 *   p = (1 + #{A²* ≥ A²}) / (B + 1)      (Davison & Hinkley 1997, Bootstrap Methods, eq. 4.11 [from memory])
 *
 * with Monte Carlo standard error √(p(1 - p)/B). Replicate i always uses the random stream
 * `createRng(seed, i)`, so the counts are a pure function of (family, parameters, n, observed,
 * seed, start, end): ranges [start, end) can run anywhere (worker threads) and be added up, and the
 * result is the same whatever the split. Cancellation is checked between replicates.
 */
import { PlumblineError } from '../errors.js';
import { getFamily, type Family, type FamilyName, type Parameters } from '../families/index.js';
import { createRng } from '../random/index.js';
import { prepareSample } from '../sample.js';
import { andersonDarlingStatistic } from './anderson-darling.js';

/** Default number of bootstrap replicates B. */
export const DEFAULT_BOOTSTRAP_REPLICATES = 999;

/** A serialisable description of a range of bootstrap replicates. */
export interface BootstrapJob {
  readonly family: FamilyName;
  readonly parameters: Parameters;
  readonly n: number;
  /** Observed A² at the fitted parameters. */
  readonly observed: number;
  readonly seed: number;
  /** First replicate index (inclusive). */
  readonly start: number;
  /** Last replicate index (exclusive). */
  readonly end: number;
}

/** Counts over a range of replicates. */
export interface BootstrapCounts {
  readonly start: number;
  readonly end: number;
  /** Replicates run (refit succeeded or not); less than end - start only when cancelled. */
  readonly completed: number;
  /** Replicates whose refit succeeded (the ones that count in B). */
  readonly valid: number;
  /** Valid replicates with A²* ≥ observed A². */
  readonly exceed: number;
  /** Replicates whose refit failed (excluded from B). */
  readonly failed: number;
  readonly cancelled: boolean;
}

/** Anything with an `aborted` flag, e.g. an AbortSignal. */
export interface CancelSignal {
  readonly aborted: boolean;
}

export interface BootstrapRunOptions {
  readonly signal?: CancelSignal;
  /** Called after each replicate with the number done in this range and the range's size. */
  readonly onProgress?: (done: number, total: number) => void;
}

/** Run replicates [job.start, job.end). Pure: same job, same counts. */
export function runBootstrapRange(job: BootstrapJob, opts: BootstrapRunOptions = {}): BootstrapCounts {
  const family = getFamily(job.family);
  const total = job.end - job.start;
  let exceed = 0;
  let failed = 0;
  let valid = 0;
  let completed = 0;
  let cancelled = false;
  for (let i = job.start; i < job.end; i++) {
    if (opts.signal?.aborted) {
      cancelled = true;
      break;
    }
    const a2 = replicateStatistic(family, job, i);
    completed++;
    if (Number.isNaN(a2)) failed++;
    else {
      valid++;
      if (a2 >= job.observed) exceed++;
    }
    opts.onProgress?.(completed, total);
  }
  return { start: job.start, end: job.end, completed, valid, exceed, failed, cancelled };
}

/**
 * A² of replicate i at its refitted parameters, or NaN when the replicate cannot be refitted: a
 * non-finite draw, a fit that is not applicable, or a typed numerical failure anywhere in drawing,
 * refitting or computing A² (e.g. a refitted scale underflowing to 0 for data near the smallest
 * doubles). Such replicates are counted as failed and reported, never thrown (issue 6).
 */
export function replicateStatistic(family: Family, job: Pick<BootstrapJob, 'parameters' | 'n' | 'seed'>, i: number): number {
  try {
    const x = family.random(job.parameters, createRng(job.seed, i), job.n);
    x.sort();
    const sample = prepareSample(x, { alreadySorted: true });
    if (!Number.isFinite(sample.sum) && x.some((v) => !Number.isFinite(v))) return Number.NaN;
    const fit = family.fit(sample);
    if (!fit.ok) return Number.NaN;
    const a2 = andersonDarlingStatistic(family.make(fit.parameters), sample.sorted);
    return Number.isFinite(a2) ? a2 : Number.NaN;
  } catch (e) {
    if (e instanceof PlumblineError && e.code !== 'cancelled') return Number.NaN;
    throw e;
  }
}

/** Split replicates [0, replicates) into `parts` contiguous jobs (for workers). */
export function splitBootstrapJob(job: Omit<BootstrapJob, 'start' | 'end'>, replicates: number, parts: number): BootstrapJob[] {
  const p = Math.max(1, Math.min(parts, replicates));
  const jobs: BootstrapJob[] = [];
  for (let j = 0; j < p; j++) {
    const start = Math.floor((j * replicates) / p);
    const end = Math.floor(((j + 1) * replicates) / p);
    if (end > start) jobs.push({ ...job, start, end });
  }
  return jobs;
}

/** Add up counts of disjoint ranges; they must tile one contiguous range. */
export function combineBootstrapCounts(parts: readonly BootstrapCounts[]): BootstrapCounts {
  const sorted = [...parts].sort((a, b) => a.start - b.start);
  const first = sorted[0];
  if (!first) throw new PlumblineError('not-computable', 'No bootstrap replicates to combine.');
  let end = first.start;
  let completed = 0;
  let valid = 0;
  let exceed = 0;
  let failed = 0;
  let cancelled = false;
  for (const c of sorted) {
    if (c.start !== end) throw new PlumblineError('not-computable', `Bootstrap ranges do not tile: a range starts at ${c.start}, expected ${end}.`);
    end = c.end;
    completed += c.completed;
    valid += c.valid;
    exceed += c.exceed;
    failed += c.failed;
    cancelled ||= c.cancelled;
  }
  return { start: first.start, end, completed, valid, exceed, failed, cancelled };
}

export interface BootstrapPValue {
  readonly pValue: number;
  readonly monteCarloStandardError: number;
  /** B: the valid replicates. */
  readonly replicates: number;
  readonly failed: number;
}

/** p = (1 + exceed)/(B + 1) and its Monte Carlo standard error √(p(1 - p)/B). */
export function bootstrapPValue(counts: BootstrapCounts): BootstrapPValue {
  if (counts.cancelled) throw new PlumblineError('cancelled', 'The bootstrap was cancelled.');
  const b = counts.valid;
  if (b === 0) throw new PlumblineError('not-computable', 'No bootstrap replicate could be refitted.');
  const p = (1 + counts.exceed) / (b + 1);
  return { pValue: p, monteCarloStandardError: Math.sqrt((p * (1 - p)) / b), replicates: b, failed: counts.failed };
}
