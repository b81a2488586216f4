/**
 * core/life: life data with right-censored suspensions — censored maximum likelihood, probability
 * plot positions, B-lives and reliability with bounds, hazard curves, bootstrap goodness of fit,
 * and `analyzeLife`, the one-call report.
 */
export { prepareLifeData, buildLifeData, type LifeData, type LifeInput } from './data.js';
export { censoredLogLikelihood } from './likelihood.js';
export { fitWeibullCensored, type WeibullCensoredFit } from './weibull-censored.js';
export { fitCensored, logLikelihoodOf, type CensoredFitOutcome, type CensoredFitSuccess, type CensoredFitFailure, type CensoredFitOptions } from './fit.js';
export { LIFE_FAMILIES, lifeModel, type LifeFamilyName, type LifeModel } from './models.js';
export { bLife, reliabilityAt, parameterInterval, type BLife, type ReliabilityAt, type BoundedEstimate, type BoundMethod, type LikelihoodSource } from './bounds.js';
export { plotPositions, drawingPositions, type DrawingPositions, johnsonBenardPositions, kaplanMeierPositions, weibullScaleY, lognormalScaleY, type PlotPositions, type PlotPoint, type PlotCoordinates, type PlotPositionMethod } from './positions.js';
export { censoredAndersonDarling } from './anderson-darling.js';
export { censoredGofBootstrap, CENSORED_AD_METHOD, type CensoredGofResult, type BootstrapOptions } from './bootstrap.js';
export { runCensoredGofRange, censoredGofFromCounts, type CensoredGofJob, type CensoredRangeOptions } from './bootstrap-range.js';
export { lifeCurves, logGrid, type LifeCurves } from './curves.js';
export { analyzeLife, FEW_FAILURES, CHI_SQUARE_NOT_APPLICABLE } from './analyze.js';
export type { CensoredGofHook, LifeOptions, LifeReport, LifeSampleSummary, LifeCandidate, LifeNotFitted, LifeMethodNote } from './types.js';
export { prepareIntervalLifeData, intervalInputFromTimes, censoringKind, type IntervalLifeInput, type IntervalLifeData, type CensoringKind } from './interval-likelihood-data.js';
export { intervalLogLikelihood, intervalLogLikelihoodOf } from './interval-likelihood.js';
export { fitInterval } from './interval-likelihood-fit.js';
export { turnbull, TURNBULL_METHOD, type TurnbullEstimate, type TurnbullInterval, type TurnbullOptions } from './turnbull.js';
export { weibayes, logExposure, type WeibayesOptions, type WeibayesResult } from './weibayes.js';
export { planTest, binomialUnits, logBinomialCdf, type TestPlan, type TestPlanInput, type TestPlanRow } from './test-plan.js';
export { analyzeModes, analyzeIntervalModes, systemQuantile, type IntervalModeInput, type ModeInput, type ModeOptions, type ModeResult, type ModeCandidate, type SystemResult, type CompetingModesReport } from './competing-modes.js';
export { fitWeibullMixture, mixtureDistribution, mixtureLogLikelihood, mixtureLogLikelihoodOf, mixtureLogSf, mixtureQuantile, type WeibullMixtureFit, type WeibullMixtureOutcome, type WeibullMixtureParameters } from './mixture.js';
export { fitRankRegression, RANK_REGRESSION_FAMILIES, RANK_REGRESSION_REASON, type RankRegressionFit, type RankRegressionOutcome, type RankRegressionFamily } from './rank-regression.js';
export { analyzeRecordedLife, rightCensoredOf, SAFETY_CAUTION, INTERVAL_GOF_REPLICATES, type RecordedLifeInput, type RecordedLifeOptions, type RecordedLifeReport, type RecordedLifeCandidate, type LifeEstimation } from './interval-likelihood-report.js';
export { recordedLifeExtras, MIXTURE_UNITS, type RecordedLifeExtras, type RecordedLifeExtrasOptions } from './interval-likelihood-extras.js';
export { intervalAndersonDarling } from './interval-anderson-darling.js';
export { mixtureBLife, MIXTURE_BOUND_METHOD } from './mixture-bounds.js';
export { fitsCommonSchedule, imputeInspections, inspectionScheme, inspectionSchemeKind, inspectionSchemeText, observeUnit, type InspectionScheme, type InspectionSchemeKind } from './interval-inspection-scheme.js';
export { intervalGofBootstrap, intervalGofFromCounts, intervalGofObserved, intervalStatistic, runIntervalReplicates, INTERVAL_AD_TURNBULL, intervalGofJob, intervalJobData, runIntervalGofRange, type IntervalGofHook, type IntervalGofJob, type IntervalGofOptions, type IntervalGofResult, type IntervalRangeOptions } from './interval-bootstrap.js';
export { intervalLikelihoodRatio, likelihoodRatioApplies, INTERVAL_LR_TURNBULL } from './interval-likelihood-ratio.js';
export { INTERVAL_AD_METHOD, INTERVAL_LR_METHOD, INTERVAL_GOF_DEFAULT_STATISTIC, INTERVAL_GOF_METHOD, INTERVAL_GOF_SIZE, INTERVAL_GOF_STATISTIC_LABEL, type IntervalGofStatistic } from './interval-gof-design.js';
export type { IntervalFitOptions } from './interval-likelihood-fit.js';
export { readIntervalRows, columnSelector, type IntervalColumns, type IntervalRowsRead } from './interval-rows-csv.js';
export { weibayesInterval } from './weibayes-interval.js';
