/**
 * Weibayes with inspection intervals (core/life/weibayes-interval.ts): the shape assumed, the scale
 * by maximum likelihood and its one-sided likelihood-ratio lower bound, against SciPy weibull_min
 * fitted to CensoredData with the shape fixed and refined by brentq
 * (scripts/fixtures/life-weibayes-interval.py); with exact failures and suspensions only, the same
 * scale as Nelson's closed form (weibayes.ts); in the recorded-life report instead of a refusal.
 */
import { describe, expect, it } from 'vitest';
import { analyzeRecordedLife, prepareIntervalLifeData, prepareLifeData, weibayes, weibayesInterval } from '../../core/life/index.js';
import { readFixture, rel } from '../helpers/fixtures.js';

const src = readFixture('life-interval.json').inspection;
const fx = readFixture('life-weibayes-interval.json');
const rows = { start: src.start as number[], end: (src.end as (number | null)[]).map((e) => e ?? Number.POSITIVE_INFINITY), counts: src.count as number[] };
const data = prepareIntervalLifeData(rows);

describe('Weibayes with inspection intervals', () => {
  type Case = { shape: number; confidence: number; scipyScale: number; scale: number; scaleLower: number };
  it.each((fx.cases as Case[]).map((c) => [c.shape, c.confidence, c] as const))('β = %s, C = %s: scale and its LR lower bound match the SciPy/brentq reference', (_b, _c, ref) => {
    const w = weibayesInterval(data, { shape: ref.shape, confidence: ref.confidence, bLifePercents: [10] });
    // The script's score is a central difference (h = 1e-6 on ln scale): its root is good to ~1e-9.
    expect(rel(w.scale!, ref.scale)).toBeLessThan(1e-8);
    expect(rel(w.scale!, ref.scipyScale)).toBeLessThan(1e-7); // SciPy's own fit stops near 1e-8
    expect(rel(w.scaleLower, ref.scaleLower)).toBeLessThan(1e-8);
    expect(w.scaleLower).toBeLessThan(w.scale!);
    expect(w.bLives[0]!.lower).toBeCloseTo(w.scaleLower * Math.pow(-Math.log(0.9), 1 / ref.shape), 8);
    expect(w.statement).toMatch(/ASSUMED/);
    expect(w.statement).toMatch(/likelihood-ratio/);
  });

  it('with exact failures and suspensions only it gives Nelson’s closed-form scale (Σ t^β / r)^(1/β)', () => {
    // NIST/SEMATECH e-Handbook §8.4.1.3 data: 10 failures, 10 running at 500 h.
    const t = [54, 187, 216, 240, 244, 335, 361, 373, 375, 386, ...Array(10).fill(500)];
    const f = [...Array(10).fill(1), ...Array(10).fill(0)];
    const d = prepareIntervalLifeData({ start: t, end: t.map((x, i) => (f[i] ? x : Number.POSITIVE_INFINITY)) });
    const closed = weibayes(prepareLifeData({ times: t, failed: f }), { shape: 2 });
    expect(rel(weibayesInterval(d, { shape: 2 }).scale!, closed.scale!)).toBeLessThan(1e-12);
  });

  it('the recorded-life report gives Weibayes on interval rows (no longer refused), the shape stated as assumed', () => {
    const r = analyzeRecordedLife({ interval: rows }, { assumedShape: 1.5, confidence: 0.9, families: ['weibull'], replicates: 0, mixture: false });
    expect(rel(r.weibayes!.scaleLower, fx.cases[0].scaleLower)).toBeLessThan(1e-8);
    expect(r.cautions.join(' ')).toMatch(/ASSUMED/);
  });
});
