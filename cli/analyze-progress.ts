/**
 * The CLI's analysis with progress: the core's planDataset, the bootstrap jobs run here replicate
 * by replicate with progress reported (cli/progress.ts), then finishDataset. The report is the one
 * analyzeDataset gives (test/workflow/pipeline.test.ts).
 */
import { finishDataset, planDataset, runDatasetJob, type AnyDatasetReport, type DatasetInput, type DatasetOptions } from '../core/index.js';
import type { Progress } from './progress.js';

export function analyzeWithProgress(dataset: DatasetInput, options: DatasetOptions, progress: Progress): AnyDatasetReport {
  try {
    const plan = planDataset(dataset, options);
    if (plan.kind === 'done') return plan.report;
    const total = plan.jobs.reduce((s, j) => s + (j.end - j.start), 0);
    let before = 0;
    const counts = plan.jobs.map((job) => {
      const c = runDatasetJob(job, { onProgress: (done) => progress.replicates(before + done, total, job.family) });
      before += job.end - job.start;
      return c;
    });
    return finishDataset(plan, counts);
  } finally {
    progress.end();
  }
}
