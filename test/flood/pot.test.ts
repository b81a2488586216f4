/**
 * Peaks over a threshold (core/flood/pot.ts) against SciPy (test/fixtures/flood-pot.json from
 * scripts/fixtures/flood-pot.py): runs declustering of an invented seeded daily series, the GPD
 * maximum-likelihood fit (SciPy genpareto.fit with floc = 0, then a tight Nelder–Mead), return
 * levels and the profile-likelihood interval of the 100-year level (SciPy minimize_scalar + brentq).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { declusterRuns, fitGpdLMoments, gpdReturnLevel, peaksOverThreshold, thresholdDiagnostics } from '../../core/flood/pot.js';
import { sampleLMoments } from '../../core/lmoments/sample-lmoments.js';

const FIX = JSON.parse(readFileSync(new URL('../fixtures/flood-pot.json', import.meta.url), 'utf8')) as {
  values: number[];
  threshold: number;
  minSeparation: number;
  clusters: number;
  tight: { shape: number; scale: number; logLikelihood: number };
  scipyFit: { shape: number; scale: number };
  years: number;
  rate: number;
  returnLevels: Record<string, number>;
  profile100: { lower: number; upper: number };
};
const times = FIX.values.map((_, i) => i);

describe('peaks over a threshold vs SciPy genpareto', () => {
  const r = peaksOverThreshold(times, FIX.values, { threshold: FIX.threshold, minSeparation: FIX.minSeparation, periods: [10, 50, 100], years: FIX.years });
  it('runs declustering gives the same number of cluster peaks and rate', () => {
    expect(r.exceedances).toBe(FIX.clusters);
    expect(r.rate).toBeCloseTo(FIX.rate, 12);
  });
  it('ML fit: the tight optimum to 1e-6 relative (Nelder–Mead xatol 1e-12 on a flat surface); log-likelihood to 1e-9', () => {
    expect(Math.abs(r.fit.scale / FIX.tight.scale - 1)).toBeLessThan(1e-6);
    expect(Math.abs(r.fit.shape - FIX.tight.shape)).toBeLessThan(1e-6);
    expect(Math.abs((r.fit.logLikelihood as number) - FIX.tight.logLikelihood)).toBeLessThan(1e-9 * Math.abs(FIX.tight.logLikelihood));
    // At least as high as SciPy's own fit's likelihood (SciPy stops earlier).
    expect(Math.abs(r.fit.shape - FIX.scipyFit.shape)).toBeLessThan(1e-4);
  });
  it('return levels and the profile-likelihood interval of the 100-year level', () => {
    for (const rl of r.returnLevels) expect(Math.abs(rl.estimate / (FIX.returnLevels[String(rl.period)] as number) - 1)).toBeLessThan(1e-6);
    const r100 = r.returnLevels.find((x) => x.period === 100)!;
    expect(Math.abs((r100.lower as number) / FIX.profile100.lower - 1)).toBeLessThan(1e-5);
    expect(Math.abs((r100.upper as number) / FIX.profile100.upper - 1)).toBeLessThan(1e-5);
    expect(r100.method).toMatch(/profile likelihood/);
  });
});

describe('parts', () => {
  it('declustering by hand: exceedances closer than the separation form one cluster, its maximum kept', () => {
    const c = declusterRuns([1, 2, 3, 10, 11, 30], [5, 9, 6, 7, 2, 8], 4, 3);
    expect(c.map((k) => [k.time, k.peak, k.size])).toEqual([[2, 9, 3], [10, 7, 1], [30, 8, 1]]);
  });
  it('L-moments with the bound known reproduce l1 = α/(1 + k) and l2 = α/((1 + k)(2 + k)) (Hosking & Wallis 1997 A.5)', () => {
    const y = [0.5, 1.2, 2.0, 0.3, 4.1, 0.9, 1.7, 2.6, 0.2, 3.3];
    const f = fitGpdLMoments(y);
    const lm = sampleLMoments(Float64Array.from(y).sort());
    const k = -f.shape;
    expect(f.scale / (1 + k)).toBeCloseTo(lm.l1, 12);
    expect(f.scale / ((1 + k) * (2 + k))).toBeCloseTo(lm.l2, 12);
  });
  it('return level: exponential limit u + σ ln(λT) at ξ = 0', () => {
    expect(gpdReturnLevel(10, 2, 0, 100)).toBeCloseTo(10 + 2 * Math.log(100), 12);
    expect(gpdReturnLevel(10, 2, 1e-9, 100)).toBeCloseTo(10 + 2 * Math.log(100), 6);
  });
  it('threshold diagnostics: mean excess and the ML shape across thresholds', () => {
    const d = thresholdDiagnostics(times, FIX.values, [20, 25, 30], FIX.minSeparation);
    expect(d).toHaveLength(3);
    expect(d[1]!.clusters).toBe(FIX.clusters);
    expect(d[1]!.shape).toBeCloseTo(FIX.tight.shape, 5);
  });
});
