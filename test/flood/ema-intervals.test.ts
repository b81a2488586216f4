/**
 * EMA quantile intervals (core/flood/ema-intervals.ts), the EMA's asymptotic covariance
 * (core/flood/ema-covariance.ts) and the noncentral t (core/flood/noncentral-t.ts).
 *
 * Sources beside each check:
 * - SciPy `stats.nct` (test/fixtures/flood-ema-ci.json, scripts/fixtures/flood-ema-ci.py): the
 *   noncentral t's cdf and quantiles, and the exact interval of a normal quantile (zero skew held,
 *   no censoring), which the EMA interval must reduce to;
 * - the first-order variance of ema-variance.ts, itself checked against an independent SciPy
 *   computation (test/flood/ema-variance.test.ts): without censoring the sandwich must equal it;
 * - a seeded simulation of our EMA estimator at long records (n = 400 systematic years, with
 *   censoring): the asymptotic variance must match the simulated one (within 4 Monte Carlo s.e.);
 * - the recursions of the conditional moments: the untruncated values are the gamma's and the
 *   normal's central moments (textbook values: gamma 4th central moment 3α² + 6α, normal 3 and 15).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { effectiveRecordLength, emaCovariance, emaQuantileVariance, type EmaDesign } from '../../core/flood/ema-covariance.js';
import { intervalMoments, intervalRawMoments } from '../../core/flood/ema-moments.js';
import { emaIterate, fitEma, type LogObservation } from '../../core/flood/ema.js';
import { emaReturnLevels } from '../../core/flood/ema-return-levels.js';
import { lp3QuantileVariance, standardizedRawMoments } from '../../core/flood/ema-variance.js';
import { noncentralTCdf, noncentralTQuantile } from '../../core/flood/noncentral-t.js';
import { Pearson3Distribution } from '../../core/families/index.js';
import { createRng, type Rng } from '../../core/random/index.js';

const fx = JSON.parse(readFileSync('test/fixtures/flood-ema-ci.json', 'utf8'));

describe('noncentral t (SciPy stats.nct)', () => {
  it.each(fx.nct as { t: number; df: number; noncentrality: number; cdf: number }[])('cdf($t; ν = $df, δ = $noncentrality) within 1e-12', (c) => {
    expect(Math.abs(noncentralTCdf(c.t, c.df, c.noncentrality) - c.cdf)).toBeLessThan(1e-12);
  });
  it.each(fx.nctQuantile as { p: number; df: number; noncentrality: number; quantile: number }[])('quantile($p; ν = $df, δ = $noncentrality) within 1e-9 relative', (c) => {
    expect(Math.abs(noncentralTQuantile(c.p, c.df, c.noncentrality) / c.quantile - 1)).toBeLessThan(1e-9);
  });
  it('refuses a non-positive degree of freedom', () => {
    expect(() => noncentralTCdf(1, 0, 0)).toThrow(/degrees of freedom/);
  });
});

describe('conditional moments of any order', () => {
  it('untruncated: the standardized Pearson III raw moments (gamma cumulants) for γ = 0.7, −0.4 and 0', () => {
    for (const g of [0.7, -0.4, 0]) {
      const r = intervalRawMoments(0, 1, g, Number.NEGATIVE_INFINITY, Number.POSITIVE_INFINITY, 6);
      const a = standardizedRawMoments(g);
      for (let k = 1; k <= 6; k++) expect(r.moments[k]).toBeCloseTo(a[k] as number, 9);
    }
  });
  it('orders 1–3 equal intervalMoments (which the EMA uses) on a censored interval', () => {
    const a = intervalRawMoments(2.1, 0.3, -0.6, 1.5, 2.4, 6);
    const b = intervalMoments(2.1, 0.3, -0.6, 1.5, 2.4);
    expect(a.moments[1]).toBe(b.m1);
    expect(a.moments[2]).toBe(b.m2);
    expect(a.moments[3]).toBe(b.m3);
  });
});

describe('EMA asymptotic covariance', () => {
  const systematic = (n: number): EmaDesign => ({ thresholds: [{ years: n, threshold: Number.NEGATIVE_INFINITY }] });
  it.each([
    [0.3, 60, 0.01, null],
    [-0.5, 40, 0.02, null],
    [0, 60, 0.01, null],
    [0.2, 60, 0.01, { stationWeight: 0.45, regionalSkewMse: 0.12 }],
  ] as const)('without censoring equals the moment-estimator variance of ema-variance.ts: skew %s, n %s, q %s (rel 1e-8)', (g, n, q, regional) => {
    const v = emaQuantileVariance(emaCovariance(systematic(n), { mean: 0, sd: 1, skew: g }, regional), g, q).variance;
    const ref = lp3QuantileVariance({ mean: 0, sd: 1, skew: g }, n, q, regional).variance;
    expect(Math.abs(v / ref - 1)).toBeLessThan(1e-8);
  });
  it('the effective record length of a record without censoring is its length; censored years count for less', () => {
    expect(effectiveRecordLength(systematic(57), { mean: 0, sd: 1, skew: 0.25 })).toBeCloseTo(57, 8);
    const hist: EmaDesign = { thresholds: [{ years: 40, threshold: Number.NEGATIVE_INFINITY }, { years: 100, threshold: 1.28 }] };
    const ne = effectiveRecordLength(hist, { mean: 0, sd: 1, skew: 0 });
    expect(ne).toBeGreaterThan(40);
    expect(ne).toBeLessThan(140);
  });

  const draw = (rng: Rng, g: number): number => {
    const a = 4 / (g * g);
    return (g / 2) * (rng.gamma(a) - a);
  };
  it.each([
    ['200 systematic years, 30 % censored (below the 0.30 quantile)', 200, 0.3, 0, 600],
    ['100 systematic + 400 historical years known above the 0.95 quantile', 100, 0, 400, 600],
  ] as const)('matches a seeded simulation of the EMA estimator: %s (skew 0.2; 100-year quantile and station skew, 4 MC s.e.)', (_label, nsys, lowQ, hist, R) => {
    const g = 0.2;
    const pop = new Pearson3Distribution(0, 1, g);
    const low = lowQ > 0 ? pop.quantile(lowQ) : Number.NEGATIVE_INFINITY;
    const high = pop.quantile(0.95);
    const rng = createRng(20261205, 3);
    const ys: number[] = [];
    const gs: number[] = [];
    for (let r = 0; r < R; r++) {
      const obs: LogObservation[] = [];
      for (let i = 0; i < nsys; i++) {
        const y = draw(rng, g);
        obs.push(y > low ? { kind: 'peak', y } : { kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: low });
      }
      for (let i = 0; i < hist; i++) {
        const y = draw(rng, g);
        obs.push(y > high ? { kind: 'peak', y } : { kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: high });
      }
      const f = emaIterate(obs);
      ys.push(new Pearson3Distribution(f.mean, f.sd, f.skew.weightedSkew).isf(0.01));
      gs.push(f.skew.stationSkew);
    }
    const variance = (x: number[]): number => {
      const m = x.reduce((a, b) => a + b, 0) / x.length;
      return x.reduce((a, b) => a + (b - m) ** 2, 0) / (x.length - 1);
    };
    const design: EmaDesign = {
      thresholds: [{ years: nsys, threshold: low }, ...(hist > 0 ? [{ years: hist, threshold: high }] : [])],
    };
    const cov = emaCovariance(design, { mean: 0, sd: 1, skew: g }, null);
    const asym = emaQuantileVariance(cov, g, 0.01).variance;
    const asymSkew = cov.parameters[8] as number;
    // Normal-theory s.e. of a sample variance, √(2/(R − 1)) σ².
    const tol = 4 * Math.sqrt(2 / (R - 1));
    expect(Math.abs(variance(ys) / asym - 1)).toBeLessThan(tol);
    expect(Math.abs(variance(gs) / asymSkew - 1)).toBeLessThan(tol);
    // Censoring matters: the skew variance of the same years without censoring is far off.
    const free = emaCovariance({ thresholds: [{ years: nsys + hist, threshold: Number.NEGATIVE_INFINITY }] }, { mean: 0, sd: 1, skew: g }, null).parameters[8] as number;
    expect(Math.abs(variance(gs) / free - 1)).toBeGreaterThan(tol);
  }, 60_000);
});

describe('EMA quantile intervals', () => {
  it.each(fx.exact as { n: number; confidence: number; flows: number[]; levels: { period: number; estimate: number; lower: number; upper: number }[] }[])(
    'reduce to the exact noncentral-t interval of a normal quantile (SciPy nct): zero skew held, n = $n, c = $confidence',
    (c) => {
      const record = { peaks: c.flows, lowOutliers: 'none' as const, regionalSkew: { skew: 0, mse: 1e-14 } };
      const fit = fitEma(record);
      const rl = emaReturnLevels(record, fit, c.levels.map((l) => l.period), { confidence: c.confidence });
      c.levels.forEach((ref, i) => {
        const r = rl[i]!;
        expect(Math.abs(r.estimate / ref.estimate - 1)).toBeLessThan(1e-9);
        expect(Math.abs(r.lower! / ref.lower - 1)).toBeLessThan(1e-8);
        expect(Math.abs(r.upper! / ref.upper - 1)).toBeLessThan(1e-8);
        expect(r.equivalentYears).toBeCloseTo(c.n, 6);
        expect(r.bootstrap).toBeNull();
      });
    },
  );
});

describe('measured coverage of the EMA intervals (test/fixtures/flood-ema-ci-coverage.json, scripts/flood-ema-ci-coverage.ts, seeded)', () => {
  const cov = JSON.parse(readFileSync('test/fixtures/flood-ema-ci-coverage.json', 'utf8')) as {
    recordsPerCase: number;
    cases: { label: string; coverage: number; waldCoverage: number; monteCarloSe: number; records: number }[];
  };
  it('the exact case (zero skew held, no censoring) covers 90 % within 3 Monte Carlo s.e.', () => {
    const c = cov.cases[0]!;
    expect(c.label).toMatch(/exact case/);
    expect(Math.abs(c.coverage - 0.9)).toBeLessThan(3 * c.monteCarloSe);
  });
  it('every case covers between 86 and 97 % (nominal 90 %) but one: approximate, as the report says; the n = 20 zero-skew record over-covers (96 %), the low-censored one under-covers (86 %)', () => {
    for (const c of cov.cases.filter((x) => !/censored below the 0.05 quantile, skew -1.6/.test(x.label))) {
      expect(c.coverage).toBeGreaterThan(0.86);
      expect(c.coverage).toBeLessThan(0.97);
    }
  });
  it('the known failure, said in the cautions: a strong negative skew (−1.6) censored below the 0.05 quantile covers only 82.7 % (12.1 % of true 100-year flows above the upper limit)', () => {
    const c = cov.cases.find((x) => /censored below the 0.05 quantile, skew -1.6/.test(x.label))!;
    expect(c.coverage).toBeGreaterThan(0.8);
    expect(c.coverage).toBeLessThan(0.86);
  });
  it('the committed numbers are what the script gives (cases 1 and 7 rerun in full)', async () => {
    const { CASES, runCase } = await import('../../scripts/flood-ema-ci-coverage.js');
    for (const i of [0, 6]) {
      const row = runCase(CASES[i]!, i, cov.recordsPerCase);
      expect(row.coverage).toBe(cov.cases[i]!.coverage);
      expect(row.waldCoverage).toBe(cov.cases[i]!.waldCoverage);
    }
  }, 120_000);
});

describe('EMA intervals where the covariance cannot be computed', () => {
  it('a design with no years (a record and fit that do not belong together) gives the estimates with no interval and says why, instead of failing the run', () => {
    const fit = fitEma({ peaks: [412, 655, 1020, 388, 790, 2140, 560, 933], lowOutliers: 'none' });
    const rl = emaReturnLevels({ peaks: [] }, fit, [10, 100], { confidence: 0.9 });
    for (const r of rl) {
      expect(r.estimate).toBeGreaterThan(0);
      expect(r.lower).toBeNull();
      expect(r.upper).toBeNull();
      expect(r.method).toMatch(/not computed for this record \(the EMA covariance is singular/);
    }
  });
});
