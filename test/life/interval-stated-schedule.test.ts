/**
 * Inspection schedules stated by the user (the inspection-times column; core IntervalLifeInput.inspections,
 * scheme 'stated' of core/life/interval-inspection-scheme.ts): the rows are checked against their
 * schedules, rows merge only with the same schedule, and the bootstrap inspects every unit at exactly
 * its own listed times. The rule checked by hand: a unit inspected at t1 < t2 < ... and failing at T
 * is recorded as (t_{j−1}, t_j] with t_j the first inspection at or after T, (0, t1] before the
 * first, (t_last, ∞) past the last (Meeker & Escobar 1998, §2.2 and §3.9, for the row kinds).
 * Size of the test that then decides: test/fixtures/life-interval-stated-size.json
 * (scripts/life-interval-stated-size.ts), checked below.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { createRng } from '../../core/random/index.js';
import {
  INTERVAL_GOF_SIZE,
  analyzeRecordedLife,
  fitInterval,
  inspectionScheme,
  intervalGofBootstrap,
  intervalGofJob,
  intervalJobData,
  observeUnit,
  prepareIntervalLifeData,
  readIntervalRows,
  runIntervalGofRange,
} from '../../core/life/index.js';
import { statedPValue, statedSample, type StatedCell } from '../../scripts/life-interval-stated-size.js';

const INF = Number.POSITIVE_INFINITY;
const weibull = getFamily('weibull').make({ shape: 2, scale: 100 });

/** Three units on schedules of their own: left (0, 20], interval (45, 70], a suspension at 90; then an exact time. */
const ROWS = {
  start: [0, 45, 90, 33],
  end: [20, 70, INF, 33],
  inspections: [[20, 55, 90, 125], [15, 45, 70, 100], [30, 60, 90], []],
};

describe('stated inspection schedules: the rows checked against them', () => {
  it('accepts rows seen through their own schedules, and keeps each distinct schedule', () => {
    const d = prepareIntervalLifeData(ROWS);
    expect(d.schedules).not.toBeNull();
    expect(d.schedules!.map((s) => Array.from(s))).toEqual([[20, 55, 90, 125], [], [15, 45, 70, 100], [30, 60, 90]]);
    expect(Array.from(d.lower)).toEqual([0, 33, 45, 90]);
    expect(inspectionScheme(d, weibull).kind).toBe('stated');
  });

  it('merges two rows only when their schedules are the same', () => {
    const same = prepareIntervalLifeData({ start: [10, 10], end: [20, 20], inspections: [[10, 20, 30], [10, 20, 30]] });
    expect(Array.from(same.counts)).toEqual([2]);
    const other = prepareIntervalLifeData({ start: [10, 10], end: [20, 20], inspections: [[10, 20, 30], [10, 20, 40]] });
    expect(Array.from(other.counts)).toEqual([1, 1]);
  });

  it('refuses a row its schedule cannot have produced, naming the row', () => {
    const bad = (start: number, end: number, s: number[]) => () => prepareIntervalLifeData({ start: [start], end: [end], inspections: [s], lines: [7] });
    expect(bad(0, 20, [10, 20])).toThrow(/^Row 7: failed before the first inspection at 20, but its first inspection time is 10/);
    expect(bad(10, 30, [10, 20, 30])).toThrow(/^Row 7: running at 10 and found failed at 30, which must be consecutive/);
    expect(bad(20, INF, [10, 20, 30])).toThrow(/^Row 7: still running at 20, which must be the unit's last inspection time/);
    expect(bad(10, 20, [20, 10])).toThrow(/^Row 7: the inspection times must be finite times > 0 in increasing order/);
    expect(bad(10, 20, [])).toThrow(/^Row 7: no inspection times/);
    expect(bad(15, 15, [15])).toThrow(/^Row 7: an exact failure time is watched continuously/);
  });

  it('reads the column from CSV text: times separated by ;, blank for an exact time; a bad time names row and column', () => {
    const csv = 'start,end,seen\n,20,20; 55;90\n45,70,15;45;70;100\n33,33,\n';
    const r = readIntervalRows(csv, { start: 'start', end: 'end', inspections: 'seen' });
    expect(r.interval.inspections).toEqual([[20, 55, 90], [15, 45, 70, 100], []]);
    expect(r.columns.map((c) => c.role)).toEqual(['interval start', 'interval end', 'inspection times']);
    expect(() => readIntervalRows('start,end,seen\n,20,20;x\n', { start: 'start', end: 'end', inspections: 'seen' })).toThrow(/row 2, column "seen": "x" in "20;x" is not a number/);
  });
});

describe('the bootstrap inspects each unit at exactly its own stated times', () => {
  it('a replicate lifetime is seen at the first listed time at or after it (by hand)', () => {
    const d = prepareIntervalLifeData(ROWS);
    const s = inspectionScheme(d, weibull);
    const own = Float64Array.from([15, 45, 70, 100]);
    // The row (45, 70] of a unit inspected at 15, 45, 70, 100:
    expect(observeUnit(s, 'interval', 45, 70, 10, 125, Number.NaN, own)).toEqual([0, 15]);
    expect(observeUnit(s, 'interval', 45, 70, 45, 125, Number.NaN, own)).toEqual([15, 45]);
    expect(observeUnit(s, 'interval', 45, 70, 80, 125, Number.NaN, own)).toEqual([70, 100]);
    expect(observeUnit(s, 'interval', 45, 70, 101, 125, Number.NaN, own)).toEqual([100, INF]);
    // A suspension at 90 of a unit inspected at 30, 60, 90: never past 90.
    expect(observeUnit(s, 'right', 90, INF, 200, 125, Number.NaN, Float64Array.from([30, 60, 90]))).toEqual([90, INF]);
  });

  it('every replicate row of a size-study sample is two consecutive times of its own unit’s schedule', () => {
    // The bootstrap's own observation rule over a whole sample, against a brute-force scan of each unit's list.
    const d = statedSample('ownk-2', 3);
    const s = inspectionScheme(d, weibull);
    const rng = createRng(11, 0);
    let checked = 0;
    for (let r = 0; r < d.lower.length; r++) {
      const own = d.schedules![r]!;
      for (let k = 0; k < 20; k++) {
        const T = weibull.quantile(rng.uniform());
        const [a, z] = observeUnit(s, d.kinds[r]!, d.lower[r]!, d.upper[r]!, T, d.maxTime, Number.NaN, own);
        const list = Array.from(own);
        const j = list.findIndex((t) => T <= t);
        expect([a, z]).toEqual(j < 0 ? [list[list.length - 1], INF] : [j === 0 ? 0 : list[j - 1], list[j]]);
        checked++;
      }
    }
    expect(checked).toBe(20 * d.lower.length);
  });

  it('the schedules change the p-value (they are used) and cross to a worker job intact (split run = one piece)', () => {
    const d = statedSample('ownk-2', 1);
    const fit = fitInterval('weibull', d);
    if (!fit.ok) throw new Error('fit');
    const stated = intervalGofBootstrap('weibull', fit.parameters, d, { replicates: 39, seed: 5 });
    const rowsOnly = prepareIntervalLifeData({ start: Array.from(d.lower), end: Array.from(d.upper), counts: Array.from(d.counts) });
    const rebuilt = intervalGofBootstrap('weibull', fit.parameters, rowsOnly, { replicates: 39, seed: 5 });
    expect(stated.scheme).toBe('stated');
    expect(rebuilt.scheme).toBe('own-times');
    expect(stated.pValue).not.toBe(rebuilt.pValue);
    const job = intervalGofJob('weibull', fit.parameters, d, 39, 5);
    expect(intervalJobData(job).schedules!.map((x) => Array.from(x))).toEqual(d.schedules!.map((x) => Array.from(x)));
    const a = runIntervalGofRange({ ...job, start: 0, end: 20 });
    const b = runIntervalGofRange({ ...job, start: 20, end: 39 });
    // p = (1 + #exceeding + #unrefittable) / (B + 1) over the two ranges
    expect(a.exceed + b.exceed + (a.completed - a.valid) + (b.completed - b.valid)).toBe(Math.round(stated.pValue * 40) - 1);
  });

  it('the report names the scheme in its method line', () => {
    const r = analyzeRecordedLife({ interval: ROWS }, { families: ['weibull'], replicates: 19, mixture: false });
    expect(r.methods.find((m) => m.topic === 'goodness of fit')!.text).toMatch(/exactly the inspection times stated for it/);
    expect(r.candidates[0]!.goodnessOfFit!.scheme).toBe('stated');
  });
});

describe('size with stated schedules (scripts/life-interval-stated-size.ts, committed seeded run)', () => {
  const fx = JSON.parse(readFileSync(join(process.cwd(), 'test', 'fixtures', 'life-interval-stated-size.json'), 'utf8')) as {
    alpha: number;
    replicates: number;
    cells: { scheme: StatedCell; samples: number; skipped: number; rejected: number; size: number; standardError: number; pValues: (number | null)[] }[];
  };

  it('each cell’s rate is its stored p-values’; the report quotes every cell and lets stated schedules decide only if each is within 5 ± 1.5 points', () => {
    expect(fx.replicates).toBeGreaterThanOrEqual(39);
    const words = INTERVAL_GOF_SIZE.stated;
    for (const c of fx.cells) {
      const ok = c.pValues.filter((p): p is number => p !== null);
      expect(ok.length).toBe(c.samples);
      expect(ok.filter((p) => p <= fx.alpha).length).toBe(c.rejected);
      expect(c.standardError).toBeCloseTo(Math.sqrt((0.05 * 0.95) / c.samples), 12);
      expect(words.text).toContain(`${c.rejected} of ${c.samples}`);
      expect(words.text).toContain(`${(100 * c.size).toFixed(1)} %, SE ${(100 * c.standardError).toFixed(2)}`);
    }
    // the design: Weibull n = 50, each unit on its own schedule, at least 1000 samples
    expect(fx.cells.find((c) => c.scheme === 'ownk-2')!.samples).toBeGreaterThanOrEqual(1000);
    expect(words.calibrated).toBe(fx.cells.every((c) => Math.abs(c.size - 0.05) <= 0.015));
  });

  it('the committed run is reproduced: the first sample of each cell gives the same p-value', { timeout: 120_000 }, () => {
    for (const c of fx.cells) expect(statedPValue(c.scheme, 0, fx.replicates)).toBe(c.pValues[0]);
  });
});
