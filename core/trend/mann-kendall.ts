/**
 * The Mann–Kendall test for a monotonic trend (Mann 1945, Econometrica 13:245-259; Kendall 1975,
 * Rank Correlation Methods, 4th ed.; applied to hydrological series by Hirsch, Slack & Smith 1982,
 * Water Resources Research 18:107-121).
 *
 *   S = Σ_{i<j} sign(x_j - x_i) sign(t_j - t_i)
 *   Var S = [n(n-1)(2n+5) - Σ_g t_g(t_g-1)(2t_g+5)] / 18     (t_g: sizes of tied groups of x)
 *   Z = (S - 1)/√Var S if S > 0, (S + 1)/√Var S if S < 0, 0 if S = 0   (continuity correction)
 * two-sided p = 2Φ(-|Z|). For n ≤ 10 without ties the exact null distribution of S (all n!
 * orderings equally likely; S = N - 2I with I the number of inversions, counted by the Mahonian
 * recursion) gives the exact two-sided p instead.
 *
 * S is computed in O(n log n) with a Fenwick tree over the ranks of x, in time order.
 * The test assumes serially independent values; positive autocorrelation makes it reject too
 * often (Hamed & Rao 1998, J. Hydrology 204:182-196 [from memory]).
 */
import { InputError } from '../errors.js';
import { normalCdf } from '../special/index.js';
import { formatNumber, formatPValue } from '../format/index.js';
import { senSlope, type SenSlope } from './sen-slope.js';

export interface TrendOptions {
  /** Times (e.g. years) of the values, all distinct; default 1, 2, …, n (the given order). */
  readonly times?: ArrayLike<number> | null;
  /** Significance level of the test and 1 - confidence of Sen's slope interval (default 0.05). */
  readonly alpha?: number;
}

export interface TrendResult {
  readonly n: number;
  readonly s: number;
  /** Var S with the tie correction. */
  readonly varianceS: number;
  /** Σ t(t-1)(2t+5) over tied groups of the values. */
  readonly tieTerm: number;
  readonly tiedGroups: number;
  /** Z with the continuity correction. */
  readonly z: number;
  readonly pValue: number;
  /** 'exact' (n ≤ 10, no ties) or 'normal' (normal approximation with continuity correction). */
  readonly pMethod: 'exact' | 'normal';
  /** Normal-approximation p, also when the exact one is reported. */
  readonly pValueNormal: number;
  /** Kendall's tau-a = S / (n(n-1)/2) and tau-b = S / √(N(N - Σ t(t-1)/2)). */
  readonly tauA: number;
  readonly tauB: number;
  readonly alpha: number;
  readonly trendDetected: boolean;
  readonly direction: 'increasing' | 'decreasing' | 'none';
  /** Sen's slope per unit of time with its interval; null when n is too large for all pairs. */
  readonly senSlope: SenSlope | null;
  readonly method: string;
  readonly decision: string;
  /** Plain-words warning when a trend is detected, else null. */
  readonly warning: string | null;
  readonly cautions: readonly string[];
}

const EXACT_MAX_N = 10;

/** Number of permutations of n with each inversion count 0..n(n-1)/2 (Mahonian numbers). */
export function inversionCounts(n: number): Float64Array {
  let counts = new Float64Array([1]);
  for (let k = 2; k <= n; k++) {
    const next = new Float64Array(counts.length + k - 1);
    for (let i = 0; i < counts.length; i++) {
      const c = counts[i] as number;
      for (let j = 0; j < k; j++) next[i + j] = (next[i + j] as number) + c;
    }
    counts = next;
  }
  return counts;
}

/** Exact two-sided P(|S| ≥ |s|) for n values without ties. */
export function exactMannKendallP(n: number, s: number): number {
  const counts = inversionCounts(n);
  const N = (n * (n - 1)) / 2;
  let total = 0;
  let tail = 0;
  for (let inv = 0; inv < counts.length; inv++) {
    const c = counts[inv] as number;
    total += c;
    if (Math.abs(N - 2 * inv) >= Math.abs(s)) tail += c;
  }
  return Math.min(1, tail / total);
}

function orderByTime(values: ArrayLike<number>, times: ArrayLike<number> | null | undefined): { x: Float64Array; t: Float64Array } {
  const n = values.length;
  const x = new Float64Array(n);
  const t = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const v = values[i] as number;
    if (!Number.isFinite(v)) throw new InputError(`Value #${i + 1} is not a finite number (${String(v)}).`, { value: String(v) }, 'not-a-number');
    x[i] = v;
    t[i] = times ? (times[i] as number) : i + 1;
  }
  if (!times) return { x, t };
  if (times.length !== n) throw new InputError(`The times (${times.length}) and the values (${n}) must have the same length.`, {}, 'bad-input');
  const idx = Array.from({ length: n }, (_, i) => i);
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(t[i] as number)) throw new InputError(`Time #${i + 1} is not a finite number.`, { value: String(times[i]) }, 'not-a-number');
  }
  idx.sort((a, b) => (t[a] as number) - (t[b] as number));
  const xs = new Float64Array(n);
  const ts = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    xs[i] = x[idx[i] as number] as number;
    ts[i] = t[idx[i] as number] as number;
    if (i > 0 && ts[i] === ts[i - 1]) {
      throw new InputError(`Two values share the time ${String(ts[i])}; the trend test needs one value per time.`, { value: String(ts[i]) }, 'bad-input');
    }
  }
  return { x: xs, t: ts };
}

/** S by a Fenwick tree over the ranks of x (x in time order). */
function kendallS(x: Float64Array): { s: number; ties: number[] } {
  const n = x.length;
  const sorted = Float64Array.from(x).sort();
  // distinct values and tie groups
  const uniq: number[] = [];
  const ties: number[] = [];
  for (let i = 0; i < n; ) {
    let j = i + 1;
    while (j < n && sorted[j] === sorted[i]) j++;
    uniq.push(sorted[i] as number);
    if (j - i > 1) ties.push(j - i);
    i = j;
  }
  const m = uniq.length;
  const tree = new Float64Array(m + 1);
  const rankOf = (v: number): number => {
    let lo = 0;
    let hi = m - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((uniq[mid] as number) < v) lo = mid + 1;
      else hi = mid;
    }
    return lo + 1; // 1-based
  };
  const prefix = (r: number): number => {
    let s = 0;
    for (let i = r; i > 0; i -= i & -i) s += tree[i] as number;
    return s;
  };
  let s = 0;
  for (let j = 0; j < n; j++) {
    const r = rankOf(x[j] as number);
    const less = prefix(r - 1);
    const lessOrEqual = prefix(r);
    const greater = j - lessOrEqual;
    s += less - greater;
    for (let i = r; i <= m; i += i & -i) tree[i] = (tree[i] as number) + 1;
  }
  return { s, ties };
}

export function mannKendall(values: ArrayLike<number>, opts: TrendOptions = {}): TrendResult {
  const alpha = opts.alpha ?? 0.05;
  if (!(alpha > 0 && alpha < 1)) throw new InputError(`alpha must lie strictly between 0 and 1 (got ${String(alpha)}).`, { value: String(alpha) }, 'bad-option');
  const n = values.length;
  if (n < 3) throw new InputError(`The trend test needs at least 3 values (got ${n}).`, {}, 'too-few-values');
  const { x, t } = orderByTime(values, opts.times);
  const { s, ties } = kendallS(x);
  let tieTerm = 0;
  let tiePairs = 0;
  for (const g of ties) {
    tieTerm += g * (g - 1) * (2 * g + 5);
    tiePairs += (g * (g - 1)) / 2;
  }
  const varianceS = (n * (n - 1) * (2 * n + 5) - tieTerm) / 18;
  const N = (n * (n - 1)) / 2;
  if (!(varianceS > 0)) throw new InputError('All values are equal; there is no trend to test.', {}, 'not-computable');
  const sd = Math.sqrt(varianceS);
  const z = s > 0 ? (s - 1) / sd : s < 0 ? (s + 1) / sd : 0;
  const pValueNormal = Math.min(1, 2 * normalCdf(-Math.abs(z)));
  const exact = n <= EXACT_MAX_N && ties.length === 0;
  const pValue = exact ? exactMannKendallP(n, s) : pValueNormal;
  const trendDetected = pValue < alpha;
  const direction = !trendDetected ? 'none' : s > 0 ? 'increasing' : 'decreasing';
  const slope = senSlope(x, t, { alpha, varianceS });
  // Numbers and the p-value through the one formatter (core/format), so the sentence shows the digits every table shows.
  const fmt = (v: number): string => formatNumber(v, 4);
  const slopeText = slope ? `; Sen's slope ${fmt(slope.estimate)} per unit of time (${fmt(100 * (1 - alpha))} % interval ${fmt(slope.lower)} to ${fmt(slope.upper)})` : '';
  const decision = trendDetected
    ? `Mann–Kendall: a monotonic ${direction} trend at α = ${alpha} (S = ${s}, ${formatPValue(pValue)})${slopeText}.`
    : `Mann–Kendall: no monotonic trend detected at α = ${alpha} (S = ${s}, ${formatPValue(pValue)})${slopeText}.`;
  const warning = trendDetected
    ? `The values show a ${direction} trend over time. A trend breaks the assumption that all values come from one and the same distribution, on which the fitted models and every number derived from them (return levels, lives, capability) rest. Analyse a period without trend or model the change over time before relying on those numbers.`
    : null;
  return {
    n,
    s,
    varianceS,
    tieTerm,
    tiedGroups: ties.length,
    z,
    pValue,
    pMethod: exact ? 'exact' : 'normal',
    pValueNormal,
    tauA: s / N,
    tauB: s / Math.sqrt(N * (N - tiePairs)),
    alpha,
    trendDetected,
    direction,
    senSlope: slope,
    method: exact
      ? 'Mann–Kendall S with its exact null distribution (n ≤ 10, no ties)'
      : 'Mann–Kendall S, tie-corrected variance, normal approximation with continuity correction',
    decision,
    warning,
    cautions: [
      'The test assumes serially independent values; positive autocorrelation (persistence) makes it find trends too often.',
    ],
  };
}

