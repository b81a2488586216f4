import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { digamma, lnGamma, lnGamma1p, trigamma } from '../../core/special/index.js';
import { relErr, section, TOL, worst } from './fixture.js';

function check1(name: string, f: (x: number) => number, tol = TOL): void {
  const s = section(name);
  const r = worst(
    s.cases.map((c) => ({ label: `${name}(${String(c[0])}) [${String(c[2])}]`, got: f(c[0] as number), want: c[1] as number, tol })),
  );
  expect(r.failures, `source: ${s.source}`).toEqual([]);
}

describe('ln Γ, ψ, ψ′ against SciPy gammaln / psi / polygamma and mpmath (test/fixtures/special.json)', () => {
  it('lnGamma from 1e-300 to 1e300, including the zeros at 1 and 2, to 1e-12 relative', () => {
    check1('lnGamma', lnGamma);
  });
  it('digamma from 1e-8 to 1e12, including its zero x0 = 1.4616321449683622, to 1e-12 relative', () => {
    check1('digamma', digamma);
  });
  it('trigamma from 1e-8 to 1e12 to 1e-12 relative', () => {
    check1('trigamma', trigamma);
  });
  it('lnGamma1p(x) = lnGamma(1 + x) where 1 + x is exact, and ≈ -γx for tiny x (A&S 6.1.33)', () => {
    expect(relErr(lnGamma1p(1e-10), -0.5772156649015329e-10 + 0.8224670334241132e-20)).toBeLessThan(TOL);
    for (const x of [-0.5, -0.25, 0.25, 0.5, 0.75, 1.5, 3]) expect(relErr(lnGamma1p(x), lnGamma(1 + x))).toBeLessThan(1e-15);
  });
  it('recurrences ln Γ(x+1) = ln Γ(x) + ln x, ψ(x+1) = ψ(x) + 1/x, ψ′(x+1) = ψ′(x) − 1/x² (identities)', () => {
    fc.assert(
      fc.property(fc.double({ min: 2.6, max: 1e6, noNaN: true }), (x) => {
        expect(relErr(lnGamma(x + 1), lnGamma(x) + Math.log(x))).toBeLessThan(1e-14);
        expect(relErr(digamma(x + 1), digamma(x) + 1 / x)).toBeLessThan(1e-14);
        expect(relErr(trigamma(x + 1), trigamma(x) - 1 / (x * x))).toBeLessThan(1e-13);
      }),
      { seed: 3, numRuns: 2000 },
    );
  });
  it('domain edges: ln Γ(0) = +∞, ψ(0) = -∞, NaN for x < 0', () => {
    expect(lnGamma(0)).toBe(Number.POSITIVE_INFINITY);
    expect(digamma(0)).toBe(Number.NEGATIVE_INFINITY);
    expect(lnGamma(-1)).toBeNaN();
    expect(trigamma(-0.5)).toBeNaN();
  });
});
