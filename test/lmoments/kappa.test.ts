import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fitKappa, kappaLMoments, kappaQuantile, kappaRatios, logisticT4 } from '../../core/lmoments/kappa.js';

// Fixture: scripts/fixtures/kappa.py (SciPy 1.17.1 kappa4 quantiles; L-moments by 30-digit mpmath
// quadrature of the quantile function, independent of the closed forms in kappa.ts).
const fixture = JSON.parse(readFileSync(new URL('../fixtures/kappa.json', import.meta.url), 'utf8')) as {
  cases: { k: number; h: number; quantiles: { p: number; x: number }[]; lmoments: { l1: number; l2: number; t3: number; t4: number } }[];
};

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(1e-300, Math.abs(b));

describe('kappa distribution (Hosking 1994)', () => {
  for (const c of fixture.cases) {
    it(`k = ${c.k}, h = ${c.h}: quantiles match SciPy kappa4`, () => {
      for (const q of c.quantiles) {
        const x = kappaQuantile({ location: 0, scale: 1, shape: c.k, shape2: c.h }, q.p);
        expect(Math.abs(x - q.x), `p = ${q.p}: ${x} vs ${q.x}`).toBeLessThan(1e-12 * Math.max(1, Math.abs(q.x)));
      }
    });

    it(`k = ${c.k}, h = ${c.h}: closed-form L-moments match quadrature of the quantile function`, () => {
      const l = kappaLMoments({ location: 0, scale: 1, shape: c.k, shape2: c.h });
      // k = 0 is evaluated at k = 1e-7 (the formulas divide by k): allow 1e-6 there, 1e-9 elsewhere.
      const tol = c.k === 0 ? 1e-6 : 1e-9;
      expect(Math.abs(l.l1 - c.lmoments.l1)).toBeLessThan(tol * Math.max(1, Math.abs(c.lmoments.l1)));
      expect(rel(l.l2, c.lmoments.l2)).toBeLessThan(tol);
      expect(Math.abs(l.t3 - c.lmoments.t3)).toBeLessThan(tol);
      expect(Math.abs(l.t4 - c.lmoments.t4)).toBeLessThan(tol);
    });
  }

  it('h = -1 is the generalized logistic: τ3 = −k, τ4 = (1 + 5k²)/6 (Hosking & Wallis 1997, appendix)', () => {
    const r = kappaRatios(0.2, -1);
    expect(r.t3).toBeCloseTo(-0.2, 10);
    expect(r.t4).toBeCloseTo(logisticT4(0.2), 10);
  });

  it('fitting recovers the shapes from the L-moments (round trip over the fixture cases)', () => {
    for (const c of fixture.cases) {
      if (c.h <= -1 || c.k === 0) continue; // h = −1 lies on the logistic curve, the edge of the region
      const fit = fitKappa(c.lmoments.l1, c.lmoments.l2, c.lmoments.t3, c.lmoments.t4);
      expect(fit.ok, `k = ${c.k}, h = ${c.h}`).toBe(true);
      if (!fit.ok) continue;
      expect(Math.abs(fit.parameters.shape - c.k)).toBeLessThan(1e-6);
      expect(Math.abs(fit.parameters.shape2 - c.h)).toBeLessThan(1e-5);
      expect(Math.abs(fit.parameters.location)).toBeLessThan(1e-6);
      expect(fit.parameters.scale).toBeCloseTo(1, 6);
    }
  });

  it('refuses τ4 on or above the logistic curve and says why', () => {
    const fit = fitKappa(1, 0.2, 0.1, logisticT4(0.1) + 0.01);
    expect(fit.ok).toBe(false);
    if (!fit.ok) expect(fit.reason).toMatch(/generalized logistic curve/);
  });
});
