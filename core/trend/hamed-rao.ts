/**
 * Mann–Kendall with the Hamed & Rao (1998) variance correction for autocorrelated series
 * (Hamed & Rao 1998, "A modified Mann-Kendall trend test for autocorrelated data", J. Hydrology
 * 204:182-196 [from memory]):
 *   1. remove the trend with Sen's slope β: x′_t = x_t − β t;
 *   2. rank x′ (average ranks for ties) and take the lag-i autocorrelations ρ(i) of the ranks;
 *   3. keep the lags whose ρ(i) is significant, |ρ(i)| > z_{1−α/2}/√n (the usual large-sample
 *      bound under independence at the test's α);
 *   4. n/n* = 1 + 2/(n(n − 1)(n − 2)) Σ_i (n − i)(n − i − 1)(n − i − 2) ρ(i) over those lags;
 *   5. Var*(S) = Var(S) · n/n*, Z* with the same continuity correction, p = 2Φ(−|Z*|).
 * The decision uses the corrected test whenever a significant lag was found (it is then the one
 * whose assumptions hold), the plain test otherwise; the result says which.
 */
import { normalCdf, normalIsf } from '../special/index.js';
import { formatNumber, formatPValue } from '../format/index.js';
import { mannKendall, type TrendOptions, type TrendResult } from './mann-kendall.js';

export interface HamedRaoResult {
  readonly plain: TrendResult;
  /** null when Sen's slope was not computed (n too large) or n < 4. */
  readonly corrected: {
    readonly varianceRatio: number;
    readonly varianceS: number;
    readonly z: number;
    readonly pValue: number;
    readonly trendDetected: boolean;
    readonly significantLags: readonly { readonly lag: number; readonly rho: number }[];
  } | null;
  /** Which test the decision uses. */
  readonly decisionUses: 'hamed-rao' | 'plain';
  readonly trendDetected: boolean;
  readonly decision: string;
  readonly method: string;
}

/** Average ranks (1-based) of values. */
export function averageRanks(xs: ArrayLike<number>): Float64Array {
  const n = xs.length;
  const idx = Array.from({ length: n }, (_, i) => i).sort((a, b) => (xs[a] as number) - (xs[b] as number));
  const r = new Float64Array(n);
  let i = 0;
  while (i < n) {
    let j = i;
    while (j + 1 < n && xs[idx[j + 1] as number] === xs[idx[i] as number]) j++;
    const avg = (i + j) / 2 + 1;
    for (let k = i; k <= j; k++) r[idx[k] as number] = avg;
    i = j + 1;
  }
  return r;
}

/** Lag-i sample autocorrelations, i = 1 … n − 1 (divisor: the total sum of squares). */
export function autocorrelations(xs: ArrayLike<number>): Float64Array {
  const n = xs.length;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += xs[i] as number;
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += ((xs[i] as number) - mean) ** 2;
  const out = new Float64Array(n - 1);
  for (let lag = 1; lag < n; lag++) {
    let s = 0;
    for (let t = 0; t + lag < n; t++) s += ((xs[t] as number) - mean) * ((xs[t + lag] as number) - mean);
    out[lag - 1] = s / ss;
  }
  return out;
}

export function hamedRaoMannKendall(values: ArrayLike<number>, opts: TrendOptions = {}): HamedRaoResult {
  const plain = mannKendall(values, opts);
  const alpha = plain.alpha;
  const n = plain.n;
  const slope = plain.senSlope;
  if (!slope || n < 4) {
    return { plain, corrected: null, decisionUses: 'plain', trendDetected: plain.trendDetected, decision: plain.decision, method: `${plain.method}; Hamed–Rao correction not computed (${n < 4 ? 'n < 4' : "no Sen's slope for this n"})` };
  }
  const times = opts.times ? Array.from(opts.times) : Array.from({ length: n }, (_, i) => i + 1);
  // In time order, like the test itself.
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => (times[a] as number) - (times[b] as number));
  const detrended = order.map((i) => (values[i] as number) - slope.estimate * (times[i] as number));
  const rho = autocorrelations(averageRanks(detrended));
  const bound = normalIsf(alpha / 2) / Math.sqrt(n);
  let sum = 0;
  const lags: { lag: number; rho: number }[] = [];
  for (let i = 1; i < n; i++) {
    const r = rho[i - 1] as number;
    if (Math.abs(r) > bound) {
      lags.push({ lag: i, rho: r });
      sum += (n - i) * (n - i - 1) * (n - i - 2) * r;
    }
  }
  const ratio = 1 + (2 / (n * (n - 1) * (n - 2))) * sum;
  const varianceS = plain.varianceS * ratio;
  const s = plain.s;
  const sd = Math.sqrt(varianceS);
  const z = s > 0 ? (s - 1) / sd : s < 0 ? (s + 1) / sd : 0;
  const pValue = Math.min(1, 2 * normalCdf(-Math.abs(z)));
  const trendDetected = pValue < alpha;
  const uses = lags.length > 0 ? 'hamed-rao' : 'plain';
  const fmt = (v: number): string => formatNumber(v, 4);
  const decision =
    uses === 'hamed-rao'
      ? `Mann–Kendall with the Hamed–Rao correction (rank autocorrelation at ${lags.length} lag${lags.length === 1 ? '' : 's'}, variance × ${fmt(ratio)}): ${trendDetected ? `a monotonic ${s > 0 ? 'increasing' : 'decreasing'} trend` : 'no monotonic trend detected'} at α = ${alpha} (${formatPValue(pValue)}; plain test ${formatPValue(plain.pValue)}). The decision uses the corrected test.`
      : `${plain.decision} No significant autocorrelation of the detrended ranks, so the plain test is used (Hamed–Rao ratio 1).`;
  return {
    plain,
    corrected: { varianceRatio: ratio, varianceS, z, pValue, trendDetected, significantLags: lags },
    decisionUses: uses,
    trendDetected: uses === 'hamed-rao' ? trendDetected : plain.trendDetected,
    decision,
    method: 'Mann–Kendall with the Hamed & Rao (1998) variance correction for autocorrelated data beside the plain test',
  };
}
