/**
 * Peaks over a threshold (core/flood/pot.ts) on a published worked example: Coles (2001), An
 * Introduction to Statistical Modeling of Extreme Values, §4.4.1, daily rainfall in south-west
 * England 1914–1962 above 30 mm, no declustering.
 *
 * Sources beside each check:
 * - the data: test/fixtures/coles-rain.csv, the book's open `rain` dataset as published in plain
 *   text (jojal5/Extremes.jl data/rain.csv at 4a52fde4…, transcribed byte for byte; its sha256 is
 *   checked here and by the generator);
 * - Coles's printed numbers FROM MEMORY (the book was not available): 152 exceedances,
 *   σ = 7.44, ξ = 0.184, 100-year return level 106.3 mm — checked at their printed rounding;
 * - SciPy `genpareto.fit` (floc = 0) refined by Nelder–Mead, its log-likelihood, the return levels
 *   and their 95 % profile-likelihood intervals (test/fixtures/pot-coles-rain.json from
 *   scripts/fixtures/pot-coles-rain.py, gpd_reference.py).
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { peaksOverThreshold, thresholdDiagnostics } from '../../core/flood/pot.js';

const FIX = JSON.parse(readFileSync('test/fixtures/pot-coles-rain.json', 'utf8')) as {
  data: { sha256: string; days: number };
  threshold: number;
  daysPerYear: number;
  exceedances: number;
  zeta: number;
  tight: { shape: number; scale: number; logLikelihood: number };
  scipyFit: { shape: number; scale: number };
  returnLevels: Record<string, { estimate: number; profileLower: number; profileUpper: number }>;
  colesFromMemory: { exceedances: number; scale: number; shape: number; returnLevel100: number };
  diagnostics: { threshold: number; exceedances: number; meanExcess: number; shape: number; modifiedScale: number }[];
};
const raw = readFileSync('test/fixtures/coles-rain.csv');
const lines = raw.toString('ascii').split('\n');
const values = lines.slice(1).filter((l) => l !== '').map(Number);
const times = values.map((_, i) => i);
// Coles's N-year level: N·n_y·ζ_u expected exceedances, n_y = 365 days a year, ζ_u = k/n; as a rate per year that is
// k/(n/365) with the record taken as n/365 years.
const r = peaksOverThreshold(times, values, { threshold: FIX.threshold, minSeparation: 0, periods: [10, 100], years: values.length / FIX.daysPerYear, confidence: 0.95 });

describe('Coles (2001) §4.4.1: daily rainfall above 30 mm', () => {
  it('the transcribed series is the committed one (sha256) with its 17,531 days', () => {
    expect(createHash('sha256').update(raw).digest('hex')).toBe(FIX.data.sha256);
    expect(lines[0]).toBe('Rainfall');
    expect(values.length).toBe(FIX.data.days);
    expect(values.every((v) => Number.isFinite(v) && v >= 0)).toBe(true);
  });

  it('152 exceedances of 30 mm (Coles, from memory), each day its own exceedance (minimum separation 0)', () => {
    expect(r.exceedances).toBe(FIX.colesFromMemory.exceedances);
    expect(r.exceedances).toBe(FIX.exceedances);
    expect(r.rate * (values.length / FIX.daysPerYear)).toBeCloseTo(152, 10);
  });

  it('ML fit: SciPy genpareto (tight optimum) to 1e-6, log-likelihood to 1e-9 relative', () => {
    expect(Math.abs(r.fit.scale / FIX.tight.scale - 1)).toBeLessThan(1e-6);
    expect(Math.abs(r.fit.shape - FIX.tight.shape)).toBeLessThan(1e-6);
    expect(Math.abs((r.fit.logLikelihood as number) / FIX.tight.logLikelihood - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.fit.shape - FIX.scipyFit.shape)).toBeLessThan(1e-4);
  });

  it("ML fit: Coles's σ = 7.44 and ξ = 0.184 (from memory) at their printed rounding", () => {
    expect(Math.abs(r.fit.scale - FIX.colesFromMemory.scale)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(r.fit.shape - FIX.colesFromMemory.shape)).toBeLessThanOrEqual(0.0005);
  });

  it("return levels: SciPy's to 1e-6, Coles's 100-year level 106.3 mm (from memory) at its rounding; 95 % profile intervals to 1e-5", () => {
    for (const rl of r.returnLevels) {
      const ref = FIX.returnLevels[String(rl.period)]!;
      expect(Math.abs(rl.estimate / ref.estimate - 1)).toBeLessThan(1e-6);
      expect(Math.abs((rl.lower as number) / ref.profileLower - 1)).toBeLessThan(1e-5);
      expect(Math.abs((rl.upper as number) / ref.profileUpper - 1)).toBeLessThan(1e-5);
      expect(rl.method).toMatch(/profile likelihood \(95 %\)/);
    }
    const r100 = r.returnLevels.find((x) => x.period === 100)!;
    expect(Math.abs(r100.estimate - FIX.colesFromMemory.returnLevel100)).toBeLessThanOrEqual(0.05);
    // The interval is strongly asymmetric (a heavy upper tail, ξ > 0): far more room above the estimate than below.
    expect((r100.upper as number) - r100.estimate).toBeGreaterThan(2 * (r100.estimate - (r100.lower as number)));
  });

  it('threshold diagnostics at 10, 20, 30, 40 mm: counts and mean excesses exact (NumPy), ML shape and modified scale σ − ξu to 1e-5 of SciPy', () => {
    const d = thresholdDiagnostics(times, values, FIX.diagnostics.map((x) => x.threshold), 0);
    d.forEach((row, i) => {
      const ref = FIX.diagnostics[i]!;
      expect(row.clusters).toBe(ref.exceedances);
      expect(Math.abs(row.meanExcess / ref.meanExcess - 1)).toBeLessThan(1e-12);
      expect(Math.abs((row.shape as number) - ref.shape)).toBeLessThan(1e-5);
      expect(Math.abs((row.modifiedScale as number) - ref.modifiedScale)).toBeLessThan(1e-5 * Math.max(1, Math.abs(ref.modifiedScale)));
    });
  });
});
