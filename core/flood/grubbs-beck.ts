/**
 * The multiple Grubbs–Beck low-outlier test (Cohn, England, Berenbrock, Mason, Stedinger & Lamontagne
 * 2013, WRR 49:5047-5058; USGS Bulletin 17C, England et al. 2018, §6) on log10 peaks.
 *
 * For the sorted log flows x(1) ≤ … ≤ x(n) and k = 1 … ⌊n/2⌋ the statistic is
 *   ω_k = (x(k) − μ̃_k)/σ̃_k,  μ̃_k, σ̃_k the mean and sample sd (divisor n − k − 1) of x(k+1) … x(n),
 * and its p-value under a normal population is p_k = P(Ω_k ≤ ω_k). Cohn et al. give an analytic
 * approximation; here p_k is computed by a seeded Monte Carlo of the statistic itself (R standard
 * normal samples of size n, every k from one sorted sample through suffix sums), so its error is
 * the binomial one, √(p(1 − p)/R): 5e-4 at p = 0.005 with the default R = 20 000, small beside the
 * decision thresholds (common practice, no source). test/flood/ema.test.ts compares it with an
 * independent NumPy simulation (scripts/fixtures/flood-ema.py). A noncentral-t approximation
 * built from the truncated-normal moments was tried first and was off by a factor up to 5 in
 * the tails for k > 1, so it is not used.
 *
 * Decision (Bulletin 17C [from memory]): an outward sweep from the median down finds the largest
 * k with p_k < 0.005; an inward sweep from the smallest value counts the run of k = 1, 2, … with
 * p_k < 0.10; the number of low outliers is the larger of the two. Low outliers then enter the EMA
 * as peaks known only to lie below the smallest retained peak.
 */
import { createRng } from '../random/index.js';
import { kahanSum } from '../compensated.js';

export const MGB_OUTWARD_ALPHA = 0.005;
export const MGB_INWARD_ALPHA = 0.1;
export const MGB_REPLICATES = 20000;
const MGB_SEED = 20131001;

/** The MGB statistic ω_k for k = 1 … ⌊n/2⌋ of ascending values. */
export function mgbStatistics(sortedAscending: ArrayLike<number>): Float64Array {
  const n = sortedAscending.length;
  const half = Math.floor(n / 2);
  const out = new Float64Array(half);
  for (let k = 1; k <= half; k++) {
    const rest = Array.from({ length: n - k }, (_, j) => sortedAscending[k + j] as number);
    const mean = kahanSum(rest) / rest.length;
    const ss = kahanSum(rest, (x) => (x - mean) * (x - mean));
    out[k - 1] = ((sortedAscending[k - 1] as number) - mean) / Math.sqrt(ss / (rest.length - 1));
  }
  return out;
}

/** ω_k, k = 1 … ⌊n/2⌋, of ascending values into out, from suffix sums (O(n)). */
function statisticsInto(xs: Float64Array, out: Float64Array): void {
  const n = xs.length;
  let s1 = 0;
  let s2 = 0;
  // Suffix sums about the sample's own median-ish value keep s2 − s1²/m from cancelling.
  const c = xs[n >> 1] as number;
  const half = out.length;
  for (let j = n - 1; j >= 1; j--) {
    const d = (xs[j] as number) - c;
    s1 += d;
    s2 += d * d;
    const k = j; // values j … n−1 are x(k+1) … x(n)
    if (k <= half) {
      const m = n - k;
      const mean = s1 / m;
      const sd = Math.sqrt(Math.max(0, (s2 - s1 * mean) / (m - 1)));
      out[k - 1] = ((xs[k - 1] as number) - c - mean) / sd;
    }
  }
}

/** Monte Carlo p-values P(Ω_k ≤ ω_k) for every k of one sample size (seeded, reproducible). */
export function mgbPValues(n: number, omegas: ArrayLike<number>, replicates = MGB_REPLICATES, seed = MGB_SEED): number[] {
  const rng = createRng(seed, n);
  const xs = new Float64Array(n);
  const w = new Float64Array(omegas.length);
  const below = new Float64Array(omegas.length);
  for (let r = 0; r < replicates; r++) {
    for (let i = 0; i < n; i++) xs[i] = rng.normal();
    xs.sort();
    statisticsInto(xs, w);
    for (let k = 0; k < w.length; k++) if ((w[k] as number) <= (omegas[k] as number)) below[k] = (below[k] as number) + 1;
  }
  return Array.from(below, (b) => b / replicates);
}

export interface MgbResult {
  /** Number of low outliers (the k smallest values). */
  readonly lowOutliers: number;
  /** The smallest retained value: low outliers are peaks known to lie below it. */
  readonly threshold: number | null;
  readonly statistics: readonly number[];
  readonly pValues: readonly number[];
  readonly outwardK: number;
  readonly inwardK: number;
  readonly method: string;
}

/** The multiple Grubbs–Beck test on log10 peaks (any order; at least 10 values recommended). */
export function multipleGrubbsBeck(logValues: ArrayLike<number>): MgbResult {
  const xs = Float64Array.from(logValues).sort();
  const n = xs.length;
  const stats = mgbStatistics(xs);
  const ps = mgbPValues(n, stats);
  let outwardK = 0;
  for (let k = ps.length; k >= 1; k--) {
    if ((ps[k - 1] as number) < MGB_OUTWARD_ALPHA) {
      outwardK = k;
      break;
    }
  }
  let inwardK = 0;
  while (inwardK < ps.length && (ps[inwardK] as number) < MGB_INWARD_ALPHA) inwardK++;
  const lowOutliers = Math.max(outwardK, inwardK);
  return {
    lowOutliers,
    threshold: lowOutliers > 0 ? (xs[lowOutliers] as number) : null,
    statistics: Array.from(stats),
    pValues: ps,
    outwardK,
    inwardK,
    method: `multiple Grubbs–Beck (Cohn et al. 2013): outward sweep p < ${MGB_OUTWARD_ALPHA}, inward sweep p < ${MGB_INWARD_ALPHA}; p-values by a seeded simulation of ${MGB_REPLICATES} normal samples`,
  };
}
