import { describe, expect, it } from 'vitest';
import { computeEvidence, getFamily, InputError, prepareSample } from '../../core/index.js';
// Φ⁻¹ (AS 241), itself checked against SciPy norm.ppf in test/special.
import { normalQuantile } from '../../core/special/index.js';
import { readFileSync } from 'node:fs';

/** Kaplan–Meier references written by scripts/fixtures/evidence_censored.py (SciPy 1.17.1 stats.ecdf on CensoredData). */
const FIXTURE = JSON.parse(readFileSync(new URL('../fixtures/evidence-censored.json', import.meta.url), 'utf8')) as {
  cases: { name: string; times: number[]; failed: number[]; x: number[]; F: number[] }[];
};

const WEIBULL = { family: 'weibull' as const, label: 'Weibull', parameters: { shape: 1.4, scale: 1500 } };
const NORMAL = { family: 'normal' as const, label: 'Normal', parameters: { mean: 1100, sd: 700 } };

function censoredEvidence(times: number[], failed: number[], positions?: 'johnson-benard' | 'kaplan-meier') {
  return computeEvidence(prepareSample(times), { candidates: [WEIBULL, NORMAL] }, {}, { times, failed, ...(positions ? { positions } : {}) });
}

/** The right-continuous step at t: the last p at a step x ≤ t (0 before the first). */
function stepAt(x: readonly number[], p: readonly number[], t: number): number {
  let v = 0;
  x.forEach((xv, j) => {
    if (xv <= t) v = p[j] as number;
  });
  return v;
}

describe('censored evidence: the distribution function is the Kaplan–Meier step', () => {
  for (const c of FIXTURE.cases) {
    it(`matches SciPy stats.ecdf(CensoredData) at every time: ${c.name}`, () => {
      const e = censoredEvidence(c.times, c.failed).cdf.empirical;
      expect(e.estimator).toBe('kaplan-meier');
      c.x.forEach((t, j) => expect(Math.abs(stepAt(e.x, e.p, t) - (c.F[j] as number))).toBeLessThan(1e-14));
      // Steps only at failure times; suspensions are marked, one mark each, at the step's height.
      const failures = c.times.filter((_, i) => c.failed[i] === 1);
      expect(e.x).toEqual([...new Set(failures)].sort((a, b) => a - b));
      expect(e.cumulativeCount[e.cumulativeCount.length - 1]).toBe(failures.length);
      const susp = c.times.filter((_, i) => c.failed[i] === 0).sort((a, b) => a - b);
      expect(e.suspensions.x).toEqual(susp);
      e.suspensions.x.forEach((t, j) => expect(e.suspensions.p[j]).toBe(stepAt(e.x, e.p, t)));
    });
  }

  it('stays below 100 % when the largest time is a suspension (hand-checked product limit)', () => {
    // Kaplan & Meier (1958): S(t) = Π (1 − d_i/n_i). Case 1, n = 11: at 150 h 1 of 11 fails
    // (F = 1/11); at 340 h 2 of 10 (S = 10/11 · 8/10 = 8/11, F = 3/11); 560 h suspended; at 800 h
    // 1 of 7 (S = 8/11 · 6/7 = 48/77, F = 29/77); the run ends with three suspensions.
    const c = FIXTURE.cases[0]!;
    const e = censoredEvidence(c.times, c.failed).cdf.empirical;
    expect(Math.abs((e.p[0] as number) - 1 / 11)).toBeLessThan(1e-15);
    expect(Math.abs((e.p[1] as number) - 3 / 11)).toBeLessThan(1e-15);
    expect(Math.abs((e.p[2] as number) - 29 / 77)).toBeLessThan(1e-15);
    expect(e.p[e.p.length - 1]).toBeLessThan(0.63);
    // The complete-sample ECDF of the same values would reach 1: the censoring is what keeps it lower.
    const complete = computeEvidence(prepareSample(c.times), { candidates: [WEIBULL] }).cdf.empirical;
    expect(complete.estimator).toBe('empirical');
    expect(complete.p[complete.p.length - 1]).toBe(1);
    expect(FIXTURE.cases[1]!.F[FIXTURE.cases[1]!.F.length - 1]).toBe(1);
  });
});

describe('censored evidence: probability plot', () => {
  // Johnson (1964) adjusted ranks, hand-computed for 10 F, 20 S, 30 F, 40 F (n = 4): increment
  // (n + 1 − previous)/(1 + units at or after): j1 = 5/5 = 1, j2 = 1 + 4/3 = 7/3, j3 = 7/3 + (8/3)/2 = 11/3;
  // Benard F = (j − 0.3)/4.4.
  const times = [30, 10, 40, 20];
  const failed = [1, 1, 1, 0];
  const F = [0.7 / 4.4, (7 / 3 - 0.3) / 4.4, (11 / 3 - 0.3) / 4.4];

  it('places only the failures, at Johnson–Benard positions, and marks the suspension on the axis', () => {
    const ev = censoredEvidence(times, failed);
    const normal = ev.candidates.find((c) => c.family === 'normal')!.probabilityPlot;
    expect(normal.points.x).toEqual([10, 30, 40]);
    normal.points.y.forEach((y, j) => expect(Math.abs(y - normalQuantile(F[j] as number))).toBeLessThan(1e-12));
    expect(normal.points.rank.map((r) => Number(r.toFixed(12)))).toEqual([1, Number((7 / 3).toFixed(12)), Number((11 / 3).toFixed(12))]);
    expect(normal.suspensions).toEqual([20]);
    expect(normal.total).toBe(3);
    expect(normal.plottingPosition.name).toMatch(/Johnson/);
    // Weibull scale: x = ln t for points and the suspension mark; y = ln(−ln(1 − F)).
    const w = ev.candidates.find((c) => c.family === 'weibull')!.probabilityPlot;
    expect(w.suspensions).toEqual([Math.log(20)]);
    w.points.y.forEach((y, j) => expect(Math.abs(y - Math.log(-Math.log1p(-(F[j] as number))))).toBeLessThan(1e-12));
    // The fitted line is the fitted quantile at each position: Weibull ln Q(F) = ln scale + ln(−ln(1 − F))/shape.
    w.fittedLine.x.forEach((x, j) => expect(Math.abs(x - (Math.log(1500) + (w.fittedLine.y[j] as number) / 1.4))).toBeLessThan(1e-12));
    // Band brackets the line (the fitted quantile of F lies between those of its band ends).
    w.band.lower.forEach((lo, j) => {
      expect(lo as number).toBeLessThanOrEqual(w.fittedLine.x[j] as number);
      expect(w.band.upper[j] as number).toBeGreaterThanOrEqual(w.fittedLine.x[j] as number);
    });
    expect(ev.censoring).not.toBeNull();
    expect(ev.censoring!.failures).toBe(3);
    expect(ev.censoring!.suspensions).toBe(1);
    expect(ev.censoring!.suspensionTimes.x).toEqual([20]);
    expect(ev.censoring!.failureTimes.x).toEqual([10, 30, 40]);
  });

  it('Kaplan–Meier positions: halfway up each product-limit step', () => {
    // Hand: S = 3/4 after 10; at 30, 2 at risk, S = 3/4 · 1/2 = 3/8; at 40, S = 0. Midpoints:
    // F = 1 − (1 + 3/4)/2 = 1/8, 1 − (3/4 + 3/8)/2 = 7/16, 1 − (3/8 + 0)/2 = 13/16.
    const ev = censoredEvidence(times, failed, 'kaplan-meier');
    const n = ev.candidates.find((c) => c.family === 'normal')!.probabilityPlot;
    [1 / 8, 7 / 16, 13 / 16].forEach((f, j) => expect(Math.abs((n.points.y[j] as number) - normalQuantile(f))).toBeLessThan(1e-12));
    expect(ev.censoring!.method).toBe('kaplan-meier');
  });

  it('follows the life report\'s plotting positions when no method is given', () => {
    const sample = prepareSample(times);
    const ev = computeEvidence(sample, { candidates: [NORMAL], life: { plot: { method: 'kaplan-meier' } } } as never, {}, { times, failed });
    expect(ev.censoring!.method).toBe('kaplan-meier');
  });
});

describe('censored evidence: no bins', () => {
  it('gives no histogram bars, chi-square bins or observed-vs-expected rows, and says why', () => {
    const c = FIXTURE.cases[1]!;
    const ev = censoredEvidence(c.times, c.failed);
    for (const ce of ev.candidates) {
      expect(ce.histogram.source).toBe('not-applicable');
      expect(ce.histogram.bars).toEqual([]);
      expect(ce.bins.source).toBe('not-applicable');
      expect(ce.bins.rows).toEqual([]);
      expect(ce.bins.notApplicable?.cause).toBe('censored');
      expect(ce.bins.notApplicable?.reason).toMatch(/suspension/);
    }
    // A complete sample keeps its bins and says nothing is missing.
    const complete = computeEvidence(prepareSample(c.times), { candidates: [WEIBULL] });
    expect(complete.candidates[0]!.bins.rows.length).toBeGreaterThan(1);
    expect(complete.candidates[0]!.bins.notApplicable).toBeNull();
    expect(complete.censoring).toBeNull();
    expect(complete.candidates[0]!.probabilityPlot.suspensions).toEqual([]);
  });

  it('refuses a status whose times are not the sample', () => {
    expect(() => computeEvidence(prepareSample([1, 2, 3]), { candidates: [WEIBULL] }, {}, { times: [1, 2, 4], failed: [1, 1, 0] })).toThrow(InputError);
    expect(() => computeEvidence(prepareSample([1, 2, 3]), { candidates: [WEIBULL] }, {}, { times: [1, 2], failed: [1, 1] })).toThrow(InputError);
    expect(() => computeEvidence(prepareSample([1, 2, 3]), { candidates: [WEIBULL] }, {}, { times: [1, 2, 3], failed: [1, 2, 0] })).toThrow(InputError);
  });

  it('every number is finite (thinned evidence of 5000 units, 40 % suspended)', () => {
    const times: number[] = [];
    const failed: number[] = [];
    const d = getFamily('weibull').make({ shape: 1.4, scale: 1500 });
    for (let i = 0; i < 5000; i++) {
      times.push(d.quantile((i + 0.5) / 5000));
      failed.push(i % 5 < 3 ? 1 : 0);
    }
    const ev = computeEvidence(prepareSample(times), { candidates: [WEIBULL] }, { maxPoints: 200 }, { times, failed });
    const pp = ev.candidates[0]!.probabilityPlot;
    expect(pp.thinned).toBe(true);
    expect(pp.points.x.length).toBeLessThanOrEqual(200);
    expect(ev.cdf.empirical.x.length).toBeLessThanOrEqual(200);
    expect(ev.cdf.empirical.suspensions.x.length).toBeLessThanOrEqual(200);
    expect(ev.cdf.empirical.suspensions.total).toBe(2000);
    for (const v of [...pp.points.x, ...pp.points.y, ...ev.cdf.empirical.p]) expect(Number.isFinite(v)).toBe(true);
  });
});
