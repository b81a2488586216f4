import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeLife } from '../../core/life/index.js';
import { readFixture } from '../helpers/fixtures.js';

const fx = readFixture('life.json');
const nist = { times: fx.nist.times as number[], failed: fx.nist.failed as number[] };

describe('analyzeLife', () => {
  const r = analyzeLife(nist, { bLifePercents: [1, 10, 50], reliabilityTimes: [300], bootstrapReplicates: 49, seed: 5 });

  it('counts all units, failures and suspensions separately (NIST §8.4.1.3: 20 units, 10 + 10)', () => {
    expect([r.n, r.failures, r.suspensions]).toEqual([20, 10, 10]);
  });

  it('ranks by AICc with n = all units, and reports the tightly solved log-likelihoods', () => {
    // Fixture life.py log-likelihoods; AICc = AIC + 2k(k+1)/(n-k-1) (Hurvich & Tsai 1989), n = 20.
    for (let i = 1; i < r.candidates.length; i++) expect(r.candidates[i]!.aicc).toBeGreaterThanOrEqual(r.candidates[i - 1]!.aicc);
    for (const c of r.candidates) {
      const ll = fx.nist.fits[c.family].logLikelihood;
      const k = c.estimatedParameters;
      expect(c.logLikelihood).toBeCloseTo(ll, 9);
      expect(c.aicc).toBeCloseTo(2 * k - 2 * ll + (2 * k * (k + 1)) / (20 - k - 1), 8);
      expect(c.bLives.map((b) => b.percent)).toEqual([1, 10, 50]);
      expect(c.goodnessOfFit!.pValue).toBeGreaterThan(0);
      expect(c.goodnessOfFit!.replicates + c.goodnessOfFit!.failedReplicates).toBe(49);
    }
    expect(r.candidates.map((c) => c.rank)).toEqual([1, 2, 3, 4, 5]);
  });

  it('Weibull B10 and R(300) carry the likelihood-ratio bounds of the fixture, and say which method', () => {
    // life.py profile bounds (90 % two-sided).
    const w = r.candidates.find((c) => c.family === 'weibull')!;
    const b10 = w.bLives[1]!;
    expect(b10.lower).toBeCloseTo(fx.nist.weibullProfileBounds.b10.lower, 4);
    expect(b10.upper).toBeCloseTo(fx.nist.weibullProfileBounds.b10.upper, 4);
    expect(b10.confidence).toBe(0.9);
    expect(b10.method).toMatch(/likelihood ratio/);
    expect(w.reliability[0]!.lower).toBeCloseTo(fx.nist.weibullProfileBounds.reliability300.lower, 6);
    expect(w.shapeInterval!.lower).toBeLessThan(1.7208);
    // Mean life of a Weibull is scale·Γ(1 + 1/shape) (closed form); Γ(1.58112) = 0.891529 (SciPy scipy.special.gamma(1 + 1/1.7207972608)).
    expect(w.meanLife / (fx.nist.fits.weibull.parameters.scale * 0.8915291949)).toBeCloseTo(1, 8);
    expect(w.curves.hazard.length).toBe(60);
    // On the Weibull scale the fitted Weibull cdf is the straight line y = k(ln t - ln λ) (closed form).
    const { shape, scale } = fx.nist.fits.weibull.parameters;
    w.curves.time.forEach((t, i) => expect(w.curves.weibullY[i]!).toBeCloseTo(shape * (Math.log(t) - Math.log(scale)), 8));
    // Weibull shape > 1: increasing hazard (closed form k/λ (t/λ)^(k-1)).
    for (let i = 1; i < w.curves.hazard.length; i++) expect(w.curves.hazard[i]!).toBeGreaterThan(w.curves.hazard[i - 1]!);
  });

  it('states that the equiprobable chi-square does not apply, and carries the model/representativeness caution', () => {
    // Issue 4 requirements.
    expect(r.chiSquare.applies).toBe(false);
    expect(r.chiSquare.reason).toMatch(/censored/);
    expect(r.cautions.some((c) => /representative/.test(c))).toBe(true);
    expect(r.methods.some((m) => /Johnson/.test(m.text) && /Benard/.test(m.text))).toBe(true);
  });

  it('few failures draw the small-sample caution; Fisher-matrix bounds are available as the second method', () => {
    // Fewer than 10 failures: common practice, no source.
    const few = analyzeLife({ times: [54, 187, 216, 240, 244, 500, 500, 500, 500], failed: [1, 1, 1, 1, 1, 0, 0, 0, 0] }, { bootstrapReplicates: 0, boundMethod: 'fisher-matrix' });
    expect(few.cautions.some((c) => /Only 5 failures/.test(c))).toBe(true);
    expect(few.candidates[0]!.bLives[0]!.method).toMatch(/Fisher/);
    expect(few.candidates[0]!.goodnessOfFit).toBeNull();
  });

  it('a single failure leaves the two-parameter families not fitted, with the reason', () => {
    // A two-parameter model needs at least two failures (common practice, no source).
    const one = analyzeLife({ times: [100, 500, 500], failed: [1, 0, 0] }, { bootstrapReplicates: 0 });
    expect(one.candidates.map((c) => c.family)).toEqual(['exponential']);
    expect(one.notFitted.map((c) => c.family).sort()).toEqual(['gamma', 'lognormal', 'normal', 'weibull']);
  });

  it('never throws on small awkward data sets, and closed bounds always bracket the estimate (property)', () => {
    // Robustness property (common practice, no source): ties, few failures, all suspensions late.
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 1, max: 60 }), fc.boolean()), { minLength: 2, maxLength: 25 }), (units) => {
        const r = analyzeLife(
          { times: units.map((u) => u[0] * 10), failed: units.map((u) => (u[1] ? 1 : 0)) },
          { bLifePercents: [1, 10, 50], reliabilityTimes: [100], bootstrapReplicates: 3 },
        );
        expect(r.n).toBe(units.length);
        expect(r.failures + r.suspensions).toBe(units.length);
        expect(r.candidates.length + r.notFitted.length).toBe(5);
        for (const c of r.candidates) {
          expect(Number.isFinite(c.logLikelihood)).toBe(true);
          for (const b of c.bLives) if (b.boundsFound) expect(b.lower <= b.estimate && b.estimate <= b.upper).toBe(true);
          for (const q of c.reliability) if (q.boundsFound) expect(q.lower <= q.estimate && q.estimate <= q.upper).toBe(true);
        }
        return true;
      }),
      { numRuns: 60, seed: 11 },
    );
  });
});
