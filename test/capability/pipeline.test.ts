/**
 * The capability bootstrap as jobs of the one pipeline (core/workflow/capability-jobs.ts):
 * planDataset → every job run in ranges and combined → finishDataset gives exactly the report of
 * analyzeDataset, which runs the same interval inline (reference: the core's own in-process path;
 * replicate i draws from stream i, so any split gives the same replicate values in order).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  analyzeDataset,
  combineDatasetJobResults,
  createRng,
  finishDataset,
  getFamily,
  planDataset,
  readColumn,
  runDatasetJob,
  splitDatasetJob,
  type DatasetInput,
  type DatasetJobResult,
  type DatasetOptions,
  type DatasetReport,
} from '../../core/index.js';
import { JOHNSON_INTERVAL_WITHHELD } from '../../core/capability/index.js';

const lognormal = (n: number, seed: number): number[] => Array.from(getFamily('lognormal').random({ meanlog: 1, sdlog: 0.5 }, createRng(seed), n));

function pipelineParts(input: DatasetInput, options: DatasetOptions) {
  const plan = planDataset(input, options);
  if (plan.kind !== 'complete') throw new Error('expected a complete-sample plan');
  const results: DatasetJobResult[] = plan.jobs.map((job) => combineDatasetJobResults(splitDatasetJob(job, 3).map((r) => runDatasetJob(r))));
  return { plan, results };
}

const json = (x: unknown): unknown => JSON.parse(JSON.stringify(x));

describe('capability bootstrap on the pipeline', () => {
  const cases: [string, DatasetInput, DatasetOptions, number][] = [
    ['Box–Cox transform', { values: lognormal(40, 1) }, { usl: 12, lsl: 0.8, transform: 'boxcox', capabilityReplicates: 99 }, 1],
    ['no transform: percentile method on the best non-normal family', { values: lognormal(60, 3) }, { usl: 12, lsl: 0.5, capabilityReplicates: 59 }, 1],
  ];
  for (const [name, input, options, atLeast] of cases) {
    it(`${name}: the capability jobs are planned, and the report equals analyzeDataset's`, () => {
      const { plan, results } = pipelineParts(input, options);
      expect(plan.capabilityJobs.length).toBeGreaterThanOrEqual(atLeast);
      expect(plan.jobs.slice(-plan.capabilityJobs.length)).toEqual(plan.capabilityJobs);
      const viaPool = finishDataset(plan, results);
      const inline = analyzeDataset(input, options) as DatasetReport;
      expect(json(viaPool)).toEqual(json(inline));
      const cap = inline.capability!;
      const iv = cap.transform.kind === 'none' ? cap.percentileIntervals : cap.transform.intervals;
      expect(iv?.intervals?.length ?? 0).toBeGreaterThan(0);
    });
  }

  for (const [name, input, options] of cases) {
    it(`${name}: the finish uses the values run on the pool (altered values change the interval), not an inline rerun`, () => {
      const { plan, results } = pipelineParts(input, options);
      const k = plan.jobs.length - plan.capabilityJobs.length;
      const altered = results.map((r, i) => {
        if (i < k || !('values' in r)) return r;
        const values = Object.fromEntries(Object.entries(r.values).map(([ix, v]) => [ix, (v as number[]).map((x) => x * 2)]));
        return { ...r, values };
      });
      const ends = (r: ReturnType<typeof finishDataset>): number[] => {
        const cap = r.capability!;
        const iv = cap.transform.kind === 'none' ? cap.percentileIntervals : cap.transform.intervals;
        return (iv?.intervals ?? []).map((x) => x.upper);
      };
      const a = ends(finishDataset(plan, results));
      const b = ends(finishDataset(plan, altered));
      expect(a.length).toBeGreaterThan(0);
      expect(b).not.toEqual(a);
    });
  }

  it('results that do not match the plan are refused', () => {
    const { plan, results } = pipelineParts({ values: lognormal(40, 1) }, { usl: 12, transform: 'boxcox', capabilityReplicates: 39 });
    expect(() => finishDataset(plan, [...results].reverse())).toThrow(/do not match/);
  });

  it('with the normal model passing its table test there is no percentile method and no capability job', () => {
    const values = Array.from(getFamily('normal').random({ mean: 10, sd: 1 }, createRng(5), 80));
    const plan = planDataset({ values }, { lsl: 6, usl: 14 });
    if (plan.kind !== 'complete') throw new Error('expected a complete-sample plan');
    const report = analyzeDataset({ values }, { lsl: 6, usl: 14 }) as DatasetReport;
    expect(report.capability!.percentile).toBeNull();
    expect(plan.capabilityJobs).toEqual([]);
  });

  it('a Johnson curve gets no interval and no capability job; the report says why (its coverage could not be calibrated: scripts/capability-coverage-calibration.ts)', () => {
    const input = { values: lognormal(45, 2) };
    const options: DatasetOptions = { usl: 14, transform: 'johnson', capabilityReplicates: 59 };
    const { plan, results } = pipelineParts(input, options);
    expect(plan.capabilityJobs).toEqual([]);
    const viaPool = finishDataset(plan, results);
    expect(json(viaPool)).toEqual(json(analyzeDataset(input, options)));
    const t = viaPool.capability!.transform;
    if (t.kind === 'none') throw new Error('expected a Johnson section');
    expect(t.percentile.indices.length).toBeGreaterThan(0);
    expect(t.intervals.intervals).toBeNull();
    expect(t.intervals.note).toBe(JOHNSON_INTERVAL_WITHHELD);
    // the Box–Cox transformation of the same data keeps its interval
    const b = analyzeDataset(input, { ...options, transform: 'boxcox' }) as DatasetReport;
    const bt = b.capability!.transform;
    if (bt.kind === 'none') throw new Error('expected a Box–Cox section');
    expect(bt.intervals.intervals?.length ?? 0).toBeGreaterThan(0);
  });

  it('every model rejected on its table tests (shaft-diameter demo): one job, for the first-ranked non-normal model, which the finish uses', () => {
    const values = readColumn(readFileSync('datasets/shaft-diameter.csv', 'utf8'), { column: 'diameter_mm' }).values;
    const options: DatasetOptions = { lsl: 24.99, usl: 25.01, capabilityReplicates: 59 };
    const { plan, results } = pipelineParts({ values }, options);
    expect(plan.plan.plan.bootstrapJobs).toEqual([]);
    expect(plan.capabilityJobs).toHaveLength(1);
    const viaPool = finishDataset(plan, results);
    expect(viaPool.capability!.percentileFamily).toBe((plan.capabilityJobs[0]!.model as { family: string }).family);
    expect(json(viaPool)).toEqual(json(analyzeDataset({ values }, options)));
  });
});
