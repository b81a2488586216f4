import { describe, expect, it } from 'vitest';
import { johnsonBenardPositions, kaplanMeierPositions, plotPositions, prepareLifeData, weibullScaleY } from '../../core/life/index.js';
import { readFixture } from '../helpers/fixtures.js';

const fx = readFixture('life.json');

describe('probability-plot positions with suspensions', () => {
  it('with no suspensions, Johnson ranks are 1..n and Benard gives (i - 0.3)/(n + 0.4)', () => {
    // Benard's approximation to the median rank (Benard & Bos-Levenbach 1953; common practice).
    const d = prepareLifeData({ times: [5, 3, 9, 7, 1], failed: [1, 1, 1, 1, 1] });
    const p = johnsonBenardPositions(d, 0.9);
    expect(p.map((q) => q.rank)).toEqual([1, 2, 3, 4, 5].map((i) => expect.closeTo(i, 12)));
    p.forEach((q, i) => expect(q.F).toBeCloseTo((i + 1 - 0.3) / 5.4, 14));
  });

  it('Johnson adjusted ranks on a hand-worked example', () => {
    // Hand calculation (Johnson 1964 increment (n + 1 - prev)/(1 + units remaining)): n = 5,
    // F 10, S 20, F 30, S 40, F 50: ranks 1, 1 + 5/4 = 2.25, 2.25 + 3.75/2 = 4.125.
    const d = prepareLifeData({ times: [10, 20, 30, 40, 50], failed: [1, 0, 1, 0, 1] });
    const p = johnsonBenardPositions(d, 0.9);
    expect(p.map((q) => q.rank)).toEqual([expect.closeTo(1, 14), expect.closeTo(2.25, 14), expect.closeTo(4.125, 14)]);
    expect(p[2]!.F).toBeCloseTo((4.125 - 0.3) / 5.4, 14);
  });

  it('Kaplan–Meier on NIST §8.4.1.3: S = 1 - i/20 at the i-th failure; positions halfway up the step', () => {
    // No suspension before 500 h, so the product-limit estimate is 1 - i/20 (Kaplan & Meier 1958).
    const d = prepareLifeData({ times: fx.nist.times, failed: fx.nist.failed });
    const p = kaplanMeierPositions(d, 0.9);
    expect(p).toHaveLength(10);
    p.forEach((q, i) => {
      expect(q.F).toBeCloseTo((i + 0.5) / 20, 14);
      expect(q.lower).toBeLessThan(q.F);
      expect(q.upper).toBeGreaterThan(q.F);
    });
  });

  it('bands widen with the band level and the Weibull-scale coordinates follow ln(-ln(1 - F))', () => {
    // Property (common practice, no source).
    const d = prepareLifeData({ times: fx.simulated.times, failed: fx.simulated.failed });
    for (const m of ['johnson-benard', 'kaplan-meier'] as const) {
      const a = plotPositions(d, m, 0.8);
      const b = plotPositions(d, m, 0.95);
      expect(a.points.length).toBe(d.failures);
      a.points.forEach((q, i) => {
        expect(b.points[i]!.lower).toBeLessThanOrEqual(q.lower);
        expect(b.points[i]!.upper).toBeGreaterThanOrEqual(q.upper);
        expect(a.weibull[i]!.y).toBeCloseTo(weibullScaleY(q.F), 14);
        expect(a.weibull[i]!.x).toBeCloseTo(Math.log(q.time), 14);
      });
      for (let i = 1; i < a.points.length; i++) expect(a.points[i]!.F).toBeGreaterThan(a.points[i - 1]!.F);
    }
  });
});
