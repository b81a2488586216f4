/**
 * Samples a family cannot be fitted to are reported as NotApplicable (never thrown, never dropped),
 * with the reason and the count of values outside the support (DEVELOPERS.md / issue 2 contract;
 * the support rules are the definitions of the families, from memory).
 */
import { describe, expect, it } from 'vitest';
import { DEFAULT_FAMILIES, getFamily } from '../../core/families/index.js';
import type { FamilyName, FitOutcome } from '../../core/families/index.js';
import { prepareSample } from '../../core/sample.js';

const POSITIVE: FamilyName[] = ['lognormal', 'gamma', 'weibull', 'exponential'];

function notApplicable(out: FitOutcome): { reason: string; offendingCount: number } {
  expect(out.ok).toBe(false);
  if (out.ok) throw new Error('expected not applicable');
  return out;
}

describe('positive families refuse zeros and negatives, counting them', () => {
  for (const name of POSITIVE) {
    const f = getFamily(name);
    it(`${name}: 3 values ≤ 0 among 10`, () => {
      const s = prepareSample([0, -1.5, 2, 3, 4, 5, 6, 7, -0.25, 8]);
      const na = notApplicable(f.fit(s));
      expect(na.offendingCount).toBe(3);
      expect(na.reason).toBe(`3 values are zero or negative; the ${f.label} model needs every value > 0`);
      expect(f.applicable(s)).toEqual({ ok: false, family: name, reason: na.reason, offendingCount: 3 });
    });
    it(`${name}: a single zero`, () => {
      const na = notApplicable(f.fit(prepareSample([0, 1, 2, 3])));
      expect(na.offendingCount).toBe(1);
      expect(na.reason).toMatch(/^1 value is zero; /);
    });
    it(`${name}: only negatives`, () => {
      const na = notApplicable(f.fit(prepareSample([-3, -2, -1])));
      expect(na.offendingCount).toBe(3);
      expect(na.reason).toMatch(/^3 values are negative; /);
    });
  }
  it('the normal family accepts zeros and negatives', () => {
    const out = getFamily('normal').fit(prepareSample([0, -1.5, 2, 3]));
    expect(out.ok).toBe(true);
    expect(getFamily('normal').applicable(prepareSample([0, -1.5, 2, 3]))).toBeNull();
  });
});

describe('every default family refuses one value and all-equal samples', () => {
  for (const name of DEFAULT_FAMILIES) {
    const f = getFamily(name);
    it(`${name}: n = 1`, () => {
      const na = notApplicable(f.fit(prepareSample([4.2])));
      expect(na.offendingCount).toBe(0);
      expect(na.reason).toBe(`the ${f.label} model needs at least 2 values; the sample has 1`);
    });
    it(`${name}: all 5 values equal`, () => {
      const na = notApplicable(f.fit(prepareSample([3.5, 3.5, 3.5, 3.5, 3.5])));
      expect(na.offendingCount).toBe(0);
      expect(na.reason).toBe(`all 5 values are equal (3.5); there is no spread to fit a ${f.label} model`);
    });
    it(`${name}: two distinct values are enough, and the fit is finite`, () => {
      const out = f.fit(prepareSample([1, 1, 1, 2]));
      expect(out.ok).toBe(true);
      if (out.ok) {
        expect(Number.isFinite(out.logLikelihood)).toBe(true);
        for (const v of Object.values(out.parameters)) expect(Number.isFinite(v)).toBe(true);
        expect(out.converged).toBe(true);
      }
    });
  }
  it('a zero in a one-value sample is reported as the support problem (with its count)', () => {
    const na = notApplicable(getFamily('gamma').fit(prepareSample([0])));
    expect(na.offendingCount).toBe(1);
  });
});

describe('fits stay finite and converge on awkward but valid samples (common practice, no source)', () => {
  const cases: [string, number[]][] = [
    ['tightly clustered values (gamma shape ~ 1e12)', [1e6, 1e6 + 1e-3, 1e6 + 2e-3, 1e6 - 1e-3, 1e6 + 5e-4]],
    ['values spanning 300 decades', [1e-150, 1e-20, 1, 1e20, 1e150]],
    ['a single outlier far above the rest', [1, 1, 1, 1, 1, 1, 1, 1, 1, 1e12]],
    ['tiny values whose squared deviations underflow', [1e-300, 2e-300, 3e-300, 5e-300]],
    ['huge values whose squared deviations overflow', [1e200, 2e200, 3e200, 5e200]],
  ];
  for (const [label, data] of cases) {
    it(label, () => {
      for (const name of DEFAULT_FAMILIES) {
        const out = getFamily(name).fit(prepareSample(data));
        expect(out.ok).toBe(true);
        if (!out.ok) continue;
        expect(out.converged).toBe(true);
        expect(Number.isFinite(out.logLikelihood)).toBe(true);
        for (const v of Object.values(out.parameters)) expect(Number.isFinite(v)).toBe(true);
      }
    });
  }
  it('values near 1.5e307 (sums overflow) and 1e-301: every fit equals the unscaled fit, rescaled', () => {
    // Maximum likelihood is scale-equivariant (common practice, no source).
    const base = [0.93, 1.02, 1.11, 0.97, 1.05, 0.88, 1.2, 1.01, 0.99, 1.07];
    for (const c of [1.5e307, 1e-301]) {
      for (const name of DEFAULT_FAMILIES) {
        const a = getFamily(name).fit(prepareSample(base));
        const b = getFamily(name).fit(prepareSample(base.map((x) => x * c)));
        if (!a.ok || !b.ok) throw new Error(`${name} should fit`);
        expect(Number.isFinite(b.logLikelihood)).toBe(true);
        const expectScaled: Record<string, number> = { ...a.parameters };
        if ('mean' in expectScaled) expectScaled.mean = (expectScaled.mean as number) * c;
        if ('sd' in expectScaled) expectScaled.sd = (expectScaled.sd as number) * c;
        if ('scale' in expectScaled) expectScaled.scale = (expectScaled.scale as number) * c;
        if ('rate' in expectScaled) expectScaled.rate = (expectScaled.rate as number) / c;
        if ('meanlog' in expectScaled) expectScaled.meanlog = (expectScaled.meanlog as number) + Math.log(c);
        for (const [k, v] of Object.entries(expectScaled)) {
          // 1e-9: the fits solve to 1e-12; x·c and ln(x·c) round differently from x and ln x
          expect(Math.abs((b.parameters[k] as number) / v - 1)).toBeLessThanOrEqual(1e-9);
        }
      }
    }
  });
  it('normal sd of tiny and huge values equals the rescaled sd (population sd of 1, 2, 3, 5 = √2.1875)', () => {
    for (const scale of [1e-300, 1e200]) {
      const out = getFamily('normal').fit(prepareSample([1, 2, 3, 5].map((x) => x * scale)));
      if (!out.ok) throw new Error(out.reason);
      // from memory: mean 2.75, Σ(x - 2.75)² = 8.75, /4 = 2.1875
      expect(Math.abs((out.parameters.sd as number) / (scale * Math.sqrt(2.1875)) - 1)).toBeLessThan(1e-14);
    }
  });
  it('tightly clustered values: gamma shape matches the normal approximation k ≈ mean²/variance', () => {
    // For k → ∞ the gamma MLE satisfies k ≈ 1/(2s) ≈ mean²/var (from memory: ln k - ψ(k) ~ 1/(2k)).
    const data = [1e6, 1e6 + 1e-3, 1e6 + 2e-3, 1e6 - 1e-3, 1e6 + 5e-4];
    const out = getFamily('gamma').fit(prepareSample(data));
    if (!out.ok) throw new Error(out.reason);
    const n = data.length;
    const mean = data.reduce((a, b) => a + b, 0) / n;
    const v = data.reduce((a, b) => a + (b - mean) ** 2, 0) / n;
    expect(Math.abs((out.parameters.shape as number) / ((mean * mean) / v) - 1)).toBeLessThan(1e-4);
  });
});
