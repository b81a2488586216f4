import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  erf,
  erfc,
  erfcx,
  normalCdf,
  normalIsf,
  normalLogCdf,
  normalLogCdfSfAt,
  normalLogIsf,
  normalLogQuantile,
  normalLogSf,
  normalQuantile,
  normalSf,
} from '../../core/special/index.js';
import { relErr, section, TOL, worst } from './fixture.js';

/** Cody's first-interval edge in z (0.46875·√2), where the central and tail forms meet. */
const Z_EDGE = 0.46875 * Math.SQRT2;

function check1(name: string, f: (x: number) => number, tol = TOL): void {
  const s = section(name);
  const rows = s.cases.map((c) => ({
    label: `${name}(${String(c[0])}) [${String(c[2])}]`,
    got: f(c[0] as number),
    want: c[1] as number,
    tol,
  }));
  const r = worst(rows);
  expect(r.failures, `source: ${s.source}`).toEqual([]);
}

describe('error function against SciPy / mpmath (test/fixtures/special.json)', () => {
  it('erf, erfc, erfcx to 1e-12 relative (DEVELOPERS.md), x from -30 to 1e8', () => {
    check1('erf', erf);
    check1('erfc', erfc);
    check1('erfcx', erfcx);
  });
  it('erf is odd and erf + erfc = 1 (identities)', () => {
    fc.assert(
      fc.property(fc.double({ min: -8, max: 8, noNaN: true }), (x) => {
        expect(erf(-x)).toBe(-erf(x));
        expect(Math.abs(erf(x) + erfc(x) - 1)).toBeLessThanOrEqual(4e-16);
      }),
      { seed: 20240601, numRuns: 2000 },
    );
  });
});

describe('normal distribution functions against SciPy ndtr / log_ndtr and mpmath', () => {
  it('normalCdf and normalSf from z = -40 to 40 (values above 1e-300) to 1e-12 relative', () => {
    check1('normalCdf', normalCdf);
    check1('normalCdf', (z) => normalSf(-z));
  });
  it('normalLogCdf and normalLogSf from z = -40 to 40 to 1e-12 relative', () => {
    check1('normalLogCdf', normalLogCdf);
    check1('normalLogCdf', (z) => normalLogSf(-z));
  });
  it('far-tail spot values: Φ(-10) = 7.61985302416047e-24, ln Φ(-40) = -804.6084420137539 (SciPy ndtr, log_ndtr)', () => {
    expect(relErr(normalCdf(-10), 7.61985302416047e-24)).toBeLessThan(TOL);
    expect(relErr(normalLogCdf(-40), -804.6084420137539)).toBeLessThan(TOL);
    expect(Number.isFinite(normalLogCdf(-1e6))).toBe(true);
    expect(relErr(normalLogSf(40), -804.6084420137539)).toBeLessThan(TOL);
  });
  it('Φ(z) + Φ(-z) = 1 and ln Φ(z) finite for |z| <= 1e3 (identities)', () => {
    fc.assert(
      fc.property(fc.double({ min: -40, max: 40, noNaN: true }), (z) => {
        expect(Math.abs(normalCdf(z) + normalSf(z) - 1)).toBeLessThanOrEqual(4e-16);
        expect(Number.isFinite(normalLogCdf(25 * z))).toBe(true);
      }),
      { seed: 7, numRuns: 2000 },
    );
  });
});

describe('normal quantile (Wichura 1988, AS 241) against SciPy ndtri / ndtri_exp and mpmath', () => {
  it('normalQuantile for p from 1e-300 to 1 - 1e-15 to 1e-12 relative', () => {
    check1('normalQuantile', normalQuantile);
  });
  it('normalIsf(q) = -normalQuantile(q) for tiny q, without forming 1 - q', () => {
    check1('normalQuantile', (p) => -normalIsf(p));
    expect(relErr(normalIsf(1e-300), 37.0470962993612)).toBeLessThan(TOL); // scipy.special.ndtri(1e-300) = -37.0470962993612
  });
  it('normalLogQuantile from ln p = -1e300 to -1e-300 to 1e-12 relative', () => {
    check1('normalLogQuantile', normalLogQuantile);
    check1('normalLogQuantile', (lp) => -normalLogIsf(lp));
  });
  it('round trips Φ(Φ⁻¹(p)) = p and ln Φ(Φ⁻¹_log(l)) = l (identities; tolerance 1e-12 covers cond = |x φ/Φ| ≤ 1.4e3)', () => {
    fc.assert(
      fc.property(fc.double({ min: -690, max: -1e-12, noNaN: true }), (lp) => {
        const p = Math.exp(lp);
        expect(relErr(normalCdf(normalQuantile(p)), p)).toBeLessThan(TOL);
        expect(relErr(normalLogCdf(normalLogQuantile(lp)), lp)).toBeLessThan(TOL);
      }),
      { seed: 11, numRuns: 3000 },
    );
  });
  it('edges: 0 and 1 give -∞ and +∞; outside [0, 1] gives NaN', () => {
    expect(normalQuantile(0)).toBe(Number.NEGATIVE_INFINITY);
    expect(normalQuantile(1)).toBe(Number.POSITIVE_INFINITY);
    expect(normalQuantile(1.5)).toBeNaN();
    expect(normalLogQuantile(0)).toBe(Number.POSITIVE_INFINITY);
    expect(normalLogQuantile(Number.NEGATIVE_INFINITY)).toBe(Number.NEGATIVE_INFINITY);
  });
});

describe('normalLogCdfSfAt: ln Φ and ln(1 − Φ) at one z from one erfcx evaluation', () => {
  const cdf = new Float64Array(1);
  const sf = new Float64Array(1);
  const both = (z: number): [number, number] => {
    normalLogCdfSfAt(z, cdf, sf, 0);
    return [cdf[0] as number, sf[0] as number];
  };
  it('equals normalLogCdf(z) and normalLogSf(z) bit for bit (z from -50 to 50 in steps of 1/64, random z, edges)', () => {
    const zs: number[] = [0, -0, Z_EDGE, -Z_EDGE, Z_EDGE * (1 + 2 ** -52), 38.5, -38.5, 38.5000001, 1e6, -1e6, Infinity, -Infinity, NaN];
    for (let k = -3200; k <= 3200; k++) zs.push(k / 64, k / 64 + 1e-9);
    for (const z of zs) {
      const [c, s] = both(z);
      expect(Object.is(c, normalLogCdf(z)), `ln Φ(${z})`).toBe(true);
      expect(Object.is(s, normalLogSf(z)), `ln(1 − Φ(${z}))`).toBe(true);
    }
    fc.assert(
      fc.property(fc.double({ min: -60, max: 60, noNaN: true }), (z) => {
        const [c, s] = both(z);
        expect(Object.is(c, normalLogCdf(z))).toBe(true);
        expect(Object.is(s, normalLogSf(z))).toBe(true);
      }),
      { seed: 20261201, numRuns: 5000 },
    );
  });
  it('against SciPy log_ndtr / mpmath (test/fixtures/special.json) to 1e-12 relative, both sides', () => {
    check1('normalLogCdf', (z) => both(z)[0]);
    check1('normalLogCdf', (z) => both(-z)[1]);
  });
});
