import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { createRng } from '../../core/random/index.js';
import { fitCensored, fitWeibullMixture, mixtureLogLikelihood, mixtureQuantile, prepareLifeData, type WeibullMixtureParameters } from '../../core/life/index.js';

const TRUTH: WeibullMixtureParameters = { fraction: 0.25, shape1: 1.2, scale1: 150, shape2: 4, scale2: 1500 };

/** Seeded mixture sample: each unit from subpopulation 1 with chance π, test stopped at 2500 h. */
function mixtureSample(seed: number, n: number) {
  const rng = createRng(seed, 0);
  const a = getFamily('weibull').random({ shape: TRUTH.shape1, scale: TRUTH.scale1 }, rng, n);
  const b = getFamily('weibull').random({ shape: TRUTH.shape2, scale: TRUTH.scale2 }, rng, n);
  const times: number[] = [];
  const failed: number[] = [];
  for (let i = 0; i < n; i++) {
    const x = rng.uniform() < TRUTH.fraction ? (a[i] as number) : (b[i] as number);
    times.push(Math.min(x, 2500));
    failed.push(x < 2500 ? 1 : 0);
  }
  return prepareLifeData({ times, failed });
}

describe('two-subpopulation Weibull mixture by EM', () => {
  it('recovers seeded parameters: 6 samples of 600 units; each mean within 4 Monte Carlo standard errors of the truth', () => {
    const R = 6;
    const fits = Array.from({ length: R }, (_, s) => fitWeibullMixture(mixtureSample(100 + s, 600)));
    for (const f of fits) {
      expect(f.ok).toBe(true);
      if (f.ok) {
        expect(f.identified, f.flags.join('; ')).toBe(true);
        expect(f.converged).toBe(true);
      }
    }
    for (const key of ['fraction', 'shape1', 'scale1', 'shape2', 'scale2'] as const) {
      const v = fits.map((f) => (f.ok ? f.parameters[key] : Number.NaN));
      const mean = v.reduce((s, x) => s + x, 0) / R;
      const sd = Math.sqrt(v.reduce((s, x) => s + (x - mean) ** 2, 0) / (R - 1));
      expect(Math.abs(mean - TRUTH[key]), `${key}: mean ${mean}, sd ${sd}`).toBeLessThan((4 * sd) / Math.sqrt(R));
    }
  });

  it('the EM end is a maximum of the mixture likelihood and beats the single Weibull on these data', () => {
    const data = mixtureSample(7, 600);
    const f = fitWeibullMixture(data);
    if (!f.ok) throw new Error(f.reason);
    expect(Math.abs(mixtureLogLikelihood(data, f.parameters) - f.logLikelihood)).toBeLessThan(1e-9 * Math.abs(f.logLikelihood));
    for (const key of ['fraction', 'shape1', 'scale1', 'shape2', 'scale2'] as const) {
      for (const m of [0.995, 1.005]) expect(mixtureLogLikelihood(data, { ...f.parameters, [key]: f.parameters[key] * m })).toBeLessThan(f.logLikelihood);
    }
    const single = fitCensored('weibull', data);
    expect(single.ok && f.logLikelihood - single.logLikelihood).toBeGreaterThan(10);
    // A B-life of the mixture solves F(t) = p: π F1 + (1 - π) F2 = 0.1.
    const b10 = mixtureQuantile(f.parameters, 0.1);
    const p = f.parameters;
    const F = p.fraction * -Math.expm1(-((b10 / p.scale1) ** p.shape1)) + (1 - p.fraction) * -Math.expm1(-((b10 / p.scale2) ** p.shape2));
    expect(F).toBeCloseTo(0.1, 12);
  });

  it('one Weibull population: the mixture is flagged as not identified', () => {
    const rng = createRng(9, 0);
    const x = Array.from(getFamily('weibull').random({ shape: 2, scale: 100 }, rng, 100));
    const f = fitWeibullMixture(prepareLifeData({ times: x, failed: x.map(() => 1) }));
    expect(f.ok).toBe(true);
    if (f.ok) {
      expect(f.identified).toBe(false);
      expect(f.flags.length).toBeGreaterThan(0);
    }
  });

  it('fewer than 10 failures: not tried, with the reason', () => {
    const f = fitWeibullMixture(prepareLifeData({ times: [1, 2, 3, 4, 5, 6], failed: [1, 1, 1, 1, 1, 0] }));
    expect(f.ok).toBe(false);
    if (!f.ok) expect(f.reason).toMatch(/at least 10 failures/);
  });
});
