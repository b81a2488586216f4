/**
 * L-moment parameter fits (core/lmoments/family-fits.ts): the L-moments of each FITTED distribution,
 * computed by numerical integration of its quantile function (λ1 = ∫Q du, λ2 = ∫Q(2u − 1) du,
 * λ3 = ∫Q(6u² − 6u + 1) du; Hosking 1990 eq. 2.4, the shifted Legendre polynomials), must give back
 * the sample l1, l2, t3 the fit started from. Independent of the closed forms: the quantile
 * functions are the families' own (Gumbel, GEV, Pearson III) or written out here from their
 * definitions (generalized logistic and Pareto, Hosking & Wallis 1997 A.5, A.7 [from memory]).
 * Integration: trapezoid in z with u = Φ(z), z ∈ [−37, 37], step 0.005 (analytic integrand,
 * geometric convergence; common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { fitByLMoments, LMOMENT_FAMILIES, pearson3AlphaFromT3, type LMomentFamily } from '../../core/lmoments/family-fits.js';
import { sampleLMoments } from '../../core/lmoments/sample-lmoments.js';
import { normalCdf, normalSf } from '../../core/special/index.js';

function quantileOf(family: LMomentFamily, p: Record<string, number>): (u: number, v: number) => number {
  switch (family) {
    case 'gumbel':
    case 'gev':
    case 'pearson3': {
      const d = getFamily(family).make(p);
      return (u, v) => (u < 0.5 ? d.quantile(u) : d.isf(v));
    }
    case 'genlogistic': {
      const k = -(p.shape as number);
      // x(F) = ξ + α(1 − ((1 − F)/F)^k)/k
      return (u, v) => (p.location as number) + ((p.scale as number) * -Math.expm1(k * Math.log(v / u))) / k;
    }
    case 'genpareto': {
      const k = -(p.shape as number);
      // x(F) = ξ + α(1 − (1 − F)^k)/k
      return (_u, v) => (p.location as number) + ((p.scale as number) * -Math.expm1(k * Math.log(v))) / k;
    }
  }
}

function lMomentsByIntegration(q: (u: number, v: number) => number): { l1: number; l2: number; t3: number } {
  const h = 0.005;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  for (let z = -37; z <= 37 + 1e-9; z += h) {
    const u = normalCdf(z);
    const v = normalSf(z);
    const w = h * Math.exp(-z * z / 2) / Math.sqrt(2 * Math.PI);
    const x = q(u, v);
    s1 += w * x;
    s2 += w * x * (u - v);
    s3 += w * x * (6 * u * u - 6 * u + 1);
  }
  return { l1: s1, l2: s2, t3: s3 / s2 };
}

// Invented annual maxima (m³/s), positively skewed.
const SAMPLE = [112, 87, 143, 96, 205, 131, 78, 164, 119, 101, 256, 92, 138, 177, 84, 125, 310, 107, 149, 99, 186, 121, 91, 134, 228]
  .sort((a, b) => a - b);
const LM = sampleLMoments(SAMPLE);

describe('L-moment fits reproduce the sample l1, l2, t3 (quadrature of the fitted quantile function)', () => {
  for (const family of LMOMENT_FAMILIES) {
    it(family, () => {
      const fit = fitByLMoments(family, LM);
      const got = lMomentsByIntegration(quantileOf(family, fit.parameters as Record<string, number>));
      expect(Math.abs(got.l1 - LM.l1) / LM.l1).toBeLessThanOrEqual(1e-9);
      expect(Math.abs(got.l2 - LM.l2) / LM.l2).toBeLessThanOrEqual(1e-9);
      // The Gumbel has two parameters: its τ3 is fixed at 0.1699 (Hosking 1990 Table 1), not the sample's.
      const t3 = family === 'gumbel' ? 2 * Math.log(3) / Math.LN2 - 3 : LM.t3;
      // Pearson III: Hosking's rational approximation of α(τ3); measured here 2.2e-6 at t3 = ±0.324.
      expect(Math.abs(got.t3 - t3)).toBeLessThanOrEqual(family === 'pearson3' ? 1e-5 : 1e-9);
    });
  }
  it('negative L-skewness (mirrored sample) for GEV, GLO, GPA and Pearson III', () => {
    const mirrored = SAMPLE.map((x) => 400 - x).sort((a, b) => a - b);
    const lm = sampleLMoments(mirrored);
    expect(lm.t3).toBeLessThan(0);
    for (const family of ['gev', 'genlogistic', 'genpareto', 'pearson3'] as const) {
      const fit = fitByLMoments(family, lm);
      const got = lMomentsByIntegration(quantileOf(family, fit.parameters as Record<string, number>));
      expect(Math.abs(got.t3 - lm.t3), family).toBeLessThanOrEqual(family === 'pearson3' ? 1e-5 : 1e-9);
    }
  });
});

describe("Hosking's Pearson III approximation", () => {
  it('approaches the normal (α → ∞) as τ3 → 0 and stays positive and finite across (−1, 1)', () => {
    for (const t of [1e-4, 0.05, 0.2, 0.33, 0.34, 0.6, 0.9, 0.99]) {
      const a = pearson3AlphaFromT3(t);
      expect(a > 0 && Number.isFinite(a)).toBe(true);
      expect(pearson3AlphaFromT3(-t)).toBe(a);
    }
    expect(pearson3AlphaFromT3(1e-4)).toBeGreaterThan(1e6);
  });
});
