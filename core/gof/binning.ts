/**
 * Equiprobable bins for the chi-square test.
 *
 * Edges are the fitted model's quantiles at j/k (j = 1..k-1); the outer edges are the support
 * bounds (±Infinity where unbounded). Every bin therefore expects exactly n/k observations.
 * Counting rule: a bin holds the values in [lower, upper); counts come from binary searches on the
 * sorted sample (one per edge), never from a scan per bin.
 *
 * Number of bins (Moore 1986, chapter 3 of D'Agostino & Stephens (eds.), Goodness-of-Fit
 * Techniques, Marcel Dekker): k = round(2·n^(2/5)); capped at floor(n/5) so that every bin expects
 * at least 5 (Cochran 1952, Ann. Math. Stat. 23:315-345; Cochran 1954, Biometrics 10:417-451);
 * raised to m + 2 so that the degrees of freedom k - 1 - m are at least 1.
 */
import { InputError } from '../errors.js';
import type { Distribution } from '../families/index.js';
import type { BinRow } from '../report.js';

/** Smallest expected count per bin (Cochran 1952/1954; NIST e-Handbook §1.3.5.15). */
export const MIN_EXPECTED_PER_BIN = 5;

export type BinChoice =
  | { readonly computable: true; readonly k: number; readonly kRule: string }
  | { readonly computable: false; readonly reason: string };

/** Moore's (1986) equiprobable-cell count round(2·n^(2/5)), before any cap. */
export function mooreBinCount(n: number): number {
  return Math.round(2 * Math.pow(n, 0.4));
}

/** The largest k that keeps n/k ≥ 5 expected per bin. */
export function maxBinCount(n: number): number {
  return Math.floor(n / MIN_EXPECTED_PER_BIN);
}

/**
 * Choose k for a sample of n with m estimated parameters. With `userK` the user's k is honoured
 * if it keeps ≥ 5 expected per bin and dof ≥ 1; otherwise an InputError is thrown ('bins-too-many'
 * with the largest k allowed, or 'bad-option' when k is too small for the dof). Without it the
 * Moore / Cochran rule above; if no k satisfies both constraints the test is not computable.
 */
export function chooseBinCount(n: number, m: number, userK?: number | null): BinChoice {
  const minK = m + 2;
  const maxK = maxBinCount(n);
  if (userK !== undefined && userK !== null) {
    if (!Number.isInteger(userK) || userK < 2) {
      throw new InputError(`The number of bins must be a whole number of at least 2 (got ${String(userK)}).`, { value: String(userK) }, 'bad-option');
    }
    if (userK > maxK) {
      throw new InputError(
        maxK >= 2
          ? `${userK} bins is too many for ${n} values: each bin must expect at least ${MIN_EXPECTED_PER_BIN}, so the largest number of bins allowed is ${maxK}.`
          : `${userK} bins is too many for ${n} values: each bin must expect at least ${MIN_EXPECTED_PER_BIN}, and ${n} values are too few for any valid binning (the largest k allowed would be ${maxK}).`,
        { value: String(userK) },
        'bins-too-many',
      );
    }
    if (userK < minK) {
      throw new InputError(
        `${userK} bins is too few for a model with ${m} estimated parameter${m === 1 ? '' : 's'}: the degrees of freedom k - 1 - ${m} must be at least 1, so at least ${minK} bins are needed.`,
        { value: String(userK) },
        'bad-option',
      );
    }
    return { computable: true, k: userK, kRule: `k = ${userK}, chosen by the user (${fmt(n / userK)} expected per bin).` };
  }
  const moore = mooreBinCount(n);
  if (maxK < minK) {
    return {
      computable: false,
      reason: `Too few values for a valid chi-square binning: ${n} values give at most ${maxK} bins with ${MIN_EXPECTED_PER_BIN} expected in each, but a model with ${m} estimated parameter${m === 1 ? '' : 's'} needs at least ${minK} bins for 1 degree of freedom (at least ${minK * MIN_EXPECTED_PER_BIN} values).`,
    };
  }
  let k = moore;
  const parts = [`Moore's rule round(2·n^(2/5)) = ${moore} for n = ${n}`];
  if (k > maxK) {
    k = maxK;
    parts.push(`capped at floor(n/5) = ${maxK} so that every bin expects at least 5`);
  }
  if (k < minK) {
    k = minK;
    parts.push(`raised to m + 2 = ${minK} so that the degrees of freedom are at least 1`);
  }
  return { computable: true, k, kRule: `k = ${k}: ${parts.join(', ')}.` };
}

/** Index of the first element of the ascending array `sorted` that is ≥ x (lower bound). */
export function lowerBound(sorted: ArrayLike<number>, x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if ((sorted[mid] as number) < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Edges e_0..e_k of k equiprobable bins under `dist`: support bounds outside, quantiles j/k inside. */
export function equiprobableEdges(dist: Distribution, k: number): Float64Array {
  const edges = new Float64Array(k + 1);
  edges[0] = dist.support.lower;
  edges[k] = dist.support.upper;
  for (let j = 1; j < k; j++) {
    // Upper half through the inverse survival function so that both halves are computed from
    // the small tail probability.
    edges[j] = 2 * j <= k ? dist.quantile(j / k) : dist.isf((k - j) / k);
  }
  return edges;
}

/**
 * Observed and expected counts of the sorted sample in k equiprobable bins under `dist`.
 * Counting rule [lower, upper): a value equal to an inner edge goes to the bin above it.
 * Values below the support's lower bound (not possible for a fitted, applicable model) would
 * be counted in the first bin and values at the upper bound in the last.
 */
export function equiprobableBins(dist: Distribution, sorted: ArrayLike<number>, k: number): BinRow[] {
  const n = sorted.length;
  const edges = equiprobableEdges(dist, k);
  const expected = n / k;
  const rows: BinRow[] = [];
  let below = 0;
  for (let j = 0; j < k; j++) {
    const upper = edges[j + 1] as number;
    const above = j === k - 1 ? n : lowerBound(sorted, upper);
    const lower = edges[j] as number;
    rows.push({
      lower: Number.isFinite(lower) ? lower : null,
      upper: Number.isFinite(upper) ? upper : null,
      observed: above - below,
      expected,
    });
    below = above;
  }
  return rows;
}

function fmt(x: number): string {
  return Number.isInteger(x) ? String(x) : x.toFixed(2);
}
