/** Flood frequency from annual maxima: the one public entry of core/flood. */
export { FLOOD_CAUTION, GEV_SIGN_NOTE, gevQuantileOffset, RECORD_MULTIPLE, returnLevels } from './return-levels.js';
export type { ReturnLevel, ReturnLevelMethod, ReturnLevelOptions, ReturnLevelReport } from './return-levels.js';
export { PLOTTING_CONSTANTS, plottingPositions } from './plotting-positions.js';
export type { PlottingFormula, PlottingPoint, PlottingPositions } from './plotting-positions.js';
export { exceedanceRisk, periodForRisk } from './risk.js';
export { floodFrequency } from './analysis.js';
export type { FloodAnalysis, FloodCandidate, FloodOptions, GumbelVersusGev } from './analysis.js';
// Log-Pearson III by the expected moments algorithm (Bulletin 17C): EMA, low outliers, regional skew.
export { EMA_MAX_PEAKS, emaCandidateFields, emaIterate, fitEma, recordObservations } from './ema.js';
export type { EmaCandidateFields, EmaCounts, EmaFit, EmaRecord, LogObservation } from './ema.js';
export { DEFAULT_EMA_REPLICATES, emaReturnLevels } from './ema-return-levels.js';
export type { EmaIntervalOptions, EmaReturnLevel } from './ema-return-levels.js';
export { intervalMoments } from './ema-moments.js';
export { lp3QuantileInterval, lp3QuantileVariance, standardizedRawMoments } from './ema-variance.js';
export type { QuantileVariance } from './ema-variance.js';
export { MGB_INWARD_ALPHA, MGB_OUTWARD_ALPHA, mgbPValues, mgbStatistics, multipleGrubbsBeck } from './grubbs-beck.js';
export type { MgbResult } from './grubbs-beck.js';
export { STATION_SKEW_MSE_METHOD, stationSkewMse, weightSkew } from './regional-skew.js';
export type { SkewWeighting } from './regional-skew.js';
export { EMA_CAUTIONS } from './ema-cautions.js';
export { declusterRuns, fitGpdLMoments, fitGpdMl, gpdLogLikelihood, gpdReturnLevel, peaksOverThreshold, thresholdDiagnostics } from './pot.js';
export type { Cluster, GpdFit, PotOptions, PotResult, PotReturnLevel, ThresholdDiagnostic } from './pot.js';
export { dayNumbers, isoDayNumber } from './pot-dates.js';
