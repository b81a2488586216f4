import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { analyzeLife, buildLifeData, censoredAndersonDarling, censoredGofBootstrap, fitCensored, prepareLifeData } from '../../core/life/index.js';
import { censoredAndersonDarlingMean, studentizedCensoredAndersonDarling } from '../../core/life/anderson-darling.js';
import { CENSORED_AD_METHOD, censoringDesign, censoringDistribution } from '../../core/life/bootstrap.js';
import { censoredGofFromCounts, censoredReplicateDrawer, MAX_REPLICATE_ATTEMPTS, runCensoredReplicates } from '../../core/life/bootstrap-range.js';
import { forEachFailureTime } from '../../core/life/data.js';
import { createRng } from '../../core/random/index.js';
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

  it('censored data ending in a failure: the integral stops at the last observed time (brute-force quadrature of the definition)', () => {
    // A² = n ∫₀^{F(τ)} (K(u) - u)²/(u(1 - u)) du with K the Kaplan–Meier estimate (Kaplan & Meier 1958)
    // and τ the largest observed time; integrated here by the midpoint rule on t, independently of the closed form.
    const times = [12.4, 15.1, 9.8, 22.7, 18.3, 11.6, 14.9, 27.5, 10.2, 13.7, 19.8, 8.9];
    const failed = [1, 0, 1, 1, 0, 1, 1, 1, 0, 1, 1, 1]; // the largest time (27.5) is a failure
    const d = prepareLifeData({ times, failed });
    const dist = getFamily('weibull').make({ shape: 2.9, scale: 18.4 });
    const K = (x: number): number => {
      let S = 1;
      for (let i = 0; i < d.n; i++) {
        const ti = d.times[i] as number;
        if (ti > x) break;
        if (d.failed[i]) S *= 1 - 1 / (d.n - i);
      }
      return 1 - S;
    };
    let q = 0;
    const steps = 400000;
    const h = 27.5 / steps;
    for (let j = 0; j < steps; j++) {
      const x = (j + 0.5) * h;
      const u = dist.cdf(x);
      q += ((K(x) - u) ** 2 / (u * (1 - u))) * Math.exp(dist.logPdf(x)) * h;
    }
    expect(censoredAndersonDarling(dist, d)).toBeCloseTo(d.n * q, 3);
    // So it does not matter whether the last unit failed or was suspended at τ (Pettitt & Stephens 1976 integrate the Type I A² to F(T) the same way).
    const d2 = prepareLifeData({ times, failed: failed.map((x, i) => (i === 7 ? 0 : x)) });
    expect(censoredAndersonDarling(dist, d2)).toBeCloseTo(censoredAndersonDarling(dist, d), 12);
  });

  it('the censoring distribution reproduces Type I censoring on the NIST set (all mass at 500 h)', () => {
    // NIST e-Handbook §8.4.1.3: the 10 survivors were all still running at 500 h.
    const d = prepareLifeData({ times: fx.nist.times, failed: fx.nist.failed });
    const G = censoringDistribution(d);
    expect(Array.from(G.atoms)).toEqual([500]);
    expect(G.mass[0]).toBeCloseTo(1, 14);
    expect(G.draw(0.3)).toBe(500);
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
  it('2 failures among 15 units, Type I at 500: every replicate keeps the 2 failures, so none is lost or unrefittable', () => {
    // Design from the issue: drawn unconditionally, 15-39 of 99 replicates had fewer than 2 failures
    // and could not be refitted. Conditional on r (Type I failures are an independent sample from the
    // model truncated at the end of test; Lawless 2003 §2.2.2 [from memory]) each replicate has r = 2.
    const times = [120, 340, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500];
    const failed = [1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0];
    const data = prepareLifeData({ times, failed });
    const fit = fitCensored('weibull', data);
    if (!fit.ok) throw new Error('fit');
    const r = censoredGofBootstrap(fit, data, { replicates: 99, seed: 3 });
    expect(r.failedReplicates).toBe(0);
    expect(r.replicates).toBe(99);
    expect(r.pValue).toBeGreaterThanOrEqual(0.01);
    expect(r.method).toMatch(/counted as exceeding/);
    expect(r.method).toMatch(/number of failures/);
  });
  it('Type I replicates: r failures from the model truncated at the end of test, the rest suspended there', () => {
    // NIST e-Handbook §8.4.1.3 design (10 of 20 units running at 500 h); the truncated model's
    // distribution function is F(t)/F(500) (Lawless 2003 §2.2.2 [from memory]).
    const d = prepareLifeData({ times: fx.nist.times, failed: fx.nist.failed });
    const params = { shape: 1.5, scale: 600 };
    const dist = getFamily('weibull').make(params);
    const draw = censoredReplicateDrawer('weibull', params, d);
    const t = new Float64Array(d.n);
    const f = new Uint8Array(d.n);
    const probe = [100, 250, 400];
    const below = probe.map(() => 0);
    let total = 0;
    for (let b = 0; b < 2000; b++) {
      draw(createRng(11, b), t, f);
      let r = 0;
      for (let i = 0; i < d.n; i++) {
        if (f[i]) {
          r++;
          total++;
          expect(t[i]).toBeLessThanOrEqual(500);
          probe.forEach((x, k) => {
            if ((t[i] as number) <= x) below[k]!++;
          });
        } else expect(t[i]).toBe(500);
      }
      expect(r).toBe(d.failures);
    }
    const F500 = dist.cdf(500);
    probe.forEach((x, k) => {
      const expected = dist.cdf(x) / F500;
      // 20,000 failure times: binomial SE below 0.0036; 5 SE allowed.
      expect(Math.abs(below[k]! / total - expected)).toBeLessThan(0.018);
    });
  });
  it('a complete sample gets complete replicates (nothing is censored at the largest value)', () => {
    const d = prepareLifeData({ times: D1, failed: D1.map(() => 1) });
    const draw = censoredReplicateDrawer('weibull', { shape: 2.92, scale: 18.42 }, d);
    const t = new Float64Array(d.n);
    const f = new Uint8Array(d.n);
    let beyond = 0;
    for (let b = 0; b < 200; b++) {
      draw(createRng(5, b), t, f);
      expect(Array.from(f).every((x) => x === 1)).toBe(true);
      for (const x of t) if (x > d.maxTime) beyond++;
    }
    // P(X > 31.3) = exp(-(31.3/18.42)^2.92) ≈ 0.008 per value: about 32 of 4000 lie beyond the sample's largest value.
    expect(beyond).toBeGreaterThan(5);
  });
  it('the Kaplan–Meier censoring distribution every replicate unit draws from has mass 1/8 at the first of staggered withdrawals', () => {
    // Efron (1981) random censorship: C ~ Ĝ independently of the lifetime; Ĝ here has atoms at the withdrawals.
    const data = prepareLifeData({ times: [5, 8, 10, 12, 15, 20, 25, 30], failed: [0, 1, 0, 1, 0, 1, 1, 0] });
    const G = censoringDistribution(data);
    let below = 0;
    for (let k = 0; k < 200; k++) if (G.draw((k + 0.5) / 200) < 8) below++;
    // The mass of Ĝ at 5 is 1/8 (first withdrawal, 8 at risk): 25 of the 200 evenly spaced draws.
    expect(below).toBe(25);
  });
});

describe('staggered withdrawals: studentized A², replicates that keep the number of failures', () => {
  // Staggered design: withdrawals at 5, 10, 15 and 30 between and after failures (Kaplan–Meier censoring estimate has 4 atoms).
  const times = [5, 8, 10, 12, 15, 20, 25, 30, 6.5, 17, 22, 27];
  const failed = [0, 1, 0, 1, 0, 1, 1, 0, 1, 1, 1, 0];
  const params = { shape: 2, scale: 22 };

  it('the mean of A² is n ∑ Greenwood variance × ∫ du/(u(1 − u)) over the window (midpoint quadrature of the definition)', () => {
    // Greenwood (1926) variance of the Kaplan–Meier estimate, Var K(t) = S(t)² Σ_{t_j ≤ t} d_j/(Y_j(Y_j − d_j)) (Kaplan & Meier 1958);
    // integrated here by the midpoint rule on t up to the last observed time, independently of the closed form.
    const d = prepareLifeData({ times, failed });
    const dist = getFamily('weibull').make(params);
    const varK = (x: number): number => {
      let S = 1;
      let g = 0;
      forEachFailureTime(d, (t, Y, k) => {
        if (t > x) return;
        S *= 1 - k / Y;
        if (Y > k) g += k / (Y * (Y - k));
      });
      return S * S * g;
    };
    let q = 0;
    const steps = 200000;
    const h = d.maxTime / steps;
    for (let j = 0; j < steps; j++) {
      const x = (j + 0.5) * h;
      const u = dist.cdf(x);
      q += (varK(x) / (u * (1 - u))) * Math.exp(dist.logPdf(x)) * h;
    }
    expect(censoredAndersonDarlingMean(dist, d)).toBeCloseTo(d.n * q, 3);
    expect(studentizedCensoredAndersonDarling(dist, d)).toBeCloseTo(censoredAndersonDarling(dist, d) / (d.n * q), 3);
  });

  it('staggered data are tested with the studentized A² (named in the result); Type I and complete data keep the plain A²', () => {
    const d = prepareLifeData({ times, failed });
    expect(censoringDesign(d)).toBe('staggered');
    const fit = fitCensored('weibull', d);
    if (!fit.ok) throw new Error('fit');
    const r = censoredGofBootstrap(fit, d, { replicates: 19, seed: 1 });
    const dist = getFamily('weibull').make(fit.parameters);
    expect(r.statistic).toBeCloseTo(studentizedCensoredAndersonDarling(dist, d), 12);
    expect(r.statistic).not.toBeCloseTo(censoredAndersonDarling(dist, d), 3);
    expect(r.testLabel).toMatch(/studentized/);
    // NIST e-Handbook §8.4.1.3 design: Type I at 500 h.
    const nist = prepareLifeData({ times: fx.nist.times, failed: fx.nist.failed });
    expect(censoringDesign(nist)).toBe('type-1');
    const fn = fitCensored('weibull', nist);
    if (!fn.ok) throw new Error('fit');
    const rn = censoredGofBootstrap(fn, nist, { replicates: 19, seed: 1 });
    expect(rn.statistic).toBeCloseTo(censoredAndersonDarling(getFamily('weibull').make(fn.parameters), nist), 12);
    expect(rn.testLabel).toBeUndefined();
  });

  it('a report on staggered data decides by the fast double bootstrap and says so, with its measured size (test/life/censored-size.test.ts checks the numbers)', () => {
    const opts = { families: ['weibull' as const], bootstrapReplicates: 19, seed: 1 };
    const rep = analyzeLife({ times, failed }, opts);
    const c = rep.candidates.find((x) => x.family === 'weibull');
    expect(c?.goodnessOfFit?.firstLevelPValue).toBeGreaterThan(0);
    expect(c?.goodnessOfFit?.method).toBe(CENSORED_AD_METHOD);
    expect(CENSORED_AD_METHOD).toMatch(/fast double bootstrap.*Davidson & MacKinnon 2007.*measured size at α = 0\.05/);
    // The single bootstrap's size warning (5.5 % / 4.0 %, outside 5 ± 0.5) is gone with the method it described.
    expect(rep.warnings.join(' ')).not.toMatch(/staggered censoring|read p-values near α as inconclusive/);
  });

  it('every staggered replicate has the observed number of failures', () => {
    const d = prepareLifeData({ times, failed });
    const draw = censoredReplicateDrawer('weibull', params, d);
    const t = new Float64Array(d.n);
    const f = new Uint8Array(d.n);
    for (let b = 0; b < 300; b++) {
      expect(draw(createRng(7, b), t, f)).toBe(true);
      expect(f.reduce((a, x) => a + x, 0)).toBe(d.failures);
    }
  });

  it('the unit-by-unit conditional draw has the law of whole replicates redrawn until they have r failures (the definition)', () => {
    // Units are independent and alike, so given r failures the failed ones are independent draws given failure
    // and the others given suspension; checked against the definition by the mean failure and suspension times.
    const d = prepareLifeData({ times, failed });
    const dist = getFamily('weibull').make(params);
    const G = censoringDistribution(d);
    const draw = censoredReplicateDrawer('weibull', params, d);
    const t = new Float64Array(d.n);
    const f = new Uint8Array(d.n);
    const stats = () => ({ fs: 0, fs2: 0, fk: 0, ss: 0, ss2: 0, sk: 0 });
    const a = stats();
    const b = stats();
    const add = (s: ReturnType<typeof stats>, x: number, failedUnit: boolean): void => {
      if (failedUnit) {
        s.fs += x;
        s.fs2 += x * x;
        s.fk++;
      } else {
        s.ss += x;
        s.ss2 += x * x;
        s.sk++;
      }
    };
    for (let k = 0; k < 4000; k++) {
      draw(createRng(21, k), t, f);
      for (let i = 0; i < d.n; i++) add(a, t[i] as number, f[i] === 1);
      const rng = createRng(22, k);
      for (;;) {
        const xs = Array.from({ length: d.n }, () => [dist.quantile(rng.uniform()), G.draw(rng.uniform())] as const);
        if (xs.filter(([x, c]) => x <= c).length !== d.failures) continue;
        for (const [x, c] of xs) add(b, Math.min(x, c), x <= c);
        break;
      }
    }
    const close = (m1: number, q1: number, k1: number, m2: number, q2: number, k2: number): void => {
      const v1 = q1 / k1 - (m1 / k1) ** 2;
      const v2 = q2 / k2 - (m2 / k2) ** 2;
      expect(Math.abs(m1 / k1 - m2 / k2)).toBeLessThan(5 * Math.sqrt(v1 / k1 + v2 / k2));
    };
    expect(a.fk).toBe(b.fk);
    close(a.fs, a.fs2, a.fk, b.fs, b.fs2, b.fk);
    close(a.ss, a.ss2, a.sk, b.ss, b.ss2, b.sk);
  });

  it('a replicate that cannot reach the observed number of failures counts as unrefittable (exceeding), after at most the stated attempts', () => {
    // Lives ~ 1e-6 of the withdrawal times: every unit fails in every draw, never r = 7 of 12.
    const d = prepareLifeData({ times, failed });
    const draw = censoredReplicateDrawer('weibull', { shape: 2, scale: 1e-5 }, d);
    const t = new Float64Array(d.n);
    const f = new Uint8Array(d.n);
    let uniforms = 0;
    const rng = createRng(3, 0);
    const counting = { ...rng, uniform: () => (uniforms++, rng.uniform()), normal: rng.normal, exponential: rng.exponential, gamma: rng.gamma };
    expect(draw(counting, t, f)).toBe(false);
    // One censoring uniform per unit per attempt (the lifetimes may use more): at most MAX_REPLICATE_ATTEMPTS attempts.
    expect(uniforms).toBeGreaterThanOrEqual(MAX_REPLICATE_ATTEMPTS * d.n);
    expect(uniforms).toBeLessThanOrEqual(2 * MAX_REPLICATE_ATTEMPTS * d.n);
    const counts = runCensoredReplicates('weibull', { shape: 2, scale: 1e-5 }, d, 0, 1, 0, 3);
    expect(counts.failed).toBe(3);
    expect(censoredGofFromCounts(0, counts).pValue).toBe(1);
  });
});
