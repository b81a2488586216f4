/**
 * The bookkeeping shared by the life bootstraps run by replicate range (bootstrap-range.ts for
 * right-censored data, interval-bootstrap.ts for inspection data): run replicates [start, end),
 * stop between replicates when cancelled, and count the statistics at or above the observed one; a
 * replicate whose statistic is not finite (its refit failed) is counted apart as unrefittable.
 */
import type { BootstrapCounts, CancelSignal } from '../gof/index.js';

export interface ReplicateRangeOptions {
  readonly signal?: CancelSignal;
  /** After each replicate: replicates done in this range and the range's size. */
  readonly onProgress?: (done: number, total: number) => void;
}

/** `statistic(b)`: replicate b's statistic against its own refit (NaN when it cannot be refitted). */
export function countReplicates(start: number, end: number, observed: number, statistic: (b: number) => number, opts: ReplicateRangeOptions = {}): BootstrapCounts {
  let exceed = 0;
  let valid = 0;
  let failed = 0;
  let completed = 0;
  let cancelled = false;
  for (let b = start; b < end; b++) {
    if (opts.signal?.aborted) {
      cancelled = true;
      break;
    }
    completed++;
    const a = statistic(b);
    if (!Number.isFinite(a)) failed++;
    else {
      valid++;
      if (a >= observed) exceed++;
    }
    opts.onProgress?.(completed, end - start);
  }
  return { start, end, completed, valid, exceed, failed, cancelled };
}
