import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { createRng } from '../../core/random/index.js';
import { analyzeRecordedLife, fitInterval, prepareIntervalLifeData } from '../../core/life/index.js';
import { readFixture, rel } from '../helpers/fixtures.js';

// Fixtures: scripts/fixtures/life-interval.py (inspection data, SciPy CensoredData refined by
// mpmath) and scripts/fixtures/life.py (NIST/SEMATECH e-Handbook §8.4.1.3).
const fx = readFixture('life-interval.json');
const life = readFixture('life.json');
const insp = { start: fx.inspection.start, end: fx.inspection.end.map((v: number | null) => v ?? Number.POSITIVE_INFINITY), counts: fx.inspection.count };

describe('analyzeRecordedLife: the report for life data as recorded', () => {
  const rep = analyzeRecordedLife({ interval: insp }, { reliabilityTimes: [1000], mixture: false });

  it('counts the units by kind and keeps family, parameters and logLikelihood on each candidate (ML, ranked by AICc)', () => {
    expect([rep.n, rep.exact, rep.left, rep.interval, rep.right]).toEqual([80, 8, 15, 48, 9]);
    expect(rep.estimation).toBe('ml');
    expect(rep.candidates.map((c) => c.rank)).toEqual([1, 2, 3, 4, 5]);
    for (let i = 1; i < rep.candidates.length; i++) expect(rep.candidates[i]!.aicc).toBeGreaterThanOrEqual(rep.candidates[i - 1]!.aicc);
    for (const c of rep.candidates) {
      expect(c.estimation).toBe('ml');
      const ref = fx.inspection.fits[c.family];
      // The same tightly solved reference as the fit test (≤ 1e-6).
      for (const [k, v] of Object.entries(ref.parameters as Record<string, number>)) expect(rel(c.parameters[k] as number, v)).toBeLessThan(1e-6);
      expect(rel(c.logLikelihood, ref.logLikelihood)).toBeLessThan(1e-9);
      expect(c.bLives[0]!.method).toMatch(/likelihood ratio/);
    }
    const wb = rep.candidates.find((c) => c.family === 'weibull')!;
    expect(rel(wb.bLives[0]!.lower, fx.inspection.weibullProfileBounds.b10.lower)).toBeLessThan(1e-6);
    expect(rel(wb.reliability[0]!.upper, fx.inspection.weibullProfileBounds.reliability.upper)).toBeLessThan(1e-6);
  });

  it('carries the Turnbull boxes, the interval caution and the safety caution', () => {
    expect(rep.turnbull.converged).toBe(true);
    expect(rep.turnbull.intervals.reduce((s, iv) => s + iv.mass, 0)).toBeCloseTo(1, 12);
    expect(rep.cautions.some((c) => /known only to an inspection interval/.test(c))).toBe(true);
    expect(rep.cautions.some((c) => /licensed practice/.test(c))).toBe(true);
    expect(rep.methods.map((m) => m.topic)).toContain('nonparametric');
  });

  it('rank regression names its estimator on every number, gives no bounds, and refuses interval rows', () => {
    const rr = analyzeRecordedLife({ times: life.nist.times, failed: life.nist.failed }, { estimation: 'rank-regression', reliabilityTimes: [300] });
    expect(rr.rankedBy).toMatch(/correlation/);
    expect(rr.notFitted.map((n) => n.family)).toEqual(['gamma']);
    for (const c of rr.candidates) {
      expect(c.estimation).toBe('rank-regression');
      expect(c.bLives[0]!.boundsFound).toBe(false);
      expect(c.bLives[0]!.method).toMatch(/rank-regression/);
      expect(Number.isNaN(c.reliability[0]!.lower)).toBe(true);
    }
    for (let i = 1; i < rr.candidates.length; i++) expect(rr.candidates[i]!.correlation!).toBeLessThanOrEqual(rr.candidates[i - 1]!.correlation!);
    expect(rr.warnings.join(' ')).toMatch(/maximum likelihood remains the default/);
    expect(() => analyzeRecordedLife({ interval: insp }, { estimation: 'rank-regression' })).toThrow(/Rank regression needs exact failure times/);
  });

  it('an assumed shape adds Weibayes and says the shape is assumed; on interval rows by likelihood (weibayes-interval.test.ts)', () => {
    const r = analyzeRecordedLife({ times: [500, 800, 1200, 1500], failed: [0, 0, 0, 0] }, { assumedShape: 2 });
    expect(r.weibayes).not.toBeNull();
    expect(r.weibayes!.scale).toBeNull();
    expect(r.candidates).toEqual([]);
    expect(r.notFitted.length).toBe(6);
    expect(r.cautions.join(' ')).toMatch(/ASSUMED/);
    expect(analyzeRecordedLife({ interval: insp }, { assumedShape: 2, replicates: 0, mixture: false }).weibayes!.method).toMatch(/inspection intervals/);
  });

  it('a mode column adds the modes and the system; the mixture is ranked as a candidate beside the families', () => {
    const rng = createRng(21, 0);
    const n = 400;
    const a = getFamily('weibull').random({ shape: 1, scale: 200 }, rng, n);
    const b = getFamily('weibull').random({ shape: 4, scale: 1500 }, rng, n);
    const times: number[] = [];
    const failed: number[] = [];
    const modes: string[] = [];
    for (let i = 0; i < n; i++) {
      const early = rng.uniform() < 0.3;
      const x = early ? (a[i] as number) : (b[i] as number);
      times.push(Math.min(x, 2500));
      failed.push(x < 2500 ? 1 : 0);
      modes.push(early ? 'infant' : 'wear');
    }
    const r = analyzeRecordedLife({ times, failed, modes }, { families: ['weibull', 'lognormal'] });
    expect(r.modes!.modes.map((m) => m.mode)).toEqual(['infant', 'wear']);
    expect(r.modes!.system).not.toBeNull();
    const mix = r.candidates.find((c) => c.family === 'weibull-mixture');
    expect(mix).toBeDefined();
    expect(mix!.identified).toBe(true);
    expect(mix!.rank).toBe(1);
    // An identified mixture's B-lives carry Fisher-matrix bounds (mixture-bounds.ts; checked in mixture-bounds.test.ts).
    expect(mix!.bLives[0]!.method).toMatch(/Fisher matrix/);
    expect(mix!.bLives[0]!.lower).toBeLessThan(mix!.bLives[0]!.estimate);
  });

  it('time + status and the same data as interval rows give the same ML candidates', () => {
    const a = analyzeRecordedLife({ times: life.nist.times, failed: life.nist.failed }, { mixture: false });
    const d = prepareIntervalLifeData({ start: life.nist.times, end: life.nist.times.map((t: number, i: number) => (life.nist.failed[i] ? t : Number.NaN)) });
    for (const c of a.candidates) {
      const f = fitInterval(c.family as 'weibull', d);
      expect(f.ok && f.logLikelihood).toBe(c.logLikelihood);
    }
  });
});

describe('recordedLifeExtras (the workflow hook)', () => {
  it('runs by default for small samples, not for large ones unless asked; a plan needs a time and a shape', async () => {
    const { recordedLifeExtras, MIXTURE_UNITS } = await import('../../core/life/index.js');
    const small = recordedLifeExtras({ times: life.nist.times, failed: life.nist.failed }, {});
    expect(small?.report?.candidates.length).toBeGreaterThan(0);
    expect(small?.plan).toBeNull();
    const n = MIXTURE_UNITS + 1;
    const big = { times: Array.from({ length: n }, (_, i) => 1 + i), failed: Array.from({ length: n }, (_, i) => i % 2) };
    expect(recordedLifeExtras(big, {})).toBeNull();
    const asked = recordedLifeExtras({ times: life.nist.times, failed: life.nist.failed }, { assumedShape: 2, planReliability: 0.9, planTime: 100 });
    expect(asked?.report?.weibayes?.shape).toBe(2);
    expect(asked?.plan?.rows.find((r) => r.timeRatio === 1)?.unitsBinomial).toBe(22);
  });
});
