import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fitGev, getFamily, gumbel } from '../../core/families/index.js';
import { exceedanceRisk, periodForRisk, plottingPositions, returnLevels } from '../../core/flood/index.js';
import { prepareSample } from '../../core/sample.js';
import { readFixture, relFloored as rel } from '../helpers/fixtures.js';

// Reference values: scripts/fixtures/flood.py (SciPy 1.17.1: fitted isf(1/T); profile-likelihood
// intervals by scipy.optimize Nelder–Mead inner maxima and brentq on the deviance).
const fx = readFixture('flood.json');
const periods = [2, 10, 50, 100, 1000];

function fitOf(f: { family: string; values: number[] }) {
  const s = prepareSample(f.values);
  const r = f.family === 'gev' ? fitGev(s) : gumbel.fit(s);
  if (!r.ok) throw new Error('fit failed');
  return { s, r };
}

describe('return levels with profile-likelihood intervals (Coles 2001 §3.3.3)', () => {
  for (const f of fx.fits) {
    it(`${f.name}: estimate = fitted isf(1/T), profile ends match the SciPy fixture`, () => {
      const { s, r } = fitOf(f);
      const rep = returnLevels(s, r, periods, { level: 0.95 });
      expect(rep.levels.map((l) => l.period)).toEqual(periods);
      for (let i = 0; i < periods.length; i++) {
        const l = rep.levels[i]!;
        const ref = f.returnLevels[i];
        // estimate: our MLE vs the refined one, through isf: 1e-8 relative
        expect(rel(l.estimate, ref.estimate)).toBeLessThan(1e-8);
        expect(l.method).toBe('profile');
        expect(l.lowerFound && l.upperFound).toBe(true);
        // profile ends: the fixture's inner Nelder–Mead maxima (fatol 1e-13) limit it to about
        // 1e-9; 1e-7 relative allowed.
        expect(rel(l.lower, ref.lower95)).toBeLessThan(1e-7);
        expect(rel(l.upper, ref.upper95)).toBeLessThan(1e-7);
        expect(l.lower).toBeLessThan(l.estimate);
        expect(l.upper).toBeGreaterThan(l.estimate);
      }
      expect(rep.cautions[0]).toMatch(/governing guideline/);
      if (f.family === 'gev') expect(rep.cautions.join(' ')).toMatch(/opposite sign/);
      // 1000 years exceeds twice every record here (≤ 80 years)
      expect(rep.levels[4]!.beyondRecord).toBe(true);
      expect(rep.warnings.join(' ')).toMatch(/twice the/);
    });
  }
  it('Port Pirie, delta method: 10-year 4.30 [4.19, 4.41], 100-year 4.69 [4.38, 5.00] (Coles 2001 p. 60, to the printed 2 decimals; recalled and confirmed in a public test file quoting it)', () => {
    const pp = fx.fits.find((x: { name: string }) => x.name === 'port-pirie');
    const { s, r } = fitOf(pp);
    const rep = returnLevels(s, r, [10, 100], { method: 'delta', level: 0.95 });
    const [l10, l100] = rep.levels;
    expect(l10!.method).toBe('delta');
    expect(Math.abs(l10!.estimate - 4.3)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(l10!.lower - 4.19)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(l10!.upper - 4.41)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(l100!.estimate - 4.69)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(l100!.lower - 4.38)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(l100!.upper - 5.0)).toBeLessThanOrEqual(0.01);
    // the delta-method standard error from the fixture's mpmath covariance (Coles p. 59 prints
    // the same matrix to 3 digits): ∇z_T by the closed form of the GEV quantile.
    const cov = pp.covariance as number[][];
    const { location: mu, scale: sg, shape: xi } = r.parameters as { location: number; scale: number; shape: number };
    void mu;
    const y = -Math.log1p(-1 / 100);
    const grad = [1, -(1 - Math.pow(y, -xi)) / xi, (sg * (1 - Math.pow(y, -xi))) / (xi * xi) - (sg / xi) * Math.pow(y, -xi) * Math.log(y)];
    let v = 0;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) v += grad[i]! * cov[i]![j]! * grad[j]!;
    const se = (l100!.upper - l100!.lower) / (2 * 1.959963984540054);
    expect(rel(se, Math.sqrt(v))).toBeLessThan(1e-5); // numerical Hessian in core/optimize: ~1e-6
    expect(cov[0]![0]).toBeCloseTo(0.00078, 5);
    expect(cov[2]![2]).toBeCloseTo(0.00965, 5);
  });
  it('other families get delta-method return levels (lognormal on Port Pirie); a profile request says so', () => {
    const pp = fx.fits.find((x: { name: string }) => x.name === 'port-pirie');
    const s = prepareSample(pp.values);
    const fam = getFamily('lognormal');
    const r = fam.fit(s);
    if (!r.ok) throw new Error('fit failed');
    const rep = returnLevels(s, r, [10, 100], { method: 'profile' });
    expect(rep.levels[0]!.method).toBe('delta');
    expect(rep.warnings.join(' ')).toMatch(/delta method/);
    const d = fam.make(r.parameters);
    expect(rep.levels[1]!.estimate).toBe(d.isf(0.01));
    expect(rep.levels[1]!.lower).toBeLessThan(rep.levels[1]!.estimate);
  });
});

describe('return-level properties (common practice, no source)', () => {
  const f = fx.fits.find((x: { name: string }) => x.name === 'gev-bounded-n60');
  const { s, r } = fitOf(f);
  const g = fitOf(fx.fits.find((x: { name: string }) => x.name === 'gumbel-n50'));
  it('return levels increase with the period (fast-check over periods)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1.01, max: 1e5, noNaN: true }), fc.double({ min: 1.001, max: 10, noNaN: true }), (T, k) => {
        const a = returnLevels(s, r, [T, T * k], { method: 'delta' }).levels;
        const b = returnLevels(g.s, g.r, [T, T * k], { method: 'delta' }).levels;
        return a[1]!.estimate > a[0]!.estimate && b[1]!.estimate > b[0]!.estimate;
      }),
      { numRuns: 60, seed: 4 },
    );
  });
  it('intervals contain the estimate and widen as the confidence level rises', () => {
    let prev = { lower: Number.POSITIVE_INFINITY, upper: Number.NEGATIVE_INFINITY };
    for (const level of [0.5, 0.8, 0.9, 0.95, 0.99]) {
      const l = returnLevels(g.s, g.r, [50], { level }).levels[0]!;
      expect(l.lower).toBeLessThan(l.estimate);
      expect(l.upper).toBeGreaterThan(l.estimate);
      expect(l.lower).toBeLessThan(prev.lower);
      expect(l.upper).toBeGreaterThan(prev.upper);
      prev = l;
    }
  });
  it('rejects periods ≤ 1 and bad levels', () => {
    expect(() => returnLevels(s, r, [1])).toThrow(/greater than 1/);
    expect(() => returnLevels(s, r, [])).toThrow();
    expect(() => returnLevels(s, r, [10], { level: 1 })).toThrow();
  });
});

describe('plotting positions and design-life risk', () => {
  it('Weibull i/(n+1), Gringorten (i-0.44)/(n+0.12), Cunnane (i-0.4)/(n+0.2) (formulas as published, Gringorten 1963, Cunnane 1978)', () => {
    const x = [3, 1, 2, 5, 4].sort((a, b) => a - b);
    const w = plottingPositions(x, 'weibull');
    expect(w.points.map((p) => p.nonExceedance)).toEqual([1 / 6, 2 / 6, 3 / 6, 4 / 6, 5 / 6]);
    expect(w.points[4]!.returnPeriod).toBeCloseTo(6, 12);
    const gr = plottingPositions(x, 'gringorten');
    expect(gr.points[0]!.nonExceedance).toBeCloseTo(0.56 / 5.12, 14);
    expect(gr.points[4]!.returnPeriod).toBeCloseTo(5.12 / 0.56, 12);
    const cu = plottingPositions(x, 'cunnane');
    expect(cu.points[2]!.nonExceedance).toBeCloseTo(2.6 / 5.2, 14);
    for (const pp of [w, gr, cu]) {
      for (const p of pp.points) {
        expect(p.exceedance + p.nonExceedance).toBeCloseTo(1, 14);
        expect(p.gumbelVariate).toBeCloseTo(-Math.log(-Math.log(p.nonExceedance)), 12);
      }
    }
    expect(() => plottingPositions(x, 'hazen' as never)).toThrow();
  });
  it('chance of at least one exceedance 1 - (1 - 1/T)^L (arithmetic identity, no source needed) and its inverse', () => {
    expect(exceedanceRisk(100, 50)).toBeCloseTo(1 - Math.pow(0.99, 50), 14);
    expect(exceedanceRisk(100, 100)).toBeCloseTo(0.6339676587267709, 14);
    // tiny risks keep their precision: 1 - (1 - 1e-9)^1 = 1e-9 exactly to rounding
    expect(rel(exceedanceRisk(1e9, 1), 1e-9)).toBeLessThan(1e-15);
    expect(rel(periodForRisk(exceedanceRisk(475, 50), 50), 475)).toBeLessThan(1e-12);
    expect(() => exceedanceRisk(1, 10)).toThrow();
  });
});

describe('return levels on the shape guard', () => {
  it('a fit held at ξ = 0.5 still gives levels; an end the profile cannot close is ±Infinity with a warning', () => {
    const s = prepareSample([1, 1.1, 1.2, 1.3, 1.5, 2, 3, 6, 15, 60]);
    const r = fitGev(s);
    if (!r.ok) throw new Error('fit failed');
    const rep = returnLevels(s, r, [10, 100]);
    for (const l of rep.levels) {
      expect(Number.isFinite(l.estimate)).toBe(true);
      expect(l.lower).toBeLessThan(l.estimate);
      if (!l.upperFound) expect(l.upper).toBe(Number.POSITIVE_INFINITY);
      else expect(l.upper).toBeGreaterThan(l.estimate);
    }
    expect(rep.levels[1]!.beyondRecord).toBe(true);
  });
});
