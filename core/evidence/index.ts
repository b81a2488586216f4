/** Evidence: plot data for the page, computed by the core. The one public entry of core/evidence. */
export type * from './types.js';
export { computeEvidence, DEFAULT_BAND_ALPHA, DEFAULT_GRID_POINTS, DEFAULT_MAX_POINTS } from './compute.js';
export type { EvidenceCandidate } from './compute.js';
export { thinMonotone, MIN_THIN_CAP } from './thin.js';
export { betaQuantile, incompleteBeta, orderStatisticInterval } from './orderStatistic.js';
export { BERNARD, BLOM, plottingPosition, probabilityPlot, scaleFor, scaleY } from './probabilityPlot.js';
export { empiricalCdf } from './ecdf.js';
export { binCounts, displayBinCount, histogramBars, DISPLAY_EDGE_RULE } from './histogram.js';
export { CENSORED_BINS, JOHNSON_POSITIONS, KAPLAN_MEIER_POSITIONS, kaplanMeierCdf, type CensoredEvidenceInput } from './censored.js';
