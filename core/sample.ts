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
  /**
   * ln x of `sorted` (ascending as well), cached; null when some value is ≤ 0, and null past
   * LOG_CACHE_MAX_N values (a second n-length array would not fit the memory a 10^8-value run may
   * use): visit them with `logBlocks` instead, which works at every size.
   */
  logs(): Float64Array | null;
  /**
   * Visit ln x of `sorted` in ascending order, block by block (`start` = index of block[0]): the
   * cached array as one block when it is cached, else blocks of LOG_BLOCK computed on the fly.
   * Throws InputError when some value is ≤ 0.
   */
  logBlocks(visit: (block: Float64Array, start: number) => void): void;
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

const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;
/** Below this size the built-in sort is as fast. */
const RADIX_MIN = 4096;
/**
 * Past this many values neither the radix sort's scratch copy nor the ln x cache is made (each is
 * another 8 bytes per value): the built-in sort works in place, and ln x is computed block by block.
 * 2^24 values keep a 10^7-value run near 300 MiB and let 10^8 values (800 MB) run within 1.5 GiB
 * (measured in bench/batch.ts; common practice, no source).
 */
export const LOG_CACHE_MAX_N = 2 ** 24;
/** Block length of `logBlocks` when ln x is not cached (512 KiB of scratch). */
const LOG_BLOCK = 65536;

/**
 * Sort finite doubles ascending in place, with exactly the order of Float64Array.prototype.sort
 * (numeric, -0 before +0): for large arrays by a least-significant-digit radix sort on the IEEE 754
 * bit patterns (Knuth, TAOCP vol. 3, §5.2.5), four passes of 16 bits over keys mapped so that
 * unsigned order is numeric order (negative: all bits flipped; otherwise the sign bit set). A pass
 * whose digit is the same for every key is skipped.
 */
function sortAscending(a: Float64Array): Float64Array | null {
  const n = a.length;
  if (n < RADIX_MIN || n > LOG_CACHE_MAX_N || !LITTLE_ENDIAN) {
    a.sort();
    return null;
  }
  const words = new Uint32Array(a.buffer, a.byteOffset, 2 * n);
  // The keys are mapped in place and the passes go back and forth between the array's own words and
  // one scratch buffer (one extra copy of the data, not two: 80 MB less at 10^7 values).
  let src: Uint32Array = words;
  // Handed back for the ln x cache (see prepareSample). Never on shared memory, even for values that
  // are: V8 counts an ArrayBuffer, not a SharedArrayBuffer, as external memory, and allocating it
  // prompts the collection of the reader's garbage (with a shared scratch the 10^7-value CLI run
  // peaked ~30 MiB higher one thread, up to ~100 MiB with two).
  const scratch = new Uint32Array(2 * n);
  let dst: Uint32Array = scratch;
  const counts = new Uint32Array(4 * 65536);
  // Each loop is a function of its own: a command runs this sort once, from cold code, and V8 then
  // compiles each small loop on its own instead of the whole sort once per loop (on-stack replacement).
  toKeysCounting(words, n, counts);
  for (let pass = 0; pass < 4; pass++) {
    const base = pass * 65536;
    const word = pass >> 1; // 0: lo, 1: hi
    const shift = (pass & 1) * 16;
    // Skip a pass whose digit is the same for every key (it would not move anything).
    const first = (word === 0 ? src[0] : src[1]) as number;
    if (counts[base + ((first >>> shift) & 0xffff)] === n) continue;
    let sum = 0;
    for (let d = 0; d < 65536; d++) {
      const c = counts[base + d] as number;
      counts[base + d] = sum;
      sum += c;
    }
    scatter(src, dst, n, counts, base, word, shift);
    const t = src;
    src = dst;
    dst = t;
  }
  fromKeys(src, words, n);
  return new Float64Array(scratch.buffer);
}

/** Maps each double's words in place to a key whose unsigned order is numeric order, counting its four 16-bit digits. */
function toKeysCounting(words: Uint32Array, n: number, counts: Uint32Array): void {
  for (let i = 0; i < n; i++) {
    let lo = words[2 * i] as number;
    let hi = words[2 * i + 1] as number;
    if (hi & 0x80000000) {
      lo = ~lo >>> 0;
      hi = ~hi >>> 0;
    } else hi = (hi | 0x80000000) >>> 0;
    words[2 * i] = lo;
    words[2 * i + 1] = hi;
    const d0 = lo & 0xffff;
    const d1 = 65536 + (lo >>> 16);
    const d2 = 131072 + (hi & 0xffff);
    const d3 = 196608 + (hi >>> 16);
    counts[d0] = (counts[d0] as number) + 1;
    counts[d1] = (counts[d1] as number) + 1;
    counts[d2] = (counts[d2] as number) + 1;
    counts[d3] = (counts[d3] as number) + 1;
  }
}

/** One stable pass: each key of `src` to its digit's next place in `dst` (counts[base + digit], then advanced). */
function scatter(src: Uint32Array, dst: Uint32Array, n: number, counts: Uint32Array, base: number, word: number, shift: number): void {
  for (let i = 0; i < n; i++) {
    const lo = src[2 * i] as number;
    const hi = src[2 * i + 1] as number;
    const digit = ((word === 0 ? lo : hi) >>> shift) & 0xffff;
    const at = counts[base + digit] as number;
    counts[base + digit] = at + 1;
    dst[2 * at] = lo;
    dst[2 * at + 1] = hi;
  }
}

/** The keys of `src` back to the doubles' own words, into `words`. */
function fromKeys(src: Uint32Array, words: Uint32Array, n: number): void {
  for (let i = 0; i < n; i++) {
    let lo = src[2 * i] as number;
    let hi = src[2 * i + 1] as number;
    if (hi & 0x80000000) hi = (hi & 0x7fffffff) >>> 0;
    else {
      lo = ~lo >>> 0;
      hi = ~hi >>> 0;
    }
    words[2 * i] = lo;
    words[2 * i + 1] = hi;
  }
}

/**
 * What a Sample computes in its one pass over the sorted values (plain data: another thread that
 * receives the same sorted values can take it instead of repeating the pass).
 */
export type SampleSummary = Pick<Sample, 'min' | 'max' | 'sum' | 'mean' | 'sumSqDev' | 'negative' | 'zeros' | 'distinct'>;

/** A Sample's summary as plain data (structured-clone safe). */
export function sampleSummary(s: Sample): SampleSummary {
  return { min: s.min, max: s.max, sum: s.sum, mean: s.mean, sumSqDev: s.sumSqDev, negative: s.negative, zeros: s.zeros, distinct: s.distinct };
}

/** Options of prepareSample. */
export interface PrepareOptions {
  /** `values` is a Float64Array already ascending, owned by the caller: used as it is, not copied. */
  readonly alreadySorted?: boolean;
  /** `values` is a Float64Array the caller gives up (its order is not needed back): checked and sorted where it is. */
  readonly inPlace?: boolean;
  /** Tests, and a thread that cannot afford the memory: cache ln x only up to this n (default LOG_CACHE_MAX_N). */
  readonly logCacheMaxN?: number;
  /**
   * With `alreadySorted`: the summary of these very values from the Sample that sorted them
   * (sampleSummary), so that the pass over them is not repeated; the same numbers.
   */
  readonly summary?: SampleSummary;
  /** With `alreadySorted`: ln x of the sorted values as that Sample's logs() gave them (the same numbers). */
  readonly logs?: Float64Array;
}

/** A Sample of `sorted` (ascending, finite) from its summary; ln x from `logs` when given, else cached lazily. */
function fromSummary(sorted: Float64Array, sm: SampleSummary, logCacheMaxN: number, logs: Float64Array | undefined, room: Float64Array | null = null): Sample {
  const n = sorted.length;
  const nonPositive = sm.negative + sm.zeros;
  let logCache: Float64Array | null | undefined = logs !== undefined && logs.length === n && nonPositive === 0 ? logs : undefined;
  let sumLogCache: number | undefined;
  return {
    n,
    sorted,
    min: sm.min,
    max: sm.max,
    sum: sm.sum,
    mean: sm.mean,
    sumSqDev: sm.sumSqDev,
    nonPositive,
    negative: sm.negative,
    zeros: sm.zeros,
    distinct: sm.distinct,
    logs(): Float64Array | null {
      if (logCache !== undefined) return logCache;
      if (nonPositive > 0 || n > logCacheMaxN) return (logCache = null);
      // In the sort's scratch when there is one (free since the sort: no second n-length allocation).
      const out = room !== null && room.length === n ? room : new Float64Array(n);
      room = null;
      for (let i = 0; i < n; i++) out[i] = Math.log(sorted[i] as number);
      return (logCache = out);
    },
    logBlocks(visit: (block: Float64Array, start: number) => void): void {
      if (nonPositive > 0) throw new InputError('ln x needs every value > 0.', {}, 'bad-input');
      const cached = this.logs();
      if (cached !== null) {
        visit(cached, 0);
        return;
      }
      const block = new Float64Array(Math.min(LOG_BLOCK, n));
      for (let start = 0; start < n; start += LOG_BLOCK) {
        const len = Math.min(LOG_BLOCK, n - start);
        for (let i = 0; i < len; i++) block[i] = Math.log(sorted[start + i] as number);
        visit(len === block.length ? block : block.subarray(0, len), start);
      }
    },
    sumLog(): number {
      if (sumLogCache !== undefined) return sumLogCache;
      if (nonPositive > 0) return (sumLogCache = Number.NaN);
      // Neumaier's compensated sum carried across blocks: the same operations, in the same order, as
      // compensated() over the whole cached array.
      const acc = new Float64Array(2); // [sum, compensation]
      this.logBlocks((block) => {
        let s = acc[0] as number;
        let c = acc[1] as number;
        for (let i = 0; i < block.length; i++) {
          const x = block[i] as number;
          const t = s + x;
          if (Math.abs(s) >= Math.abs(x)) c += s - t + x;
          else c += x - t + s;
          s = t;
        }
        acc[0] = s;
        acc[1] = c;
      });
      return (sumLogCache = (acc[0] as number) + (acc[1] as number));
    },
  };
}

/** Index of the first value that is not finite, or -1 (a loop of its own, compiled on its own). */
function firstNonFinite(values: Float64Array): number {
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i] as number)) return i;
  return -1;
}

/**
 * The one pass over the sorted values (a function of its own, compiled on its own): out = [Σ (x - mean)²
 * (compensated), count < 0, count = 0, distinct values].
 */
function summaryPass(sorted: Float64Array, mean: number, out: Float64Array): void {
  const n = sorted.length;
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
  out[0] = s + c;
  out[1] = negative;
  out[2] = zeros;
  out[3] = distinct;
}

/**
 * Build a Sample. Throws InputError for non-finite values (with the 0-based index in the
 * message as "value #i", 1-based) and for an empty sample. Does not copy `alreadySorted`
 * when told the array is already ascending and owned by the caller; with `inPlace` a Float64Array
 * the caller gives up (its order is not needed back) is checked and sorted where it is, not copied.
 */
export function prepareSample(values: ArrayLike<number>, opts: PrepareOptions = {}): Sample {
  const logCacheMaxN = opts.logCacheMaxN ?? LOG_CACHE_MAX_N;
  const n = values.length;
  if (n === 0) throw new InputError('No values to analyse: the sample is empty.', {}, 'too-few-values');
  if (opts.alreadySorted && opts.summary !== undefined && values instanceof Float64Array) return fromSummary(values, opts.summary, logCacheMaxN, opts.logs);
  let sorted: Float64Array;
  // The radix sort's scratch (n doubles, free once the values are sorted): the room for the ln x cache.
  let room: Float64Array | null = null;
  if (opts.alreadySorted && values instanceof Float64Array) sorted = values;
  else if (opts.inPlace && values instanceof Float64Array) {
    const bad = firstNonFinite(values);
    if (bad >= 0) {
      const v = values[bad] as number;
      throw new InputError(`Value #${bad + 1} is not a finite number (${String(v)}).`, { value: String(v) }, 'not-a-number');
    }
    sorted = values;
    room = sortAscending(sorted);
  } else {
    sorted = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const v = values[i] as number;
      if (!Number.isFinite(v)) {
        throw new InputError(`Value #${i + 1} is not a finite number (${String(v)}).`, { value: String(v) }, 'not-a-number');
      }
      sorted[i] = v;
    }
    room = sortAscending(sorted);
  }
  const min = sorted[0] as number;
  const max = sorted[n - 1] as number;
  if (!Number.isFinite(min) || !Number.isFinite(max)) {
    throw new InputError('The sample contains a non-finite value.', {}, 'not-a-number');
  }
  const sum = compensated(sorted);
  // The mean lies in [min, max]; the last rounding of sum/n can step just outside (nine values of
  // 1e307 average to 9.999999999999999e306), so it is held there.
  const mean = Math.min(max, Math.max(min, sum / n));
  const pass = new Float64Array(4);
  summaryPass(sorted, mean, pass);
  const sumSqDev = pass[0] as number;
  const negative = pass[1] as number;
  const zeros = pass[2] as number;
  const distinct = pass[3] as number;
  const summary: SampleSummary = { min, max, sum, mean, sumSqDev, negative, zeros, distinct };
  // Kept only when it will hold ln x (else it is left to the garbage collector now).
  const logsRoom = room !== null && negative + zeros === 0 && n <= logCacheMaxN ? room : null;
  return fromSummary(sorted, summary, logCacheMaxN, opts.alreadySorted ? opts.logs : undefined, logsRoom);
}
