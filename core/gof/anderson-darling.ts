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
}

/** A² of the ascending sample `sorted` under `dist`. */
export function andersonDarlingStatistic(dist: LogCdfSf, sorted: ArrayLike<number>): number {
  const n = sorted.length;
  const s = new CompensatedSum();
  for (let i = 1; i <= n; i++) {
    const x = sorted[i - 1] as number;
    s.add((2 * i - 1) * dist.logCdf(x) + (2 * (n - i) + 1) * dist.logSf(x));
  }
  return -n - s.value / n;
}
