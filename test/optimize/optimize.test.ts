import { describe, expect, it } from 'vitest';
import {
  LOG,
  above,
  between,
  brentRoot,
  chiSquare1Quantile,
  maximize,
  numericalHessian,
  observedInformation,
  profileInterval,
} from '../../core/optimize/index.js';

// A fixed sample made up for arithmetic checks (not real data).
const xs = [12.4, 15.1, 9.8, 22.7, 18.3, 11.6, 14.9, 27.5, 10.2, 13.7, 19.8, 8.9, 16.4, 24.1, 12.9, 17.6, 14.2, 31.3, 11.1, 15.8];
const n = xs.length;
const mean = xs.reduce((a, b) => a + b, 0) / n;
const s2 = xs.reduce((a, b) => a + (b - mean) * (b - mean), 0) / n; // MLE variance (divisor n)
const normalLogLik = (th: Float64Array): number => {
  const mu = th[0] as number;
  const sd = th[1] as number;
  if (!(sd > 0)) return Number.NEGATIVE_INFINITY;
  let s = 0;
  for (const x of xs) s += ((x - mu) / sd) ** 2;
  return -n * Math.log(sd) - 0.5 * s - 0.5 * n * Math.log(2 * Math.PI);
};

describe('maximize', () => {
  it('finds the Rosenbrock optimum (1, 1) from (-1.2, 1)', () => {
    // Rosenbrock (1960) Computer Journal 3:175-184; minimum at (1, 1) with value 0 (known in closed form).
    const f = (x: Float64Array): number => -(100 * ((x[1] as number) - (x[0] as number) ** 2) ** 2 + (1 - (x[0] as number)) ** 2);
    const r = maximize(f, [-1.2, 1]);
    expect(r.converged).toBe(true);
    expect(Math.abs((r.x[0] as number) - 1)).toBeLessThan(1e-7);
    expect(Math.abs((r.x[1] as number) - 1)).toBeLessThan(1e-7);
    expect(r.value).toBeLessThanOrEqual(0);
    expect(r.value).toBeGreaterThan(-1e-14);
  });

  it('reproduces the closed-form normal MLE (mean, sd with divisor n) with sd on the log scale', () => {
    // Closed form: μ̂ = x̄, σ̂² = Σ(x - x̄)²/n (textbook normal MLE, common practice).
    const r = maximize(normalLogLik, [10, 2], { transforms: [{ name: 'id', toFree: (t) => t, fromFree: (z) => z }, LOG] });
    expect(r.converged).toBe(true);
    expect(Math.abs((r.x[0] as number) - mean) / mean).toBeLessThan(1e-10);
    expect(Math.abs((r.x[1] as number) - Math.sqrt(s2)) / Math.sqrt(s2)).toBeLessThan(1e-10);
    expect(r.value).toBeCloseTo(normalLogLik(Float64Array.of(mean, Math.sqrt(s2))), 10);
  });

  it('handles bounded transforms (logit, shifted log) on a 1-D concave function', () => {
    // f(p) = 3 ln p + 7 ln(1 - p) has its maximum at p = 0.3 (binomial MLE, closed form).
    const r = maximize((t) => 3 * Math.log(t[0] as number) + 7 * Math.log1p(-(t[0] as number)), [0.9], { transforms: [between(0, 1)] });
    expect(Math.abs((r.x[0] as number) - 0.3)).toBeLessThan(1e-10);
    const r2 = maximize((t) => -(((t[0] as number) - 5) ** 2), [2.5], { transforms: [above(2)] });
    expect(Math.abs((r2.x[0] as number) - 5)).toBeLessThan(1e-9);
  });
});

describe('numerical derivatives and observed information', () => {
  it('Hessian of a quadratic form is exact to rounding', () => {
    // f = -(2a² + ab + 3b²) has Hessian [[-4, -1], [-1, -6]] (closed form).
    const H = numericalHessian((x) => -(2 * (x[0] as number) ** 2 + (x[0] as number) * (x[1] as number) + 3 * (x[1] as number) ** 2), [0.3, -0.7]);
    expect(Array.from(H).map((v) => Number(v.toFixed(6)))).toEqual([-4, -1, -1, -6]);
  });

  it('normal observed information at the MLE is diag(n/σ̂², 2n/σ̂²)', () => {
    // Closed form for the normal model (common practice, e.g. Lawless 2003 §B.2).
    const info = observedInformation(normalLogLik, [mean, Math.sqrt(s2)]);
    expect(info.information[0]! / (n / s2)).toBeCloseTo(1, 6);
    expect(info.information[3]! / ((2 * n) / s2)).toBeCloseTo(1, 6);
    expect(Math.abs(info.information[1]!)).toBeLessThan(1e-5);
    expect(info.standardErrors[0]! / Math.sqrt(s2 / n)).toBeCloseTo(1, 6);
  });
});

describe('profileInterval', () => {
  it('normal mean: matches x̄ ± σ̂·√(exp(c/n) - 1)', () => {
    // The profile deviance of μ is n ln(1 + (μ - x̄)²/σ̂²) (closed form), so the ends are exact.
    const mle = { x: [mean, Math.sqrt(s2)], value: normalLogLik(Float64Array.of(mean, Math.sqrt(s2))) };
    for (const level of [0.8, 0.9, 0.95]) {
      const c = chiSquare1Quantile(level);
      const half = Math.sqrt(s2) * Math.sqrt(Math.expm1(c / n));
      const iv = profileInterval(normalLogLik, mle, 0, level, { transforms: [{ name: 'id', toFree: (t) => t, fromFree: (z) => z }, LOG] });
      expect(iv.lowerFound && iv.upperFound).toBe(true);
      expect(Math.abs(iv.lower - (mean - half)) / half).toBeLessThan(1e-7);
      expect(Math.abs(iv.upper - (mean + half)) / half).toBeLessThan(1e-7);
    }
  });

  it('normal sd: the ends satisfy n[(r - 1) - ln r] = c with r = σ̂²/σ², and the interval widens with level', () => {
    // Profile deviance of σ in closed form (μ profiled out at x̄).
    const mle = { x: [mean, Math.sqrt(s2)], value: normalLogLik(Float64Array.of(mean, Math.sqrt(s2))) };
    let prevWidth = 0;
    for (const level of [0.5, 0.8, 0.9, 0.95, 0.99]) {
      const c = chiSquare1Quantile(level);
      const iv = profileInterval(normalLogLik, mle, 1, level, { transforms: [{ name: 'id', toFree: (t) => t, fromFree: (z) => z }, LOG] });
      for (const end of [iv.lower, iv.upper]) {
        const r = s2 / (end * end);
        expect(Math.abs(n * (r - 1 - Math.log(r)) - c)).toBeLessThan(1e-6);
      }
      expect(iv.upper - iv.lower).toBeGreaterThan(prevWidth);
      prevWidth = iv.upper - iv.lower;
    }
  });

  it('chi-square(1) quantiles match the published table', () => {
    // references.md: chi-square upper critical values, df 1: 2.7055 (0.10), 3.8415 (0.05), 6.6349 (0.01).
    expect(chiSquare1Quantile(0.9)).toBeCloseTo(2.7055, 4);
    expect(chiSquare1Quantile(0.95)).toBeCloseTo(3.8415, 4);
    expect(chiSquare1Quantile(0.99)).toBeCloseTo(6.6349, 4);
  });
});

describe('brentRoot', () => {
  it('solves cos x = x to 1e-15', () => {
    // Dottie number 0.7390851332151607 (from memory; checked by the residual below).
    const r = brentRoot((x) => Math.cos(x) - x, 0, 1);
    expect(Math.abs(Math.cos(r.x) - r.x)).toBeLessThan(1e-15);
    expect(r.x).toBeCloseTo(0.7390851332151607, 14);
  });
});

describe('maximize: properties and edge cases', () => {
  it('finds the optimum of random concave quadratics in 3 dimensions (property)', async () => {
    // The maximiser of -½(x - c)ᵀA(x - c) is c (closed form); A = BᵀB + I is positive definite.
    const fc = (await import('fast-check')).default;
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -2, max: 2, noNaN: true }), { minLength: 9, maxLength: 9 }),
        fc.array(fc.double({ min: -50, max: 50, noNaN: true }), { minLength: 3, maxLength: 3 }),
        (b, c) => {
          const A = new Float64Array(9);
          for (let i = 0; i < 3; i++)
            for (let j = 0; j < 3; j++) {
              let s = i === j ? 1 : 0;
              for (let k = 0; k < 3; k++) s += b[k * 3 + i]! * b[k * 3 + j]!;
              A[i * 3 + j] = s;
            }
          const f = (x: Float64Array): number => {
            let q = 0;
            for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) q += (x[i]! - c[i]!) * A[i * 3 + j]! * (x[j]! - c[j]!);
            return -0.5 * q;
          };
          const r = maximize(f, [0, 0, 0]);
          for (let i = 0; i < 3; i++) expect(Math.abs(r.x[i]! - c[i]!)).toBeLessThan(1e-6 * Math.max(1, Math.abs(c[i]!)));
          return true;
        },
      ),
      { numRuns: 40, seed: 2 },
    );
  });

  it('treats -∞ and NaN as infeasible and still finds an optimum next to the boundary', () => {
    // f(x) = ln x - x on x > 0 (-∞ elsewhere) has its maximum at x = 1 (closed form).
    const f = (x: Float64Array): number => ((x[0] as number) > 0 ? Math.log(x[0] as number) - (x[0] as number) : Number.NaN);
    const r = maximize(f, [0.05]);
    expect(r.converged).toBe(true);
    expect(Math.abs((r.x[0] as number) - 1)).toBeLessThan(1e-9);
  });

  it('rejects a start outside the transform range', () => {
    // Typed failure instead of a silent NaN (common practice, no source).
    expect(() => maximize((x) => -((x[0] as number) ** 2), [-1], { transforms: [LOG] })).toThrow(RangeError);
  });
});
