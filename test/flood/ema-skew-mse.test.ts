/**
 * The station skew's mean square error from the effective record length when years are censored
 * (core/flood/ema.ts fitEma, regional-skew.ts): Bulletin 17C computes the station skew's MSE of a
 * record with censored or historical years from an effective record length [from memory: the
 * Bulletin's text was not available here, so its exact formula is not checked].
 *
 * Sources beside each check:
 * - a seeded simulation of the EMA station skew on five record designs
 *   (scripts/flood-ema-skew-mse.ts → test/fixtures/flood-ema-skew-mse.json, 4000 records a case):
 *   the MSE at the effective length must be near the simulated MSE where the record length alone is
 *   far from it;
 * - Griffis & Stedinger's (2009) formula (regional-skew.ts, itself checked against a SciPy
 *   simulation for complete records, test/flood/ema.test.ts): the fit's MSE is that formula at
 *   the effective length, and the weights are the inverse-MSE weights of Bulletin 17B eq. 5.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { asymptoticSkewRecordLength, effectiveRecordLength, emaDesign } from '../../core/flood/ema-covariance.js';
import { Pearson3Distribution } from '../../core/families/index.js';
import { fitEma, type EmaRecord } from '../../core/flood/ema.js';
import { emaReturnLevels } from '../../core/flood/ema-return-levels.js';
import { STATION_SKEW_MSE_METHOD, stationSkewMse } from '../../core/flood/regional-skew.js';
import { createRng } from '../../core/random/index.js';

interface Row {
  label: string;
  skew: number;
  years: number;
  records: number;
  simulatedMse: number;
  monteCarloSe: number;
  effectiveRecordLength: number;
  asymptoticRatio: number;
  mseAtEffectiveLength: number;
  mseAtRecordYears: number;
}
const fx = JSON.parse(readFileSync('test/fixtures/flood-ema-skew-mse.json', 'utf8')) as { recordsPerCase: number; cases: Row[] };

// An invented record: 45 systematic peaks, two known historical floods, 60 more historical years below a
// perception threshold of 2800, and a regional skew. Flows invented for the test (no gauge).
const peaks = [
  412, 655, 1020, 388, 790, 2140, 560, 933, 1210, 470, 880, 1530, 610, 720, 1340, 505, 998, 1750, 640, 830, 1120, 455, 760, 1410, 590, 1005, 2480, 530, 870, 1190,
  430, 690, 1610, 575, 940, 1280, 495, 810, 1900, 620, 1060, 735, 1450, 545, 915,
];
const record: EmaRecord = { peaks, historicalPeaks: [3900, 3100], historicalYearsBelow: { years: 60, threshold: 2800 }, regionalSkew: { skew: -0.05, mse: 0.12 }, lowOutliers: 'none' };

describe('the station skew MSE of a censored record uses its effective record length', () => {
  const fit = fitEma(record);
  const design = emaDesign(record, fit);

  it('the MSE is Griffis & Stedinger at the effective length, and that length is the one at the fitted model (fixed point, rel 1e-8)', () => {
    expect(fit.skew.mseYearsKind).toBe('effective');
    expect(fit.skew.mseYears).toBe(fit.effectiveRecordLength);
    const atFit = effectiveRecordLength(design, fit.parameters);
    expect(Math.abs(atFit / fit.skew.mseYears - 1)).toBeLessThan(1e-8);
    expect(fit.skew.stationSkewMse).toBe(stationSkewMse(fit.skew.stationSkew, fit.skew.mseYears));
    // It is not the record's years: 107 years, most of them historical years below the threshold.
    expect(fit.counts.years).toBe(107);
    expect(Math.abs(fit.skew.mseYears - fit.counts.years)).toBeGreaterThan(10);
    expect(fit.skew.mseMethod).toMatch(/effective record length/);
  });

  it('the weights are the inverse-MSE weights with that MSE (Bulletin 17B eq. 5), and the fit uses the weighted skew', () => {
    const mseR = 0.12;
    const mseS = fit.skew.stationSkewMse;
    expect(fit.skew.stationWeight).toBeCloseTo(mseR / (mseR + mseS), 14);
    expect(fit.parameters.skew).toBeCloseTo(fit.skew.stationWeight * fit.skew.stationSkew + fit.skew.regionalWeight * -0.05, 14);
  });

  it('a record with no censored years keeps the record length exactly (its effective length equals it only up to rounding)', () => {
    const sys = fitEma({ peaks, regionalSkew: { skew: -0.05, mse: 0.12 }, lowOutliers: 'none' });
    expect(sys.skew.mseYearsKind).toBe('record');
    expect(sys.skew.mseYears).toBe(peaks.length);
    expect(sys.skew.mseMethod).toBe(STATION_SKEW_MSE_METHOD);
    expect(sys.effectiveRecordLength!).toBeCloseTo(peaks.length, 5);
  });

  it('the bootstrap replicates weight their skews with the same length (their intervals still bracket the estimates)', () => {
    const rl = emaReturnLevels(record, fit, [10, 100], { rng: createRng(5, 12), replicates: 40 });
    for (const l of rl) {
      expect(l.bootstrap!.lower!).toBeLessThan(l.estimate);
      expect(l.bootstrap!.upper!).toBeGreaterThan(l.estimate);
    }
  });
});

describe('seeded simulation of the EMA station skew (test/fixtures/flood-ema-skew-mse.json, scripts/flood-ema-skew-mse.ts)', () => {
  const censored = fx.cases.filter((c) => !/no censoring/.test(c.label));

  it('the committed lengths and formula values are what the code gives now', () => {
    // The design-only numbers are recomputed here; the simulated ones come from the seeded script.
    for (const c of fx.cases) {
      expect(stationSkewMse(c.skew, c.effectiveRecordLength)).toBe(c.mseAtEffectiveLength);
      expect(stationSkewMse(c.skew, c.years)).toBe(c.mseAtRecordYears);
    }
  });

  it('no censoring: the effective length is the record, and the formula is within 4 MC s.e. + 3 % of the simulation', () => {
    const c = fx.cases[0]!;
    expect(c.effectiveRecordLength).toBeCloseTo(c.years, 6);
    expect(Math.abs(c.mseAtEffectiveLength - c.simulatedMse)).toBeLessThan(4 * c.monteCarloSe + 0.03 * c.simulatedMse);
  });

  it('historical years above a perception threshold: at the effective length within 4 MC s.e. + 5 % of the simulated MSE; at the record years more than 25 % off', () => {
    for (const c of censored.filter((x) => /historical/.test(x.label) && !/strong negative skew/.test(x.label))) {
      expect(Math.abs(c.mseAtEffectiveLength - c.simulatedMse)).toBeLessThan(4 * c.monteCarloSe + 0.05 * c.simulatedMse);
      expect(Math.abs(c.mseAtRecordYears / c.simulatedMse - 1)).toBeGreaterThan(0.25);
    }
  });

  it('systematic years censored below a low threshold: the effective length is closer than the record years, but still optimistic (the simulated MSE is 1.3–1.6 times it: asymptotics at 20–34 effective years)', () => {
    for (const c of censored.filter((x) => /censored below/.test(x.label) && !/strong negative skew/.test(x.label))) {
      expect(Math.abs(Math.log(c.mseAtEffectiveLength / c.simulatedMse))).toBeLessThan(Math.abs(Math.log(c.mseAtRecordYears / c.simulatedMse)));
      expect(c.simulatedMse / c.mseAtEffectiveLength).toBeGreaterThan(1.2);
      expect(c.simulatedMse / c.mseAtEffectiveLength).toBeLessThan(1.7);
    }
  });

  it('strong negative skew (−1.6) with low censoring: the asymptotic ratio promises more years than the record (121 of 60, 168 of 135), the simulation says the opposite, so the length is capped at the record; even then the formula is optimistic (simulated MSE 1.6–1.8 times it)', () => {
    const strong = censored.filter((x) => /strong negative skew/.test(x.label));
    expect(strong.length).toBe(2);
    for (const c of strong) {
      expect(c.asymptoticRatio).toBeGreaterThan(c.years);
      expect(c.effectiveRecordLength).toBe(c.years);
      const uncapped = stationSkewMse(c.skew, c.asymptoticRatio);
      expect(Math.abs(Math.log(c.mseAtEffectiveLength / c.simulatedMse))).toBeLessThan(Math.abs(Math.log(uncapped / c.simulatedMse)));
      expect(c.simulatedMse / c.mseAtEffectiveLength).toBeGreaterThan(1.5);
      expect(c.simulatedMse / c.mseAtEffectiveLength).toBeLessThan(1.9);
    }
    // Censoring the low end raised the skew's error above that of the same complete record (0.31 for 60 complete years).
    const complete = fx.cases.find((x) => /no censoring, strong negative skew/.test(x.label))!;
    expect(strong[0]!.simulatedMse).toBeGreaterThan(complete.simulatedMse + 4 * (strong[0]!.monteCarloSe + complete.monteCarloSe));
  });

  it('the cap holds at the fit: on a censored design whose asymptotic ratio exceeds the years, effectiveRecordLength is the years', () => {
    const c = fx.cases.find((x) => /invented gauge/.test(x.label))!;
    const pop = new Pearson3Distribution(0, 1, c.skew);
    const design = { thresholds: [{ years: 73, threshold: pop.quantile(0.04) }, { years: 62, threshold: pop.quantile(0.95) }] };
    expect(asymptoticSkewRecordLength(design, { mean: 0, sd: 1, skew: c.skew })).toBeGreaterThan(135);
    expect(effectiveRecordLength(design, { mean: 0, sd: 1, skew: c.skew })).toBe(135);
  });
});
