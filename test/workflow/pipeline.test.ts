/**
 * planDataset → run the bootstrap jobs by ranges → finishDataset gives exactly analyzeDataset's
 * report (the server runs every request this way; the CLI calls analyzeDataset). Reference: the
 * core's own in-process analyzeDataset; replicate i draws from stream i (core/gof/bootstrap.ts),
 * so counts added over any split equal the one-piece counts.
 */
import { describe, expect, it } from 'vitest';
import {
  analyzeDataset,
  combineDatasetJobResults,
  createRng,
  finishDataset,
  getFamily,
  planDataset,
  runDatasetJob,
  splitDatasetJob,
  type DatasetInput,
  type DatasetOptions,
} from '../../core/index.js';

const weibull = (n: number, seed: number): number[] => Array.from(getFamily('weibull').random({ shape: 1.6, scale: 80 }, createRng(seed), n));

function viaPipeline(input: DatasetInput, options: DatasetOptions): unknown {
  const plan = planDataset(input, options);
  if (plan.kind === 'done') return plan.report;
  const counts = plan.jobs.map((job) => combineDatasetJobResults(splitDatasetJob(job, 3).map((r) => runDatasetJob(r))));
  return finishDataset(plan, counts);
}

describe('planDataset / finishDataset', () => {
  const cases: [string, DatasetInput, DatasetOptions][] = [
    ['plain complete sample, bootstrap p-values', { values: weibull(60, 1) }, { families: ['weibull', 'gamma'], pMethod: 'bootstrap', bootstrapReplicates: 59 }],
    ['flood options (GEV needs the bootstrap)', { values: weibull(40, 2), order: Array.from({ length: 40 }, (_, i) => 1980 + i) }, { returnPeriods: [10, 100], bootstrapReplicates: 19 }],
    ['capability with subgroups', { values: weibull(30, 3).map((x) => 25 + x / 1e4), subgroups: Array.from({ length: 30 }, (_, i) => Math.floor(i / 5)) }, { lsl: 24.99, usl: 25.03 }],
    ['censored life data (censored bootstrap by ranges)', { values: weibull(30, 4), status: Array.from({ length: 30 }, (_, i) => (i % 3 === 0 ? 0 : 1)) }, { bootstrapReplicates: 19 }],
    ['grouped counts', { grouped: [{ lower: Number.NEGATIVE_INFINITY, upper: 1, count: 12 }, { lower: 1, upper: 2, count: 30 }, { lower: 2, upper: 3, count: 25 }, { lower: 3, upper: Number.POSITIVE_INFINITY, count: 9 }] }, {}],
  ];
  for (const [name, input, options] of cases) {
    it(`${name}: same report as analyzeDataset`, () => {
      expect(JSON.parse(JSON.stringify(viaPipeline(input, options)))).toEqual(JSON.parse(JSON.stringify(analyzeDataset(input, options))));
    });
  }

  it('a complete sample that needs the bootstrap leaves it to the caller (jobs, not a report)', () => {
    const plan = planDataset({ values: weibull(50, 5) }, { families: ['weibull'], pMethod: 'bootstrap', bootstrapReplicates: 99 });
    expect(plan.kind).toBe('complete');
    if (plan.kind !== 'complete') return;
    expect(plan.jobs.map((j) => [j.family, j.start, j.end, j.n])).toEqual([['weibull', 0, 99, 50]]);
  });

  it('censored life data: one censored job per fitted family, over the units as given', () => {
    const times = weibull(20, 6);
    const status = times.map((_, i) => (i % 4 === 0 ? 0 : 1));
    const plan = planDataset({ values: times, status }, { families: ['weibull', 'lognormal'], bootstrapReplicates: 29 });
    expect(plan.kind).toBe('life');
    if (plan.kind !== 'life') return;
    expect(plan.jobs.map((j) => [j.kind, j.family, j.start, j.end, j.times.length])).toEqual([
      ['censored', 'weibull', 0, 29, 20],
      ['censored', 'lognormal', 0, 29, 20],
    ]);
    expect(plan.jobs[0]?.failed).toEqual(status);
  });
});
