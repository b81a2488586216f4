/**
 * Anderson–Darling for interval-censored life data (core/life/interval-anderson-darling.ts) and its
 * inspection-scheme bootstrap (interval-bootstrap.ts): the statistic against the published complete
 * sample values and against the Kaplan–Meier form; its closed form against brute-force quadrature of
 * the defining integral; the bootstrap's range additivity, its p-value rule and its verdicts on the
 * valve demo; the report's fields. Its size: interval-gof-size.test.ts.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { parseStrictNumber, readColumns, type NumberColumn, type TextColumn } from '../../core/index.js';
import {
  analyzeRecordedLife,
  censoredAndersonDarling,
  fitCensored,
  fitInterval,
  intervalAndersonDarling,
  intervalGofBootstrap,
  intervalGofFromCounts,
  intervalInputFromTimes,
  intervalStatistic,
  prepareIntervalLifeData,
  prepareLifeData,
  runIntervalReplicates,
  turnbull,
  INTERVAL_AD_TURNBULL,
  type IntervalLifeData,
  type TurnbullEstimate,
} from '../../core/life/index.js';
import type { Distribution } from '../../core/families/index.js';
import { analyzeDataset } from '../../core/workflow/index.js';
import { sizeSample } from '../../scripts/life-interval-size.js';

// references.md, D1 set (SciPy): A² at the MLE, complete sample.
const D1 = [12.4, 15.1, 9.8, 22.7, 18.3, 11.6, 14.9, 27.5, 10.2, 13.7, 19.8, 8.9, 16.4, 24.1, 12.9, 17.6, 14.2, 31.3, 11.1, 15.8];
// NIST/SEMATECH e-Handbook §8.4.1.3: 20 units, 10 failures, 10 still running at 500 h.
const NIST_T = [54, 187, 216, 240, 244, 335, 361, 373, 375, 386, ...Array(10).fill(500)];
const NIST_F = [...Array(10).fill(1), ...Array(10).fill(0)];

/** The invented valve inspections (datasets/README.md): left, interval, exact and right rows with counts. */
function valves(): IntervalLifeData {
  const t = readColumns(readFileSync(join(process.cwd(), 'datasets', 'valve-inspections.csv'), 'utf8'), [
    { select: 'start_months', kind: 'text', keepBlank: true },
    { select: 'end_months', kind: 'text', keepBlank: true },
    { select: 'valves', kind: 'number' },
  ]);
  const cell = (s: string, empty: number) => (s === '' ? empty : parseStrictNumber(s));
  return prepareIntervalLifeData({
    start: (t.columns[0] as TextColumn).texts.map((s) => cell(s, 0)),
    end: (t.columns[1] as TextColumn).texts.map((s) => cell(s, Number.POSITIVE_INFINITY)),
    counts: (t.columns[2] as NumberColumn).values,
  });
}

/**
 * The defining integral n ∫ (K(u) − u)²/(u(1 − u)) du by the midpoint rule in s = logit u (du =
 * u(1 − u) ds, so the integrand is the bounded (K − u)²), with K read off the Turnbull estimate at
 * t = F⁻¹(u): the flat value between boxes, clamp(u, before, after) inside a box, and the
 * integration stopping where a box opens to the right.
 */
function bruteForce(dist: Distribution, np: TurnbullEstimate, n: number, steps: number): number {
  const open = np.intervals.find((iv) => !Number.isFinite(iv.upper));
  const uStop = open ? dist.cdf(open.lower) : 1 - 1e-15;
  const s0 = -40;
  const s1 = Math.log(uStop / (1 - uStop));
  const h = (s1 - s0) / steps;
  let total = 0;
  for (let k = 0; k < steps; k++) {
    const u = 1 / (1 + Math.exp(-(s0 + (k + 0.5) * h)));
    const t = u < 0.5 ? dist.quantile(u) : dist.isf(1 - u);
    let K = 0;
    for (const iv of np.intervals) {
      if (t > iv.upper) K = iv.cdfAfter;
      else if (t >= iv.lower && iv.upper > iv.lower) K = Math.min(Math.max(u, iv.cdfBefore), iv.cdfAfter);
    }
    total += (K - u) * (K - u);
  }
  return n * total * h;
}

describe('interval-data Anderson–Darling statistic', () => {
  it('with a complete sample it is the published A² (references.md D1: Weibull 0.53535, exponential 4.12317)', () => {
    const d = prepareIntervalLifeData(intervalInputFromTimes({ times: D1, failed: D1.map(() => 1) }));
    expect(intervalAndersonDarling(getFamily('weibull').make({ shape: 2.920022, scale: 18.419691 }), turnbull(d), d.n)).toBeCloseTo(0.53535, 4);
    expect(intervalAndersonDarling(getFamily('exponential').make({ rate: 1 / 16.415 }), turnbull(d), d.n)).toBeCloseTo(4.12317, 4);
  });

  it('with exact failures and suspensions it is the Kaplan–Meier A² (NIST §8.4.1.3, every life family)', () => {
    const ld = prepareLifeData({ times: NIST_T, failed: NIST_F });
    const d = prepareIntervalLifeData(intervalInputFromTimes({ times: NIST_T, failed: NIST_F }));
    for (const f of ['weibull', 'lognormal', 'gamma', 'normal', 'exponential'] as const) {
      const fit = fitCensored(f, ld);
      if (!fit.ok) throw new Error(fit.reason);
      const dist = getFamily(f).make(fit.parameters);
      // Two independent codings of one integral: agreement to rounding.
      expect(intervalAndersonDarling(dist, turnbull(d, { tolerance: 1e-13 }), d.n)).toBeCloseTo(censoredAndersonDarling(dist, ld), 7);
    }
  });

  it('on interval rows the closed form equals brute-force quadrature of the defining integral (valve demo)', () => {
    const d = valves();
    const np = turnbull(d, INTERVAL_AD_TURNBULL);
    for (const f of ['weibull', 'lognormal', 'exponential'] as const) {
      const fit = fitInterval(f, d);
      if (!fit.ok) throw new Error(fit.reason);
      const dist = getFamily(f).make(fit.parameters);
      const a = intervalAndersonDarling(dist, np, d.n);
      // Midpoint rule, 1.6 million steps of ~3e-5 in logit u: error O(h) at each of the ~20 jumps of K
      // (measured: 2e-6 to 3e-5 relative, settling as the steps grow), so 1e-4 relative.
      expect(Math.abs(a - bruteForce(dist, np, d.n, 1600000)) / a).toBeLessThan(1e-4);
    }
  });

  it('one box and a suspension: the clamp inside the box and the stop at the open box agree with quadrature', () => {
    // One interval row (10, 20] with 4 units and 4 still running at 30: F rises from 0 to 1/2 in the box.
    const d = prepareIntervalLifeData({ start: [10, 30], end: [20, Number.POSITIVE_INFINITY], counts: [4, 4] });
    const np = turnbull(d);
    expect(np.intervals[0]).toMatchObject({ lower: 10, upper: 20, cdfBefore: 0 });
    expect(np.intervals[0]!.cdfAfter).toBeCloseTo(0.5, 9);
    for (const [shape, scale] of [[3, 22], [1, 8], [6, 40]] as const) {
      const w = getFamily('weibull').make({ shape, scale });
      expect(intervalAndersonDarling(w, np, d.n)).toBeCloseTo(bruteForce(w, np, d.n, 400000), 4);
    }
  });
});

describe('inspection-scheme bootstrap', () => {
  const d = valves();
  const fit = fitInterval('weibull', d);
  if (!fit.ok) throw new Error(fit.reason);
  const observed = intervalStatistic('weibull', fit.parameters, d);

  it('counts over a split range add up to the one-piece run (replicate b draws from its own stream)', () => {
    const whole = runIntervalReplicates('weibull', fit.parameters, d, observed, 7, 0, 12);
    const a = runIntervalReplicates('weibull', fit.parameters, d, observed, 7, 0, 5);
    const b = runIntervalReplicates('weibull', fit.parameters, d, observed, 7, 5, 12);
    expect(a.exceed + b.exceed).toBe(whole.exceed);
    expect(a.failed + b.failed).toBe(whole.failed);
    expect(a.completed + b.completed).toBe(12);
  });

  it('p = (1 + exceed + unrefittable)/(1 + B), rejected only at p ≤ α', () => {
    const r = intervalGofFromCounts(1.5, { start: 0, end: 19, completed: 19, valid: 18, exceed: 3, failed: 1, cancelled: false }, d);
    expect(r.pValue).toBeCloseTo(5 / 20, 15);
    expect(r.monteCarloError).toBeCloseTo(Math.sqrt((0.25 * 0.75) / 19), 15);
  });

  it('rejects the exponential model of the valve demo and not the Weibull it was drawn from (datasets/README.md)', () => {
    const e = fitInterval('exponential', d);
    if (!e.ok) throw new Error(e.reason);
    expect(intervalGofBootstrap('exponential', e.parameters, d, { replicates: 99, seed: 3 }).pValue).toBeLessThanOrEqual(0.05);
    expect(intervalGofBootstrap('weibull', fit.parameters, d, { replicates: 99, seed: 3 }).pValue).toBeGreaterThan(0.05);
  });

  it('on rows that fit no common schedule the p-value decides nothing: no verdict, a warning, "No decision" in the dataset report (INTERVAL_GOF_SIZE)', () => {
    // Case-2 rows: each unit at its own inspections (the size study's first case-2 sample).
    const c2 = sizeSample('case2', 0);
    const input = { start: Array.from(c2.lower), end: Array.from(c2.upper), counts: Array.from(c2.counts) };
    const r = analyzeRecordedLife({ interval: input }, { families: ['weibull'], replicates: 19, seed: 5, mixture: false });
    const w = r.candidates[0]!;
    expect(w.goodnessOfFit!.scheme).toBe('own-times');
    expect(w.goodnessOfFit!.sizeCalibrated).toBe(false);
    expect(w.rejected).toBeNull();
    expect(r.warnings.some((x) => /not size-calibrated/.test(x) && /decides nothing/.test(x))).toBe(true);
    const ds = analyzeDataset({ interval: input }, { families: ['weibull'], bootstrapReplicates: 19 });
    const ad = ds.candidates[0]!.andersonDarling as { rejected: boolean; decision: string };
    expect(ad.rejected).toBe(false);
    expect(ad.decision).toMatch(/^No decision: the test is not size-calibrated/);
    // The report names the test it ran (A² on every design; the likelihood ratio was measured and not adopted: interval-gof-design.ts).
    expect(w.goodnessOfFit!.test).toBe('anderson-darling');
    expect(ad.decision).toMatch(/Anderson–Darling A² = \S+, p = /);
    // The valve demo fits one common schedule: its test decides.
    const v = analyzeRecordedLife({ interval: { start: Array.from(d.lower), end: Array.from(d.upper), counts: Array.from(d.counts) } }, { families: ['weibull'], replicates: 19, seed: 5, mixture: false });
    expect(v.candidates[0]!.goodnessOfFit!.sizeCalibrated).toBe(true);
    expect(v.candidates[0]!.rejected).toBe(v.candidates[0]!.goodnessOfFit!.pValue <= 0.05);
  });

  it('the recorded-life report carries the test on interval rows, and says why not on exact failures with suspensions', () => {
    const r = analyzeRecordedLife({ interval: { start: Array.from(d.lower), end: Array.from(d.upper), counts: Array.from(d.counts) } }, { families: ['weibull', 'exponential'], replicates: 39, seed: 5 });
    const w = r.candidates.find((c) => c.family === 'weibull')!;
    expect(w.goodnessOfFit!.replicates).toBe(39);
    expect(w.rejected).toBe(w.goodnessOfFit!.pValue <= 0.05);
    expect(r.goodnessOfFitNote).toBeNull();
    expect(r.methods.some((m) => m.topic === 'goodness of fit' && /inspection/.test(m.text))).toBe(true);
    const rc = analyzeRecordedLife({ times: NIST_T, failed: NIST_F }, { families: ['weibull'], mixture: false });
    expect(rc.candidates[0]!.goodnessOfFit).toBeNull();
    expect(rc.goodnessOfFitNote).toMatch(/life section/);
  });
});
