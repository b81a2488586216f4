/**
 * The nonparametric log-likelihood of the Turnbull estimate (core/life/turnbull.ts), its accelerated
 * iteration, and the likelihood-ratio statistic built on them (core/life/interval-likelihood-ratio.ts),
 * each against a closed form computed here from its definition:
 *  - exact failures with suspensions: the NPMLE is the Kaplan–Meier product limit (Kaplan & Meier
 *    1958, JASA 53:457-481), whose log-likelihood is Σ_j [d_j ln(d_j/n_j) + (n_j − d_j) ln(1 − d_j/n_j)]
 *    over the distinct failure times (d_j failures among n_j at risk);
 *  - current-status data (each unit seen once: failed before its inspection or not): the NPMLE of F at
 *    the inspection times is the isotonic regression of the failure indicators, found by the
 *    pool-adjacent-violators algorithm (Ayer, Brunk, Ewing, Reid & Silverman 1955, Ann. Math. Statist.
 *    26:641-647), with log-likelihood Σ [δ ln F̂(c) + (1 − δ) ln(1 − F̂(c))].
 */
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { createRng } from '../../core/random/index.js';
import {
  fitInterval,
  intervalGofBootstrap,
  intervalInputFromTimes,
  intervalLikelihoodRatio,
  intervalLogLikelihood,
  prepareIntervalLifeData,
  turnbull,
  type IntervalLifeData,
} from '../../core/life/index.js';
import { readFixture } from '../helpers/fixtures.js';
import { lrSample } from '../../scripts/life-interval-size.js';

// NIST/SEMATECH e-Handbook §8.4.1.3 right-censored example (life.json, scripts/fixtures/life.py).
const life = readFixture('life.json');

/** Σ d ln(d/n) + (n − d) ln(1 − d/n) over the distinct failure times (product-limit log-likelihood). */
function kaplanMeierLogLikelihood(times: readonly number[], failed: readonly number[]): number {
  let ll = 0;
  for (const t of [...new Set(times.filter((_, i) => failed[i]))].sort((a, b) => a - b)) {
    const n = times.filter((x) => x >= t).length;
    const d = times.filter((x, i) => x === t && failed[i]).length;
    ll += d * Math.log(d / n) + (d < n ? (n - d) * Math.log(1 - d / n) : 0);
  }
  return ll;
}

/** Current-status data: inspection times c and indicators δ (1: failed by c); seeded. */
function currentStatus(seed: number, n: number): { c: number[]; delta: number[] } {
  const rng = createRng(seed, 0);
  const c: number[] = [];
  const delta: number[] = [];
  for (let i = 0; i < n; i++) {
    const t = -100 * Math.log1p(-rng.uniform());
    const ci = 10 + 190 * rng.uniform();
    c.push(ci);
    delta.push(t <= ci ? 1 : 0);
  }
  return { c, delta };
}

/** Pool adjacent violators on δ ordered by c: the NPMLE's log-likelihood. */
function pavaLogLikelihood(c: readonly number[], delta: readonly number[]): number {
  const order = c.map((_, i) => i).sort((a, b) => (c[a] as number) - (c[b] as number));
  const blocks: { sum: number; w: number }[] = [];
  for (const i of order) {
    blocks.push({ sum: delta[i] as number, w: 1 });
    while (blocks.length > 1 && blocks[blocks.length - 2]!.sum / blocks[blocks.length - 2]!.w > blocks[blocks.length - 1]!.sum / blocks[blocks.length - 1]!.w) {
      const b = blocks.pop()!;
      blocks[blocks.length - 1]!.sum += b.sum;
      blocks[blocks.length - 1]!.w += b.w;
    }
  }
  let ll = 0;
  for (const b of blocks) {
    const f = b.sum / b.w;
    if (b.sum > 0) ll += b.sum * Math.log(f);
    if (b.w - b.sum > 0) ll += (b.w - b.sum) * Math.log(1 - f);
  }
  return ll;
}

const csData = (c: readonly number[], delta: readonly number[]): IntervalLifeData =>
  prepareIntervalLifeData({ start: c.map((x, i) => (delta[i] ? 0 : x)), end: c.map((x, i) => (delta[i] ? x : Number.POSITIVE_INFINITY)) });

describe('the Turnbull estimate’s log-likelihood', () => {
  it('exact failures with suspensions: the Kaplan–Meier log-likelihood (NIST §8.4.1.3 set)', () => {
    const d = prepareIntervalLifeData(intervalInputFromTimes({ times: life.nist.times, failed: life.nist.failed }));
    expect(turnbull(d).logLikelihood).toBeCloseTo(kaplanMeierLogLikelihood(life.nist.times, life.nist.failed), 9);
  });

  it('current-status data: the pool-adjacent-violators log-likelihood, plain and accelerated (1e-7)', () => {
    for (const seed of [1, 2]) {
      const { c, delta } = currentStatus(seed, 60);
      const ref = pavaLogLikelihood(c, delta);
      const d = csData(c, delta);
      expect(Math.abs(turnbull(d, { tolerance: 1e-11, maxIterations: 1_000_000 }).logLikelihood - ref)).toBeLessThan(1e-7);
      const fast = turnbull(d, { tolerance: 1e-9, maxIterations: 20000, accelerate: true });
      expect(fast.converged).toBe(true);
      expect(Math.abs(fast.logLikelihood - ref)).toBeLessThan(1e-7);
    }
  });

  // Samples of the size study where an unguarded extrapolation drives a mass to 0 (where it would stay):
  // with the positivity backtracking removed, these stop short of the NPMLE (Kuhn–Tucker excess 0.03-0.18) or fail.
  it('accelerated (SQUAREM) iteration: the same estimate in far fewer steps on case-2 rows; a maximum by the Kuhn–Tucker conditions', () => {
    for (const [cell, i] of [['own2-0.8-100', 14], ['own2-2-30', 23], ['own2e-2-100', 21], ['ownk-2-30', 9], ['ownk-2-100', 3]] as const) {
      const d = lrSample(cell, i);
      const slow = turnbull(d, { tolerance: 1e-12, maxIterations: 2_000_000 });
      const fast = turnbull(d, { tolerance: 1e-9, maxIterations: 20000, accelerate: true });
      expect(slow.converged && fast.converged).toBe(true);
      expect(Math.abs(fast.logLikelihood - slow.logLikelihood)).toBeLessThan(1e-6);
      expect(fast.kuhnTuckerExcess).toBeLessThan(1e-5); // Gentleman & Geyer 1994: d_j ≤ 1 at the NPMLE
      expect(fast.iterations).toBeLessThan(slow.iterations / 5);
      // F at every box end agrees (the masses are unique on the innermost intervals: Turnbull 1976).
      expect(fast.intervals.length).toBe(slow.intervals.length);
      fast.intervals.forEach((iv, j) => expect(Math.abs(iv.cdfAfter - slow.intervals[j]!.cdfAfter)).toBeLessThan(1e-4));
    }
  });
});

describe('the likelihood-ratio statistic against the Turnbull estimate', () => {
  it('current-status data: 2(PAVA ln L − model ln L) at the fitted Weibull, and ≥ 0', () => {
    const { c, delta } = currentStatus(4, 80);
    const d = csData(c, delta);
    const f = fitInterval('weibull', d);
    if (!f.ok) throw new Error(f.reason);
    const lr = intervalLikelihoodRatio(f.logLikelihood, d);
    expect(lr).toBeGreaterThanOrEqual(0);
    expect(Math.abs(lr - 2 * (pavaLogLikelihood(c, delta) - f.logLikelihood))).toBeLessThan(2e-7);
    // The model's ln L is the interval likelihood at the fit (Meeker & Escobar 1998 §2.4.3).
    expect(intervalLogLikelihood(getFamily('weibull').make(f.parameters), d)).toBeCloseTo(f.logLikelihood, 9);
  });

  it('refuses exact rows (a density against a point mass has a unit of time)', () => {
    const d = prepareIntervalLifeData({ start: [0, 5, 7, 9, 12], end: [5, 9, 7, 14, Number.POSITIVE_INFINITY] });
    expect(() => intervalLikelihoodRatio(-10, d)).toThrow(/exact rows/);
  });

  it('the product tests by A²; the likelihood ratio, asked for by a size study, never decides, even on a common schedule', () => {
    const d = lrSample('own2-2-30', 0);
    const f = fitInterval('weibull', d);
    if (!f.ok) throw new Error(f.reason);
    const a = intervalGofBootstrap('weibull', f.parameters, d, { replicates: 9, seed: 1 });
    expect(a.test).toBe('anderson-darling');
    expect(a.sizeCalibrated).toBe(false); // own times: nothing decides
    // A common schedule (every 25 h): A² decides there, the likelihood ratio does not.
    const c = prepareIntervalLifeData({ start: [0, 25, 25, 50, 75, 100, 100, 125, 150], end: [25, 50, 50, 75, 100, 125, 125, 150, Number.POSITIVE_INFINITY], counts: [3, 5, 2, 6, 4, 3, 2, 1, 4] });
    const fc = fitInterval('weibull', c);
    if (!fc.ok) throw new Error(fc.reason);
    expect(intervalGofBootstrap('weibull', fc.parameters, c, { replicates: 9, seed: 1 }).sizeCalibrated).toBe(true);
    const lr = intervalGofBootstrap('weibull', fc.parameters, c, { replicates: 9, seed: 1, statistic: 'likelihood-ratio' });
    expect(lr.test).toBe('likelihood-ratio');
    expect(lr.statistic).toBeCloseTo(intervalLikelihoodRatio(fc.logLikelihood, c), 6);
    expect(lr.sizeCalibrated).toBe(false);
    expect(lr.sizeNote).toMatch(/not size-calibrated/);
  });
});
