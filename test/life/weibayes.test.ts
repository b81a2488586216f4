import { describe, expect, it } from 'vitest';
import { prepareLifeData, weibayes } from '../../core/life/index.js';
import { readFixture, rel } from '../helpers/fixtures.js';

// Fixture: scripts/fixtures/life-weibayes.py (SciPy chi2.ppf closed form of Nelson 1985, and a
// bounded numerical maximisation of the censored Weibull likelihood at the fixed shape).
const fx = readFixture('life-weibayes.json');

describe('Weibayes (Nelson 1985, J. Quality Technology 17:140-146)', () => {
  for (const c of fx.weibayes) {
    it(`${c.source}: scale and lower bound agree with the chi-square (2r+2 dof) closed form`, () => {
      const data = prepareLifeData({ times: c.times, failed: c.failed });
      const w = weibayes(data, { shape: c.shape, confidence: c.confidence, bLifePercents: [10], reliabilityTimes: [1000] });
      expect(w.shapeIs).toBe('assumed');
      expect(w.statement).toMatch(/ASSUMED/);
      expect(w.degreesOfFreedom).toBe(2 * w.failures + 2);
      expect(rel(w.exposure, c.exposure)).toBeLessThan(1e-13);
      // chiSquareIsf vs SciPy chi2.ppf: both near machine precision; 1e-12 covers the 1/β power.
      expect(rel(w.scaleLower, c.scaleLower)).toBeLessThan(1e-12);
      if (c.scale === null) {
        expect(w.scale).toBeNull();
        expect(w.bLives[0]!.estimate).toBeNull();
      } else {
        expect(rel(w.scale as number, c.scale)).toBeLessThan(1e-13);
        // The closed form is the likelihood maximum at fixed β (SciPy bounded search, xatol 1e-12 in ln scale).
        expect(rel(w.scale as number, c.scaleNumerical)).toBeLessThan(1e-7);
      }
      // B10 lower bound = η_L (-ln 0.9)^{1/β}; R(1000) lower bound = exp(-(1000/η_L)^β).
      expect(rel(w.bLives[0]!.lower, c.scaleLower * Math.pow(-Math.log(0.9), 1 / c.shape))).toBeLessThan(1e-13);
      expect(rel(w.reliability[0]!.lower, Math.exp(-Math.pow(1000 / c.scaleLower, c.shape)))).toBeLessThan(1e-12);
    });
  }

  it('zero failures: the "one assumed failure" value is the 63.2 % lower bound (χ²(1 - 1/e; 2)/2 = 1)', () => {
    const data = prepareLifeData({ times: [100, 200, 300], failed: [0, 0, 0] });
    const w = weibayes(data, { shape: 1.5, confidence: 1 - Math.exp(-1) });
    expect(rel(w.scaleLower, w.scaleOneFailure)).toBeLessThan(1e-12);
    expect(rel(w.scaleOneFailure, Math.pow(100 ** 1.5 + 200 ** 1.5 + 300 ** 1.5, 1 / 1.5))).toBeLessThan(1e-14);
  });

  it('large shapes do not overflow the exposure sum (pivot on the largest time)', () => {
    const data = prepareLifeData({ times: [1e5, 2e5, 3e5], failed: [1, 0, 0] });
    const w = weibayes(data, { shape: 20 });
    expect(Number.isFinite(w.scale as number)).toBe(true);
    // Σ t^20 is dominated by 3e5: scale ≈ 3e5·(1 + (2/3)^20 + (1/3)^20)^{1/20}.
    expect(rel(w.scale as number, 3e5 * Math.pow(1 + (2 / 3) ** 20 + (1 / 3) ** 20, 1 / 20))).toBeLessThan(1e-13);
  });

  it('refuses a shape that is not > 0', () => {
    const data = prepareLifeData({ times: [1, 2], failed: [1, 0] });
    expect(() => weibayes(data, { shape: 0 })).toThrow(/shape must be a number > 0/);
    expect(() => weibayes(data, { shape: Number.NaN })).toThrow(/shape/);
  });
});
