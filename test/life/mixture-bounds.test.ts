/**
 * Mixture B-life bounds (core/life/mixture-bounds.ts): on an invented seeded two-subpopulation sample
 * (scripts/fixtures/life-mixture-bounds.py -> test/fixtures/life-mixture-bounds.json) the EM fit
 * against an independent SciPy minimize + mpmath score root (1e-6), and B10 with its two-sided 90 %
 * Fisher-matrix bounds against mpmath (observed information by 30-digit numerical second derivatives,
 * gradient of ln B10 through its defining equation), 1e-5; no bound when the components are not identified.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeRecordedLife, fitWeibullMixture, mixtureBLife, prepareLifeData } from '../../core/life/index.js';

const fx = JSON.parse(readFileSync(join(process.cwd(), 'test', 'fixtures', 'life-mixture-bounds.json'), 'utf8')) as {
  times: number[];
  failed: number[];
  parameters: Record<string, number>;
  logLikelihood: number;
  b10: number;
  b10Fisher90: [number, number];
};
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('mixture B-life bounds (Fisher matrix)', () => {
  const data = prepareLifeData({ times: fx.times, failed: fx.failed });
  const fit = fitWeibullMixture(data);
  if (!fit.ok) throw new Error(fit.reason);

  it('the EM fit is the maximum SciPy + mpmath find (1e-6)', () => {
    expect(fit.identified).toBe(true);
    for (const k of ['fraction', 'shape1', 'scale1', 'shape2', 'scale2'] as const) expect(rel(fit.parameters[k], fx.parameters[k]!)).toBeLessThan(1e-6);
    expect(Math.abs(fit.logLikelihood - fx.logLikelihood)).toBeLessThan(1e-6);
  });

  it('B10 and its two-sided 90 % bounds as mpmath’s delta method (1e-5)', () => {
    const b = mixtureBLife(fit, data, 10, 0.9);
    expect(b.boundsFound).toBe(true);
    expect(rel(b.estimate, fx.b10)).toBeLessThan(1e-7);
    expect(rel(b.lower, fx.b10Fisher90[0])).toBeLessThan(1e-5);
    expect(rel(b.upper, fx.b10Fisher90[1])).toBeLessThan(1e-5);
    const r = analyzeRecordedLife({ times: fx.times, failed: fx.failed }, { families: ['weibull'], bLifePercents: [10] });
    const m = r.candidates.find((c) => c.family === 'weibull-mixture')!;
    expect(m.bLives[0]!.lower).toBeCloseTo(b.lower, 9);
    expect(m.bLives[0]!.method).toMatch(/Fisher matrix/);
  });

  it('no bound when the components are not identified', () => {
    const b = mixtureBLife({ ...fit, identified: false }, data, 10, 0.9);
    expect(b.boundsFound).toBe(false);
    expect(Number.isNaN(b.lower)).toBe(true);
    expect(b.method).toMatch(/not identified/);
  });
});
