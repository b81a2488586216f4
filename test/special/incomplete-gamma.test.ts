import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gammaP, gammaQ, logGammaP, logGammaQ } from '../../core/special/index.js';
import { relErr, section, TOL, worst } from './fixture.js';

const EPS = 2.220446049250313e-16;

/**
 * Tolerance for a case with condition number cond = |x F′(x)/F(x)| (from the fixture script):
 * 1e-12 relative (DEVELOPERS.md) where the value is well conditioned; where cond is large, forming
 * (x − a)/a or x/a rounds by half an ulp and moves F by cond·ε/2 relative, which no double
 * algorithm can avoid, so the bound is max(1e-12, 16·cond·ε).
 */
function tolFor(cond: number): number {
  return Math.max(TOL, 16 * cond * EPS);
}

/**
 * Log forms: compared in relative terms on ln F (DEVELOPERS.md: ≤ 1e-10 in far tails). The
 * absolute error of ln F is bounded like F's relative error, cond·ε, so relative to |ln F| it is
 * cond·ε/|ln F|.
 */
function logTolFor(cond: number, value: number): number {
  return Math.max(TOL, (16 * cond * EPS) / Math.max(Math.abs(value), 1e-300));
}

function check2(name: string, f: (a: number, x: number) => number, log: boolean): { max: number } {
  const s = section(name);
  const rows = s.cases.map((c) => {
    const [a, x, want, src, cond] = c as [number, number, number, string, number];
    return {
      label: `${name}(${String(a)}, ${String(x)}) [${src}, cond ${cond.toExponential(1)}]`,
      got: f(a, x),
      want,
      tol: log ? logTolFor(cond, want) : tolFor(cond),
    };
  });
  const r = worst(rows);
  expect(r.failures, `source: ${s.source}`).toEqual([]);
  return r;
}

describe('regularized incomplete gamma against SciPy gammainc/gammaincc and mpmath (a 1e-3 … 1e6, x 1e-300 … 1e6)', () => {
  it('gammaP', () => {
    check2('gammaP', gammaP, false);
  });
  it('gammaQ', () => {
    check2('gammaQ', gammaQ, false);
  });
  it('logGammaP, including where P underflows (mpmath at 50 digits)', () => {
    check2('logGammaP', logGammaP, true);
  });
  it('logGammaQ, including where Q underflows (mpmath at 50 digits)', () => {
    check2('logGammaQ', logGammaQ, true);
  });
  it('spot values: P(1, x) = 1 − e^{−x}, Q(1, x) = e^{−x} exactly (A&S 6.5.2 with a = 1); ln Q(0.5, 2000) = ln erfc(√2000)', () => {
    for (const x of [1e-10, 0.3, 1, 5, 30, 700]) {
      expect(relErr(gammaP(1, x), -Math.expm1(-x))).toBeLessThan(TOL);
      expect(relErr(gammaQ(1, x), Math.exp(-x))).toBeLessThan(TOL);
      expect(relErr(logGammaQ(1, x), -x)).toBeLessThan(TOL);
    }
    // Q(1/2, x) = erfc(√x) (A&S 6.5.17); ln erfc(√2000) = -2004.3730660166381 (mpmath, 50 digits)
    expect(relErr(logGammaQ(0.5, 2000), -2004.3730660166381)).toBeLessThan(TOL);
  });
  it('P + Q = 1 where both are representable, and both in [0, 1] (identity)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -3, max: 6, noNaN: true }),
        fc.double({ min: -5, max: 5, noNaN: true }),
        (la, k) => {
          const a = 10 ** la;
          const x = Math.max(1e-300, a + k * Math.sqrt(a) + (la < 0 ? 10 ** (k - 2) : 0));
          const p = gammaP(a, x);
          const q = gammaQ(a, x);
          expect(p).toBeGreaterThanOrEqual(0);
          expect(q).toBeLessThanOrEqual(1);
          expect(Math.abs(p + q - 1)).toBeLessThan(1e-14);
        },
      ),
      { seed: 99, numRuns: 3000 },
    );
  });
  it('edges: x = 0, x = ∞, and invalid arguments', () => {
    expect(gammaP(2, 0)).toBe(0);
    expect(gammaQ(2, 0)).toBe(1);
    expect(logGammaP(2, 0)).toBe(Number.NEGATIVE_INFINITY);
    expect(gammaQ(2, Number.POSITIVE_INFINITY)).toBe(0);
    expect(gammaP(0, 1)).toBeNaN();
    expect(gammaP(1, -1)).toBeNaN();
  });
});
