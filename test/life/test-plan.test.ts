import { describe, expect, it } from 'vitest';
import { planTest } from '../../core/life/index.js';
import { readFixture, rel } from '../helpers/fixtures.js';

// Fixture: scripts/fixtures/life-weibayes.py (smallest n found by counting upward with SciPy
// binom.cdf; zero-failure closed form ln(1-C)/(k^β ln R); Weibayes form chi2.ppf(C, 2r+2)/(2k^β(-ln R))).
const fx = readFixture('life-weibayes.json');

describe('test planning', () => {
  for (const c of fx.plans) {
    it(`R ${c.reliability}, C ${c.confidence}, β ${c.shape}, r ${c.failuresAllowed}, k ${c.timeRatio}: n = ${c.unitsBinomial}`, () => {
      const p = planTest({ reliability: c.reliability, time: 1000, confidence: c.confidence, shape: c.shape, failuresAllowed: c.failuresAllowed, timeRatios: [c.timeRatio] });
      const row = p.rows[0]!;
      expect(row.unitsBinomial).toBe(c.unitsBinomial);
      expect(row.testTime).toBeCloseTo(1000 * c.timeRatio, 9);
      expect(rel(row.unitsWeibayesExact, c.unitsWeibayesExact)).toBeLessThan(1e-12);
      expect(row.unitsWeibayes).toBe(Math.ceil(c.unitsWeibayesExact));
      if (c.unitsZeroFailureExact !== null) {
        expect(rel(row.unitsZeroFailureExact as number, c.unitsZeroFailureExact)).toBeLessThan(1e-13);
        // With no failures the binomial and Weibayes forms coincide (χ²(C; 2)/2 = -ln(1 - C)).
        expect(row.unitsBinomial).toBe(Math.ceil(c.unitsZeroFailureExact));
      } else {
        expect(row.unitsZeroFailureExact).toBeNull();
      }
    });
  }

  it('success-run table values: R = C = 0.90 → 22 units; R = C = 0.95 → 59 (from memory; equal to the closed form)', () => {
    expect(planTest({ reliability: 0.9, time: 1, confidence: 0.9, shape: 1, timeRatios: [1] }).rows[0]!.unitsBinomial).toBe(22);
    expect(planTest({ reliability: 0.95, time: 1, confidence: 0.95, shape: 1, timeRatios: [1] }).rows[0]!.unitsBinomial).toBe(59);
  });

  it('shows the derivation and the assumed-shape caution', () => {
    const p = planTest({ reliability: 0.9, time: 500, confidence: 0.9, shape: 2 });
    expect(p.derivation.join(' ')).toMatch(/n = ln\(0\.1\) \/ ln\(0\.9\) = 21\.8543, rounded up to 22/);
    expect(p.cautions[0]).toMatch(/assumed, not measured/);
    expect(p.rows.map((r) => r.timeRatio)).toEqual([0.5, 1, 1.5, 2, 3]);
    // Longer tests need fewer units.
    for (let i = 1; i < p.rows.length; i++) expect(p.rows[i]!.unitsBinomial).toBeLessThanOrEqual(p.rows[i - 1]!.unitsBinomial);
  });

  it('refuses impossible inputs', () => {
    expect(() => planTest({ reliability: 1, time: 1, confidence: 0.9, shape: 2 })).toThrow(/reliability must be in \(0, 1\)/);
    expect(() => planTest({ reliability: 0.9, time: 1, confidence: 0.9, shape: 2, failuresAllowed: 1.5 })).toThrow(/whole number/);
  });
});
