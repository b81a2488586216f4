import { describe, expect, it } from 'vitest';
import { getFamily, prepareSample, type FamilyName } from '../../core/index.js';
import { chiSquareTest } from '../../core/gof/index.js';
import { fixture, rel } from './fixture.js';
import { CHI_SQUARE_UPPER_CRITICAL } from '../helpers/chi-square-table.js';

// Upper critical values of chi-square, from shared/references.md (SciPy chi2.ppf, agreeing with
// NIST/SEMATECH e-Handbook §1.3.6.7.4), printed to 4 decimals (test/helpers/chi-square-table.ts).
const TABLE = CHI_SQUARE_UPPER_CRITICAL;

/** A sample of n values and a model with m "estimated" parameters giving dof = k - 1 - m. */
function testWithDof(dof: number, alpha: number) {
  const m = 1;
  const k = dof + 1 + m;
  const dist = getFamily('exponential').make({ rate: 1 });
  const n = 5 * k;
  const sorted = Array.from({ length: n }, (_, i) => dist.quantile((i + 0.5) / n));
  return chiSquareTest(dist, sorted, { alpha, estimatedParameters: m, bins: k });
}

describe('chi-square test', () => {
  it('critical values at α = .10/.05/.01 match the printed table', () => {
    for (const [df, c10, c05, c01] of TABLE) {
      for (const [alpha, c] of [
        [0.1, c10],
        [0.05, c05],
        [0.01, c01],
      ] as const) {
        const r = testWithDof(df, alpha);
        if (!r.computable) throw new Error('not computable');
        expect(r.dof).toBe(df);
        expect(Math.abs(r.criticalValue - c), `df ${df} α ${alpha}`).toBeLessThanOrEqual(0.5e-4 + 1e-9);
      }
    }
  });

  // NIST counts c = (estimated parameters + 1) = 3 and df = k - c = 29; in our terms m = 2, dof = k - 1 - m.
  // (references.md says "3 estimated parameters"; that is NIST's c, since 32 - 1 - 3 would be 28.)
  it('NIST e-Handbook §1.3.5.15: 32 cells, df 29, critical 42.557 at α = 0.05', () => {
    const dist = getFamily('normal').make({ mean: 0, sd: 1 });
    const n = 320;
    const sorted = Array.from({ length: n }, (_, i) => dist.quantile((i + 0.5) / n));
    const r = chiSquareTest(dist, sorted, { alpha: 0.05, estimatedParameters: 2, bins: 32 });
    if (!r.computable) throw new Error('not computable');
    expect(r.dof).toBe(29);
    expect(r.dofUpper).toBe(31);
    expect(r.criticalValue).toBeCloseTo(42.557, 3); // NIST: 42.557
    // The four NIST statistics against that critical value (NIST: the first sample is not rejected, the others are).
    for (const [stat, rejected] of [
      [32.256, false],
      [91.776, true],
      [101.488, true],
      [1085.104, true],
    ] as const) {
      expect(stat > r.criticalValue).toBe(rejected);
    }
  });

  it('D1 under each fitted model: statistic, dof and both p-values match SciPy (scripts/fixtures/gof.py)', () => {
    const sample = prepareSample(fixture.D1.values);
    for (const [f, ref] of Object.entries(fixture.D1.models)) {
      const fam = getFamily(f as FamilyName);
      const r = chiSquareTest(fam.make(ref.parameters), sample.sorted, { alpha: 0.05, estimatedParameters: fam.estimatedParameters });
      if (!r.computable) throw new Error(f);
      expect(r.k).toBe(4);
      expect(r.dof).toBe(4 - 1 - ref.estimatedParameters);
      expect(r.statistic).toBeCloseTo(ref.chiSquare, 12);
      // SciPy chi2.sf; 1e-8 relative while core/special is provisional (its own suite holds 1e-12).
      expect(rel(r.pValue, ref.pValue), f).toBeLessThan(1e-8);
      expect(rel(r.pValueUpper, ref.pValueUpper), f).toBeLessThan(1e-8);
      // Chernoff–Lehmann (1954): k - 1 dof gives the larger p-value.
      expect(r.pValueUpper).toBeGreaterThan(r.pValue);
      expect(r.rejected).toBe(ref.pValue < 0.05);
      expect(r.decision).toMatch(r.rejected ? /^Rejected/ : /^Not rejected/);
    }
  });

  it('is reported as not computable with a reason when n is too small', () => {
    const dist = getFamily('normal').make({ mean: 0, sd: 1 });
    const r = chiSquareTest(dist, [-1, -0.5, 0, 0.2, 0.4, 0.9, 1.3, 1.5, 2, 2.2], { alpha: 0.05, estimatedParameters: 2 });
    expect(r.computable).toBe(false);
    if (!r.computable) expect(r.reason).toMatch(/Too few values.*at least 20 values/);
  });
});
