/**
 * L-moment ratio diagram curves (core/lmoments/ratio-diagram.ts) checked by quadrature of each
 * family's quantile function (λ2, λ3, λ4 with the shifted Legendre polynomials, Hosking 1990 eq. 2.4),
 * independent of the closed forms; published points: normal τ4 = 30π⁻¹ arctan √2 − 9 = 0.1226,
 * Gumbel (0.1699, 0.1504) (Hosking 1990 Table 1).
 */
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { gevRatios, gloT4, gpaT4, pe3T4, ratioDiagram } from '../../core/lmoments/ratio-diagram.js';
import { normalCdf, normalSf } from '../../core/special/index.js';

function ratios(q: (u: number, v: number) => number): { t3: number; t4: number } {
  const h = 0.005;
  let l2 = 0;
  let l3 = 0;
  let l4 = 0;
  for (let z = -37; z <= 37 + 1e-9; z += h) {
    const u = normalCdf(z);
    const v = normalSf(z);
    const w = (h * Math.exp((-z * z) / 2)) / Math.sqrt(2 * Math.PI);
    const x = q(u, v);
    const d = u - v; // 2u − 1
    l2 += w * x * d;
    l3 += w * x * (6 * u * u - 6 * u + 1);
    l4 += w * x * (20 * u ** 3 - 30 * u * u + 12 * u - 1);
  }
  return { t3: l3 / l2, t4: l4 / l2 };
}

describe('ratio-diagram curves vs quadrature of the quantile functions', () => {
  it('GEV at k = −0.2, 0, 0.3 (Plumbline shape −k)', () => {
    for (const k of [-0.2, 0.3]) {
      const d = getFamily('gev').make({ location: 0, scale: 1, shape: -k });
      const r = ratios((u, v) => (u < 0.5 ? d.quantile(u) : d.isf(v)));
      const c = gevRatios(k);
      expect(Math.abs(r.t3 - c.t3)).toBeLessThan(1e-8);
      expect(Math.abs(r.t4 - c.t4)).toBeLessThan(1e-8);
    }
    expect(gevRatios(0).t3).toBeCloseTo(0.1699, 4); // Gumbel, Hosking 1990 Table 1
    expect(gevRatios(0).t4).toBeCloseTo(0.1504, 4);
  });
  it('generalized logistic and Pareto (quantile functions from their definitions)', () => {
    for (const k of [-0.3, 0.2]) {
      const glo = ratios((u, v) => -Math.expm1(k * Math.log(v / u)) / k);
      expect(Math.abs(glo.t4 - gloT4(glo.t3))).toBeLessThan(1e-8);
      const gpa = ratios((_u, v) => -Math.expm1(k * Math.log(v)) / k);
      expect(Math.abs(gpa.t4 - gpaT4(gpa.t3))).toBeLessThan(1e-8);
    }
  });
  it("Pearson III: Hosking's polynomial within 5e-4 of quadrature (an approximation; measured below that)", () => {
    for (const skew of [-1.5, 0.5, 1, 2]) {
      const d = getFamily('pearson3').make({ mean: 0, sd: 1, skew });
      const r = ratios((u, v) => (u < 0.5 ? d.quantile(u) : d.isf(v)));
      expect(Math.abs(r.t4 - pe3T4(r.t3))).toBeLessThan(5e-4);
    }
  });
  it('the sample point and the published normal point', () => {
    const dgm = ratioDiagram([5, 7, 8, 9, 12, 15, 21]);
    expect(dgm.sample.n).toBe(7);
    expect(dgm.points.find((p) => p.family === 'normal')!.t4).toBeCloseTo(0.1226, 4);
    expect(dgm.curves.map((c) => c.family)).toEqual(['gev', 'genlogistic', 'genpareto', 'pearson3', 'bound']);
  });
});
