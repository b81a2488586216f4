import { describe, expect, it } from 'vitest';
import { analyze, getFamily, prepareSample } from '../../core/index.js';
import {
  EXPONENTIAL_CASE_CRITICAL,
  EXPONENTIAL_TURNING_POINT,
  GAMMA_AD_TABLE,
  NORMAL_CASE_CRITICAL,
  WEIBULL_CASE_CRITICAL,
  andersonDarlingStatistic,
  exponentialCasePValue,
  exponentialCaseResult,
  gammaCasePValue,
  gammaCriticalValues,
  normalCaseModified,
  normalCasePValue,
  normalCaseResult,
  tablePValue,
  weibullCasePValue,
} from '../../core/gof/index.js';
import { fixture } from './fixture.js';

describe("normal case (D'Agostino & Stephens 1986 Table 4.9, via references.md)", () => {
  it('spot values p(0.752) = 0.05034, p(0.631) = 0.10013, p(1.035) = 0.01010', () => {
    expect(normalCasePValue(0.752)).toBeCloseTo(0.05034, 5);
    expect(normalCasePValue(0.631)).toBeCloseTo(0.10013, 5);
    expect(normalCasePValue(1.035)).toBeCloseTo(0.0101, 5);
  });

  it('the published discontinuity at 0.34: 0.50152 from below, 0.49823 at 0.34 (references.md)', () => {
    expect(normalCasePValue(0.34 - 1e-12)).toBeCloseTo(0.50152, 5);
    expect(normalCasePValue(0.34)).toBeCloseTo(0.49823, 5);
  });

  it('never rises again for huge A* (the quadratic turns at 153.5; held there)', () => {
    // Guard against the formula's upturn (our rule, no source): p stays tiny and non-increasing.
    let prev = 1;
    for (const a of [0.1, 0.5, 1, 2, 5, 20, 100, 150, 153, 160, 300, 1e4]) {
      const p = normalCasePValue(a);
      expect(p, String(a)).toBeLessThanOrEqual(prev + 0.004);
      prev = p;
    }
    expect(normalCasePValue(1e4)).toBeLessThan(1e-100);
    expect(exponentialCasePValue(1e4)).toBeLessThan(1e-6);
  });

  it('Table 4.7 critical values map close to their α (formula fitted to the table; within 3 % relative)', () => {
    for (const { alpha, value } of NORMAL_CASE_CRITICAL) {
      expect(Math.abs(normalCasePValue(value) / alpha - 1), String(alpha)).toBeLessThan(0.03);
    }
  });

  it('D1: A² with the n - 1 sd 0.60668, A* 0.63284, p = 0.0991 (references.md)', () => {
    const sample = prepareSample(fixture.D1.values);
    const fit = getFamily('normal').fit(sample);
    if (!fit.ok) throw new Error('fit');
    const a2 = andersonDarlingStatistic(getFamily('normal').make(fit.parameters), sample.sorted);
    const r = tablePValue('normal', fit.parameters, sample, a2);
    expect(r?.tableStatistic).toBeCloseTo(0.60668, 5);
    expect(r?.modifiedStatistic).toBeCloseTo(0.63284, 5);
    expect(normalCaseModified(0.60668, 20)).toBeCloseTo(0.63284, 4); // A* = A²(1 + 0.75/n + 2.25/n²)
    expect(r?.pValue).toBeCloseTo(0.0991, 4);
    expect(r?.pValueIs).toBe('estimate');
    expect(r?.methodDetail).toMatch(/n - 1 standard deviation/);
  });

  it('lognormal uses the same table on ln x with the n - 1 sdlog (mpmath fixture)', () => {
    const sample = prepareSample(fixture.D1.values);
    const fit = getFamily('lognormal').fit(sample);
    if (!fit.ok) throw new Error('fit');
    const r = tablePValue('lognormal', fit.parameters, sample, 0.17836);
    expect(r?.tableStatistic).toBeCloseTo(fixture.D1.lognormalA2WithNMinus1Sd, 10);
    expect(r?.pValue).toBeCloseTo(normalCasePValue(normalCaseModified(fixture.D1.lognormalA2WithNMinus1Sd, 20)), 12);
  });
});

describe("exponential case (D'Agostino & Stephens 1986, via references.md)", () => {
  it('critical values 0.916/1.062/1.321/1.591/1.959 map to 15/10/5/2.5/1 % within 5 % relative', () => {
    // The p-value formulas are a smooth fit to the tabulated points, so they agree only approximately.
    for (const { alpha, value } of EXPONENTIAL_CASE_CRITICAL) {
      expect(Math.abs(exponentialCasePValue(value) / alpha - 1), String(alpha)).toBeLessThan(0.05);
    }
  });
  it('is a decreasing function, in [0, 1]', () => {
    let prev = 1;
    for (let a = 0.05; a < 15; a += 0.05) {
      const p = exponentialCasePValue(a);
      expect(p).toBeLessThanOrEqual(prev + 0.004); // allowing the published branch discontinuities
      expect(p).toBeGreaterThanOrEqual(0);
      prev = p;
    }
  });
});

describe('Weibull via the extreme-value table (Stephens 1977, via references.md)', () => {
  it('critical values 0.474/0.637/0.757/0.877/1.038 map to 25/10/5/2.5/1 %', () => {
    for (const { alpha, value } of WEIBULL_CASE_CRITICAL) expect(weibullCasePValue(value).pValue).toBeCloseTo(alpha, 12);
  });
  it('interpolates ln p between points and gives a bound outside the table', () => {
    // Midway between 0.637 (10 %) and 0.757 (5 %): ln p halfway → √(0.1·0.05) (common practice, no source).
    expect(weibullCasePValue((0.637 + 0.757) / 2).pValue).toBeCloseTo(Math.sqrt(0.005), 12);
    expect(weibullCasePValue(0.3)).toEqual({ pValue: 0.25, pValueIs: 'lower-bound' });
    expect(weibullCasePValue(2.5)).toEqual({ pValue: 0.01, pValueIs: 'upper-bound' });
  });
});

describe('gamma, simulated shape grid (scripts/simulate-ad-tables.ts)', () => {
  it('shape 1 row agrees with the published values within 0.006', () => {
    // D'Agostino & Stephens 1986 Table 4.21 [from memory]: 0.486 0.657 0.786 0.917 1.092.
    // Allowance: Monte Carlo SE of the 1 % point with 1e5 replicates is about 0.002; the table is for large n.
    const published = [0.486, 0.657, 0.786, 0.917, 1.092];
    const { points } = gammaCriticalValues(1);
    points.forEach((p, j) => expect(Math.abs(p.value - (published[j] as number)), String(p.alpha)).toBeLessThan(0.006));
  });
  it('shapes 2 and 5 agree with the independent simulation quoted in references.md within 0.01', () => {
    const ref: Record<number, number[]> = { 2: [0.478, 0.643, 0.766, 0.889, 1.051], 5: [0.471, 0.632, 0.755, 0.874, 1.034] };
    for (const [shape, vals] of Object.entries(ref)) {
      gammaCriticalValues(Number(shape)).points.forEach((p, j) => expect(Math.abs(p.value - (vals[j] as number))).toBeLessThan(0.01));
    }
  });
  it('the normal limit row agrees with Table 4.7 (0.631 0.752 0.873 1.035) within 0.01', () => {
    const inf = GAMMA_AD_TABLE.rows[GAMMA_AD_TABLE.rows.length - 1];
    expect(inf?.shape).toBe(Infinity);
    [0.631, 0.752, 0.873, 1.035].forEach((v, j) => expect(Math.abs((inf?.values[j + 1] as number) - v)).toBeLessThan(0.01));
  });
  it('interpolates in 1/shape, clamps below the grid, and gives bounds outside it', () => {
    const r1 = GAMMA_AD_TABLE.rows[1];
    const r2 = GAMMA_AD_TABLE.rows[2];
    if (!r1 || !r2) throw new Error('table');
    // 1/shape = 0.75 is halfway between 1/1 and 1/2 (common practice, no source).
    const mid = gammaCriticalValues(4 / 3).points;
    mid.forEach((p, j) => expect(p.value).toBeCloseTo(((r1.values[j] as number) + (r2.values[j] as number)) / 2, 12));
    expect(gammaCriticalValues(0.2).clamped).toBe(true);
    expect(gammaCasePValue(0.3, 3)).toMatchObject({ pValue: 0.25, pValueIs: 'lower-bound' });
    expect(gammaCasePValue(3, 3)).toMatchObject({ pValue: 0.01, pValueIs: 'upper-bound' });
    expect(gammaCasePValue(r1.values[2] as number, 1).pValue).toBeCloseTo(0.05, 12);
  });
});

describe('past the formula range the p-value is a bound, printed as one', () => {
  // D'Agostino & Stephens (1986) ch. 4 formulas: the last branch's quadratic turns upward (exponential at
  // A* = 3.009/0.3 ≈ 10.03, normal at 5.709/0.0372 ≈ 153.5); beyond it the number held is only p < minimum.
  it('exponential: A* = 34.8 and 233.5 give pValueIs upper-bound at the formula minimum 5.8e-7', () => {
    for (const aStar of [34.8, 233.5]) {
      const r = exponentialCaseResult(aStar);
      expect(r.pValueIs).toBe('upper-bound');
      expect(r.pValue).toBeCloseTo(5.8e-7, 8);
    }
    expect(exponentialCaseResult(5).pValueIs).toBe('estimate');
    expect(exponentialCaseResult(EXPONENTIAL_TURNING_POINT).pValueIs).toBe('estimate');
  });
  it('normal: A* past 153.5 is a bound; inside it an estimate', () => {
    expect(normalCaseResult(200).pValueIs).toBe('upper-bound');
    expect(normalCaseResult(100).pValueIs).toBe('estimate');
  });
  it('an analysis with a far-off exponential fit says "p < 5.8e-7" in its decision', () => {
    // 40 values from a normal far from 0 with tiny spread: the exponential fit is absurd and A* is huge.
    const xs = Array.from({ length: 40 }, (_, i) => 1000 + i * 0.01);
    const r = analyze(xs, { families: ['exponential', 'normal'] });
    const e = r.candidates.find((c) => c.family === 'exponential');
    expect(e?.andersonDarling.modifiedStatistic).toBeGreaterThan(EXPONENTIAL_TURNING_POINT);
    expect(e?.andersonDarling.pValueIs).toBe('upper-bound');
    expect(e?.andersonDarling.decision).toMatch(/p < 5\.8\d*e-7/);
    expect(e?.andersonDarling.rejected).toBe(true);
  });
});
