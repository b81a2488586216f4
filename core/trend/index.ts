/** Trend check for time-ordered data: the one public entry of core/trend. */
export { exactMannKendallP, inversionCounts, mannKendall } from './mann-kendall.js';
export type { TrendOptions, TrendResult } from './mann-kendall.js';
export { MAX_SEN_N, senSlope } from './sen-slope.js';
export type { SenSlope } from './sen-slope.js';
export { autocorrelations, averageRanks, hamedRaoMannKendall } from './hamed-rao.js';
export type { HamedRaoResult } from './hamed-rao.js';
