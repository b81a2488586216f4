/**
 * ln P(a < X ≤ b) = ln(F(b) - F(a)) of a fitted model, in log space without cancellation:
 * in the lower half (F(b) ≤ 1/2) from the log-cdf, ln F(b) + ln(1 - e^{ln F(a) - ln F(b)});
 * in the upper half (S(a) ≤ 1/2) from the log-survival function, ln S(a) + ln(1 - e^{ln S(b) - ln S(a)});
 * across the median ln(1 - F(a) - S(b)) by log1p, where neither difference is small.
 * (ln(1 - e^x) is log1mexp, Mächler 2012.)
 */
import type { Distribution } from '../families/index.js';
import { log1mexp } from '../special/index.js';

export function logClassProbability(d: Pick<Distribution, 'logCdf' | 'logSf'>, a: number, b: number): number {
  const lFb = b === Number.POSITIVE_INFINITY ? 0 : d.logCdf(b);
  if (lFb <= -Math.LN2) {
    const lFa = a === Number.NEGATIVE_INFINITY ? Number.NEGATIVE_INFINITY : d.logCdf(a);
    if (lFb === Number.NEGATIVE_INFINITY) return Number.NEGATIVE_INFINITY;
    return lFb + log1mexp(Math.min(lFa - lFb, 0));
  }
  const lSa = a === Number.NEGATIVE_INFINITY ? 0 : d.logSf(a);
  if (lSa <= -Math.LN2) {
    const lSb = b === Number.POSITIVE_INFINITY ? Number.NEGATIVE_INFINITY : d.logSf(b);
    if (lSa === Number.NEGATIVE_INFINITY) return Number.NEGATIVE_INFINITY;
    return lSa + log1mexp(Math.min(lSb - lSa, 0));
  }
  // F(a) < 1/2 < F(b): P = 1 - F(a) - S(b) ≥ 0, no cancellation beyond a factor of 2.
  const fa = a === Number.NEGATIVE_INFINITY ? 0 : Math.exp(d.logCdf(a));
  const sb = b === Number.POSITIVE_INFINITY ? 0 : Math.exp(d.logSf(b));
  return Math.log1p(-(fa + sb));
}
