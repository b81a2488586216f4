/** Goodness of fit: the one public entry of core/gof. */
export { MIN_EXPECTED_PER_BIN, chooseBinCount, equiprobableBins, equiprobableEdges, lowerBound, maxBinCount, mooreBinCount } from './binning.js';
export type { BinChoice } from './binning.js';
export { chiSquareTest, pearsonStatistic } from './chi-square.js';
export type { ChiSquareOptions } from './chi-square.js';
export { andersonDarlingStatistic } from './anderson-darling.js';
export type { LogCdfSf } from './anderson-darling.js';
export type { AdPValue } from './ad-pvalue-types.js';
export { hasTablePValue, tablePValue } from './ad-pvalue.js';
export { interpolateCriticalTable } from './ad-pvalue-interpolate.js';
export type { CriticalPoint } from './ad-pvalue-interpolate.js';
export { NORMAL_CASE_CRITICAL, NORMAL_TURNING_POINT, normalCaseModified, normalCasePValue, normalCaseResult } from './ad-pvalue-normal.js';
export { EXPONENTIAL_CASE_CRITICAL, EXPONENTIAL_TURNING_POINT, exponentialCaseModified, exponentialCasePValue, exponentialCaseResult } from './ad-pvalue-exponential.js';
export {
  EXTREME_VALUE_SIMULATED_MIN_N,
  EXTREME_VALUE_TABLE_MIN_N,
  WEIBULL_CASE_CRITICAL,
  extremeValueSimulatedCritical,
  extremeValueSimulatedPValue,
  weibullCaseModified,
  weibullCasePValue,
} from './ad-pvalue-weibull.js';
export { EXTREME_VALUE_AD_TABLE } from './ad-extreme-value-table.js';
export { gammaCasePValue, gammaCriticalValues } from './ad-pvalue-gamma.js';
export { GAMMA_AD_TABLE } from './ad-gamma-table.js';
export {
  DEFAULT_BOOTSTRAP_REPLICATES,
  bootstrapPValue,
  chiSquareBootstrapPValue,
  combineBootstrapCounts,
  replicateStatistic,
  replicateStatistics,
  runBootstrapRange,
  splitBootstrapJob,
} from './bootstrap.js';
export type { BootstrapCounts, BootstrapJob, BootstrapPValue, BootstrapRunOptions, CancelSignal, ChiSquareBootstrapPValue, ChiSquareBootstrapSpec } from './bootstrap.js';
export { formatNumber } from '../format/index.js';
