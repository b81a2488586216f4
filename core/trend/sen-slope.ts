/**
 * Sen's slope (Sen 1968, JASA 63:1379-1389; Theil 1950): the median of the pairwise slopes
 * (x_j - x_i)/(t_j - t_i), i < j, with the distribution-free interval of Sen's eq. (2.6):
 * with N pairwise slopes sorted ascending and C = z_{1-α/2}·√Var S, the lower limit is the
 * round((N - C)/2)-th slope and the upper the (round((N + C)/2) + 1)-th (1-based; rounding half
 * to even), as also described by Gilbert 1987 (Statistical Methods for Environmental Pollution
 * Monitoring, §16.5 [from memory]). All N = n(n-1)/2 slopes are stored, so the slope is computed
 * only up to MAX_SEN_N values.
 * The intercept is median(x) - slope·median(t) (Conover's convention, as used by SciPy's theilslopes).
 */
import { normalQuantile } from '../special/index.js';

export const MAX_SEN_N = 3000;

export interface SenSlope {
  readonly estimate: number;
  readonly lower: number;
  readonly upper: number;
  readonly confidence: number;
  readonly intercept: number;
  readonly method: string;
}

function median(sorted: Float64Array): number {
  const n = sorted.length;
  const h = n >> 1;
  return n % 2 === 1 ? (sorted[h] as number) : 0.5 * ((sorted[h - 1] as number) + (sorted[h] as number));
}

function roundHalfEven(v: number): number {
  const r = Math.round(v);
  return Math.abs(v - Math.trunc(v)) === 0.5 && r % 2 !== 0 ? r - 1 : r;
}

/** x, t in time order (t strictly increasing); `varianceS` the tie-corrected Var S. */
export function senSlope(x: Float64Array, t: Float64Array, opts: { alpha: number; varianceS: number }): SenSlope | null {
  const n = x.length;
  if (n < 2 || n > MAX_SEN_N) return null;
  const N = (n * (n - 1)) / 2;
  const slopes = new Float64Array(N);
  let k = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) slopes[k++] = ((x[j] as number) - (x[i] as number)) / ((t[j] as number) - (t[i] as number));
  }
  slopes.sort();
  const estimate = median(slopes);
  const c = -normalQuantile(opts.alpha / 2) * Math.sqrt(opts.varianceS);
  const lo = Math.max(roundHalfEven((N - c) / 2) - 1, 0);
  const hi = Math.min(roundHalfEven((N + c) / 2), N - 1);
  const xs = Float64Array.from(x).sort();
  const ts = Float64Array.from(t).sort();
  return {
    estimate,
    lower: slopes[lo] as number,
    upper: slopes[hi] as number,
    confidence: 1 - opts.alpha,
    intercept: median(xs) - estimate * median(ts),
    method: "Sen's (1968) median of pairwise slopes with the eq. (2.6) rank interval",
  };
}
