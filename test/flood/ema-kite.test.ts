/**
 * The first-order variance of the log-Pearson III quantile (core/flood/ema-variance.ts, and the
 * EMA's censored-record covariance core/flood/ema-covariance.ts on a record with no censored year)
 * against a published formula: the standard error of a Pearson III T-year event fitted by moments,
 *   S_T = δ S/√n,
 *   δ² = 1 + Kg + (K²/2)(3g²/4 + 1) + 3K (∂K/∂g)(g + g³/4) + 3 (∂K/∂g)² (2 + 3g² + 5g⁴/8),
 * Kite (2004), Frequency and Risk Analyses in Hydrology, eq. 9-54 (after Kite 1975, 1976), the δ of
 * Australian Rainfall and Runoff (1987) Book IV, whose confidence limits are log Q_T ± z δ S/√N on
 * log10 flows. Source read: T. Ladson (2015), "Delta values for flood frequency confidence limits",
 * tonyladson.wordpress.com, which quotes the equation (Kite's book itself was not read). K is the
 * Pearson III frequency factor (its quantile at the skew, checked against SciPy pearson3 in the
 * family tests), ∂K/∂g found here by Richardson extrapolation (scripts/flood-kite-variance.ts).
 *
 * Kite's skew term is (∂K/∂g)² times the large-sample variance of the sample skew,
 * 6(1 + 3g²/2 + 5g⁴/16)/n, and his formula has no mean–skew term: for a Pearson III population
 * the sample mean and skew are asymptotically uncorrelated (κ4 = 3γ²/2). Ours uses the same skew
 * variance and reduces to it exactly. How both compare with the real variance of the estimator
 * at finite n: test/fixtures/flood-kite-variance.json (seeded simulation, same script).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { emaCovariance, emaQuantileVariance } from '../../core/flood/ema-covariance.js';
import { fitEma } from '../../core/flood/ema.js';
import { emaReturnLevels } from '../../core/flood/ema-return-levels.js';
import { lp3QuantileInterval, lp3QuantileVariance } from '../../core/flood/ema-variance.js';
import { normalIsf } from '../../core/special/index.js';
import { frequencyFactor, KITE_CASES, kiteDeltaSquared, runKiteCase } from '../../scripts/flood-kite-variance.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const SKEWS = [-2, -1.6, -1, -0.5, 0, 0.3, 1, 2];
const EXCEEDANCES = [0.5, 0.1, 0.02, 0.01, 0.002];

describe('quantile variance by moments = Kite (2004) eq. 9-54 (ARR 1987 Book IV δ; quoted by Ladson 2015)', () => {
  it('ema-variance.ts: Var(ŷ_T)·n/S² = δ² for skews −2 … 2 and exceedance chances 0.5 … 0.002 (rel ≤ 1e-7)', () => {
    for (const g of SKEWS) {
      for (const q of EXCEEDANCES) {
        const v = lp3QuantileVariance({ mean: 3.1, sd: 0.27, skew: g }, 43, q);
        // 1e-7: ∂K/∂g by two different finite differences (ours a central step 1e-4, Richardson here).
        expect(rel((v.variance * 43) / 0.27 ** 2, kiteDeltaSquared(g, q)), `g ${g}, q ${q}`).toBeLessThan(1e-7);
      }
    }
  });

  it('ema-covariance.ts (the sandwich used for censored records) on a censor-free design gives the same δ²', () => {
    for (const g of SKEWS) {
      const cov = emaCovariance({ thresholds: [{ years: 43, threshold: Number.NEGATIVE_INFINITY }] }, { mean: 3.1, sd: 0.27, skew: g }, null);
      for (const q of EXCEEDANCES) {
        const v = emaQuantileVariance(cov, g, q).variance; // in units of S²
        expect(rel(v * 43, kiteDeltaSquared(g, q)), `g ${g}, q ${q}`).toBeLessThan(1e-7);
      }
    }
  });

  it('ARR\'s limits log Q_T ± z δ S/√N are our normal-approximation interval (lp3QuantileInterval)', () => {
    const fit = { mean: 2.9, sd: 0.31, skew: -0.4 };
    const v = lp3QuantileVariance(fit, 35, 0.01);
    const i = lp3QuantileInterval(v, 0.9);
    const half = (normalIsf(0.05) * Math.sqrt(kiteDeltaSquared(-0.4, 0.01)) * 0.31) / Math.sqrt(35);
    const yT = 2.9 + 0.31 * frequencyFactor(-0.4, 0.01);
    expect(Math.abs(Math.log10(i.upper) - (yT + half))).toBeLessThan(1e-9);
    expect(Math.abs(Math.log10(i.lower) - (yT - half))).toBeLessThan(1e-9);
  });

  it('end to end: an EMA fit of a systematic record reports equivalent years n(1 + K²/2)/δ² at its own mean, sd and skew', () => {
    // Invented annual peaks (m³/s), 30 years, no low outlier test (EMA = moments of log10 Q).
    const peaks = [412, 655, 1020, 388, 790, 2140, 560, 933, 1210, 475, 690, 1580, 820, 505, 1340, 720, 980, 610, 1750, 845, 300, 1110, 640, 1460, 530, 870, 2600, 715, 455, 1005];
    const record = { peaks, lowOutliers: 'none' as const };
    const fit = fitEma(record);
    const g = fit.parameters.skew;
    const levels = emaReturnLevels(record, fit, [10, 100, 500], { confidence: 0.9 });
    for (const l of levels) {
      const K = frequencyFactor(g, 1 / l.period);
      const expected = (30 * (1 + (K * K) / 2)) / kiteDeltaSquared(g, 1 / l.period);
      expect(rel(l.equivalentYears as number, expected), `T ${l.period}`).toBeLessThan(1e-7);
    }
  });
});

interface KiteRow {
  label: string;
  skew: number;
  n: number;
  period: number;
  replicates: number;
  simulatedVariance: number;
  se: number;
  kite: number;
  kiteRatio: number;
  withGriffisStedinger: number;
  withGriffisStedingerRatio: number;
}
const FX = JSON.parse(readFileSync('test/fixtures/flood-kite-variance.json', 'utf8')) as { R: number; cases: KiteRow[] };

describe('Kite\'s first-order variance against a seeded simulation of our estimator at finite n (scripts/flood-kite-variance.ts, R = 20,000 a case)', () => {
  it('the fixture is what the committed script gives (case n = 30, skew 0.5 rerun)', () => {
    const i = KITE_CASES.findIndex((c) => c.systematic === 30 && c.skew === 0.5);
    expect(runKiteCase(KITE_CASES[i]!, i, FX.R)).toEqual(FX.cases[i]);
  });

  it('the formula in the fixture is ours: kite = lp3QuantileVariance at the true skew (S = 1)', () => {
    for (const c of FX.cases) expect(rel(c.kite, lp3QuantileVariance({ mean: 0, sd: 1, skew: c.skew }, c.n, 1 / c.period).variance)).toBeLessThan(1e-7);
  });

  it('at n = 20 … 100 the first-order variance is too large by 3 to 23 % (the small-sample skew varies less than 6(1 + 3g²/2 + 5g⁴/16)/n says), by 2.5 % at n = 400', () => {
    for (const c of FX.cases) {
      expect(c.kiteRatio, c.label).toBeGreaterThan(1.02);
      expect(c.kiteRatio, c.label).toBeLessThan(c.n >= 400 ? 1.04 : 1.25);
      // the excess is real, not Monte Carlo error
      expect(c.kite - c.simulatedVariance, c.label).toBeGreaterThan(2 * c.se);
    }
  });

  it('Griffis & Stedinger\'s finite-n skew variance in place of the large-sample one comes closer in every case (within −11 … +7 %)', () => {
    for (const c of FX.cases) {
      expect(Math.abs(c.withGriffisStedingerRatio - 1), c.label).toBeLessThan(Math.abs(c.kiteRatio - 1));
      expect(c.withGriffisStedingerRatio, c.label).toBeGreaterThan(0.89);
      expect(c.withGriffisStedingerRatio, c.label).toBeLessThan(1.07);
    }
  });
});
