/**
 * Map a probability given as the pair (p, 1 - p) through a fitted model's quantile function,
 * taking the upper half through the inverse survival function so that both tails are computed
 * from their small tail probability (DEVELOPERS.md, numerics).
 */
import type { Distribution } from '../families/index.js';

export function quantileOfPair(dist: Distribution, p: number, q: number): number {
  return p <= 0.5 ? dist.quantile(p) : dist.isf(q);
}

/** A finite number, or null (JSON has no Infinity/NaN). */
export function finiteOrNull(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}
