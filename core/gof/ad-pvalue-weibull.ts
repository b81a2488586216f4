/**
 * Anderson–Darling p-value for the two-parameter Weibull with shape and scale estimated, through
 * the equivalent extreme-value (Gumbel) test of ln x (A² is the same number): Stephens (1977),
 * "Goodness of fit for the extreme value distribution", Biometrika 64:583-588. Modified statistic
 * A* = A²(1 + 0.2/√n); ln p interpolated between the tabulated upper critical values; outside the
 * table a bound (p > 0.25 or p < 0.01). Used from n = 100 up; below, the same statistic's null
 * distribution simulated by n (scripts/simulate-ad-extreme-value-table.ts).
 */
import { interpolateCriticalTable, type CriticalPoint } from './ad-pvalue-interpolate.js';
import { EXTREME_VALUE_AD_TABLE } from './ad-extreme-value-table.js';

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

/**
 * From this n up Stephens's (1977) table decides (measured 5.27–5.35 % at n = 100–500 on 100,000
 * samples, docs/size-study.md); below it the simulated table by n (`EXTREME_VALUE_AD_TABLE`).
 */
export const EXTREME_VALUE_TABLE_MIN_N = 100;

/** Smallest and largest n of the simulated table; below the smallest the bootstrap decides. */
export const EXTREME_VALUE_SIMULATED_MIN_N: number = EXTREME_VALUE_AD_TABLE.rows[0].n;
export const EXTREME_VALUE_SIMULATED_MAX_N: number = (EXTREME_VALUE_AD_TABLE.rows[EXTREME_VALUE_AD_TABLE.rows.length - 1] as { n: number }).n;

/**
 * Upper critical values of A² at sample size n from the simulated table, linear in 1/n between the
 * two nearest tabulated sizes (common practice, no source: the critical values are smooth in 1/n);
 * null outside the table's range.
 */
export function extremeValueSimulatedCritical(n: number): CriticalPoint[] | null {
  const rows = EXTREME_VALUE_AD_TABLE.rows;
  if (!Number.isInteger(n) || n < EXTREME_VALUE_SIMULATED_MIN_N || n > EXTREME_VALUE_SIMULATED_MAX_N) return null;
  let hi = 0;
  while ((rows[hi] as { n: number }).n < n) hi++;
  const b = rows[hi] as (typeof rows)[number];
  const a = (hi === 0 ? b : rows[hi - 1]) as (typeof rows)[number];
  const w = a.n === b.n ? 0 : (1 / n - 1 / a.n) / (1 / b.n - 1 / a.n);
  return EXTREME_VALUE_AD_TABLE.alphas.map((alpha, j) => ({
    alpha,
    value: (a.values[j] as number) + w * ((b.values[j] as number) - (a.values[j] as number)),
  }));
}

/** p-value of A² at sample size n from the simulated table, or null outside its range. */
export function extremeValueSimulatedPValue(a2: number, n: number): ReturnType<typeof interpolateCriticalTable> | null {
  const points = extremeValueSimulatedCritical(n);
  return points === null ? null : interpolateCriticalTable(a2, points);
}
