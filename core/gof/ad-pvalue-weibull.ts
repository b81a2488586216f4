/**
 * Anderson–Darling p-value for the two-parameter Weibull with shape and scale estimated, through
 * the equivalent extreme-value (Gumbel) test of ln x (A² is the same number): Stephens (1977),
 * "Goodness of fit for the extreme value distribution", Biometrika 64:583-588. Modified statistic
 * A* = A²(1 + 0.2/√n); ln p interpolated between the tabulated upper critical values; outside the
 * table a bound (p > 0.25 or p < 0.01).
 */
import { interpolateCriticalTable, type CriticalPoint } from './ad-pvalue-interpolate.js';

/** A* = A²(1 + 0.2/√n). */
export function weibullCaseModified(a2: number, n: number): number {
  return a2 * (1 + 0.2 / Math.sqrt(n));
}

/** Stephens (1977) upper critical values of A*, both parameters estimated. */
export const WEIBULL_CASE_CRITICAL: readonly CriticalPoint[] = [
  { alpha: 0.25, value: 0.474 },
  { alpha: 0.1, value: 0.637 },
  { alpha: 0.05, value: 0.757 },
  { alpha: 0.025, value: 0.877 },
  { alpha: 0.01, value: 1.038 },
];

export function weibullCasePValue(aStar: number): ReturnType<typeof interpolateCriticalTable> {
  return interpolateCriticalTable(aStar, WEIBULL_CASE_CRITICAL);
}
