import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { buildLifeData, censoredAndersonDarling, censoredGofBootstrap, fitCensored, prepareLifeData } from '../../core/life/index.js';
import { censoringDistribution } from '../../core/life/bootstrap.js';
import { readFixture } from '../helpers/fixtures.js';

const fx = readFixture('life.json');
// D1 check set (references.md, SciPy): A² at the MLE for each family.
const D1 = [12.4, 15.1, 9.8, 22.7, 18.3, 11.6, 14.9, 27.5, 10.2, 13.7, 19.8, 8.9, 16.4, 24.1, 12.9, 17.6, 14.2, 31.3, 11.1, 15.8];

describe('censored Anderson–Darling', () => {
  it('with no suspensions it equals the usual A² (references.md D1 table)', () => {
    // references.md, D1 set: A² = 0.61625 (normal), 0.17836 (lognormal), 0.53535 (Weibull), 4.12317 (exponential).
    const d = prepareLifeData({ times: D1, failed: D1.map(() => 1) });
    const cases: [string, Record<string, number>, number][] = [
      ['normal', { mean: 16.415, sd: 5.894343 }, 0.61625],
      ['lognormal', { meanlog: 2.739527, sdlog: 0.336705 }, 0.17836],
      ['weibull', { shape: 2.920022, scale: 18.419691 }, 0.53535],
      ['exponential', { rate: 1 / 16.415 }, 4.12317],
    ];
    for (const [fam, p, a2] of cases) {
      const dist = getFamily(fam as 'normal').make(p);
      expect(censoredAndersonDarling(dist, d)).toBeCloseTo(a2, 4);
    }
  });

  it('with no suspensions it equals the order-statistic formula to rounding', () => {
    // A² = -n - (1/n) Σ (2i - 1)[ln uᵢ + ln(1 - u_{n+1-i})] (Anderson & Darling 1954).
    const d = prepareLifeData({ times: D1, failed: D1.map(() => 1) });
    const dist = getFamily('gamma').make({ shape: 8.685794, scale: 1.889868 });
    const s = [...D1].sort((a, b) => a - b);
    const n = s.length;
    let sum = 0;
    for (let i = 1; i <= n; i++) sum += (2 * i - 1) * (dist.logCdf(s[i - 1]!) + dist.logSf(s[n - i]!));
    expect(censoredAndersonDarling(dist, d)).toBeCloseTo(-n - sum / n, 11);
    expect(censoredAndersonDarling(dist, d)).toBeCloseTo(0.28443, 4); // references.md D1 gamma A²
  });

  it('the censoring distribution reproduces Type I censoring on the NIST set (all mass at 500 h)', () => {
    // NIST e-Handbook §8.4.1.3: the 10 survivors were all still running at 500 h.
    const d = prepareLifeData({ times: fx.nist.times, failed: fx.nist.failed });
    const G = censoringDistribution(d);
    expect(Array.from(G.atoms)).toEqual([500]);
    expect(G.mass[0]).toBeCloseTo(1, 14);
    expect(G.drawBeyond(54, 0.3)).toBe(500);
  });

  it('bootstrap p-value: seeded, reproducible, in (0, 1], and small for a clearly wrong model', () => {
    // Common practice, no source: the exponential cannot follow a Weibull shape-4 sample.
    const n = 60;
    const t = new Float64Array(n);
    const f = new Uint8Array(n);
    for (let i = 0; i < n; i++) {
      // Weibull(shape 4, scale 100) quantiles at (i + 0.5)/n, Type I censored at 110.
      const x = 100 * Math.pow(-Math.log1p(-(i + 0.5) / n), 1 / 4);
      t[i] = Math.min(x, 110);
      f[i] = x <= 110 ? 1 : 0;
    }
    const d = buildLifeData(t, f);
    const fe = fitCensored('exponential', d);
    const fw = fitCensored('weibull', d);
    if (!fe.ok || !fw.ok) throw new Error('fit failed');
    const ge = censoredGofBootstrap(fe, d, { replicates: 99, seed: 3 });
    const gw = censoredGofBootstrap(fw, d, { replicates: 99, seed: 3 });
    expect(ge.pValue).toBe(0.01); // nothing exceeds: (1 + 0)/(1 + 99)
    expect(gw.pValue).toBeGreaterThan(0.2);
    expect(gw.pValue).toBeLessThanOrEqual(1);
    expect(censoredGofBootstrap(fw, d, { replicates: 99, seed: 3 }).pValue).toBe(gw.pValue);
    expect(gw.monteCarloError).toBeCloseTo(Math.sqrt((gw.pValue * (1 - gw.pValue)) / 99), 14);
  });
});

describe('censored bootstrap: unrefittable replicates are counted, censoring by random censorship', () => {
  it('2 failures among 15 units: every replicate counts (unrefittable ones as exceeding), so B stays 99', () => {
    // Design from the issue: with only 2 failures many replicates have too few failures to refit;
    // leaving them out made the p-value describe another design.
    const times = [120, 340, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500];
    const failed = [1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0];
    const data = prepareLifeData({ times, failed });
    const fit = fitCensored('weibull', data);
    if (!fit.ok) throw new Error('fit');
    const r = censoredGofBootstrap(fit, data, { replicates: 99, seed: 3 });
    expect(r.failedReplicates).toBeGreaterThan(0);
    expect(r.replicates).toBe(99);
    expect(r.pValue).toBeGreaterThanOrEqual((1 + r.failedReplicates) / 100);
    expect(r.method).toMatch(/counted as exceeding/);
  });
  it('the Kaplan–Meier censoring distribution every replicate unit draws from has mass 1/8 at the first of staggered withdrawals', () => {
    // Efron (1981) random censorship: C ~ Ĝ independently of the lifetime; Ĝ here has atoms at the withdrawals.
    const data = prepareLifeData({ times: [5, 8, 10, 12, 15, 20, 25, 30], failed: [0, 1, 0, 1, 0, 1, 1, 0] });
    const G = censoringDistribution(data);
    let below = 0;
    for (let k = 0; k < 200; k++) if (G.drawBeyond(Number.NEGATIVE_INFINITY, (k + 0.5) / 200) < 8) below++;
    // The mass of Ĝ at 5 is 1/8 (first withdrawal, 8 at risk): 25 of the 200 evenly spaced draws.
    expect(below).toBe(25);
  });
});
