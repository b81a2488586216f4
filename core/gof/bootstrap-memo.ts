/**
 * Reuse of bootstrap replicate statistics across jobs whose statistics cannot differ.
 *
 * For a location-scale family (normal; lognormal and Weibull on ln x; Gumbel) or a scale family
 * (exponential), with the parameters estimated by maximum likelihood (an equivariant estimator),
 * the null distribution of A² and of X² on k equiprobable bins under the refitted model depends on
 * n and k only, not on the true parameters (David & Johnson 1948, Biometrika 35:182-190 [from
 * memory]; the same fact behind the published A² tables). More than that: replicate i draws its
 * sample as a location-scale (or scale) transform of the same uniforms/normals of stream
 * createRng(seed, i) whatever the parameters (each family's `random`), so A²* and X²* of replicate i
 * are the same numbers, up to the refit's convergence tolerance, at any parameters. A batch of many
 * series of one size therefore asks for the same B replicates again and again; this memo keeps the
 * last few ranges per thread and gives their statistics back. Counts computed from them equal a fresh
 * run's (checked replicate by replicate in test/gof/bootstrap-memo.test.ts); X² takes few distinct
 * values and is computed from integer bin counts, so ties with the observed value are unchanged.
 *
 * Gamma (shape), the threshold families and the GEV are not parameter-free and never use the memo.
 */
import type { FamilyName } from '../families/index.js';
import type { BootstrapJob } from './bootstrap.js';

/** Replicate statistics of one range: A²* and X²* (NaN where unrefittable, X²* NaN when k = 0). */
export interface ReplicateStatistics {
  readonly a2: Float64Array;
  readonly x2: Float64Array;
  /** Replicates run (end - start unless cancelled). */
  readonly completed: number;
  readonly cancelled: boolean;
}

const PARAMETER_FREE: ReadonlySet<FamilyName> = new Set<FamilyName>(['normal', 'lognormal', 'exponential', 'weibull', 'gumbel']);

/** Ranges kept per thread (each 16 bytes a replicate: 64 ranges of B = 999 hold about 1 MiB). */
export const MEMO_CAPACITY = 64;

const memo = new Map<string, ReplicateStatistics>();

/** The memo key of a job whose replicate statistics are parameter-free, else null. */
export function parameterFreeKey(job: Pick<BootstrapJob, 'family' | 'n' | 'seed' | 'start' | 'end'>, k: number, withA2 = true): string | null {
  if (!PARAMETER_FREE.has(job.family)) return null;
  return `${job.family}|${job.n}|${job.seed}|${job.start}|${job.end}|${k}|${withA2 ? 'a2' : 'x2'}`;
}

export function recallReplicates(key: string): ReplicateStatistics | undefined {
  const hit = memo.get(key);
  if (hit !== undefined) {
    memo.delete(key); // most recently used last
    memo.set(key, hit);
  }
  return hit;
}

export function rememberReplicates(key: string, stats: ReplicateStatistics): void {
  memo.set(key, stats);
  if (memo.size > MEMO_CAPACITY) {
    const oldest = memo.keys().next().value;
    if (oldest !== undefined) memo.delete(oldest);
  }
}

/** Empty the memo (tests: compare fresh runs with recalled ones). */
export function clearReplicateMemo(): void {
  memo.clear();
}
