/**
 * Anderson–Darling p-value for the exponential case (origin 0 known, mean estimated):
 * D'Agostino & Stephens (1986), Goodness-of-Fit Techniques, ch. 4 (p. 136, page from memory).
 * Modified statistic A* = A²(1 + 0.6/n).
 *
 *   A* < 0.26          p = 1 - exp(-12.2204 + 67.459A* - 110.30A*²)
 *   0.26 ≤ A* < 0.51   p = 1 - exp(-6.1327 + 20.218A* - 18.663A*²)
 *   0.51 ≤ A* < 0.95   p = exp(0.9209 - 3.353A* + 0.300A*²)
 *   A* ≥ 0.95          p = exp(0.731 - 3.009A* + 0.15A*²)
 */
import type { AdPValue } from './ad-pvalue-types.js';

/** A* = A²(1 + 0.6/n). */
export function exponentialCaseModified(a2: number, n: number): number {
  return a2 * (1 + 0.6 / n);
}

/**
 * p-value of A*. The last branch's quadratic turns upward at A* ≈ 10; its value there is
 * already below 1e-6 (5.8e-7), so beyond the turning point the number is held at the minimum,
 * which is then only an upper bound on p (`exponentialCaseResult` says so).
 */
export function exponentialCasePValue(aStar: number): number {
  let p: number;
  if (aStar < 0.26) p = -Math.expm1(-12.2204 + 67.459 * aStar - 110.3 * aStar * aStar);
  else if (aStar < 0.51) p = -Math.expm1(-6.1327 + 20.218 * aStar - 18.663 * aStar * aStar);
  else if (aStar < 0.95) p = Math.exp(0.9209 - 3.353 * aStar + 0.3 * aStar * aStar);
  else {
    const a = Math.min(aStar, EXPONENTIAL_TURNING_POINT);
    p = Math.exp(0.731 - 3.009 * a + 0.15 * a * a);
  }
  return Math.min(1, Math.max(0, p));
}

/** Where exp(0.731 - 3.009A + 0.15A²) has its minimum: A = 3.009 / 0.3. */
export const EXPONENTIAL_TURNING_POINT = 3.009 / 0.3;

/**
 * The p-value of A* as the report carries it: an estimate inside the formula's range; beyond the
 * turning point, where the formula stops decreasing, only the bound p < (its minimum, 5.8e-7).
 */
export function exponentialCaseResult(aStar: number): Pick<AdPValue, 'pValue' | 'pValueIs'> {
  return { pValue: exponentialCasePValue(aStar), pValueIs: aStar > EXPONENTIAL_TURNING_POINT ? 'upper-bound' : 'estimate' };
}

/** Upper critical values of A* (D'Agostino & Stephens 1986). */
export const EXPONENTIAL_CASE_CRITICAL = [
  { alpha: 0.15, value: 0.916 },
  { alpha: 0.1, value: 1.062 },
  { alpha: 0.05, value: 1.321 },
  { alpha: 0.025, value: 1.591 },
  { alpha: 0.01, value: 1.959 },
] as const;
