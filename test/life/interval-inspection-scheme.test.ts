/**
 * The inspection scheme the interval bootstrap rebuilds from the rows (core/life/interval-inspection-scheme.ts):
 * which rows fit one common schedule, how a replicate lifetime is seen under each scheme (worked by
 * hand from the rule: a unit inspected at t1 < t2 < ... and failing at T is recorded as (t_{j−1}, t_j]
 * with t_j the first inspection at or after T; Meeker & Escobar 1998, §2.2 and §3.9, for the row
 * kinds), and the inverse-probability weights of the gaps (Horvitz & Thompson 1952: a row recorded
 * with probability π is weighted 1/π).
 */
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { analyzeRecordedLife, fitsCommonSchedule, imputeInspections, inspectionScheme, observeUnit, prepareIntervalLifeData } from '../../core/life/index.js';
import { sizeSample } from '../../scripts/life-interval-size.js';

const INF = Number.POSITIVE_INFINITY;
const weibull = getFamily('weibull').make({ shape: 2, scale: 100 });
const none = Number.NaN;

describe('common schedule', () => {
  // A fleet inspected every 25 h to 150 h: left (0, 25], consecutive intervals, suspensions at inspection times.
  const fleet = prepareIntervalLifeData({ start: [0, 25, 50, 100, 150, 75], end: [25, 50, 75, 125, INF, INF], counts: [2, 3, 4, 1, 5, 2] });

  it('is recognised when every row fits it, and not when a left row ends after the first inspection or an interval skips one', () => {
    expect(inspectionScheme(fleet, weibull).kind).toBe('common-schedule');
    expect(Array.from(inspectionScheme(fleet, weibull).schedule)).toEqual([25, 50, 75, 100, 125, 150]);
    const lateLeft = prepareIntervalLifeData({ start: [0, 0, 25], end: [25, 50, 50], counts: [1, 1, 1] });
    expect(inspectionScheme(lateLeft, weibull).kind).toBe('own-times');
    const skip = prepareIntervalLifeData({ start: [0, 25, 25], end: [25, 50, 75] });
    expect(inspectionScheme(skip, weibull).kind).toBe('own-times');
    // Only suspensions and exact failures: no inspection rows, nothing to call a schedule.
    expect(fitsCommonSchedule(prepareIntervalLifeData({ start: [10, 30], end: [10, INF] }), Float64Array.from([30]))).toBe(false);
  });

  it('a unit is seen at every schedule time up to its end of follow-up', () => {
    const s = inspectionScheme(fleet, weibull);
    // A failed unit (row (25, 50]) is followed to the last inspection, 150.
    expect(observeUnit(s, 'interval', 25, 50, 60, 150, none)).toEqual([50, 75]);
    expect(observeUnit(s, 'interval', 25, 50, 10, 150, none)).toEqual([0, 25]);
    expect(observeUnit(s, 'left', 0, 25, 149, 150, none)).toEqual([125, 150]);
    expect(observeUnit(s, 'interval', 25, 50, 151, 150, none)).toEqual([150, INF]);
    // An inspection at exactly T finds it failed: (50, 75] for T = 75.
    expect(observeUnit(s, 'interval', 25, 50, 75, 150, none)).toEqual([50, 75]);
    // A suspension at 75 is inspected at 25, 50, 75 only.
    expect(observeUnit(s, 'right', 75, INF, 60, 150, none)).toEqual([50, 75]);
    expect(observeUnit(s, 'right', 75, INF, 80, 150, none)).toEqual([75, INF]);
    // Exact rows are watched continuously to τ.
    expect(observeUnit(s, 'exact', 40, 40, 33, 150, none)).toEqual([33, 33]);
    expect(observeUnit(s, 'exact', 40, 40, 160, 150, none)).toEqual([150, INF]);
  });

  it('the report names the scheme it used (goodness-of-fit method line)', () => {
    const r = analyzeRecordedLife({ interval: { start: [0, 25, 50, 100, 150, 75], end: [25, 50, 75, 125, INF, INF], counts: [2, 3, 4, 1, 5, 2] } }, { families: ['weibull'], replicates: 9, mixture: false });
    expect(r.methods.find((m) => m.topic === 'goodness of fit')!.text).toMatch(/one common inspection schedule/);
    const c2 = analyzeRecordedLife({ interval: { start: [0, 20, 40, 70], end: [50, 30, 80, INF], counts: [3, 2, 2, 3] } }, { families: ['weibull'], replicates: 9, mixture: false });
    expect(c2.methods.find((m) => m.topic === 'goodness of fit')!.text).toMatch(/case-2/);
  });

  it('the periodic cell of the size study fits it and the case-2 cell does not (scripts/life-interval-size.ts)', () => {
    expect(inspectionScheme(sizeSample('periodic', 0), weibull).kind).toBe('common-schedule');
    expect(inspectionScheme(sizeSample('case2', 0), weibull).kind).toBe('own-times');
  });
});

describe('each unit at its own times (case 2)', () => {
  // Interval rows (20, 30] and (40, 80], a left row (0, 50], a suspension at 70.
  const data = prepareIntervalLifeData({ start: [20, 40, 0, 70], end: [30, 80, 50, INF] });
  const s = inspectionScheme(data, weibull);

  it('gaps are the interval widths weighted by 1/(F(R) − F(L)) under the model', () => {
    const p1 = weibull.cdf(30) - weibull.cdf(20);
    const p2 = weibull.cdf(80) - weibull.cdf(40);
    expect(s.kind).toBe('own-times');
    expect(Array.from(s.gaps)).toEqual([10, 40]);
    expect(s.gapCumulative[0]).toBeCloseTo(1 / p1 / (1 / p1 + 1 / p2), 12);
    expect(s.gapCumulative[1]).toBe(1);
  });

  it('an interval row keeps both times; a left row gets a later inspection and a suspension an earlier one', () => {
    expect(observeUnit(s, 'interval', 20, 30, 25, 200, none)).toEqual([20, 30]);
    expect(observeUnit(s, 'interval', 20, 30, 31, 200, none)).toEqual([30, INF]);
    expect(observeUnit(s, 'left', 0, 50, 45, 200, none)).toEqual([0, 50]);
    // Imputed once, in row order (left (0, 50], (20, 30], (40, 80], suspension at 70): u = 0.999 draws the
    // last gap, 40, for the left row (later inspection 90); u = 1e-9 the first, 10, for the suspension (60).
    const us = [0.999, 1e-9];
    const extra = imputeInspections(s, data, () => us.shift()!);
    expect(Array.from(extra)).toEqual([90, none, none, 60]);
    expect(observeUnit(s, 'left', 0, 50, 85, 200, 90)).toEqual([50, 90]);
    expect(observeUnit(s, 'left', 0, 50, 95, 200, 90)).toEqual([90, INF]);
    expect(observeUnit(s, 'right', 70, INF, 65, 200, 60)).toEqual([60, 70]);
    expect(observeUnit(s, 'right', 70, INF, 50, 200, 60)).toEqual([0, 60]);
    expect(observeUnit(s, 'right', 70, INF, 75, 200, 60)).toEqual([70, INF]);
    // A gap reaching back past 0: no earlier inspection (u = 1e-9 draws the first gap, 40, for a suspension at 30).
    const early = prepareIntervalLifeData({ start: [40, 50, 30], end: [80, 60, INF] });
    const se = inspectionScheme(early, weibull);
    expect(se.kind).toBe('own-times');
    expect(Array.from(imputeInspections(se, early, () => 1e-9))).toEqual([none, none, none]);
    expect(observeUnit(se, 'right', 30, INF, 20, 200, none)).toEqual([0, 30]);
  });

  it('with no interval rows (current status) every row keeps its one inspection', () => {
    const cs = inspectionScheme(prepareIntervalLifeData({ start: [0, 60, 0], end: [40, INF, 90] }), weibull);
    expect(cs.kind).toBe('own-times');
    expect(cs.gaps.length).toBe(0);
    expect(Array.from(imputeInspections(cs, prepareIntervalLifeData({ start: [0, 60, 0], end: [40, INF, 90] }), () => 0.5))).toEqual([none, none, none]);
    expect(observeUnit(cs, 'left', 0, 90, 95, 200, none)).toEqual([90, INF]);
    expect(observeUnit(cs, 'right', 60, INF, 10, 200, none)).toEqual([0, 60]);
  });
});
