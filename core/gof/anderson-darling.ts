/**
 * The Anderson–Darling statistic (Anderson & Darling 1954, JASA 49:765-769; computing form as in
 * D'Agostino & Stephens 1986, Goodness-of-Fit Techniques, ch. 4):
 *
 *   A² = -n - (1/n) Σ_{i=1..n} (2i - 1) [ln F(x_(i)) + ln(1 - F(x_(n+1-i)))]
 *
 * Rearranged per order statistic i (1-based) as
 *   Σ_i [(2i - 1) ln F(x_(i)) + (2(n - i) + 1) ln S(x_(i))],
 * with ln F and ln S taken from the model's logCdf and logSf, never from 1 - F, so that far-tail
 * observations keep their weight instead of rounding to ln 0. Compensated summation; one pass.
 */
import { CompensatedSum } from '../compensated.js';

/** The part of a distribution the statistic needs. */
export interface LogCdfSf {
  logCdf(x: number): number;
  logSf(x: number): number;
  /** Batch form (see Distribution.logCdfSfInto); used when present. */
  logCdfSfInto?(xs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void;
  /**
   * The batch form from ln x instead of x (same numbers: the family forms ln x itself otherwise);
   * used when present and the caller passes the sample's cached logs, saving one Math.log a point.
   */
  logCdfSfFromLogsInto?(logs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void;
}

/** Points per batch call: small enough to stay in cache, large enough to amortise the call. */
const CHUNK = 2048;
// Scratch buffers reused by every call (the statistic never re-enters itself).
const LOG_CDF = new Float64Array(CHUNK);
const LOG_SF = new Float64Array(CHUNK);
const XS = new Float64Array(CHUNK);

/**
 * A² of the ascending sample `sorted` under `dist`. `logs`, when given, must be ln of `sorted`
 * element by element (the Sample's cached logs()); it is used only by distributions with
 * logCdfSfFromLogsInto.
 */
export function andersonDarlingStatistic(dist: LogCdfSf, sorted: ArrayLike<number>, logs?: Float64Array | null): number {
  const n = sorted.length;
  const s = new CompensatedSum();
  if (dist.logCdfSfInto === undefined) {
    for (let i = 1; i <= n; i++) {
      const x = sorted[i - 1] as number;
      s.add((2 * i - 1) * dist.logCdf(x) + (2 * (n - i) + 1) * dist.logSf(x));
    }
    return -n - s.value / n;
  }
  // Same terms, same order, from the batch form in chunks.
  const fromLogs = logs !== undefined && logs !== null && logs.length === n ? dist.logCdfSfFromLogsInto : undefined;
  const typed = sorted instanceof Float64Array;
  const acc = new Float64Array(2); // [sum, compensation], carried from chunk to chunk
  for (let start = 0; start < n; start += CHUNK) {
    const len = Math.min(CHUNK, n - start);
    const lc = len === CHUNK ? LOG_CDF : LOG_CDF.subarray(0, len);
    const ls = len === CHUNK ? LOG_SF : LOG_SF.subarray(0, len);
    if (fromLogs !== undefined) fromLogs.call(dist, (logs as Float64Array).subarray(start, start + len), lc, ls);
    else {
      let xs: Float64Array;
      if (typed) xs = sorted.subarray(start, start + len);
      else {
        xs = len === CHUNK ? XS : XS.subarray(0, len);
        for (let j = 0; j < len; j++) xs[j] = sorted[start + j] as number;
      }
      dist.logCdfSfInto(xs, lc, ls);
    }
    addTerms(lc, ls, len, start, n, acc);
  }
  return -n - ((acc[0] as number) + (acc[1] as number)) / n;
}

/**
 * Adds the terms of order statistics start+1 … start+len to `acc` = [sum, compensation]: the
 * operations of CompensatedSum.add on locals, in the same order, so the same sum. A function of its
 * own, called with every family's chunks: small and of one shape, it is optimised once, early in the
 * first chunk, where the loop inside the caller (which also calls each family's batch form) was
 * recompiled for every family and ran in unoptimised code meanwhile (~11 ns a point through the object).
 */
function addTerms(lc: Float64Array, ls: Float64Array, len: number, start: number, n: number, acc: Float64Array): void {
  let sum = acc[0] as number;
  let comp = acc[1] as number;
  for (let j = 0; j < len; j++) {
    const i = start + j + 1;
    const x = (2 * i - 1) * (lc[j] as number) + (2 * (n - i) + 1) * (ls[j] as number);
    const t = sum + x;
    if (Math.abs(sum) >= Math.abs(x)) comp += sum - t + x;
    else comp += x - t + sum;
    sum = t;
  }
  acc[0] = sum;
  acc[1] = comp;
}
