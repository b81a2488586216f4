/**
 * The expected moments algorithm (core/flood/ema.ts) and its parts, against outside references:
 * - conditional Pearson III moments vs SciPy `pearson3` + scipy.integrate.quad (test/fixtures/flood-ema.json);
 * - the EMA iteration vs an independent Python implementation with quadrature moments (same fixture);
 * - the reduction to the moments of log10 Q with a systematic record only (Bulletin 17B eq. 6 skew;
 *   Cohn, Lane & Baier 1997: EMA equals the method of moments without censoring);
 * - the multiple Grubbs–Beck p-values vs a seeded NumPy Monte Carlo of the statistic;
 * - the station-skew MSE (Griffis & Stedinger 2009, Bulletin 17C) vs a seeded SciPy simulation of the skew
 *   estimator, its large-sample limit, and Bulletin 17B's formula by hand.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { intervalMoments } from '../../core/flood/ema-moments.js';
import { emaIterate, fitEma, type LogObservation } from '../../core/flood/ema.js';
import { mgbPValues, mgbStatistics, MGB_REPLICATES, multipleGrubbsBeck } from '../../core/flood/grubbs-beck.js';
import { stationSkewMse, stationSkewMse17b, weightSkew } from '../../core/flood/regional-skew.js';
import { standardizedRawMoments } from '../../core/flood/ema-variance.js';

interface MomentCase {
  mean: number;
  sd: number;
  skew: number;
  lower: number | null;
  upper: number | null;
  probability: number;
  m1: number;
  m2: number;
  m3: number;
}
interface EmaRef {
  mean: number;
  sd: number;
  stationSkew: number;
  weightedSkew: number;
}
interface Fixture {
  intervalMoments: MomentCase[];
  mgb: { n: number; k: number; eta: number; p: number; se: number }[];
  ema: { peaks: number[]; intervals: [number | null, number | null][]; station: EmaRef; regional: { skew: number; mse: number; fit: EmaRef } };
  skewVariance: { skew: number; n: number; variance: number; se: number }[];
}
const FIX = JSON.parse(readFileSync(new URL('../fixtures/flood-ema.json', import.meta.url), 'utf8')) as Fixture;

function rel(a: number, b: number): number {
  return a === b ? 0 : Math.abs(a - b) / Math.abs(b);
}

describe('conditional Pearson III moments (SciPy pearson3 + quad, epsrel 1e-13)', () => {
  for (const c of FIX.intervalMoments) {
    it(`skew ${c.skew} on (${String(c.lower)}, ${String(c.upper)}]`, () => {
      const r = intervalMoments(c.mean, c.sd, c.skew, c.lower ?? -Infinity, c.upper ?? Infinity);
      // 1e-9: quadrature of a ratio of two integrals; the closed forms themselves are ~1e-14.
      expect(rel(r.probability, c.probability)).toBeLessThanOrEqual(1e-12);
      expect(rel(r.m1, c.m1)).toBeLessThanOrEqual(1e-9);
      expect(rel(r.m2, c.m2)).toBeLessThanOrEqual(1e-9);
      expect(rel(r.m3, c.m3)).toBeLessThanOrEqual(1e-9);
    });
  }
});

describe('EMA with a systematic record only equals the moments of log10 Q (no low outliers)', () => {
  // Invented peaks (m³/s).
  const peaks = [412, 655, 1020, 388, 790, 2140, 560, 933, 1210, 475, 690, 1580, 820, 505, 1340, 720, 980, 610, 1750, 845];
  const ys = peaks.map((q) => Math.log10(q));
  const n = ys.length;
  const mean = ys.reduce((a, b) => a + b, 0) / n;
  const s2 = ys.reduce((a, y) => a + (y - mean) ** 2, 0) / (n - 1);
  const s = Math.sqrt(s2);
  // Bulletin 17B eq. 6 (IACWD 1982), kept by 17C: G = n Σ(y − ȳ)³ / ((n − 1)(n − 2) s³).
  const g = (n * ys.reduce((a, y) => a + (y - mean) ** 3, 0)) / ((n - 1) * (n - 2) * s ** 3);
  it('mean, standard deviation (n − 1) and the bias-corrected station skew', () => {
    const fit = fitEma({ peaks, lowOutliers: 'none' });
    expect(rel(fit.parameters.mean, mean)).toBeLessThanOrEqual(1e-14);
    expect(rel(fit.parameters.sd, s)).toBeLessThanOrEqual(1e-14);
    expect(rel(fit.parameters.skew, g)).toBeLessThanOrEqual(1e-13);
    expect(fit.skew.stationSkew).toBe(fit.parameters.skew);
    expect(fit.iterations).toBe(1);
  });
  it('the multiple Grubbs–Beck test finds no low outlier here, so the default run is the same', () => {
    const fit = fitEma({ peaks });
    expect(fit.lowOutlierTest?.lowOutliers).toBe(0);
    expect(rel(fit.parameters.skew, g)).toBeLessThanOrEqual(1e-13);
  });
});

describe('EMA with historical years, censored low values and a lower-bounded peak vs an independent implementation', () => {
  const obs: LogObservation[] = [
    ...FIX.ema.peaks.map((y) => ({ kind: 'peak' as const, y })),
    ...FIX.ema.intervals.map(([lo, hi]) => ({ kind: 'interval' as const, lower: lo ?? -Infinity, upper: hi ?? Infinity })),
  ];
  it('station skew', () => {
    const r = emaIterate(obs);
    expect(r.converged).toBe(true);
    // 1e-9: the reference's moments are quadratures (relative 1e-13 each) iterated to 1e-13.
    expect(rel(r.mean, FIX.ema.station.mean)).toBeLessThanOrEqual(1e-9);
    expect(rel(r.sd, FIX.ema.station.sd)).toBeLessThanOrEqual(1e-9);
    expect(Math.abs(r.skew.stationSkew - FIX.ema.station.stationSkew)).toBeLessThanOrEqual(1e-9);
  });
  it('with a regional skew weighted by mean square errors at every step', () => {
    const r = emaIterate(obs, { skew: FIX.ema.regional.skew, mse: FIX.ema.regional.mse });
    const ref = FIX.ema.regional.fit;
    expect(rel(r.mean, ref.mean)).toBeLessThanOrEqual(1e-9);
    expect(rel(r.sd, ref.sd)).toBeLessThanOrEqual(1e-9);
    expect(Math.abs(r.skew.stationSkew - ref.stationSkew)).toBeLessThanOrEqual(1e-9);
    expect(Math.abs(r.skew.weightedSkew - ref.weightedSkew)).toBeLessThanOrEqual(1e-9);
  });
});

describe('station-skew MSE: Griffis & Stedinger (2009), the Bulletin 17C approximation [coefficients from memory]', () => {
  it('matches the variance of the bias-corrected station skew in a seeded SciPy simulation (n = 20, 50, 100; skew −1 … 1; within 3 % and 4 MC s.e.)', () => {
    for (const r of FIX.skewVariance) {
      const m = stationSkewMse(r.skew, r.n);
      expect(Math.abs(m - r.variance), `skew ${r.skew}, n ${r.n}`).toBeLessThan(4 * r.se);
      expect(rel(m, r.variance)).toBeLessThan(0.03);
    }
  });
  it('the simulation tells it from Bulletin 17B\'s formula (off by more than 10 % in some cells)', () => {
    const off = FIX.skewVariance.map((r) => rel(stationSkewMse17b(r.skew, r.n), r.variance));
    expect(Math.max(...off)).toBeGreaterThan(0.1);
  });
  it('its leading term is the large-sample variance of the sample skew, ∇gᵀΣ∇g/n with ∇g = (−3, −3γ/2, 1) from the Pearson III raw moments', () => {
    for (const g of [-1, -0.3, 0, 0.4, 1.2]) {
      const a = standardizedRawMoments(g);
      const grad = [-3, -1.5 * g, 1];
      let v = 0;
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) v += grad[i]! * (a[i + j + 2]! - a[i + 1]! * a[j + 1]!) * grad[j]!;
      expect(v).toBeCloseTo(6 * (1 + 1.5 * g * g + (5 / 16) * g ** 4), 10);
      // at large n the correction terms vanish (b(n) ~ 3.92/n^0.3 is the slowest): n·MSE → that limit
      expect(rel(1e14 * stationSkewMse(g, 1e14), v)).toBeLessThan(1e-3);
    }
  });
  it('Bulletin 17B\'s formula by hand (kept as stationSkewMse17b): 10^(−0.29 − 0.81 log10 5) for G = 0.5, n = 50', () => {
    expect(rel(stationSkewMse17b(0.5, 50), Math.pow(10, -0.29 - 0.81 * Math.log10(5)))).toBeLessThanOrEqual(1e-14);
    // |G| > 0.9 and > 1.5 branches: A = −0.52 + 0.3|G|, B = 0.55.
    expect(rel(stationSkewMse17b(-1.6, 40), Math.pow(10, -0.52 + 0.48 - 0.55 * Math.log10(4)))).toBeLessThanOrEqual(1e-14);
  });
  it('weights are MSE_R/(MSE_R + MSE_S) and MSE_S/(MSE_R + MSE_S)', () => {
    const w = weightSkew(0.5, 50, { skew: -0.1, mse: 0.302 });
    const ms = stationSkewMse(0.5, 50);
    expect(w.stationWeight).toBeCloseTo(0.302 / (0.302 + ms), 15);
    expect(w.weightedSkew).toBeCloseTo((0.302 * 0.5 + ms * -0.1) / (0.302 + ms), 15);
  });
});

describe('multiple Grubbs–Beck p-values vs an independent seeded NumPy simulation (200 000 samples)', () => {
  it('the statistic: (x(k) − mean of the rest)/sd of the rest (n − k − 1 divisor), by hand for n = 5', () => {
    const w = mgbStatistics([1, 2, 4, 7, 11]);
    // k = 1: rest 2, 4, 7, 11: mean 6, squared deviations 16 + 4 + 1 + 25 = 46, sd √(46/3).
    expect(w[0]).toBeCloseTo((1 - 6) / Math.sqrt(46 / 3), 13);
    const m = 22 / 3;
    const sd = Math.sqrt(((4 - m) ** 2 + (7 - m) ** 2 + (11 - m) ** 2) / 2);
    expect(w[1]).toBeCloseTo((2 - m) / sd, 13);
  });
  for (const c of FIX.mgb) {
    it(`n = ${c.n}, k = ${c.k}, P(Ω ≤ ${c.eta.toFixed(3)}) = ${c.p}`, () => {
      const omegas = new Float64Array(Math.floor(c.n / 2)).fill(-Infinity);
      omegas[c.k - 1] = c.eta;
      const p = mgbPValues(c.n, omegas)[c.k - 1] as number;
      // 4.5 standard errors of the difference of two independent binomial estimates.
      const se = Math.sqrt(c.se ** 2 + (c.p * (1 - c.p)) / MGB_REPLICATES);
      expect(Math.abs(p - c.p)).toBeLessThanOrEqual(4.5 * se);
    });
  }
  it('flags two planted low values in an invented sample and censors them', () => {
    const ys = [3.1, 3.3, 3.0, 3.25, 3.4, 3.15, 3.05, 3.5, 3.2, 3.35, 3.12, 3.28, 3.45, 3.08, 3.22, 3.18, 3.38, 3.02, 1.9, 2.1];
    const r = multipleGrubbsBeck(ys);
    expect(r.lowOutliers).toBe(2);
    expect(r.threshold).toBe(3.0);
  });
});

describe('EMA return levels', () => {
  const peaks = [412, 655, 1020, 388, 790, 2140, 560, 933, 1210, 475, 690, 1580, 820, 505, 1340, 720, 980, 610, 1750, 845, 95, 120];
  const record = { peaks, historicalPeaks: [3900, 3100], historicalYearsBelow: { years: 60, threshold: 2800 }, regionalSkew: { skew: -0.05, mse: 0.12 } };
  it('the two planted low peaks are low outliers; the historical period enters as 62 years', () => {
    const fit = fitEma(record);
    expect(fit.counts.lowOutliers).toBe(2);
    expect(fit.lowOutlierThreshold).toBe(388);
    expect(fit.counts.years).toBe(22 + 2 + 60);
    expect(fit.converged).toBe(true);
  });
  it('estimate = 10^(Pearson III isf(1/T)) of log10 flows; the EMA-variance interval and the seeded bootstrap beside it bracket it', async () => {
    const { emaReturnLevels } = await import('../../core/flood/ema-return-levels.js');
    const { createRng } = await import('../../core/random/index.js');
    const { getFamily } = await import('../../core/families/index.js');
    const fit = fitEma(record);
    const rl = emaReturnLevels(record, fit, [10, 100], { rng: createRng(7), replicates: 60 });
    const d = getFamily('pearson3').make(fit.parameters);
    expect(rl[1]!.estimate).toBeCloseTo(Math.pow(10, d.isf(0.01)), 8);
    for (const r of rl) {
      expect(r.lower!).toBeLessThan(r.estimate);
      expect(r.upper!).toBeGreaterThan(r.estimate);
      expect(r.method).toMatch(/Cohn, Lane & Stedinger 2001/);
      expect(r.bootstrap!.lower!).toBeLessThan(r.estimate);
      expect(r.bootstrap!.upper!).toBeGreaterThan(r.estimate);
      expect(r.bootstrap!.method).toMatch(/parametric bootstrap/);
      // 84 years of which 60 historical below a threshold: fewer equivalent years than years, more than the 20 known systematic peaks.
      expect(r.equivalentYears).toBeGreaterThan(20);
      expect(r.equivalentYears).toBeLessThan(84);
    }
    // The skew's effective record length: 19.5 years here (the two low outliers censored, the historical
    // years telling little about the skew); a positive length below the 84 years.
    expect(fit.effectiveRecordLength!).toBeGreaterThan(10);
    expect(fit.effectiveRecordLength!).toBeLessThan(84);
    expect(rl[1]!.estimate).toBeGreaterThan(rl[0]!.estimate);
  });
});
