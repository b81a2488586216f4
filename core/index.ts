/**
 * Plumbline's core: the single public entry for the CLI, the server and the page.
 * (Outside code imports only this file.)
 */
export * from './errors.js';
export type * from './report.js';
export { LOG_CACHE_MAX_N, prepareSample, sampleSummary } from './sample.js';
export type { Sample, SampleSummary } from './sample.js';
export { createRng } from './random/index.js';
export type { Rng } from './random/index.js';
export { DEFAULT_FAMILIES, allFamilies, getFamily, registerFamily } from './families/index.js';
export type * from './families/types.js';
export {
  DEFAULT_ALPHA,
  DEFAULT_SEED,
  PLUMBLINE_VERSION,
  analyze,
  analyzeAsync,
  evaluateFamilies,
  finishAnalysis,
  planAnalysis,
  resolveOptions,
  runPlanBootstrap,
} from './analyze.js';
export type { AnalysisPlan, AnalyzeOptions, DelegatedFamilies, EvaluatedFamily, BootstrapProgress, BootstrapRunner, ResolvedOptions } from './analyze.js';
export { RANKING_RULE, informationCriteria, rankCandidates } from './rank.js';
export {
  DEFAULT_BOOTSTRAP_REPLICATES,
  MIN_EXPECTED_PER_BIN,
  andersonDarlingStatistic,
  bootstrapPValue,
  chiSquareTest,
  chooseBinCount,
  combineBootstrapCounts,
  equiprobableBins,
  formatNumber,
  hasTablePValue,
  maxBinCount,
  mooreBinCount,
  runBootstrapRange,
  splitBootstrapJob,
} from './gof/index.js';
export type { BootstrapCounts, BootstrapJob, CancelSignal } from './gof/index.js';
export * from './csv/index.js';
export { computeEvidence, DEFAULT_BAND_ALPHA, DEFAULT_GRID_POINTS, DEFAULT_MAX_POINTS, CENSORED_BINS, type CensoredEvidenceInput } from './evidence/index.js';
export type * from './evidence/types.js';
export type * from './workflow/index.js';
export type * from './api-types.js';
export { DEFAULT_CONFIDENCE, DEFAULT_LIFE_REPLICATES, GROUPED_DOF_RULE, analyzeDataset, analyzeDatasetAsync, planDataset, finishDataset, censoredBootstrapWork, runDatasetJob, combineDatasetJobResults, jobSampleSize, splitDatasetJob, POOL_CAPABILITY_WORK } from './workflow/index.js';
export { POT_CAUTIONS, POT_DEFAULT_PERIODS, POT_DEFAULT_SEPARATION, POT_DIAGNOSTICS_RULE, diagnosticThresholds, potSection } from './workflow/index.js';
export { readFailureModes, readIntervalModes } from './workflow/index.js';
export { FLOOD_RECORD_PERIODS, PEAK_COLUMN, fitFloodRecord, floodRecordReport, looksLikePeakFile, peakFileMakeUp, readFloodRecord, regionalSkewOf } from './workflow/index.js';
export * from './batch/index.js';
export * from './options/index.js';
export { formatPValue, pValueText, testNames } from './format/index.js';
export type { PValueKind, PValueResult } from './format/index.js';
export { analyzeRecordedLife, planTest, weibayes, prepareIntervalLifeData, turnbull, SAFETY_CAUTION, RANK_REGRESSION_REASON } from './life/index.js';
export { readIntervalRows, columnSelector, INTERVAL_GOF_REPLICATES, type IntervalColumns, type IntervalRowsRead } from './life/index.js';
export type {
  RecordedLifeInput,
  RecordedLifeOptions,
  RecordedLifeReport,
  RecordedLifeCandidate,
  LifeEstimation,
  IntervalLifeInput,
  TestPlan,
  TestPlanInput,
  TestPlanRow,
  WeibayesResult,
  TurnbullEstimate,
  TurnbullInterval,
  CompetingModesReport,
  ModeResult,
  BLife,
  ReliabilityAt,
} from './life/index.js';
export * from './regional/index.js';
export type { ChartPanel, ChartPoint, ComparisonRow, ModelComparison, PercentileIntervals, BootstrapIndexInterval, StabilityChart, TransformSection, TransformedCapability } from './capability/index.js';
export { EMA_CAUTIONS, emaCautions, DEFAULT_EMA_REPLICATES, EMA_INTERVAL_STREAM, emaCandidateFields, emaReturnLevels, fitEma, multipleGrubbsBeck, stationSkewMse, weightSkew } from './flood/index.js';
export type { EmaCandidateFields, EmaFit, EmaRecord, EmaReturnLevel, MgbResult, SkewWeighting } from './flood/index.js';
export { readPeakFile } from './gauge/peak-file.js';
export type { CodeSummary, PeakFile, PeakFileOptions, PeakRow } from './gauge/peak-file.js';
export { hamedRaoMannKendall } from './trend/index.js';
export type { HamedRaoResult } from './trend/index.js';
export { fitByLMoments, LMOMENT_FAMILIES } from './lmoments/family-fits.js';
export type { LMomentFamily, LMomentFit } from './lmoments/family-fits.js';
export { gevRatios, gloT4, gpaT4, pe3T4, ratioDiagram } from './lmoments/ratio-diagram.js';
export type { RatioDiagram, RatioPoint } from './lmoments/ratio-diagram.js';
export { declusterRuns, peaksOverThreshold, thresholdDiagnostics, dayNumbers, isoDayNumber } from './flood/index.js';
export type { Cluster, GpdFit, PotResult, PotReturnLevel, ThresholdDiagnostic } from './flood/index.js';
