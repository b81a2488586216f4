import { describe, expect, it } from 'vitest';
import { fitGev } from '../../core/families/index.js';
import { floodFrequency, returnLevels } from '../../core/flood/index.js';
import { prepareSample } from '../../core/sample.js';
import { readFixture } from '../helpers/fixtures.js';

// Reference: scripts/fixtures/gev-guard.py — 25 values from a GEV with ξ = +0.3 (numpy
// default_rng(61)) whose maximum-likelihood shape is above 0.5; SciPy genextreme.fit refined by
// Nelder-Mead and BFGS; the 100-year profile-likelihood interval (Coles 2001 §3.3.3) solved by brentq.
const fx = readFixture('gev-guard.json');
const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe('GEV: the unconstrained maximum and profile intervals not cut by a guard', () => {
  const s = prepareSample(fx.values);

  it('reports the unconstrained MLE (ξ above 0.5) matching the refined SciPy fit, with a warning', () => {
    const f = fitGev(s);
    if (!f.ok) throw new Error('fit failed');
    expect(fx.mle.shape).toBeGreaterThan(0.5);
    // Refined reference (gradient norm stored in the fixture): ≤ 1e-6 on the parameters, the
    // Nelder-Mead/BFGS stop in SciPy being the looser of the two solvers.
    expect(Math.abs((f.parameters.shape as number) - fx.mle.shape)).toBeLessThan(1e-6);
    expect(rel(f.parameters.scale as number, fx.mle.scale)).toBeLessThan(1e-6);
    expect(rel(f.parameters.location as number, fx.mle.location)).toBeLessThan(1e-6);
    expect(f.logLikelihood).toBeGreaterThanOrEqual(fx.logLikelihood - 1e-9 * Math.abs(fx.logLikelihood));
    expect(f.shapeOnGuard).toBe(false);
    expect(f.warnings.join(' ')).toMatch(/beyond ±0.5/);
  });

  it('the 100-year profile interval is the unconstrained one (SciPy brentq ends, ≤ 1e-5 relative)', () => {
    const f = fitGev(s);
    if (!f.ok) throw new Error('fit failed');
    const ref = fx.returnLevels.find((r: { period: number }) => r.period === 100);
    const l = returnLevels(s, f, [100]).levels[0];
    if (!l) throw new Error('no level');
    // The reference inner maximisation is Nelder-Mead (xatol 1e-11): 1e-5 relative on the ends.
    expect(rel(l.estimate, ref.estimate)).toBeLessThan(1e-6);
    expect(rel(l.lower, ref.lower95)).toBeLessThan(1e-5);
    expect(rel(l.upper, ref.upper95)).toBeLessThan(1e-5);
  });

  it('a requested constraint |ξ| ≤ 0.5 is said on the fit, the interval and in the Gumbel-vs-GEV test', () => {
    const f = fitGev(s, { shapeConstraint: 0.5 });
    if (!f.ok) throw new Error('fit failed');
    expect(f.shapeOnGuard).toBe(true);
    expect(f.parameters.shape).toBe(0.5);
    expect(rel(f.logLikelihood, fx.shapeHeldAtHalf.logLikelihood)).toBeLessThan(1e-9);
    expect(f.unconstrainedShape).toBeCloseTo(fx.mle.shape, 6);
    const r = returnLevels(s, f, [100], { shapeConstraint: 0.5 });
    expect(r.methodDetail).toMatch(/constrained model/);
    expect(r.warnings.join(' ')).toMatch(/constrained model/);
    const ff = floodFrequency(fx.values, { periods: [100], shapeConstraint: 0.5 });
    expect(ff.gumbelVersusGev?.decision).toMatch(/held at the constraint.*not an estimate/);
  });
});
