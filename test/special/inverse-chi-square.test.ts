import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  chiSquareCdf,
  chiSquareIsf,
  chiSquareLogSf,
  chiSquareSf,
  gammaP,
  gammaPInv,
  gammaPInvLog,
  gammaQ,
  gammaQInv,
  gammaQInvLog,
  logGammaP,
  logGammaQ,
} from '../../core/special/index.js';
import { relErr, section, TOL, worst } from './fixture.js';
import { CHI_SQUARE_UPPER_CRITICAL } from '../helpers/chi-square-table.js';

function check(name: string, f: (u: number, v: number) => number, tol = TOL): void {
  const s = section(name);
  const r = worst(
    s.cases.map((c) => ({
      label: `${name}(${String(c[0])}, ${String(c[1])}) [${String(c[3])}]`,
      got: f(c[0] as number, c[1] as number),
      want: c[2] as number,
      tol,
    })),
  );
  expect(r.failures, `source: ${s.source}`).toEqual([]);
}

describe('incomplete gamma inverses against SciPy gammaincinv / gammainccinv and mpmath roots', () => {
  it('gammaPInv(a, p) for a 1e-3 … 1e6, p 1e-300 … 1 − 1e-6, to 1e-12 relative', () => {
    check('gammaPInv', gammaPInv);
  });
  it('gammaQInv(a, q), to 1e-12 relative', () => {
    check('gammaQInv', gammaQInv);
  });
  it('log-probability forms agree with the plain ones', () => {
    for (const a of [0.01, 0.7, 3, 40, 1e4]) {
      for (const p of [1e-200, 1e-8, 0.2, 0.6, 0.99]) {
        expect(relErr(gammaPInvLog(a, Math.log(p)), gammaPInv(a, p))).toBeLessThan(1e-13);
        expect(relErr(gammaQInvLog(a, Math.log(p)), gammaQInv(a, p))).toBeLessThan(1e-13);
      }
    }
    // ln Q = -5000 is far below the smallest double; the root still satisfies ln Q(a, x) = -5000.
    const x = gammaQInvLog(2.5, -5000);
    expect(relErr(logGammaQ(2.5, x), -5000)).toBeLessThan(1e-13);
  });
  it('round trips ln P(a, P⁻¹(a, ln p)) = ln p, ln Q(a, Q⁻¹(a, ln q)) = ln q, P(a, P⁻¹(a, p)) = p (identities, seeded)', () => {
    // Tolerances: an error δ in x moves ln F by cond·δ, cond = x f(x)/F(x) ≤ ~4e4 here (a = 1e6,
    // F = 1e-300); with δ ≈ 1e-15 that is ≤ 4e-11 on ln F, ≤ 1e-11 relative to |ln F| ≥ 1e-9·… .
    fc.assert(
      fc.property(fc.double({ min: -3, max: 6, noNaN: true }), fc.double({ min: -300, max: -1e-9, noNaN: true }), (la, lp) => {
        const a = 10 ** la;
        // Roots below 1e-300 (tiny a, P tiny) are subnormal doubles with fewer digits: not checked.
        const xp = gammaPInvLog(a, lp);
        const xq = gammaQInvLog(a, lp);
        if (xp > 1e-300) expect(relErr(logGammaP(a, xp), lp)).toBeLessThan(1e-11);
        if (xq > 1e-300) expect(relErr(logGammaQ(a, xq), lp)).toBeLessThan(1e-11);
        if (la <= 3) {
          // P itself: cond ≤ ~1.2e3 for a ≤ 1e3, so 1e-10 relative.
          const p = Math.exp(lp);
          const yp = gammaPInv(a, p);
          const yq = gammaQInv(a, p);
          if (yp > 1e-300) expect(relErr(gammaP(a, yp), p)).toBeLessThan(1e-10);
          if (yq > 1e-300) expect(relErr(gammaQ(a, yq), p)).toBeLessThan(1e-10);
        }
      }),
      { seed: 5, numRuns: 400 },
    );
  });
});

describe('chi-square distribution', () => {
  it('chiSquareSf against SciPy chdtrc / mpmath (dof 1 … 1000, x 1e-10 … 5000)', () => {
    check('chiSquareSf', (dof, x) => chiSquareSf(x, dof));
  });
  it('chiSquareLogSf against mpmath at 50 digits, finite where the sf underflows', () => {
    check('chiSquareLogSf', (dof, x) => chiSquareLogSf(x, dof));
    expect(Number.isFinite(chiSquareLogSf(1e5, 3))).toBe(true);
  });
  it('chiSquareIsf against SciPy chi2.isf (alpha 1e-300 … 0.99)', () => {
    check('chiSquareIsf', chiSquareIsf);
  });
  it('upper critical values in ../shared/references.md (SciPy chi2.ppf, agree with NIST/SEMATECH §1.3.6.7.4), to the 4 printed decimals', () => {
    const table = CHI_SQUARE_UPPER_CRITICAL; // test/helpers/chi-square-table.ts
    for (const [df, a10, a05, a01] of table) {
      expect(chiSquareIsf(0.1, df)).toBeCloseTo(a10, 4);
      expect(chiSquareIsf(0.05, df)).toBeCloseTo(a05, 4);
      expect(chiSquareIsf(0.01, df)).toBeCloseTo(a01, 4);
    }
    // NIST e-Handbook §1.3.5.15 worked example: df 29, alpha 0.05, critical value 42.557.
    expect(chiSquareIsf(0.05, 29)).toBeCloseTo(42.557, 3);
  });
  it('cdf + sf = 1 and edges', () => {
    for (const dof of [1, 4, 29, 300]) for (const x of [0.1, 3, 30, 400]) expect(Math.abs(chiSquareCdf(x, dof) + chiSquareSf(x, dof) - 1)).toBeLessThan(1e-15);
    expect(chiSquareSf(0, 3)).toBe(1);
    expect(chiSquareSf(-1, 3)).toBe(1);
    expect(chiSquareCdf(-1, 3)).toBe(0);
    expect(chiSquareSf(1, 0)).toBeNaN();
  });
});
