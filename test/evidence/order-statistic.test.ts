import { describe, expect, it } from 'vitest';
// The evidence folder's own entry: these helpers are not part of the core's public API.
import { betaQuantile, incompleteBeta, orderStatisticInterval } from '../../core/evidence/index.js';
import { rel } from '../helpers/fixtures.js';


describe('Beta quantiles for the order-statistic band', () => {
  it('matches SciPy beta.ppf', () => {
    // SciPy 1.17.1: scipy.stats.beta.ppf(p, a, b). Tolerance 1e-10 relative: a plotting band,
    // solved to about 1e-12 (see core/evidence/orderStatistic.ts).
    const cases: [number, number, number, number][] = [
      [0.025, 1, 20, 0.0012650894979498038],
      [0.975, 1, 20, 0.1684334709830853],
      [0.025, 10, 11, 0.27195784956079183],
      [0.975, 10, 11, 0.6847218669594515],
      [0.025, 20, 1, 0.8315665290169146],
      [0.975, 20, 1, 0.9987349105020502],
      [0.025, 3, 998, 0.0006190999316495713],
      [0.975, 500, 501, 0.5304537166614578],
      [0.05, 250000, 750001, 0.24928779275491153],
    ];
    for (const [p, a, b, want] of cases) {
      const q = betaQuantile(p, a, b);
      expect(rel(q.x, want)).toBeLessThan(1e-10);
      expect(Math.abs(q.x + q.y - 1)).toBeLessThan(1e-15);
    }
  });

  it('Beta(1, n) has the closed form 1 - (1 - p)^(1/n) (the minimum of n uniforms)', () => {
    // P(min U ≤ u) = 1 - (1 - u)^n: textbook identity; evaluated as -expm1(log1p(-p)/n) to avoid cancellation.
    for (const n of [1, 2, 10, 1000, 1e6]) {
      for (const p of [0.025, 0.5, 0.975]) {
        const want = -Math.expm1(Math.log1p(-p) / n);
        expect(rel(betaQuantile(p, 1, n).x, want)).toBeLessThan(1e-9);
      }
    }
  });

  it('I_u(i, n+1-i) equals P(Binomial(n, u) ≥ i) summed term by term', () => {
    // The order-statistic/binomial identity (David & Nagaraja 2003, eq. 2.1.3 [from memory]).
    const n = 20;
    for (const u of [0.03, 0.2, 0.5, 0.77, 0.96]) {
      for (const i of [1, 2, 5, 10, 15, 19, 20]) {
        let s = 0;
        let c = 1; // C(n, k)
        for (let k = 0; k <= n; k++) {
          if (k >= i) s += c * Math.pow(u, k) * Math.pow(1 - u, n - k);
          c = (c * (n - k)) / (k + 1);
        }
        expect(Math.abs(incompleteBeta(u, i, n + 1 - i) - s)).toBeLessThan(1e-13);
      }
    }
  });

  it('the band is symmetric: the i-th lower bound is 1 minus the (n+1-i)-th upper bound', () => {
    // Symmetry of Beta(a, b) and Beta(b, a) (definition).
    const n = 37;
    for (const i of [1, 4, 19, 30, 37]) {
      const a = orderStatisticInterval(i, n, 0.05);
      const b = orderStatisticInterval(n + 1 - i, n, 0.05);
      expect(Math.abs(a.lower.x - b.upper.y)).toBeLessThan(1e-12);
      expect(a.lower.x).toBeLessThan(a.upper.x);
    }
  });
});
