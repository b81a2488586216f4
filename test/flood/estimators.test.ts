/**
 * The flood section's estimators beside maximum likelihood (core/workflow/flood-estimators.ts) on
 * the invented river-peaks demo, through the dataset pipeline (analyzeDataset), against
 * test/fixtures/flood-estimators.json (scripts/fixtures/flood-estimators.py: NumPy/SciPy, coded
 * independently of the TypeScript):
 * - log-Pearson III by EMA on a systematic record without low outliers = the moments of log10 Q
 *   (NumPy mean, ddof=1 sd, SciPy skew(bias=False) = the Bulletin's station skew), flows by SciPy
 *   pearson3.isf; the station-skew MSE (Griffis & Stedinger 2009, Bulletin 17C) and the MSE weighting with a regional skew;
 * - sample L-moments from exact binomial PWM weights; L-moment fits (Hosking & Wallis 1997 App. A
 *   coded in Python) and their levels by SciPy's gumbel_r, genextreme, genpareto, pearson3 and the
 *   generalized logistic quantile written out; Pearson III from the exact τ3 by quadrature.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, InputError, readColumns, type DatasetReport, type NumberColumn } from '../../core/index.js';
import type { FloodEmaBlock, FloodLMomentBlock } from '../../core/workflow/flood-estimators.js';

const fx = JSON.parse(readFileSync('test/fixtures/flood-estimators.json', 'utf8'));
const flows = Array.from((readColumns(readFileSync('datasets/river-peaks.csv', 'utf8'), [{ select: 'peak_flow_m3s', kind: 'number' }]).columns[0] as NumberColumn).values);
const periods: number[] = fx.periods;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const run = (opts: Record<string, unknown>) => analyzeDataset({ values: flows }, { returnPeriods: periods, families: ['gumbel', 'gev'], seed: 7, ...opts }) as DatasetReport;

describe('log-Pearson III by EMA in the flood section (estimation ema)', () => {
  const r = run({ estimation: 'ema' });
  const ema = r.flood!.estimators!.ema as FloodEmaBlock;

  it('systematic record, no low outliers: the moments of log10 Q and SciPy pearson3 flows (rel ≤ 1e-12)', () => {
    expect(ema.applicable).toBe(true);
    expect(ema.counts.lowOutliers).toBe(0);
    expect(rel(ema.parameters.mean, fx.lp3.mean)).toBeLessThan(1e-13);
    expect(rel(ema.parameters.sd, fx.lp3.sd)).toBeLessThan(1e-13);
    expect(rel(ema.skew.stationSkew, fx.lp3.stationSkew)).toBeLessThan(1e-12);
    expect(rel(ema.skew.stationSkewMse, fx.lp3.stationSkewMse)).toBeLessThan(1e-12);
    ema.returnLevels.forEach((l, i) => expect(rel(l.estimate, fx.lp3.station[i].flow)).toBeLessThan(1e-12));
  });

  it('every level names its estimator; intervals bracket the estimate; the report carries the cautions and the method note', () => {
    expect(ema.estimation).toBe('ema');
    expect(ema.logLikelihood).toBeNull();
    for (const l of ema.returnLevels) {
      expect(l.lower!).toBeLessThan(l.estimate);
      expect(l.upper!).toBeGreaterThan(l.estimate);
    }
    expect(ema.intervalMethod).toMatch(/Cohn, Lane & Stedinger 2001/);
    expect(ema.bootstrapMethod).toMatch(/parametric bootstrap/);
    for (const l of ema.returnLevels) {
      expect(l.bootstrapLower!).toBeLessThan(l.estimate);
      expect(l.bootstrapUpper!).toBeGreaterThan(l.estimate);
      // A systematic record with no low outliers: the equivalent length of the quantile is at most the record's
      // (the skew's uncertainty adds variance), and the skew's effective record length is the record's.
      expect(l.equivalentYears).toBeLessThanOrEqual(ema.counts.years);
    }
    expect(ema.effectiveRecordLength!).toBeCloseTo(ema.counts.years, 6);
    expect(ema.cautions.join(' ')).toMatch(/licensed engineer/);
    expect(r.methods.map((m) => m.topic)).toContain('log-Pearson III by EMA');
    expect(r.flood!.estimators!.requested).toBe('ema');
  });

  it('a regional skew is weighted by inverse MSEs (Griffis & Stedinger station-skew MSE; fixture weights), levels by SciPy at the weighted skew', () => {
    const w = run({ estimation: 'ema', regionalSkew: -0.1, regionalSkewMse: 0.12 }).flood!.estimators!.ema as FloodEmaBlock;
    expect(rel(w.parameters.skew, fx.lp3.regional.weightedSkew)).toBeLessThan(1e-12);
    expect(rel(w.skew.stationWeight, fx.lp3.regional.stationWeight)).toBeLessThan(1e-12);
    w.returnLevels.forEach((l, i) => expect(rel(l.estimate, fx.lp3.regional.levels[i].flow)).toBeLessThan(1e-12));
  });

  it('refuses a regional skew without its MSE, with lmoments, or without ema', () => {
    const quick = (o: Record<string, unknown>) => run({ families: ['gumbel'], ...o });
    expect(() => quick({ estimation: 'ema', regionalSkew: -0.1 })).toThrow(InputError);
    expect(() => quick({ estimation: 'lmoments', regionalSkew: -0.1, regionalSkewMse: 0.1 })).toThrow(/ema, not lmoments/);
    expect(() => quick({ regionalSkew: -0.1, regionalSkewMse: 0.1 })).toThrow(/ask for estimation ema/);
  });

  it('two planted drought years: the multiple Grubbs–Beck test censors them below the smallest retained peak, and the bootstrap intervals still bracket each level', () => {
    const dry = flows.map((q, i) => (i === 10 ? 9 : i === 30 ? 14 : q));
    const e = (analyzeDataset({ values: dry }, { returnPeriods: [10, 100], families: ['gumbel'], estimation: 'ema', seed: 2 }) as DatasetReport).flood!.estimators!.ema as FloodEmaBlock;
    expect(e.lowOutliers.count).toBe(2);
    const retained = dry.filter((q) => q !== 9 && q !== 14);
    expect(e.lowOutliers.threshold).toBe(Math.min(...retained));
    expect(e.counts.years).toBe(60);
    expect(e.iterations).toBeGreaterThan(1);
    for (const l of e.returnLevels) {
      expect(l.lower!).toBeLessThan(l.estimate);
      expect(l.upper!).toBeGreaterThan(l.estimate);
    }
  });

  it('a column far longer than any annual-peak record (1001 values) is not fitted by EMA, with the reason, before any simulation', () => {
    const long = Array.from({ length: 1001 }, (_, i) => flows[i % flows.length]! + (i % 7));
    const e = (analyzeDataset({ values: long }, { returnPeriods: [10], families: ['gumbel'], estimation: 'ema', seed: 1 }) as DatasetReport).flood!.estimators!;
    expect(e.ema!.applicable).toBe(false);
    expect(e.warnings.join(' ')).toMatch(/at most 1000 known peaks \(got 1001\)/);
  });

  it('negative flows: EMA not applicable, said with the reason (the L-moment fits still run)', () => {
    const r2 = analyzeDataset({ values: flows.map((q, i) => (i === 3 ? -q : q)) }, { returnPeriods: [10, 100], families: ['gumbel'], estimation: 'ema', seed: 1 }) as DatasetReport;
    const e = r2.flood!.estimators!;
    expect(e.ema!.applicable).toBe(false);
    expect(e.warnings.join(' ')).toMatch(/value 4 is -/);
    expect(e.lmoments.applicable).toBe(true);
  });
});

describe('L-moment fits in the flood section (estimation lmoments)', () => {
  const r = run({ estimation: 'lmoments' });
  const lm = r.flood!.estimators!.lmoments as FloodLMomentBlock;

  it('sample L-moments equal the exact-weight PWM computation (rel ≤ 1e-12)', () => {
    expect(rel(lm.sample.l1, fx.lmoments.l1)).toBeLessThan(1e-13);
    expect(rel(lm.sample.l2, fx.lmoments.l2)).toBeLessThan(1e-12);
    expect(rel(lm.sample.t3, fx.lmoments.t3)).toBeLessThan(1e-11);
    expect(rel(lm.sample.t4, fx.lmoments.t4)).toBeLessThan(1e-11);
    expect(lm.diagram.sample.t3).toBe(lm.sample.t3);
  });

  it('levels of the Gumbel, GEV, generalized logistic and generalized Pareto fits equal SciPy on the Python fits (rel ≤ 1e-10)', () => {
    for (const fam of ['gumbel', 'gev', 'genlogistic', 'genpareto'] as const) {
      const fit = lm.fits.find((f) => f.family === fam)!;
      fit.returnLevels.forEach((l, i) => expect(rel(l.estimate, fx.lmoments.levels[fam][i])).toBeLessThan(1e-10));
    }
  });

  it("Pearson III levels within 1e-5 of the exact-τ3 fit (Hosking's rational approximation of the shape, Hosking & Wallis 1997 A.9)", () => {
    const fit = lm.fits.find((f) => f.family === 'pearson3')!;
    fit.returnLevels.forEach((l, i) => expect(rel(l.estimate, fx.lmoments.levels.pearson3[i])).toBeLessThan(1e-5));
  });

  it('point estimates only, each named lmoments with no likelihood; no EMA block unless asked; the ML candidates are untouched', () => {
    for (const f of lm.fits) {
      expect(f.estimation).toBe('lmoments');
      expect(f.logLikelihood).toBeNull();
      expect(f.returnLevels.every((l) => l.lower === null && l.upper === null)).toBe(true);
    }
    expect(lm.intervalMethod).toMatch(/point estimates/);
    expect(r.flood!.estimators!.ema).toBeNull();
    const ml = run({});
    expect(ml.flood!.estimators).toBeUndefined();
    expect(r.candidates.map((c) => c.returnLevels)).toEqual(ml.candidates.map((c) => c.returnLevels));
  });
});
