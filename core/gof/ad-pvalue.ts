/**
 * Table (published case formula) p-values for the Anderson–Darling statistic with estimated
 * parameters, one case per family. Returns null for a family without a table: its p-value then
 * comes from the parametric bootstrap (`bootstrap.ts`).
 */
import { getFamily, type FamilyName, type Parameters } from '../families/index.js';
import type { Sample } from '../sample.js';
import { formatNumber } from '../format/index.js';
import { andersonDarlingStatistic } from './anderson-darling.js';
import type { AdPValue } from './ad-pvalue-types.js';
import { NORMAL_TURNING_POINT, normalCaseModified, normalCasePValue, normalCaseResult } from './ad-pvalue-normal.js';
import { EXPONENTIAL_TURNING_POINT, exponentialCaseModified, exponentialCasePValue, exponentialCaseResult } from './ad-pvalue-exponential.js';
import {
  EXTREME_VALUE_SIMULATED_MAX_N,
  EXTREME_VALUE_SIMULATED_MIN_N,
  EXTREME_VALUE_TABLE_MIN_N,
  extremeValueSimulatedPValue, weibullCaseModified, weibullCasePValue 
} from './ad-pvalue-weibull.js';
import { EXTREME_VALUE_AD_TABLE } from './ad-extreme-value-table.js';
import { gammaCasePValue } from './ad-pvalue-gamma.js';
import { GAMMA_AD_TABLE } from './ad-gamma-table.js';

/** Families with a table p-value. */
export function hasTablePValue(family: FamilyName): boolean {
  return family === 'normal' || family === 'lognormal' || family === 'exponential' || family === 'weibull' || family === 'gumbel' || family === 'gamma';
}

/**
 * The table p-value of `a2` (A² at the fitted parameters `parameters` of `family` on `sample`),
 * or null when the family has no table.
 */
export function tablePValue(family: FamilyName, parameters: Parameters, sample: Sample, a2: number): AdPValue | null {
  const n = sample.n;
  switch (family) {
    case 'normal':
    case 'lognormal': {
      // Table 4.9 is built with the n - 1 standard deviation: recompute A² with it.
      // Lognormal: the same number as the normal test of ln x, computed on the sample's cached logs.
      const inflate = Math.sqrt(n / (n - 1));
      const logs = family === 'lognormal' ? sample.logs() : null;
      const tableA2 =
        family === 'normal'
          ? andersonDarlingStatistic(getFamily('normal').make({ mean: parameters['mean'] as number, sd: (parameters['sd'] as number) * inflate }), sample.sorted)
          : logs !== null
            ? andersonDarlingStatistic(getFamily('normal').make({ mean: parameters['meanlog'] as number, sd: (parameters['sdlog'] as number) * inflate }), logs)
            : sample.nonPositive === 0 // ln x not cached (very large samples): the lognormal of x, the same statistic
              ? andersonDarlingStatistic(getFamily('lognormal').make({ meanlog: parameters['meanlog'] as number, sdlog: (parameters['sdlog'] as number) * inflate }), sample.sorted)
              : Number.NaN;
      if (Number.isNaN(tableA2)) return null;
      const aStar = normalCaseModified(tableA2, n);
      const on = family === 'normal' ? 'x' : 'ln x';
      return {
        ...normalCaseResult(aStar),
        modifiedStatistic: aStar,
        tableStatistic: tableA2,
        methodDetail:
          `Normal case with mean and variance estimated, on ${on}: D'Agostino & Stephens (1986), Goodness-of-Fit Techniques, Table 4.9 formula, ` +
          `entered with A* = A²(1 + 0.75/n + 2.25/n²) where this A² (${formatNumber(tableA2)}) uses the n - 1 standard deviation as the table does; ` +
          `the reported statistic (${formatNumber(a2)}) is A² at the maximum-likelihood fit. Beyond A* = ${formatNumber(NORMAL_TURNING_POINT)}, where the formula stops decreasing, the p-value is only the bound p < ${formatNumber(normalCasePValue(NORMAL_TURNING_POINT))}.`,
      };
    }
    case 'exponential': {
      const aStar = exponentialCaseModified(a2, n);
      return {
        ...exponentialCaseResult(aStar),
        modifiedStatistic: aStar,
        methodDetail:
          "Exponential case, origin known (0), mean estimated: D'Agostino & Stephens (1986), Goodness-of-Fit Techniques, ch. 4 p-value formula, entered with A* = A²(1 + 0.6/n). " +
          `Beyond A* = ${formatNumber(EXPONENTIAL_TURNING_POINT)}, where the formula stops decreasing, the p-value is only the bound p < ${formatNumber(exponentialCasePValue(EXPONENTIAL_TURNING_POINT))}.`,
      };
    }
    case 'weibull':
    case 'gumbel': {
      const what =
        family === 'weibull'
          ? 'Two-parameter Weibull through the extreme-value test of ln x (same A²)'
          : 'Gumbel (extreme value) with location and scale estimated';
      const simulated = n < EXTREME_VALUE_TABLE_MIN_N ? extremeValueSimulatedPValue(a2, n) : null;
      if (simulated !== null) {
        return {
          ...simulated,
          methodDetail:
            `${what}: the null distribution of A² with both parameters estimated depends on n only, and was simulated by this project ` +
            `(${EXTREME_VALUE_AD_TABLE.generatedBy}, seed ${EXTREME_VALUE_AD_TABLE.seed}, ${EXTREME_VALUE_AD_TABLE.replicates} refitted samples at each tabulated n from ` +
            `${EXTREME_VALUE_SIMULATED_MIN_N} to ${EXTREME_VALUE_SIMULATED_MAX_N}); critical values linear in 1/n between tabulated sizes, ` +
            `ln p interpolated linearly between the ${EXTREME_VALUE_AD_TABLE.alphas.map((a) => formatNumber(100 * a)).join(', ')} % points, a bound outside them. ` +
            `Below n = ${EXTREME_VALUE_TABLE_MIN_N} this replaces Stephens's (1977) A*(1 + 0.2/√n) table, which rejects about 5.6 % at n = 20 for a nominal 5 %.`,
        };
      }
      // n >= 100, or below the simulated table (where the analysis switches to the bootstrap).
      const aStar = weibullCaseModified(a2, n);
      return {
        ...weibullCasePValue(aStar),
        modifiedStatistic: aStar,
        methodDetail:
          `${what}: Stephens (1977), Biometrika 64:583-588, critical values of A* = A²(1 + 0.2/√n) at 25, 10, 5, 2.5 and 1 %, ` +
          'ln p interpolated linearly between them; outside that range the p-value is a bound.',
      };
    }
    case 'gamma': {
      const shape = parameters['shape'] as number;
      const r = gammaCasePValue(a2, shape);
      const smallest = GAMMA_AD_TABLE.rows[0].shape;
      return {
        pValue: r.pValue,
        pValueIs: r.pValueIs,
        methodDetail:
          `Gamma with shape and scale estimated: critical values of A² (no n-correction) interpolated in 1/shape at the fitted shape ${formatNumber(shape)} ` +
          `from a grid simulated by this project (${GAMMA_AD_TABLE.generatedBy}, seed ${GAMMA_AD_TABLE.seed}, ${GAMMA_AD_TABLE.replicates} refitted replicates per shape at n = ${GAMMA_AD_TABLE.n}), ` +
          "which matches the shape-1 values of D'Agostino & Stephens (1986), Table 4.21 (recalled, not read from a copy); ln p interpolated linearly between the 25, 10, 5, 2.5 and 1 % points, a bound outside them." +
          (r.clamped ? ` The fitted shape is below the smallest tabulated shape ${smallest}, so that row was used: prefer the bootstrap.` : ''),
      };
    }
    default:
      return null;
  }
}
