/**
 * The inspection-scheme bootstrap as pipeline jobs (core/workflow/pipeline.ts; the server's pool runs
 * them by range with progress): planDataset gives one 'interval' job per fitted family; running each
 * job in 3 ranges and finishing gives exactly analyzeDataset's in-process report (replicate b draws
 * from stream b, the imputed inspections from a stream of their own, so counts add over any split);
 * a job crosses to a worker thread as structured-clone data (Infinity kept).
 * Reference: the core's own in-process analyzeDataset.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, combineDatasetJobResults, finishDataset, jobSampleSize, planDataset, runDatasetJob, splitDatasetJob, type DatasetInput, type DatasetOptions } from '../../core/index.js';
import { parseStrictNumber, readColumns, type NumberColumn, type TextColumn } from '../../core/index.js';
import { sizeSample } from '../../scripts/life-interval-size.js';

function viaPipeline(input: DatasetInput, options: DatasetOptions) {
  const plan = planDataset(input, options);
  if (plan.kind !== 'interval') throw new Error(`expected an interval plan, got ${plan.kind}`);
  const counts = plan.jobs.map((job) => combineDatasetJobResults(splitDatasetJob(job, 3).map((r) => runDatasetJob(r))));
  return { plan, report: finishDataset(plan, counts) };
}

function valves(): DatasetInput {
  const t = readColumns(readFileSync(join(process.cwd(), 'datasets', 'valve-inspections.csv'), 'utf8'), [
    { select: 'start_months', kind: 'text', keepBlank: true },
    { select: 'end_months', kind: 'text', keepBlank: true },
    { select: 'valves', kind: 'number' },
  ]);
  const cell = (s: string, empty: number) => (s === '' ? empty : parseStrictNumber(s));
  return {
    interval: {
      start: (t.columns[0] as TextColumn).texts.map((s) => cell(s, 0)),
      end: (t.columns[1] as TextColumn).texts.map((s) => cell(s, Number.POSITIVE_INFINITY)),
      counts: (t.columns[2] as NumberColumn).values,
    },
  };
}

describe('inspection-scheme bootstrap as pipeline jobs', () => {
  const options: DatasetOptions = { families: ['weibull', 'exponential'], bootstrapReplicates: 19, seed: 11 };

  it('valve demo (common schedule): one job per family over all units; ranges + finish = analyzeDataset', () => {
    const input = valves();
    const { plan, report } = viaPipeline(input, options);
    expect(plan.jobs.map((j) => [j.kind, j.family, j.start, j.end])).toEqual([
      ['interval', 'weibull', 0, 19],
      ['interval', 'exponential', 0, 19],
    ]);
    const units = Array.from(input.interval!.counts!).reduce((a, c) => a + c, 0);
    for (const j of plan.jobs) expect(jobSampleSize(j)).toBe(units);
    expect(JSON.stringify(report)).toBe(JSON.stringify(analyzeDataset(input, options)));
  });

  it('case-2 rows (imputed inspections): the same, and the not-calibrated verdict survives the finish', () => {
    const d = sizeSample('case2', 1);
    const input: DatasetInput = { interval: { start: Array.from(d.lower), end: Array.from(d.upper), counts: Array.from(d.counts) } };
    const { plan, report } = viaPipeline(input, options);
    const direct = analyzeDataset(input, options);
    expect(JSON.stringify(report)).toBe(JSON.stringify(direct));
    expect((report.candidates[0]!.andersonDarling as { decision: string }).decision).toMatch(/^No decision/);
    // What a worker thread receives: a structured clone of the job gives the same counts.
    const job = plan.jobs[0]!;
    const clone = structuredClone(job);
    expect(clone.rows.end).toContain(Number.POSITIVE_INFINITY);
    expect(runDatasetJob({ ...clone, start: 0, end: 5 })).toEqual(runDatasetJob({ ...job, start: 0, end: 5 }));
  });
});
