/**
 * p-values from a table of upper critical values: ln p is interpolated linearly against the
 * statistic between tabulated points (common practice, no source; the points are close enough
 * that ln p is nearly linear between them). Outside the table the p-value is reported as a bound:
 * below the smallest critical value p exceeds its level (lower bound), above the largest p is less
 * than its level (upper bound).
 */
import type { AdPValue } from './ad-pvalue-types.js';

export interface CriticalPoint {
  /** Upper-tail probability α. */
  readonly alpha: number;
  /** Critical value c with P(T > c) = α. */
  readonly value: number;
}

/**
 * Interpolate ln p against t in `points`, which must be sorted by increasing critical value
 * (decreasing α).
 */
export function interpolateCriticalTable(
  t: number,
  points: readonly CriticalPoint[],
): Pick<AdPValue, 'pValue' | 'pValueIs'> {
  const first = points[0];
  const last = points[points.length - 1];
  if (!first || !last) throw new Error('empty critical-value table');
  if (t < first.value) return { pValue: first.alpha, pValueIs: 'lower-bound' };
  if (t > last.value) return { pValue: last.alpha, pValueIs: 'upper-bound' };
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1] as CriticalPoint;
    const b = points[i] as CriticalPoint;
    if (t <= b.value) {
      const w = b.value === a.value ? 0 : (t - a.value) / (b.value - a.value);
      return { pValue: Math.exp(Math.log(a.alpha) + w * (Math.log(b.alpha) - Math.log(a.alpha))), pValueIs: 'estimate' };
    }
  }
  return { pValue: last.alpha, pValueIs: 'estimate' };
}
