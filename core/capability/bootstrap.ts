/**
 * Parametric-bootstrap interval for the percentile-method indices (ISO 22514-2 Pp, Ppk, Ppu, Ppl)
 * under a fitted model: draw n values from the model, refit the same kind of model to every
 * replicate (fit-model.ts: λ re-estimated, the Johnson curve re-chosen, the family refitted),
 * recompute the indices, and take the empirical α/2 and 1 - α/2 quantiles of the replicate values
 * (the percentile interval; Efron & Tibshirani 1993, An Introduction to the Bootstrap, §13.3
 * [from memory]). Its coverage is measured in scripts/capability-coverage.ts.
 *
 * Planned and finished like core/gof/bootstrap.ts: replicate i always uses `createRng(seed, i)`, so
 * a range [start, end) can run on any worker and the combined values are the same for any split.
 */
import { PlumblineError } from '../errors.js';
import { createRng } from '../random/index.js';
import type { CancelSignal } from '../gof/index.js';
import { fitModelSpec, kindOf } from './fit-model.js';
import type { SpecLimits } from './indices.js';
import { makeModel, type ModelSpec } from './model.js';
import { percentileCapability } from './percentile.js';

export type PercentileIndexName = 'Pp' | 'Ppk' | 'Ppu' | 'Ppl';
const NAMES: readonly PercentileIndexName[] = ['Pp', 'Ppk', 'Ppu', 'Ppl'];

/** Default number of replicates of the capability bootstrap. */
export const CAPABILITY_BOOTSTRAP_REPLICATES = 999;

export interface CapabilityBootstrapJob {
  readonly model: ModelSpec;
  readonly n: number;
  readonly lsl: number | null;
  readonly usl: number | null;
  readonly seed: number;
  readonly start: number;
  readonly end: number;
}

export interface CapabilityBootstrapValues {
  readonly start: number;
  readonly end: number;
  readonly completed: number;
  readonly failed: number;
  readonly cancelled: boolean;
  /** Per replicate (in order), each index present for the limits; NaN where the refit failed. */
  readonly values: Readonly<Partial<Record<PercentileIndexName, readonly number[]>>>;
}

/** The indices of one replicate, NaN when the replicate cannot be refitted. */
export function capabilityReplicate(job: Pick<CapabilityBootstrapJob, 'model' | 'n' | 'lsl' | 'usl' | 'seed'>, i: number): Partial<Record<PercentileIndexName, number>> {
  try {
    const x = makeModel(job.model).draw(createRng(job.seed, i), job.n);
    x.sort();
    if (!Number.isFinite(x[0] as number) || !Number.isFinite(x[x.length - 1] as number)) return {};
    const refit = makeModel(fitModelSpec(kindOf(job.model), x));
    const pc = percentileCapability(refit, { lsl: job.lsl, usl: job.usl });
    const out: Partial<Record<PercentileIndexName, number>> = {};
    for (const ix of pc.indices) if (Number.isFinite(ix.estimate)) out[ix.name] = ix.estimate;
    return out;
  } catch (e) {
    if (e instanceof PlumblineError && e.code !== 'cancelled') return {};
    throw e;
  }
}

function namesFor(limits: SpecLimits): PercentileIndexName[] {
  const both = limits.lsl !== null && limits.usl !== null;
  return NAMES.filter((k) => (k === 'Pp' ? both : k === 'Ppu' ? limits.usl !== null : k === 'Ppl' ? limits.lsl !== null : true));
}

/** Run replicates [job.start, job.end). Pure: same job, same values. */
export function runCapabilityBootstrapRange(job: CapabilityBootstrapJob, opts: { signal?: CancelSignal; onProgress?: (done: number, total: number) => void } = {}): CapabilityBootstrapValues {
  const names = namesFor(job);
  const values: Partial<Record<PercentileIndexName, number[]>> = {};
  for (const k of names) values[k] = [];
  let completed = 0;
  let failed = 0;
  let cancelled = false;
  const total = job.end - job.start;
  for (let i = job.start; i < job.end; i++) {
    if (opts.signal?.aborted) {
      cancelled = true;
      break;
    }
    const r = capabilityReplicate(job, i);
    const ok = names.every((k) => r[k] !== undefined);
    if (!ok) failed++;
    for (const k of names) (values[k] as number[]).push(ok ? (r[k] as number) : Number.NaN);
    completed++;
    opts.onProgress?.(completed, total);
  }
  return { start: job.start, end: job.end, completed, failed, cancelled, values };
}

/** Split replicates [0, replicates) into `parts` contiguous jobs. */
export function splitCapabilityBootstrap(job: Omit<CapabilityBootstrapJob, 'start' | 'end'>, replicates: number, parts: number): CapabilityBootstrapJob[] {
  const p = Math.max(1, Math.min(parts, replicates));
  const jobs: CapabilityBootstrapJob[] = [];
  for (let j = 0; j < p; j++) {
    const start = Math.floor((j * replicates) / p);
    const end = Math.floor(((j + 1) * replicates) / p);
    if (end > start) jobs.push({ ...job, start, end });
  }
  return jobs;
}

/** Concatenate disjoint ranges that tile one contiguous range, in replicate order. */
export function combineCapabilityBootstrap(parts: readonly CapabilityBootstrapValues[]): CapabilityBootstrapValues {
  const sorted = [...parts].sort((a, b) => a.start - b.start);
  const first = sorted[0];
  if (!first) throw new PlumblineError('not-computable', 'No capability bootstrap replicates to combine.');
  let end = first.start;
  let completed = 0;
  let failed = 0;
  let cancelled = false;
  const values: Partial<Record<PercentileIndexName, number[]>> = {};
  for (const c of sorted) {
    if (c.start !== end) throw new PlumblineError('not-computable', `Bootstrap ranges do not tile: a range starts at ${c.start}, expected ${end}.`);
    end = c.end;
    completed += c.completed;
    failed += c.failed;
    cancelled ||= c.cancelled;
    for (const [k, v] of Object.entries(c.values) as [PercentileIndexName, readonly number[]][]) (values[k] ??= []).push(...v);
  }
  return { start: first.start, end, completed, failed, cancelled, values };
}

export interface BootstrapIndexInterval {
  readonly name: PercentileIndexName;
  readonly lower: number;
  readonly upper: number;
  readonly confidence: number;
  /** Valid replicates B. */
  readonly replicates: number;
  readonly failed: number;
  readonly method: string;
}

/** Empirical quantile of ascending values at probability p: order statistic ⌈(B + 1)p⌉ clamped to [1, B] (common practice, no source). */
function orderStatistic(sorted: readonly number[], p: number): number {
  const b = sorted.length;
  const k = Math.min(b, Math.max(1, Math.ceil((b + 1) * p - 1e-9)));
  return sorted[k - 1] as number;
}

/** The percentile intervals at confidence 1 - alpha. */
export function capabilityBootstrapIntervals(v: CapabilityBootstrapValues, alpha: number): BootstrapIndexInterval[] {
  if (v.cancelled) throw new PlumblineError('cancelled', 'The capability bootstrap was cancelled.');
  const out: BootstrapIndexInterval[] = [];
  for (const [name, list] of Object.entries(v.values) as [PercentileIndexName, readonly number[]][]) {
    const ok = list.filter((x) => !Number.isNaN(x)).sort((a, b) => a - b);
    if (ok.length < 19) throw new PlumblineError('not-computable', `Only ${ok.length} bootstrap replicates could be refitted; no interval.`);
    // the upper end: ⌈(B+1)(1 - α/2)⌉-th value; the lower end mirrors it from the bottom
    const lo = ok[Math.max(1, Math.floor((ok.length + 1) * (alpha / 2) + 1e-9)) - 1] as number;
    out.push({
      name,
      lower: lo,
      upper: orderStatistic(ok, 1 - alpha / 2),
      confidence: 1 - alpha,
      replicates: ok.length,
      failed: v.failed,
      method: `parametric bootstrap percentile interval, ${ok.length} replicates refitting the model each time`,
    });
  }
  return out;
}
