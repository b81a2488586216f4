/**
 * Interval rows through the JSON API (server/validate.ts parseAnalyzeBody → server/analysis.ts
 * planRequest → the inspection-scheme jobs → finishRequest → core/workflow/life-interval.ts): the same fits as the CLI, checked
 * against SciPy CensoredData refined by mpmath (scripts/fixtures/life-interval.py); the option
 * table's rules (interval columns with csv only, two of them, not with a status column; the count
 * column only with them); the bounded bootstrap work (server/limits.ts); the report's frame.
 */
import { describe, expect, it } from 'vitest';
import { analyzeDataset, analyzeRecordedLife, runDatasetJob, type DatasetReport, type InputSummary } from '../../core/index.js';
import { finishRequest, planRequest } from '../../server/analysis.js';
import { parseAnalyzeBody } from '../../server/validate.js';
import { readFixture, rel } from '../helpers/fixtures.js';

const fx = readFixture('life-interval.json');
const s = fx.inspection;
// Empty cells: "before the first inspection" (start) and "still running" (end).
const CSV = ['start,end,units', ...s.start.map((a: number, i: number) => `${a === 0 ? '' : a},${s.end[i] === null ? '' : s.end[i]},${s.count[i]}`)].join('\n') + '\n';

/** As the server does it: plan, run each inspection-scheme job (one per family; here in one range each), finish. */
function analyze(body: Record<string, unknown>) {
  const planned = planRequest(parseAnalyzeBody(body));
  if (planned.plan.kind === 'done') throw new Error('interval rows with a bootstrap plan jobs');
  if (planned.plan.kind !== 'interval') throw new Error(`expected an interval plan, got ${planned.plan.kind}`);
  return finishRequest(planned, planned.plan.jobs.map((j) => runDatasetJob(j))) as DatasetReport & { readonly input: InputSummary };
}

describe('interval rows through the API', () => {
  const r = analyze({ csv: CSV, intervalColumns: ['start', 'end'], countColumn: 'units', bLifePercents: [10], reliabilityTimes: [1000], replicates: 19, seed: 3 });

  it('fits every life family to the SciPy CensoredData / mpmath reference (parameters and ln L to 1e-6)', () => {
    expect(r.dataKind).toBe('censored');
    expect(r.n).toBe(80);
    for (const c of r.candidates) {
      const ref = fx.inspection.fits[c.family];
      for (const [k, v] of Object.entries(ref.parameters as Record<string, number>)) expect(rel(c.parameters[k]!, v)).toBeLessThan(1e-6);
      expect(rel(c.logLikelihood, ref.logLikelihood)).toBeLessThan(1e-9);
    }
  });

  it('is the CLI’s analysis: same candidates and B-lives as analyzeRecordedLife, and analyzeDataset({ interval }) gives the same report', () => {
    const rec = analyzeRecordedLife({ interval: { start: s.start, end: s.end.map((e: number | null) => e ?? Number.POSITIVE_INFINITY), counts: s.count } }, { bLifePercents: [10], reliabilityTimes: [1000], replicates: 19, seed: 3, mixture: false });
    expect(r.candidates.map((c) => c.family)).toEqual(rec.candidates.map((c) => c.family));
    expect(r.candidates.map((c) => c.bLives![0]!.lower)).toEqual(rec.candidates.map((c) => c.bLives[0]!.lower));
    const direct = analyzeDataset({ interval: { start: s.start, end: s.end.map((e: number | null) => e ?? Number.POSITIVE_INFINITY), counts: s.count } }, { bLifePercents: [10], reliabilityTimes: [1000], bootstrapReplicates: 19, seed: 3 });
    const { input: _i, ...api } = r;
    expect(JSON.parse(JSON.stringify(api))).toEqual(JSON.parse(JSON.stringify(direct)));
  });

  it('each candidate carries the inspection-scheme A² bootstrap, chi-square not computable, LR bounds; the life section has no failure points and the recorded extras', () => {
    for (const c of r.candidates) {
      expect(c.andersonDarling).toMatchObject({ method: 'bootstrap', replicates: 19, alpha: 0.05 });
      expect('computable' in c.chiSquare && c.chiSquare.computable).toBe(false);
      expect(c.bLives![0]!.boundsFound).toBe(true);
    }
    expect(r.life!.plot.points).toEqual([]);
    expect(r.life!.plot.description).toMatch(/known only to its inspection interval/);
    expect(r.life!.recorded!.report!.turnbull.intervals.length).toBeGreaterThan(3);
    expect(r.input).toMatchObject({ source: 'csv', n: 80, column: 'start', otherColumns: [{ role: 'interval end', column: 'end' }, { role: 'count', column: 'units' }] });
    expect(r.life!.cautions.some((c) => /licensed practice/.test(c))).toBe(true);
  });

  it('refuses what the option table refuses, naming the field', () => {
    const msg = (body: Record<string, unknown>): string => {
      try {
        parseAnalyzeBody(body);
        return 'accepted';
      } catch (e) {
        return (e as Error).message;
      }
    };
    expect(msg({ values: [1, 2, 3], intervalColumns: ['a', 'b'] })).toMatch(/"intervalColumns" goes with "csv"/);
    expect(msg({ csv: CSV, intervalColumns: ['start'] })).toMatch(/takes two columns/);
    expect(msg({ csv: CSV, intervalColumns: ['start', 'end'], statusColumn: 'units' })).toMatch(/cannot be combined with "statusColumn"/);
    expect(msg({ csv: CSV, countColumn: 'units' })).toMatch(/"countColumn" needs/);
    expect(msg({ csv: CSV, intervalColumns: ['start', 'end'], column: 'units' })).toMatch(/"column" goes with a value column/);
  });

  it('a cell that is not a number is refused with its row and column; too much bootstrap work is a 422', () => {
    expect(() => planRequest(parseAnalyzeBody({ csv: 'start,end\n1,2\nx,5\n', intervalColumns: ['start', 'end'] }))).toThrow(/row 3, column "start": "x" is not a number/);
    let status = 0;
    try {
      planRequest(parseAnalyzeBody({ csv: CSV, intervalColumns: ['start', 'end'], countColumn: 'units', replicates: 100000 }));
    } catch (e) {
      status = (e as { status?: number }).status ?? -1;
    }
    expect(status).toBe(422);
  });
});
