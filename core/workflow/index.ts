/** core/workflow: one call that composes the trade workflows into one report (issue 4). */
export type * from './types.js';
export { analyzeDataset, analyzeDatasetAsync } from './analyze-dataset.js';
export { DEFAULT_CONFIDENCE } from './options.js';
export { DEFAULT_LIFE_REPLICATES } from './life.js';
export { GROUPED_DOF_RULE } from './grouped.js';
export { planDataset, finishDataset, censoredBootstrapWork, runDatasetJob, jobSampleSize, splitDatasetJob, type DatasetPlan, type DatasetJob } from './pipeline.js';
