import { InputError } from './errors.js';

/**
 * A prepared, complete (uncensored) sample: sorted once and summarised once, shared by every
 * family's fit and every test so that no family re-sorts or re-scans the data needlessly.
 * All sums are compensated (Neumaier). Logs are computed lazily, once, and only when every
 * value is positive.
 */
export interface Sample {
  readonly n: number;
  /** Ascending copy of the values. */
  readonly sorted: Float64Array;
  readonly min: number;
  readonly max: number;
  readonly sum: number;
  readonly mean: number;
  /** Σ (x - mean)², computed two-pass on the compensated mean. */
  readonly sumSqDev: number;
  /** Count of values ≤ 0 (outside the support of the positive families). */
  readonly nonPositive: number;
  /** Count of values < 0. */
  readonly negative: number;
  /** Count of values exactly 0. */
  readonly zeros: number;
  /** Number of distinct values. */
  readonly distinct: number;
  /** ln x of `sorted` (ascending as well), or null when some value is ≤ 0. */
  logs(): Float64Array | null;
  /** Σ ln x (compensated), or NaN when some value is ≤ 0. */
  sumLog(): number;
}

function compensated(xs: Float64Array): number {
  let s = 0;
  let c = 0;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i] as number;
    const t = s + x;
    if (Math.abs(s) >= Math.abs(x)) c += s - t + x;
    else c += x - t + s;
    s = t;
  }
  return s + c;
}

/**
 * Build a Sample. Throws InputError for non-finite values (with the 0-based index in the
 * message as "value #i", 1-based) and for an empty sample. Does not copy `alreadySorted`
 * when told the array is already ascending and owned by the caller.
 */
export function prepareSample(values: ArrayLike<number>, opts: { alreadySorted?: boolean } = {}): Sample {
  const n = values.length;
  if (n === 0) throw new InputError('No values to analyse: the sample is empty.', {}, 'too-few-values');
  let sorted: Float64Array;
  if (opts.alreadySorted && values instanceof Float64Array) sorted = values;
  else {
    sorted = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const v = values[i] as number;
      if (!Number.isFinite(v)) {
        throw new InputError(`Value #${i + 1} is not a finite number (${String(v)}).`, { value: String(v) }, 'not-a-number');
      }
      sorted[i] = v;
    }
    sorted.sort();
  }
  const min = sorted[0] as number;
  const max = sorted[n - 1] as number;
  if (!Number.isFinite(min) || !Number.isFinite(max)) {
    throw new InputError('The sample contains a non-finite value.', {}, 'not-a-number');
  }
  const sum = compensated(sorted);
  const mean = sum / n;
  let s = 0;
  let c = 0;
  let negative = 0;
  let zeros = 0;
  let distinct = 0;
  let prev = Number.NaN;
  for (let i = 0; i < n; i++) {
    const x = sorted[i] as number;
    if (x < 0) negative++;
    else if (x === 0) zeros++;
    if (x !== prev) distinct++;
    prev = x;
    const d = (x - mean) * (x - mean);
    const t = s + d;
    if (Math.abs(s) >= Math.abs(d)) c += s - t + d;
    else c += d - t + s;
    s = t;
  }
  const sumSqDev = s + c;
  const nonPositive = negative + zeros;
  let logCache: Float64Array | null | undefined;
  let sumLogCache: number | undefined;
  return {
    n,
    sorted,
    min,
    max,
    sum,
    mean,
    sumSqDev,
    nonPositive,
    negative,
    zeros,
    distinct,
    logs(): Float64Array | null {
      if (logCache !== undefined) return logCache;
      if (nonPositive > 0) return (logCache = null);
      const out = new Float64Array(n);
      for (let i = 0; i < n; i++) out[i] = Math.log(sorted[i] as number);
      return (logCache = out);
    },
    sumLog(): number {
      if (sumLogCache !== undefined) return sumLogCache;
      const l = this.logs();
      return (sumLogCache = l === null ? Number.NaN : compensated(l));
    },
  };
}
