/** Flood frequency from annual maxima: the one public entry of core/flood. */
export { FLOOD_CAUTION, GEV_SIGN_NOTE, gevQuantileOffset, RECORD_MULTIPLE, returnLevels } from './return-levels.js';
export type { ReturnLevel, ReturnLevelMethod, ReturnLevelOptions, ReturnLevelReport } from './return-levels.js';
export { PLOTTING_CONSTANTS, plottingPositions } from './plotting-positions.js';
export type { PlottingFormula, PlottingPoint, PlottingPositions } from './plotting-positions.js';
export { exceedanceRisk, periodForRisk } from './risk.js';
export { floodFrequency } from './analysis.js';
export type { FloodAnalysis, FloodCandidate, FloodOptions, GumbelVersusGev } from './analysis.js';
