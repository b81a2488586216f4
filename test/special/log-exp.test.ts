import { describe, expect, it } from 'vitest';
import { log1mexp, log1pexp, log1pmx, logAddExp, logSumExp, normalLogCdf, normalLogPdf, normalPdfOverCdf } from '../../core/special/index.js';
import { relErr } from './fixture.js';

// Reference values below from mpmath at 50 digits (log(1 - exp(x)), log1p(exp(x)), log1p(x) - x),
// computed when this test was written: python3 -c "import mpmath as mp; mp.mp.dps=50; ...".
describe('log/exp helpers (Mächler 2012 for log1mexp / log1pexp)', () => {
  it('log1mexp keeps precision on both sides of -ln 2', () => {
    expect(relErr(log1mexp(-1e-20), -46.051701859880914)).toBeLessThan(1e-15); // ln(1e-20)
    expect(relErr(log1mexp(-0.5), -0.9327521295671886)).toBeLessThan(1e-15);
    expect(relErr(log1mexp(-40), -4.248354255291589e-18)).toBeLessThan(1e-15);
    expect(log1mexp(0)).toBe(Number.NEGATIVE_INFINITY);
    expect(log1mexp(1)).toBeNaN();
  });
  it('log1pexp does not overflow and is exact in the tails', () => {
    expect(relErr(log1pexp(-50), 1.9287498479639178e-22)).toBeLessThan(1e-15);
    expect(relErr(log1pexp(0), Math.LN2)).toBeLessThan(1e-16);
    expect(relErr(log1pexp(20), 20.000000002061153)).toBeLessThan(1e-15);
    expect(log1pexp(1000)).toBe(1000);
  });
  it('log1pmx(x) = ln(1+x) − x accurate near 0 (≈ −x²/2)', () => {
    expect(relErr(log1pmx(1e-10), -4.999999999666667e-21)).toBeLessThan(1e-15);
    expect(relErr(log1pmx(-0.3), -0.056674943938732374)).toBeLessThan(2e-15);
    expect(relErr(log1pmx(0.49), -0.09122388004263222)).toBeLessThan(2e-15);
    expect(log1pmx(0)).toBe(0);
  });
  it('logSumExp and logAddExp scale by the largest term', () => {
    expect(relErr(logSumExp([1000, 1000]), 1000 + Math.LN2)).toBeLessThan(1e-16);
    expect(relErr(logSumExp(new Float64Array([-1e4, -1e4 + Math.log(3)])), -1e4 + Math.log(4))).toBeLessThan(1e-16);
    expect(logSumExp([])).toBe(Number.NEGATIVE_INFINITY);
    expect(relErr(logAddExp(-800, -800), -800 + Math.LN2)).toBeLessThan(1e-16);
  });
  it('normalPdfOverCdf = exp(ln φ − ln Φ), finite far in the lower tail (≈ |z| + 1/|z|)', () => {
    for (const z of [-30, -5, -0.5, 0, 0.7, 3]) {
      expect(relErr(normalPdfOverCdf(z), Math.exp(normalLogPdf(z) - normalLogCdf(z)))).toBeLessThan(1e-13);
    }
    const z = -1e6;
    expect(relErr(normalPdfOverCdf(z), 1e6 + 1e-6)).toBeLessThan(1e-15);
  });
});
