/**
 * The sample mean and the maximum-likelihood standard deviation (divisor n) for the fits, kept
 * finite at the ends of the double range: the prepared sample's own sums overflow for values near
 * 1e308 and its squared deviations underflow for spreads near 1e-160 and below. In those cases
 * both are recomputed on the values divided by a power of two near the largest |x| (the division
 * is exact), with compensated sums; otherwise the sample's values are used as they are, so the
 * common case costs nothing (common practice, no source).
 */
import { CompensatedSum } from '../compensated.js';
import type { Sample } from '../sample.js';

/** A power of two near max |x| (never 0 or ∞). */
function powerOfTwoScale(sample: Sample): number {
  const big = Math.max(Math.abs(sample.min), Math.abs(sample.max));
  if (!(big > 0)) return 1;
  return Math.pow(2, Math.max(-1074, Math.min(1023, Math.floor(Math.log2(big)))));
}

/** Σx/n, finite whenever the values are. */
export function sampleMean(sample: Sample): number {
  if (Number.isFinite(sample.mean)) return sample.mean;
  const s = powerOfTwoScale(sample);
  const xs = sample.sorted;
  const sum = new CompensatedSum();
  for (let i = 0; i < xs.length; i++) sum.add((xs[i] as number) / s);
  return (sum.value / sample.n) * s;
}

/** √(Σ(x - mean)²/n), the maximum-likelihood standard deviation; > 0 unless all values are equal. */
export function mleStandardDeviation(sample: Sample): number {
  const n = sample.n;
  const direct = Math.sqrt(sample.sumSqDev / n);
  if (direct > 0 && direct < Number.POSITIVE_INFINITY && Number.isFinite(sample.mean)) return direct;
  if (sample.distinct === 1) return 0;
  const mean = sampleMean(sample);
  // Divide the deviations by the largest one (exactly representable ratios ≤ 1 in size).
  const big = Math.max(mean - sample.min, sample.max - mean);
  const xs = sample.sorted;
  const ss = new CompensatedSum();
  for (let i = 0; i < xs.length; i++) {
    const d = (xs[i] as number) / big - mean / big;
    ss.add(d * d);
  }
  return big * Math.sqrt(ss.value / n);
}
