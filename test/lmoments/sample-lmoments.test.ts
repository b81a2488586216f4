import { describe, expect, it } from 'vitest';
import { sampleLMoments } from '../../core/lmoments/sample-lmoments.js';
import { createRng } from '../../core/index.js';

/**
 * The definition of the sample L-moments (Hosking 1990, eq. 2.x and §3; Hosking & Wallis 1997 §2.3):
 * l_r = C(n, r)⁻¹ Σ over all r-element subsamples of r⁻¹ Σ_{k=0..r−1} (−1)^k C(r−1, k) x_(r−k : r),
 * the average over subsamples of the r-th L-moment's order-statistic contrast. Enumerated by brute force.
 */
function choose(n: number, k: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) c = (c * (n - k + i)) / i;
  return c;
}

function bruteForce(sorted: number[], r: number): number {
  const n = sorted.length;
  let total = 0;
  let count = 0;
  const pick: number[] = [];
  const walk = (start: number): void => {
    if (pick.length === r) {
      const xs = pick.map((i) => sorted[i] as number); // ascending, since indices ascend
      let s = 0;
      for (let k = 0; k < r; k++) s += (-1) ** k * choose(r - 1, k) * (xs[r - 1 - k] as number);
      total += s / r;
      count++;
      return;
    }
    for (let i = start; i < n; i++) {
      pick.push(i);
      walk(i + 1);
      pick.pop();
    }
  };
  walk(0);
  expect(count).toBe(choose(n, r));
  return total / count;
}

describe('sampleLMoments', () => {
  it('equals the subsample definition by brute force on small samples (n = 5 … 9)', () => {
    const rng = createRng(7);
    for (let n = 5; n <= 9; n++) {
      const xs = Array.from({ length: n }, () => Math.exp(rng.normal())).sort((a, b) => a - b);
      const l = sampleLMoments(Float64Array.from(xs));
      const ref = [1, 2, 3, 4, 5].map((r) => bruteForce(xs, r));
      const got = [l.l1, l.l2, l.l3, l.l4, l.l5];
      for (let r = 0; r < 5; r++) expect(Math.abs((got[r] as number) - (ref[r] as number))).toBeLessThan(1e-12 * (Math.abs(ref[0] as number) + 1));
      expect(l.t3).toBeCloseTo(l.l3 / l.l2, 14);
    }
  });

  it('l2 is half the mean absolute difference of all pairs (Gini; Hosking 1990 §2)', () => {
    const xs = [1, 2, 4, 7, 11, 16];
    let s = 0;
    for (let i = 0; i < xs.length; i++) for (let j = 0; j < xs.length; j++) s += Math.abs((xs[i] as number) - (xs[j] as number));
    const gini = s / (xs.length * (xs.length - 1));
    expect(sampleLMoments(Float64Array.from(xs)).l2).toBeCloseTo(gini / 2, 14);
  });

  it('refuses unsorted or too short input', () => {
    expect(() => sampleLMoments(Float64Array.from([1, 2, 3, 4]))).toThrow(/at least 5/);
    expect(() => sampleLMoments(Float64Array.from([1, 3, 2, 4, 5]))).toThrow(/sorted/);
  });
});
