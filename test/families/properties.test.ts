/**
 * Properties every registered family must satisfy, run over several parameter sets each.
 * These are mathematical identities (common practice, no source) unless a comment names a source;
 * tolerances are stated beside each check with their reason.
 */
import { describe, expect, it } from 'vitest';
import { ParameterError } from '../../core/errors.js';
import { allFamilies, DEFAULT_FAMILIES, getFamily } from '../../core/families/index.js';
import type { Distribution, FamilyName, Parameters } from '../../core/families/index.js';
import { createRng } from '../../core/random/index.js';

const EPS = 2 ** -52;

/**
 * Parameter sets per registered family: everyday values, the D1 fits, and extreme shapes/scales.
 * Every registered family must appear here (the first test fails otherwise): add a family's sets
 * when you register it.
 */
const CASES: Partial<Record<FamilyName, Parameters[]>> = {
  normal: [{ mean: 0, sd: 1 }, { mean: 16.415, sd: 5.894343 }, { mean: -40, sd: 0.25 }, { mean: 1e6, sd: 3e3 }],
  lognormal: [{ meanlog: 0, sdlog: 1 }, { meanlog: 2.739527, sdlog: 0.336705 }, { meanlog: -3, sdlog: 2.5 }],
  gamma: [
    { shape: 0.2, scale: 3 },
    { shape: 1, scale: 2 },
    { shape: 8.685794, scale: 1.889868 },
    { shape: 50, scale: 0.1 },
  ],
  weibull: [
    { shape: 0.5, scale: 100 },
    { shape: 1, scale: 3 },
    { shape: 2.920022, scale: 18.419691 },
    { shape: 8, scale: 2 },
  ],
  exponential: [{ rate: 1 }, { rate: 0.06091989 }, { rate: 250 }],
  gumbel: [{ location: 0, scale: 1 }, { location: 100, scale: 25 }],
  gev: [
    { location: 10, scale: 2, shape: 0.1 },
    { location: 0, scale: 1, shape: -0.2 },
    { location: 5, scale: 3, shape: 0 },
  ],
  weibull3: [
    { shape: 1.5, scale: 10, threshold: 5 },
    { shape: 0.7, scale: 2, threshold: -3 },
  ],
  lognormal3: [
    { meanlog: 1, sdlog: 0.5, threshold: 10 },
    { meanlog: 0, sdlog: 1.5, threshold: -2 },
  ],
  pearson3: [
    { mean: 0, sd: 1, skew: 0.5 },
    { mean: 3.2, sd: 0.25, skew: -0.6 },
    { mean: 10, sd: 2, skew: 0 },
    { mean: -5, sd: 0.5, skew: 1.8 },
    { mean: 100, sd: 15, skew: -2.5 },
  ],
  logpearson3: [
    { mean: 3, sd: 0.25, skew: 0.4 },
    { mean: 2, sd: 0.3, skew: -0.6 },
    { mean: 0.5, sd: 0.2, skew: 0 },
  ],
  genpareto: [
    { location: 0, scale: 1, shape: 0.2 },
    { location: 25, scale: 14, shape: -0.1 },
    { location: -2, scale: 0.5, shape: 0 },
  ],
  genlogistic: [
    { location: 0, scale: 1, shape: 0.2 },
    { location: 100, scale: 15, shape: -0.25 },
    { location: 5, scale: 2, shape: 0 },
  ],
};

const PS = [1e-12, 1e-6, 1e-3, 0.01, 0.1, 0.3, 0.5, 0.7, 0.9, 0.99, 0.999, 1 - 1e-6];

/** Exactly zero, either sign (ln 1 may come out as -0). */
function expectZero(v: number): void {
  expect(v === 0).toBe(true);
}

/** DEVELOPERS.md policy: 1e-12 relative, 1e-10 in far tails (probabilities below 1e-20). */
function base(p: number): number {
  return p < 1e-20 ? 1e-10 : 1e-12;
}

function rel(a: number, b: number): number {
  return a === b ? 0 : Math.abs(a - b) / Math.abs(b);
}

/** Relative condition number of p = F(x) with respect to a relative change in x. */
function condCdf(d: Distribution, x: number, p: number): number {
  return (Math.abs(x) * d.pdf(x)) / p;
}

it('the registry starts with the five default families, and every registered family has cases here', () => {
  expect(allFamilies().map((f) => f.name).slice(0, DEFAULT_FAMILIES.length)).toEqual([...DEFAULT_FAMILIES]);
  expect(Object.keys(CASES).sort()).toEqual(allFamilies().map((f) => f.name).sort());
});

for (const family of allFamilies()) {
  describe(`${family.name}`, () => {
    for (const params of CASES[family.name] ?? []) {
      const d = family.make(params);
      const tag = JSON.stringify(params);

      it(`${tag}: quantile/cdf round trip (sf for the upper half)`, () => {
        for (const p of PS) {
          const x = d.quantile(p);
          expect(Number.isFinite(x)).toBe(true);
          if (x === d.support.upper || x === d.support.lower) continue; // see the isf round trip
          // Tolerance: the policy bound plus the rounding of x to a double, amplified by the
          // condition number (no implementation can beat that).
          if (p <= 0.5) {
            expect(rel(d.cdf(x), p)).toBeLessThanOrEqual(base(p) + 16 * EPS * condCdf(d, x, p));
          } else {
            const q = 1 - p; // exact for p ≥ 0.5 (Sterbenz)
            expect(rel(d.sf(x), q)).toBeLessThanOrEqual(base(q) + 16 * EPS * condCdf(d, x, q));
          }
        }
      });

      it(`${tag}: isf/sf round trip down to q = 1e-100`, () => {
        for (const q of [1e-100, 1e-30, ...PS]) {
          const x = d.isf(q);
          expect(Number.isFinite(x)).toBe(true);
          // At a finite support edge the exact quantile is closer to the edge than one ulp:
          // it rounds to the edge itself and cannot round-trip (checked by the edge test instead).
          if (x === d.support.upper || x === d.support.lower) continue;
          expect(rel(d.sf(x), q)).toBeLessThanOrEqual(base(q) + 16 * EPS * condCdf(d, x, q));
        }
      });

      it(`${tag}: pdf equals the derivative of cdf (Richardson-extrapolated central difference)`, () => {
        for (const p of [0.01, 0.1, 0.3, 0.5, 0.7, 0.9, 0.99]) {
          const x = d.quantile(p);
          // Step: small against the spread and against the distance to a finite support edge.
          const edgeDistance = Math.min(Math.abs(x - d.support.lower), Math.abs(d.support.upper - x));
          const h = 1e-3 * Math.min(d.quantile(0.75) - d.quantile(0.25), edgeDistance);
          const D = (step: number) => (d.cdf(x + step) - d.cdf(x - step)) / (2 * step);
          const deriv = (4 * D(h / 2) - D(h)) / 3;
          // Truncation O(h⁴) and rounding ≈ eps/h leave about 1e-8 relative.
          expect(rel(deriv, d.pdf(x))).toBeLessThanOrEqual(1e-7);
        }
      });

      const xs = [...PS.map((p) => d.quantile(p)), ...[1e-30, 1e-80].map((q) => d.isf(q))];

      it(`${tag}: cdf + sf = 1`, () => {
        for (const x of xs) expect(Math.abs(d.cdf(x) + d.sf(x) - 1)).toBeLessThanOrEqual(4 * EPS);
      });

      it(`${tag}: log forms equal the logs of the plain forms where those are representable`, () => {
        for (const x of xs) {
          if (x === d.support.upper || x === d.support.lower) continue; // the density may be infinite there
          for (const [lf, f] of [
            [d.logCdf(x), d.cdf(x)],
            [d.logSf(x), d.sf(x)],
            [d.logPdf(x), d.pdf(x)],
          ] as const) {
            if (f < 1e-290) continue; // below this the plain form loses digits (subnormals)
            // ln f has absolute error ≈ the relative error of f: allow 1e-13 absolute or relative.
            expect(Math.abs(lf - Math.log(f))).toBeLessThanOrEqual(1e-13 * Math.max(1, Math.abs(lf)));
          }
        }
      });

      it(`${tag}: log forms stay finite far beyond where the plain forms underflow`, () => {
        const far = d.isf(1e-300);
        const near = d.quantile(1e-300);
        if (far < d.support.upper) {
          expect(Number.isFinite(d.logSf(far))).toBe(true);
          expect(d.logSf(far)).toBeLessThan(-690);
        }
        if (near > d.support.lower) {
          expect(Number.isFinite(d.logCdf(near))).toBe(true);
          expect(d.logCdf(near)).toBeLessThan(-690);
        }
      });

      it(`${tag}: support edges and out-of-range arguments`, () => {
        const { lower, upper } = d.support;
        expect(d.cdf(lower)).toBe(0);
        expect(d.sf(lower)).toBe(1);
        expect(d.logCdf(lower)).toBe(-Infinity);
        expectZero(d.logSf(lower));
        expect(d.cdf(upper)).toBe(1);
        expect(d.sf(upper)).toBe(0);
        expect(d.logSf(upper)).toBe(-Infinity);
        expectZero(d.logCdf(upper));
        if (!Number.isFinite(upper)) {
          expect(d.logPdf(upper)).toBe(-Infinity);
          expect(d.pdf(upper)).toBe(0);
        }
        expect(d.quantile(0)).toBe(lower);
        expect(d.quantile(1)).toBe(upper);
        expect(d.isf(0)).toBe(upper);
        expect(d.isf(1)).toBe(lower);
        if (Number.isFinite(lower)) {
          const below = lower === 0 ? [-1e-300, -1, -Infinity] : [lower - 1e-6 * Math.abs(lower), lower - 1, -Infinity];
          for (const x of below) {
            expect(d.cdf(x)).toBe(0);
            expect(d.sf(x)).toBe(1);
            expect(d.logPdf(x)).toBe(-Infinity);
            expect(d.pdf(x)).toBe(0);
            expect(d.logCdf(x)).toBe(-Infinity);
            expectZero(d.logSf(x));
          }
        } else {
          expect(d.logPdf(lower)).toBe(-Infinity);
        }
        if (Number.isFinite(upper)) {
          for (const x of [upper + 1e-6 * Math.max(1, Math.abs(upper)), upper + 1, Infinity]) {
            expect(d.cdf(x)).toBe(1);
            expect(d.sf(x)).toBe(0);
            expect(d.logPdf(x)).toBe(-Infinity);
            expectZero(d.logCdf(x));
            expect(d.logSf(x)).toBe(-Infinity);
          }
        }
        for (const p of [-0.1, 1.1, Number.NaN]) {
          expect(d.quantile(p)).toBeNaN();
          expect(d.isf(p)).toBeNaN();
        }
        for (const f of [d.pdf, d.logPdf, d.cdf, d.sf, d.logCdf, d.logSf]) expect(f.call(d, Number.NaN)).toBeNaN();
      });

      it(`${tag}: mean and variance agree with numerical integration of the density`, () => {
        const m = d.mean();
        const v = d.variance();
        // Trapezoid rule on a smooth, rapidly decaying integrand over the whole line converges
        // geometrically (common practice, no source). A finite end point e: x = e ± e^u.
        const N = 6000;
        let s1 = 0;
        let s2 = 0;
        const { lower, upper } = d.support;
        if (Number.isFinite(lower) || Number.isFinite(upper)) {
          const sign = Number.isFinite(lower) ? 1 : -1;
          const edge = Number.isFinite(lower) ? lower : upper;
          const near = sign > 0 ? d.quantile(1e-50) : d.isf(1e-50);
          const far = sign > 0 ? d.isf(1e-50) : d.quantile(1e-50);
          // Start where edge ± e^u is still distinguishable from the edge (the density may be
          // infinite there); the sliver next to the edge is added as (edge - mean)^k·P(sliver).
          const lo = Math.log(Math.max(Math.abs(near - edge), 1e-300, 64 * EPS * Math.abs(edge)));
          const hi = Math.log(Math.abs(far - edge));
          const du = (hi - lo) / N;
          const sliver = sign > 0 ? d.cdf(edge + Math.exp(lo)) : d.sf(edge - Math.exp(lo));
          s1 += edge * sliver;
          s2 += (edge - m) * (edge - m) * sliver;
          for (let i = 0; i <= N; i++) {
            const u = lo + i * du;
            const x = edge + sign * Math.exp(u);
            const w = (i === 0 || i === N ? 0.5 : 1) * du * Math.exp(u + d.logPdf(x));
            s1 += w * x;
            s2 += w * (x - m) * (x - m);
          }
        } else {
          const lo = d.quantile(1e-50);
          const hi = d.isf(1e-50);
          const dx = (hi - lo) / N;
          for (let i = 0; i <= N; i++) {
            const x = lo + i * dx;
            const w = (i === 0 || i === N ? 0.5 : 1) * dx * d.pdf(x);
            s1 += w * x;
            s2 += w * (x - m) * (x - m);
          }
        }
        expect(Math.abs(s1 - m)).toBeLessThanOrEqual(1e-9 * (Math.abs(m) + Math.sqrt(v)));
        expect(rel(s2, v)).toBeLessThanOrEqual(1e-9);
      });

      it(`${tag}: random() draws follow the distribution (seeded; binomial standard error)`, () => {
        const n = 20000;
        const draws = family.random(params, createRng(20261201, 7), n);
        expect(draws).toBeInstanceOf(Float64Array);
        expect(draws.length).toBe(n);
        for (const p of [0.1, 0.5, 0.9]) {
          const x = d.quantile(p);
          let below = 0;
          for (let i = 0; i < n; i++) if ((draws[i] as number) < x) below++;
          // 4.5 binomial standard errors: a false alarm about once in 150,000 runs per check.
          expect(Math.abs(below / n - p)).toBeLessThanOrEqual(4.5 * Math.sqrt((p * (1 - p)) / n));
        }
      });
    }

    it('bad parameters throw ParameterError naming the parameter', () => {
      const good = (CASES[family.name] ?? [])[0] as Parameters;
      for (const name of family.parameterNames) {
        const bound = family.parameterBounds[name];
        expect(bound).toBeDefined();
        const bads = [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY];
        if (bound!.lower === 0) bads.push(0, -1, -1e-300);
        else if (Number.isFinite(bound!.lower) && !bound!.lowerInclusive) bads.push(bound!.lower, bound!.lower - 1);
        if (Number.isFinite(bound!.upper)) bads.push(bound!.upper, bound!.upper + 1);
        for (const bad of bads) {
          const call = () => family.make({ ...good, [name]: bad });
          expect(call).toThrow(ParameterError);
          expect(call).toThrow(new RegExp(`parameter ${name} `));
        }
        const missing: Record<string, number> = { ...good };
        delete missing[name];
        expect(() => family.make(missing)).toThrow(ParameterError);
        expect(() => family.random({ ...good, [name]: Number.NaN }, createRng(1), 3)).toThrow(ParameterError);
      }
    });

    it('make() accepts the parameters by role and reports them back', () => {
      const good = (CASES[family.name] ?? [])[1] as Parameters;
      expect(family.make(good).parameters).toEqual(good);
      expect(family.make(good).family).toBe(family.name);
      expect(getFamily(family.name)).toBe(family);
    });
  });
}

describe('densities at the lower edge of the positive families (from memory: the closed forms)', () => {
  it('gamma and Weibull: +∞ for shape < 1, 1/scale for shape 1, 0 for shape > 1; exponential: rate', () => {
    for (const name of ['gamma', 'weibull'] as const) {
      const f = getFamily(name);
      expect(f.make({ shape: 0.5, scale: 2 }).pdf(0)).toBe(Infinity);
      expect(f.make({ shape: 1, scale: 2 }).pdf(0)).toBeCloseTo(0.5, 15);
      expect(f.make({ shape: 2, scale: 2 }).pdf(0)).toBe(0);
    }
    expect(getFamily('exponential').make({ rate: 3 }).pdf(0)).toBeCloseTo(3, 14);
    expect(getFamily('lognormal').make({ meanlog: 0, sdlog: 1 }).pdf(0)).toBe(0);
  });
});
