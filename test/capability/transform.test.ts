import { describe, expect, it } from 'vitest';
import {
  boxCoxInverse,
  boxCoxLogLikelihood,
  boxCoxTransform,
  fitBoxCox,
  fitJohnson,
  hazenQuantile,
  johnsonCdf,
  johnsonLogPdf,
  johnsonQuantile,
  johnsonSf,
  johnsonZ,
  massOutsideRange,
  transformedCapability,
  type JohnsonParameters,
} from '../../core/capability/index.js';
import { normalQuantile } from '../../core/special/index.js';
import { readFixture, relFloored as rel } from '../helpers/fixtures.js';

// Reference values: scripts/fixtures/capability-transform.py (SciPy 1.17.1).
const fx = readFixture('capability-transform.json');

const sortedOf = (x: readonly number[]): Float64Array => Float64Array.from(x).sort();

describe('Box–Cox λ by maximum likelihood', () => {
  for (const set of fx.boxcox as { name: string; x: number[]; lambdaScipy: number; lambdaTight: number; ci95: [number, number]; llfAtMax: number; llf: { lambda: number; llf: number }[]; transformed: { x: number; lambda: number; y: number }[] }[]) {
    it(`${set.name}: λ̂ agrees with SciPy boxcox_normmax(method="mle") to 1e-6 and the 40-digit mpmath root of the score to 1e-10`, () => {
      const fit = fitBoxCox(set.x, 0.05);
      expect(Math.abs(fit.lambda - set.lambdaScipy)).toBeLessThan(1e-6);
      expect(Math.abs(fit.lambda - set.lambdaTight)).toBeLessThan(1e-10);
      expect(rel(fit.logLikelihood, set.llfAtMax)).toBeLessThan(1e-12);
    });
    it(`${set.name}: the 95 % profile-likelihood interval agrees with SciPy boxcox(alpha=0.05) to 1e-7`, () => {
      const fit = fitBoxCox(set.x, 0.05);
      expect(fit.lower).not.toBeNull();
      expect(fit.upper).not.toBeNull();
      // SciPy's ends solve ℓ(λ) = ℓ(λ̂_SciPy) - q/2 with its Brent λ̂ (off by up to 2e-7 here); ℓ is flat at λ̂,
      // so that moves the target by O(1e-14) and the ends by far less than 1e-9.
      expect(Math.abs((fit.lower as number) - set.ci95[0])).toBeLessThan(1e-9);
      expect(Math.abs((fit.upper as number) - set.ci95[1])).toBeLessThan(1e-9);
    });
    it(`${set.name}: ℓ(λ) equals SciPy boxcox_llf on a grid and y(λ) equals scipy.special.boxcox`, () => {
      for (const g of set.llf) expect(rel(boxCoxLogLikelihood(set.x, g.lambda), g.llf)).toBeLessThan(1e-11);
      for (const t of set.transformed) {
        expect(rel(boxCoxTransform(t.x, t.lambda), t.y)).toBeLessThan(1e-14);
        // x = (1 + λy)^(1/λ): dx/x = (dy/y)·y/(1 + λy), so cond = |y/(1 + λy)|; bound 16·cond·ε (DEVELOPERS.md).
        const cond = Math.abs(t.y / (1 + t.lambda * t.y));
        expect(rel(boxCoxInverse(t.y, t.lambda), t.x)).toBeLessThan(16 * cond * Number.EPSILON + 4e-16);
      }
    });
  }
  it('refuses values that are not positive (typed error), and reports an interval end it cannot reach as null', () => {
    expect(() => fitBoxCox([1, 2, 0, 4])).toThrow(/positive/);
    // A narrow range (5 to 5.2): the likelihood is nearly flat in λ and neither 95 % end lies within |λ| ≤ 20.
    const flat = fitBoxCox([5, 5.1, 5.2, 5.05, 5.15]);
    expect(flat.lower).toBeNull();
    expect(flat.upper).toBeNull();
    const wide = fitBoxCox([1, 2, 3.5]);
    expect(wide.lower).toBeLessThan(wide.lambda);
    expect(wide.upper).toBeGreaterThan(wide.lambda);
  });
});

describe('Johnson system by the Slifker & Shapiro (1980) percentile method', () => {
  for (const set of fx.johnsonFits as { name: string; x: number[]; quantiles: number[]; ratio: number; type: string; gamma: number; delta: number; xi: number; lambda: number }[]) {
    it(`${set.name}: type ${set.type}, parameters equal the numerical solution of the percentile equations (SciPy least_squares)`, () => {
      const x = sortedOf(set.x);
      const f = fitJohnson(x);
      for (let i = 0; i < 4; i++) expect(rel(f.quantiles[i]!, set.quantiles[i]!)).toBeLessThan(1e-14);
      expect(rel(f.ratio, set.ratio)).toBeLessThan(1e-12);
      expect(f.type).toBe(set.type);
      // least_squares stops at xtol 1e-15 on well-scaled unknowns; 1e-8 relative is conditioning headroom.
      expect(rel(f.gamma, set.gamma) < 1e-8 || Math.abs(f.gamma - set.gamma) < 1e-9).toBe(true);
      expect(rel(f.delta, set.delta)).toBeLessThan(1e-8);
      expect(rel(f.xi, set.xi)).toBeLessThan(1e-8);
      expect(rel(f.lambda, set.lambda)).toBeLessThan(1e-8);
    });
    it(`${set.name}: the fitted transformation puts the sample quantiles at ±ζ, ±3ζ (the defining equations)`, () => {
      const f = fitJohnson(sortedOf(set.x));
      const z = [-3 * f.zeta, -f.zeta, f.zeta, 3 * f.zeta];
      // SL fits three of the four equations exactly (the lower three: x₋ζ, xζ, x₃ζ).
      for (let i = f.type === 'SL' ? 1 : 0; i < 4; i++) expect(Math.abs(johnsonZ(f, f.quantiles[i]!) - z[i]!)).toBeLessThan(1e-11);
    });
  }
  it('Hazen quantile: position nP + ½ (NumPy method="hazen"), clamped at the extremes', () => {
    const x = Float64Array.from([1, 2, 3, 4]);
    expect(hazenQuantile(x, 0.5)).toBe(2.5);
    expect(hazenQuantile(x, 0.3)).toBeCloseTo(1.7, 14); // position 1.7
    expect(hazenQuantile(x, 0.01)).toBe(1);
    expect(hazenQuantile(x, 0.99)).toBe(4);
  });
  for (const d of fx.johnsonDensities as { type: 'SU' | 'SB' | 'SL'; gamma: number; delta: number; xi: number; lambda: number; x: number[]; logpdf: number[]; cdf: number[]; sf: number[]; ppf: { p: number; x: number }[] }[]) {
    it(`${d.type}: log density, cdf, sf and quantiles agree with SciPy (${d.type === 'SL' ? 'lognorm' : `johnson${d.type.toLowerCase()}`}) to 1e-12`, () => {
      const p: JohnsonParameters = { type: d.type, gamma: d.gamma, delta: d.delta, xi: d.xi, lambda: d.lambda };
      d.x.forEach((x, i) => {
        expect(rel(johnsonLogPdf(p, x), d.logpdf[i]!)).toBeLessThan(1e-12);
        expect(rel(johnsonCdf(p, x), d.cdf[i]!)).toBeLessThan(1e-12);
        expect(rel(johnsonSf(p, x), d.sf[i]!)).toBeLessThan(1e-12);
      });
      // quantiles through AS 241 Φ⁻¹ (relative 1e-15) and the inverse transformation
      for (const q of d.ppf) expect(rel(johnsonQuantile(p, q.p), q.x)).toBeLessThan(1e-12);
      expect(normalQuantile(0.5)).toBe(0);
    });
  }
});

describe('capability on the transformed scale', () => {
  const cases = fx.transformedCapability as any[];
  const find = (list: readonly { name: string; estimate: number }[], name: string): number => {
    const r = list.find((x) => x.name === name);
    if (!r) throw new Error(`no ${name}`);
    return r.estimate;
  };
  it('Box–Cox: limits, mean, sd, transformed-scale Pp/Ppk, ISO 22514-2 quantiles and indices, ppm and A² agree with SciPy', () => {
    const c = cases[0];
    const r = transformedCapability(c.x, 'boxcox', { lsl: c.lsl, usl: c.usl });
    expect(Math.abs(r.lambda! - c.lambda)).toBeLessThan(1e-10);
    // everything below inherits λ̂'s 1e-10 agreement, amplified by at most a few units of conditioning
    const tol = 1e-8;
    expect(rel(r.transformedLimits.lsl!, c.transformedLsl)).toBeLessThan(tol);
    expect(rel(r.transformedLimits.usl!, c.transformedUsl)).toBeLessThan(tol);
    expect(rel(r.transformedMean, c.mean)).toBeLessThan(tol);
    expect(rel(r.transformedSd, c.sd)).toBeLessThan(tol);
    expect(rel(find(r.indices, 'Pp'), c.Pp_transformed)).toBeLessThan(tol);
    expect(rel(find(r.indices, 'Ppk'), c.Ppk_transformed)).toBeLessThan(tol);
    expect(rel(r.percentile.lowerQuantile, c.quantiles[0])).toBeLessThan(1e-6); // x₀.₁₃₅ ≈ 0.009 sits where 1 + λy is small: cond ≈ 1e2
    expect(rel(r.percentile.median, c.quantiles[1])).toBeLessThan(tol);
    expect(rel(r.percentile.upperQuantile, c.quantiles[2])).toBeLessThan(tol);
    expect(rel(find(r.percentile.indices, 'Pp'), c.Pp)).toBeLessThan(1e-6);
    expect(rel(find(r.percentile.indices, 'Ppk'), c.Ppk)).toBeLessThan(1e-6);
    expect(rel(r.ppm.belowLsl, c.ppmBelow)).toBeLessThan(1e-7);
    expect(rel(r.ppm.aboveUsl, c.ppmAbove)).toBeLessThan(1e-7);
    expect(rel(r.normality.statistic, c.a2)).toBeLessThan(1e-8);
    expect(r.support.text).toBe('x > 0');
    // the normal on y(λ̂) puts Φ((-1/λ - mean)/sd) below the transform's range: stated, and removed (truncation)
    expect(rel(massOutsideRange(r.model), c.massOutside)).toBeLessThan(1e-7);
    expect(r.notes.join(' ')).toContain(`${(c.massOutside * 1e6).toPrecision(3)} ppm outside the transform's range`);
  });
  it('Johnson SU with an upper limit only: Ppu alone, no lower tail, agrees with SciPy johnsonsu', () => {
    const c = cases[1];
    const r = transformedCapability(c.x, 'johnson', { lsl: null, usl: c.usl });
    expect(r.type).toBe('SU');
    const tol = 1e-8; // parameters agree with the least_squares solution to 1e-8 (see above)
    expect(rel(r.transformedLimits.usl!, c.transformedUsl)).toBeLessThan(tol);
    expect(r.transformedLimits.lsl).toBeNull();
    expect(rel(r.transformedMean + 10, c.mean + 10)).toBeLessThan(tol); // mean ≈ 0: compared shifted
    expect(rel(r.transformedSd, c.sd)).toBeLessThan(tol);
    expect(rel(find(r.indices, 'Ppu'), c.Ppu_transformed)).toBeLessThan(tol);
    expect(r.indices.map((i) => i.name)).toEqual(['Ppk', 'Ppu']);
    expect(r.percentile.indices.map((i) => i.name)).toEqual(['Ppk', 'Ppu']);
    expect(rel(find(r.percentile.indices, 'Ppu'), c.Ppu)).toBeLessThan(tol);
    expect(rel(r.percentile.upperQuantile, c.quantiles[2])).toBeLessThan(tol);
    expect(r.ppm.belowLsl).toBe(0);
    expect(rel(r.ppm.aboveUsl, c.ppmAbove)).toBeLessThan(1e-7);
    expect(rel(r.normality.statistic, c.a2)).toBeLessThan(1e-7);
  });
  it('a Box–Cox lower limit at the natural bound 0 has no tail beyond it: dropped with a note, Ppu only', () => {
    const c = cases[0];
    const r = transformedCapability(c.x, 'boxcox', { lsl: 0, usl: c.usl });
    expect(r.transformedLimits.lsl).toBeNull();
    expect(r.percentile.indices.map((i) => i.name)).toEqual(['Ppk', 'Ppu']);
    expect(r.ppm.belowLsl).toBe(0);
    expect(r.notes.join(' ')).toMatch(/lower specification limit 0 lies outside the model's support \(x > 0\)/);
  });
});

describe('Johnson type choice near the lognormal boundary', () => {
  it('a left-skewed sample with mn/p² ≈ 1 is not forced into SL (whose tail is the upper one): SU or SB by the ratio', () => {
    // mirror the committed SL sample: same ratio, m and n swapped, so m/p < 1
    const sl = (fx.johnsonFits as { type: string; x: number[] }[]).find((s) => s.type === 'SL')!;
    const mirrored = sortedOf(sl.x.map((v) => -v));
    const f = fitJohnson(mirrored);
    expect(Math.abs(f.ratio - 1)).toBeLessThanOrEqual(0.01);
    expect(f.type).toBe(f.ratio > 1 ? 'SU' : 'SB');
    const z = [-3 * f.zeta, -f.zeta, f.zeta, 3 * f.zeta];
    for (let i = 0; i < 4; i++) expect(Math.abs(johnsonZ(f, f.quantiles[i]!) - z[i]!)).toBeLessThan(1e-9);
  });
});
