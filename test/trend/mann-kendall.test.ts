import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { exactMannKendallP, inversionCounts, mannKendall } from '../../core/trend/index.js';

// Reference values: scripts/fixtures/flood.py, trend section (SciPy 1.17.1: kendalltau,
// theilslopes; S and the tie-corrected variance by the double sum; exact p by enumerating
// permutations for n ≤ 8).
const fx = JSON.parse(readFileSync(new URL('../fixtures/flood.json', import.meta.url), 'utf8'));
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('Mann–Kendall trend test', () => {
  for (const c of fx.trend) {
    it(`${c.name}: S, Var S with ties, Z, p, tau-b and Sen's slope match the SciPy fixture`, () => {
      const r = mannKendall(c.values, { times: c.times, alpha: 0.05 });
      expect(r.s).toBe(c.S);
      expect(rel(r.varianceS, c.varS)).toBeLessThan(1e-14);
      expect(r.tieTerm).toBe(c.tieTerm);
      expect(rel(r.z, c.z)).toBeLessThan(1e-13);
      // normal p from core/special's normal cdf: 1e-12 relative
      expect(rel(r.pValueNormal, c.pNormal)).toBeLessThan(1e-12);
      expect(rel(r.tauB, c.tauB)).toBeLessThan(1e-12);
      if (c.pExact !== undefined) {
        expect(r.pMethod).toBe('exact');
        expect(rel(r.pValue, c.pExact)).toBeLessThan(1e-12);
      } else expect(r.pMethod).toBe('normal');
      expect(r.senSlope).not.toBeNull();
      expect(rel(r.senSlope!.estimate, c.sen.slope)).toBeLessThan(1e-12);
      expect(rel(r.senSlope!.lower, c.sen.low)).toBeLessThan(1e-12);
      expect(rel(r.senSlope!.upper, c.sen.high)).toBeLessThan(1e-12);
      expect(Math.abs(r.senSlope!.intercept - c.sen.intercept)).toBeLessThan(1e-9 * Math.max(1, Math.abs(c.sen.intercept)));
      expect(r.trendDetected).toBe(r.pValue < 0.05);
      if (r.trendDetected) expect(r.warning).toMatch(/same distribution/);
      else expect(r.warning).toBeNull();
    });
  }
  it('the time order matters, not the input order: shuffled (value, time) pairs give the same S', () => {
    const c = fx.trend[2];
    const idx = (c.values as number[]).map((_, i) => i).reverse();
    const r = mannKendall(idx.map((i) => c.values[i]), { times: idx.map((i) => c.times[i]) });
    expect(r.s).toBe(c.S);
  });
  it('Mahonian numbers: known small rows (OEIS A008302, from memory) and sum n!', () => {
    expect(Array.from(inversionCounts(3))).toEqual([1, 2, 2, 1]);
    expect(Array.from(inversionCounts(4))).toEqual([1, 3, 5, 6, 5, 3, 1]);
    const c10 = inversionCounts(10);
    expect(c10.reduce((a, b) => a + b, 0)).toBe(3628800);
    // a perfectly increasing series of 10: S = 45, p = 2/10!
    expect(exactMannKendallP(10, 45)).toBeCloseTo(2 / 3628800, 15);
  });
  it('a strictly increasing series is detected as an increasing trend; a constant one is refused', () => {
    const r = mannKendall(Array.from({ length: 25 }, (_, i) => Math.sqrt(i + 1)));
    expect(r.direction).toBe('increasing');
    expect(r.tauA).toBe(1);
    expect(() => mannKendall([3, 3, 3, 3])).toThrow();
    expect(() => mannKendall([1, 2, 3], { times: [1, 1, 2] })).toThrow(/share the time/);
  });
});
