/**
 * Mann–Kendall with the Hamed & Rao (1998) variance correction, against an independent NumPy/SciPy
 * implementation of the paper's formulas (scripts/fixtures/hamed-rao.py, test/fixtures/hamed-rao.json;
 * invented seeded series: AR(1) φ = 0.6 with a small trend, and an independent one).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { autocorrelations, averageRanks, hamedRaoMannKendall } from '../../core/trend/hamed-rao.js';

interface Case {
  values: number[];
  sen: number;
  ratio: number;
  s: number;
  varianceS: number;
  z: number;
  p: number;
  lags: number[];
}
const FIX = JSON.parse(readFileSync(new URL('../fixtures/hamed-rao.json', import.meta.url), 'utf8')) as { cases: Case[] };

describe('Hamed–Rao corrected Mann–Kendall vs an independent NumPy/SciPy implementation', () => {
  it('autocorrelated series: lag 1 significant, variance inflated, the decision uses the corrected test', () => {
    const c = FIX.cases[0] as Case;
    const r = hamedRaoMannKendall(c.values);
    expect(r.plain.s).toBe(c.s);
    expect(r.plain.senSlope!.estimate).toBeCloseTo(c.sen, 12);
    expect(r.corrected!.significantLags.map((l) => l.lag)).toEqual(c.lags);
    expect(r.corrected!.varianceRatio).toBeCloseTo(c.ratio, 12);
    expect(r.corrected!.z).toBeCloseTo(c.z, 12);
    expect(r.corrected!.pValue).toBeCloseTo(c.p, 12);
    expect(r.decisionUses).toBe('hamed-rao');
    expect(r.corrected!.pValue).toBeGreaterThan(r.plain.pValue);
    expect(r.decision).toMatch(/decision uses the corrected test/);
  });
  it('independent series: no significant lag, ratio 1, the plain test decides', () => {
    const c = FIX.cases[1] as Case;
    const r = hamedRaoMannKendall(c.values);
    expect(c.lags).toEqual([]);
    expect(r.corrected!.varianceRatio).toBe(1);
    expect(r.decisionUses).toBe('plain');
    expect(r.corrected!.pValue).toBeCloseTo(c.p, 12);
  });
});

describe('parts (definitions)', () => {
  it('average ranks with ties', () => {
    expect(Array.from(averageRanks([10, 20, 20, 5, 30]))).toEqual([2, 3.5, 3.5, 1, 5]);
  });
  it("lag-1 autocorrelation of 1, 2, 3, 4 by hand", () => {
    // deviations −1.5, −0.5, 0.5, 1.5; lag 1: 0.75 − 0.25 + 0.75 = 1.25; Σd² = 5.
    expect(autocorrelations([1, 2, 3, 4])[0]).toBeCloseTo(0.25, 15);
  });
});
