/**
 * The empirical CDF as a right-continuous step function over the distinct values of the sorted
 * sample, with the cumulative count at each step, thinned for drawing (extremes kept, at most cap
 * steps; the count at a kept step is always exact, so the last count is n).
 */
import type { CdfEvidence } from './types.js';
import { thinMonotone } from './thin.js';

const NO_SUSPENSIONS = { x: [], p: [], thinned: false, total: 0 } as const;

export function empiricalCdf(sorted: ArrayLike<number>, cap: number): CdfEvidence['empirical'] {
  const n = sorted.length;
  // Distinct values and their cumulative counts (one pass; the arrays are as long as the
  // number of distinct values).
  const xs = new Float64Array(n);
  const cs = new Float64Array(n);
  let m = 0;
  for (let i = 0; i < n; i++) {
    const v = sorted[i] as number;
    if (i === n - 1 || (sorted[i + 1] as number) !== v) {
      xs[m] = v;
      cs[m] = i + 1;
      m++;
    }
  }
  const x = xs.subarray(0, m);
  const c = cs.subarray(0, m);
  const keep = thinMonotone(x, c, cap);
  const outX: number[] = new Array(keep.length);
  const outC: number[] = new Array(keep.length);
  const outP: number[] = new Array(keep.length);
  keep.forEach((idx, j) => {
    outX[j] = x[idx] as number;
    outC[j] = c[idx] as number;
    outP[j] = (c[idx] as number) / n;
  });
  return { estimator: 'empirical', x: outX, cumulativeCount: outC, p: outP, thinned: keep.length < m, total: m, suspensions: NO_SUSPENSIONS };
}
