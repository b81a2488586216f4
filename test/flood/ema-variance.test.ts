/**
 * First-order variance of the log-Pearson III quantile fitted by moments (core/flood/ema-variance.ts)
 * against test/fixtures/flood-ema-variance.json (scripts/fixtures/flood-ema-variance.py):
 * - the same delta-method variance computed independently in Python: SciPy `pearson3.moment` for
 *   the raw moments (not the cumulant algebra) and a numerical gradient (not the closed form);
 * - a seeded SciPy simulation of the estimator (n = 1000, R = 4000): the simulated variance of
 *   y_p = m + s K(G) within 4 Monte Carlo standard errors of the formula (the first-order formula
 *   is asymptotic; at n = 1000 its bias is far below the Monte Carlo error).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { lp3QuantileInterval, lp3QuantileVariance, standardizedRawMoments } from '../../core/flood/ema-variance.js';

const fx = JSON.parse(readFileSync('test/fixtures/flood-ema-variance.json', 'utf8'));
interface Case { skew: number; n: number; exceedance: number; variance: number; K: number; stationWeight: number; regionalSkewMse: number }
interface Sim { skew: number; n: number; exceedance: number; variance: number; se: number }

describe('variance of a log-Pearson III quantile by moments', () => {
  it('raw moments of the standardized Pearson III: a4 = 3 + 1.5γ² (gamma cumulants; the normal\'s 3 and 15 at γ = 0)', () => {
    expect(standardizedRawMoments(0)).toEqual([1, 0, 1, 0, 3, 0, 15]);
    expect(standardizedRawMoments(0.4)[4]).toBeCloseTo(3.24, 14);
  });

  it.each(fx.formula as Case[])('equals the independent Python delta method: skew $skew, n $n, q $exceedance, station weight $stationWeight (rel ≤ 1e-6)', (c) => {
    const v = lp3QuantileVariance({ mean: 0, sd: 1, skew: c.skew }, c.n, c.exceedance, c.stationWeight < 1 ? { stationWeight: c.stationWeight, regionalSkewMse: c.regionalSkewMse } : null);
    // 1e-6: the fixture's numerical gradient (Richardson, h = 2e-3) and our central difference of K (h = 1e-4).
    expect(Math.abs(v.variance - c.variance) / c.variance).toBeLessThan(1e-6);
    expect(Math.abs(v.frequencyFactor - c.K)).toBeLessThan(1e-9);
  });

  it.each(fx.simulation as Sim[])('matches a seeded SciPy simulation of the estimator: skew $skew, n $n, q $exceedance (within 4 MC s.e.)', (s) => {
    const v = lp3QuantileVariance({ mean: 0, sd: 1, skew: s.skew }, s.n, s.exceedance);
    expect(Math.abs(v.variance - s.variance)).toBeLessThan(4 * s.se);
  });

  it('scales with sd² and 1/n, and the interval is 10^(ŷ ± z se)', () => {
    const a = lp3QuantileVariance({ mean: 2.5, sd: 0.2, skew: 0.3 }, 50, 0.01);
    const b = lp3QuantileVariance({ mean: 2.5, sd: 0.4, skew: 0.3 }, 100, 0.01);
    expect(b.variance / a.variance).toBeCloseTo(2, 12);
    const i = lp3QuantileInterval(a, 0.9);
    expect(Math.log10(i.upper) - a.estimate).toBeCloseTo(1.6448536269514722 * Math.sqrt(a.variance), 12);
    expect(a.estimate - Math.log10(i.lower)).toBeCloseTo(1.6448536269514722 * Math.sqrt(a.variance), 12);
  });
});
