/**
 * Anderson–Darling p-value for the normal case with mean and variance estimated (and the
 * lognormal case, the same test on ln x): D'Agostino & Stephens (1986), Goodness-of-Fit
 * Techniques, Table 4.9. The table is entered with A² computed with the sample mean and the n - 1
 * sample standard deviation, modified to A* = A²(1 + 0.75/n + 2.25/n²).
 *
 *   A* < 0.2          p = 1 - exp(-13.436 + 101.14A* - 223.73A*²)
 *   0.2 ≤ A* < 0.34   p = 1 - exp(-8.318 + 42.796A* - 59.938A*²)
 *   0.34 ≤ A* < 0.6   p = exp(0.9177 - 4.279A* - 1.38A*²)
 *   A* ≥ 0.6          p = exp(1.2937 - 5.709A* + 0.0186A*²)
 *
 * The formula is not continuous at its branch edges (0.50152 vs 0.49823 at 0.34), as published.
 */
import type { AdPValue } from './ad-pvalue-types.js';

/** A* = A²(1 + 0.75/n + 2.25/n²). */
export function normalCaseModified(a2: number, n: number): number {
  return a2 * (1 + 0.75 / n + 2.25 / (n * n));
}

/** Table 4.9 p-value of A*; 1 - exp(y) is computed as -expm1(y). */
export function normalCasePValue(aStar: number): number {
  let p: number;
  if (aStar < 0.2) p = -Math.expm1(-13.436 + 101.14 * aStar - 223.73 * aStar * aStar);
  else if (aStar < 0.34) p = -Math.expm1(-8.318 + 42.796 * aStar - 59.938 * aStar * aStar);
  else if (aStar < 0.6) p = Math.exp(0.9177 - 4.279 * aStar - 1.38 * aStar * aStar);
  else {
    const a = Math.min(aStar, NORMAL_TURNING_POINT);
    p = Math.exp(1.2937 - 5.709 * a + 0.0186 * a * a);
  }
  return Math.min(1, Math.max(0, p));
}

/**
 * The last branch's quadratic has its minimum at A* = 5.709/(2·0.0186) ≈ 153.5 (p ≈ 1e-190) and
 * would rise again beyond it; the number is held at that minimum there, which is then only an
 * upper bound on p (our guard, no source; `normalCaseResult` says so).
 */
export const NORMAL_TURNING_POINT = 5.709 / (2 * 0.0186);

/**
 * The p-value of A* as the report carries it: an estimate inside the formula's range; beyond the
 * turning point only the bound p < (the formula's minimum, about 1e-190).
 */
export function normalCaseResult(aStar: number): Pick<AdPValue, 'pValue' | 'pValueIs'> {
  return { pValue: normalCasePValue(aStar), pValueIs: aStar > NORMAL_TURNING_POINT ? 'upper-bound' : 'estimate' };
}

/** Upper critical values of A* (D'Agostino & Stephens 1986, Table 4.7). */
export const NORMAL_CASE_CRITICAL = [
  { alpha: 0.15, value: 0.561 },
  { alpha: 0.1, value: 0.631 },
  { alpha: 0.05, value: 0.752 },
  { alpha: 0.025, value: 0.873 },
  { alpha: 0.01, value: 1.035 },
] as const;
