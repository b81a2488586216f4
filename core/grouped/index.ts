/** Grouped counts (class limits with counts): the one public entry of core/grouped. */
export { prepareGrouped } from './classes.js';
export type { GroupedClass, GroupedData } from './classes.js';
export { logClassProbability } from './class-probability.js';
export { classMidpoints, fitGrouped, groupedLogLikelihood } from './fit.js';
export type { GroupedFitOutcome, GroupedFitSuccess } from './fit.js';
export { groupedChiSquare, GROUPED_AD_NOTE, mergeCells } from './chi-square.js';
export type { GroupedChiSquare } from './chi-square.js';
export { analyzeGrouped } from './analyze.js';
export type { GroupedAnalysis, GroupedCandidate } from './analyze.js';
