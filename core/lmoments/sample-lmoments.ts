/**
 * Sample L-moments from the unbiased probability-weighted moments (Hosking 1990, JRSS B 52:105-124,
 * §3; Hosking & Wallis 1997, Regional Frequency Analysis, §2.3):
 *
 *   b_r = n⁻¹ Σ_{j=r+1..n} [(j−1)(j−2)…(j−r)] / [(n−1)(n−2)…(n−r)] · x_(j)
 *   l1 = b0, l2 = 2b1 − b0, l3 = 6b2 − 6b1 + b0, l4 = 20b3 − 30b2 + 12b1 − b0,
 *   l5 = 70b4 − 140b3 + 90b2 − 20b1 + b0,
 *
 * and the ratios t = l2/l1 (L-CV), t3 = l3/l2 (L-skewness), t4 = l4/l2 (L-kurtosis), t5 = l5/l2.
 * Each l_r is an unbiased estimator of the population L-moment λ_r. Sums are compensated.
 */
import { CompensatedSum } from '../compensated.js';
import { InputError } from '../errors.js';

export interface SampleLMoments {
  readonly n: number;
  readonly l1: number;
  readonly l2: number;
  readonly l3: number;
  readonly l4: number;
  readonly l5: number;
  /** L-CV l2/l1 (NaN when l1 = 0). */
  readonly t: number;
  readonly t3: number;
  readonly t4: number;
  readonly t5: number;
}

/** The first five sample L-moments and their ratios of ascending-sorted values (n ≥ 5). */
export function sampleLMoments(sorted: ArrayLike<number>): SampleLMoments {
  const n = sorted.length;
  if (n < 5) throw new InputError(`sample L-moments up to the fifth need at least 5 values, got ${n}`, {}, 'too-few-values');
  for (let i = 1; i < n; i++) {
    if (!((sorted[i] as number) >= (sorted[i - 1] as number))) throw new InputError('sample L-moments need ascending-sorted finite values', {}, 'bad-input');
  }
  const b = [new CompensatedSum(), new CompensatedSum(), new CompensatedSum(), new CompensatedSum(), new CompensatedSum()];
  for (let j = 1; j <= n; j++) {
    const x = sorted[j - 1] as number;
    // weight_r = Π_{s=1..r} (j − s)/(n − s), built up term by term.
    let w = 1;
    (b[0] as CompensatedSum).add(x);
    for (let r = 1; r <= 4; r++) {
      w *= (j - r) / (n - r);
      if (w === 0) break;
      (b[r] as CompensatedSum).add(w * x);
    }
  }
  const [b0, b1, b2, b3, b4] = b.map((s) => s.value / n) as [number, number, number, number, number];
  const l1 = b0;
  const l2 = 2 * b1 - b0;
  const l3 = 6 * b2 - 6 * b1 + b0;
  const l4 = 20 * b3 - 30 * b2 + 12 * b1 - b0;
  const l5 = 70 * b4 - 140 * b3 + 90 * b2 - 20 * b1 + b0;
  return { n, l1, l2, l3, l4, l5, t: l2 / l1, t3: l3 / l2, t4: l4 / l2, t5: l5 / l2 };
}
