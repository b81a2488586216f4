/**
 * Failure modes on interval rows (core/life/competing-modes.ts analyzeIntervalModes): each mode's
 * Weibull against SciPy weibull_min.fit(CensoredData) refined by mpmath on the same rows (another
 * mode's failure suspended at its row's start), the system B10 and reliabilities against SciPy sf
 * products and brentq (scripts/fixtures/life-modes-interval.py -> test/fixtures/life-modes-interval.json);
 * exact and right rows give the times-and-status analysis; bad mode rows are named.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeIntervalModes, analyzeModes, analyzeRecordedLife } from '../../core/life/index.js';

interface Fx {
  rows: { start: number; end: number | null; mode: string | null; count: number }[];
  modes: Record<string, { parameters: { shape: number; scale: number }; logLikelihood: number; failures: number; b10: number }>;
  system: { b10: number; reliabilityAt50: number; reliabilityAt100: number; b10LikelihoodRatio90: [number, number]; b10Fisher90: [number, number] };
}
const fx = JSON.parse(readFileSync(join(process.cwd(), 'test', 'fixtures', 'life-modes-interval.json'), 'utf8')) as Fx;
const INF = Number.POSITIVE_INFINITY;
const input = {
  interval: { start: fx.rows.map((r) => r.start), end: fx.rows.map((r) => r.end ?? INF), counts: fx.rows.map((r) => r.count) },
  modes: fx.rows.map((r) => r.mode),
};
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('failure modes on interval rows', () => {
  const rep = analyzeIntervalModes(input, { family: 'weibull', bLifePercents: [10], reliabilityTimes: [50, 100] });

  it('each mode: Weibull parameters and log-likelihood as SciPy CensoredData refined by mpmath (1e-6)', () => {
    expect(rep.modes.map((m) => m.mode)).toEqual(['A', 'B']);
    for (const m of rep.modes) {
      const ref = fx.modes[m.mode]!;
      expect(m.failures).toBe(ref.failures);
      expect(m.suspensions).toBe(80 - ref.failures);
      expect(rel(m.parameters!.shape!, ref.parameters.shape)).toBeLessThan(1e-6);
      expect(rel(m.parameters!.scale!, ref.parameters.scale)).toBeLessThan(1e-6);
      expect(Math.abs(m.candidates[0]!.logLikelihood - ref.logLikelihood)).toBeLessThan(1e-6);
      expect(rel(m.bLives[0]!.estimate, ref.b10)).toBeLessThan(1e-6);
      // Likelihood-ratio bounds on the mode's own likelihood bracket the estimate.
      expect(m.bLives[0]!.lower).toBeLessThan(m.bLives[0]!.estimate);
      expect(m.bLives[0]!.upper).toBeGreaterThan(m.bLives[0]!.estimate);
    }
  });

  it('the system: B10 and reliabilities as the product of SciPy sf (brentq root), 1e-6', () => {
    expect(rel(rep.system!.bLives[0]!.estimate, fx.system.b10)).toBeLessThan(1e-6);
    expect(rel(rep.system!.reliability[0]!.estimate, fx.system.reliabilityAt50)).toBeLessThan(1e-6);
    expect(rel(rep.system!.reliability[1]!.estimate, fx.system.reliabilityAt100)).toBeLessThan(1e-6);
    expect(rep.method).toMatch(/suspended at the last inspection/);
  });

  it('system B10 bounds: likelihood ratio as an independent SciPy profile over (hazard split, both shapes) with brentq, Fisher as mpmath derivatives (1e-5)', () => {
    const b = rep.system!.bLives[0]!;
    expect(b.boundsFound).toBe(true);
    expect(b.method).toMatch(/likelihood ratio/);
    expect(rel(b.lower, fx.system.b10LikelihoodRatio90[0])).toBeLessThan(1e-5);
    expect(rel(b.upper, fx.system.b10LikelihoodRatio90[1])).toBeLessThan(1e-5);
    const fm = analyzeIntervalModes(input, { family: 'weibull', bLifePercents: [10], boundMethod: 'fisher-matrix' }).system!.bLives[0]!;
    expect(fm.method).toMatch(/Fisher/);
    expect(rel(fm.lower, fx.system.b10Fisher90[0])).toBeLessThan(1e-5);
    expect(rel(fm.upper, fx.system.b10Fisher90[1])).toBeLessThan(1e-5);
  });

  it('with exact and right rows only it is the times-and-status analysis (two codings of one likelihood)', () => {
    const times = [12, 30, 45, 45, 60, 71, 80, 95, 100, 100, 100, 22, 54, 88];
    const failed = [1, 1, 1, 1, 1, 1, 1, 1, 0, 0, 0, 1, 1, 1];
    const modes = ['a', 'b', 'a', 'a', 'b', 'a', 'b', 'a', null, null, null, 'b', 'a', 'a'];
    const a = analyzeModes({ times, failed, modes }, { family: 'weibull' });
    const b = analyzeIntervalModes({ interval: { start: times, end: times.map((t, i) => (failed[i] ? t : INF)) }, modes }, { family: 'weibull' });
    for (let k = 0; k < 2; k++) {
      expect(rel(b.modes[k]!.parameters!.scale!, a.modes[k]!.parameters!.scale!)).toBeLessThan(1e-6);
      expect(rel(b.modes[k]!.parameters!.shape!, a.modes[k]!.parameters!.shape!)).toBeLessThan(1e-6);
    }
    expect(rel(b.system!.bLives[0]!.estimate, a.system!.bLives[0]!.estimate)).toBeLessThan(1e-6);
  });

  it('a failed row without a mode is named by its line; the recorded-life report carries the modes', () => {
    expect(() => analyzeIntervalModes({ interval: { start: [0, 10, 20], end: [10, 20, INF], lines: [2, 3, 4] }, modes: ['x', null, null] })).toThrow(/Row 3 failed but has no failure mode/);
    const r = analyzeRecordedLife({ interval: input.interval, modes: input.modes }, { families: ['weibull'], replicates: 0, mixture: false });
    expect(r.modes!.modes.map((m) => m.mode)).toEqual(['A', 'B']);
    expect(rel(r.modes!.system!.bLives[0]!.estimate, fx.system.b10)).toBeLessThan(1e-6);
  });
});
