/** core/workflow: one call that composes the trade workflows into one report (issue 4). */
export type * from './types.js';
export { analyzeDataset, analyzeDatasetAsync } from './analyze-dataset.js';
export { DEFAULT_CONFIDENCE } from './options.js';
export { DEFAULT_LIFE_REPLICATES } from './life.js';
export { GROUPED_DOF_RULE } from './grouped.js';
export { readFailureModes, readIntervalModes, type FailureModesRead, type ModeCellPlace } from './life-modes.js';
export { planDataset, finishDataset, censoredBootstrapWork, runDatasetJob, combineDatasetJobResults, jobSampleSize, splitDatasetJob, type DatasetPlan, type DatasetJob, type DatasetJobResult, type DatasetJobResultOf } from './pipeline.js';
export { POOL_CAPABILITY_WORK, planCapabilityJobs, type CapabilityJob } from './capability-jobs.js';
export { POT_CAUTIONS, POT_DEFAULT_PERIODS, POT_DEFAULT_SEPARATION, POT_DIAGNOSTICS_RULE, diagnosticThresholds, potSection, type PotCandidate, type PotSection, type PotSectionOptions } from './flood-pot.js';
export { FLOOD_RECORD_PERIODS, PEAK_COLUMN, fitFloodRecord, looksLikePeakFile, peakFileMakeUp, readFloodRecord, regionalSkewOf, type FloodRecordFit, type FloodRecordRead, type FloodRecordReadOptions, type FloodRecordRun, type PeakFileMakeUp } from './flood-record.js';
export { floodRecordReport, type FloodRecordSection } from './flood-record-report.js';
