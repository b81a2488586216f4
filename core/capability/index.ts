/** Process capability: the one public entry of core/capability. */
export { capability, CAPABILITY_CAUTION } from './capability.js';
export type { CapabilityOptions, CapabilityReport, NormalityGate } from './capability.js';
export { c4, d2, d3 } from './constants.js';
export { bissellInterval, chiSquareInterval, cpm, normalIndices } from './indices.js';
export type { IndexEstimate, IndexName, SpecLimits } from './indices.js';
export { percentileCapability, PERCENTILE_TAIL } from './percentile.js';
export type { QuantileModel } from './percentile.js';
export type { PercentileCapability, PercentileIndex } from './percentile.js';
export { ppmOutOfSpec } from './ppm.js';
export type { PpmOutOfSpec } from './ppm.js';
export { checkResolution } from './resolution.js';
export type { ResolutionCheck } from './resolution.js';
export { groupByLabel, withinSigma } from './within.js';
export type { WithinMethod, WithinSigma } from './within.js';
export { boxCoxInverse, boxCoxLogLikelihood, boxCoxRange, boxCoxTransform, fitBoxCox, LAMBDA_LIMIT } from './boxcox.js';
export type { BoxCoxFit } from './boxcox.js';
export { fitJohnson, hazenQuantile, johnsonCdf, johnsonLogPdf, johnsonQuantile, johnsonSf, johnsonSupport, johnsonX, johnsonZ, JOHNSON_ZETA, SL_TOLERANCE } from './johnson.js';
export type { JohnsonFit, JohnsonParameters, JohnsonType } from './johnson.js';
export { fitBoxCoxLambda } from './boxcox.js';
export { makeModel, massOutsideRange, supportText } from './model.js';
export type { CapabilityModel, ModelSpec } from './model.js';
export { fitModelSpec, kindOf, transformedMoments } from './fit-model.js';
export type { ModelKind } from './fit-model.js';
export {
  CAPABILITY_BOOTSTRAP_REPLICATES,
  capabilityBootstrapIntervals,
  capabilityBootstrapJob,
  sameCapabilityJob,
  capabilityReplicate,
  jackknifeIndices,
  JACKKNIFE_GROUPS,
  INLINE_BOOTSTRAP_WORK,
  JOHNSON_INTERVAL_WITHHELD,
  EXPONENTIAL_INTERVAL_WITHHELD,
  intervalWithheld,
  POOL_BOOTSTRAP_WORK,
  percentileIntervals,
  bootstrapPercentileIntervals,
  expandedZ,
  studentTUpper,
  combineCapabilityBootstrap,
  runCapabilityBootstrapRange,
  splitCapabilityBootstrap,
} from './bootstrap.js';
export type { BootstrapIndexInterval, CapabilityBootstrapJob, CapabilityBootstrapValues, PercentileIndexName, PercentileIntervals } from './bootstrap.js';
export { transformedCapability } from './transformed.js';
export type { TransformedCapability, TransformKind, TransformNormality } from './transformed.js';
export { compareModels, OVERALL_SIGMA, PERCENTILE_SIGMA } from './comparison.js';
export type { ComparisonCandidate, ComparisonRow, ModelComparison, NormalRowInput } from './comparison.js';
export { D3_PAIR, d4Pair, individualsChart, rangeChartFactors, subgroupChart, subgroupRangeChart, STABILITY_SOURCE, UNSTABLE_RUNS_WARNING, UNSTABLE_WARNING } from './control-chart.js';
export { runRuleSignals, RUN_RULE_WORDS, RUN_RULES_SOURCE } from './run-rules.js';
export type { RunRule } from './run-rules.js';
export type { ChartPanel, ChartPoint, RangeChartFactors, StabilityChart } from './control-chart.js';
export { capabilityExtensions, transformTarget } from './extensions.js';
export type { BoundHandling, CapabilityExtensions, CapabilityExtensionsInput, ExtensionCandidate, TransformSection } from './extensions.js';
export { capabilityAnswer, comparisonRowOf, noIntervalNote } from './answer.js';
export type { AnswerCandidate, CapabilityAnswer, CapabilityAnswerBasis, CapabilityAnswerSource } from './answer.js';
