import { describe, expect, it } from 'vitest';
import { createRng } from '../../core/random/index.js';
import { intervalInputFromTimes, prepareIntervalLifeData, turnbull, type IntervalLifeData } from '../../core/life/index.js';
import { readFixture } from '../helpers/fixtures.js';

// NIST/SEMATECH e-Handbook §8.4.1.3 right-censored example (life.json, scripts/fixtures/life.py).
const life = readFixture('life.json');

/**
 * Brute force: mass on every cell between consecutive distinct end points (and on each point), no
 * innermost-interval reduction, the plain self-consistency update run to a fixed count. Its F at
 * every end point must agree with turnbull's (Turnbull 1976: the NPMLE's masses are unique on the
 * innermost intervals, so F is unique outside their interiors).
 */
function bruteForceF(d: IntervalLifeData, at: readonly number[], iterations: number): number[] {
  const pts = Array.from(new Set([...d.lower, ...d.upper].filter((v) => Number.isFinite(v)))).sort((a, b) => a - b);
  // Cells: {p} for each point, and (p_k, p_{k+1}) open between, plus (last, ∞).
  const cells: { lo: number; hi: number; point: boolean }[] = [];
  pts.forEach((p, k) => {
    cells.push({ lo: p, hi: p, point: true });
    cells.push({ lo: p, hi: k + 1 < pts.length ? (pts[k + 1] as number) : Number.POSITIVE_INFINITY, point: false });
  });
  const inRow = (c: (typeof cells)[number], i: number): boolean => {
    const L = d.lower[i] as number;
    const R = d.upper[i] as number;
    if (d.kinds[i] === 'exact') return c.point && c.lo === L;
    // (L, R]: the point R is in, the point L is not; open cells between L and R are in.
    return c.point ? c.lo > L && c.lo <= R : c.lo >= L && c.hi <= R;
  };
  const A = Array.from({ length: d.lower.length }, (_, i) => cells.map((c) => inRow(c, i)));
  let p = cells.map(() => 1 / cells.length);
  for (let it = 0; it < iterations; it++) {
    const next = cells.map(() => 0);
    for (let i = 0; i < A.length; i++) {
      let den = 0;
      A[i]!.forEach((a, j) => (den += a ? (p[j] as number) : 0));
      A[i]!.forEach((a, j) => {
        if (a) next[j] = (next[j] as number) + ((d.counts[i] as number) * (p[j] as number)) / den / d.n;
      });
    }
    p = next;
  }
  return at.map((x) => cells.reduce((s, c, j) => s + (c.hi <= x && (c.point || c.hi < Number.POSITIVE_INFINITY) ? (p[j] as number) : 0), 0));
}

function turnbullF(d: IntervalLifeData, x: number): number {
  let F = 0;
  for (const iv of turnbull(d).intervals) if (iv.upper <= x) F = iv.cdfAfter;
  return F;
}

describe('Turnbull nonparametric estimate', () => {
  it('right-censored data: equals the Kaplan–Meier product-limit estimate (Kaplan & Meier 1958) on the NIST §8.4.1.3 set', () => {
    const d = prepareIntervalLifeData(intervalInputFromTimes({ times: life.nist.times, failed: life.nist.failed }));
    const t = turnbull(d);
    expect(t.converged).toBe(true);
    // Product limit computed here from its definition: S(t) = Π (1 - d_i / n_i).
    const times: number[] = life.nist.times;
    const failed: number[] = life.nist.failed;
    let S = 1;
    for (const tf of [...new Set(times.filter((_, i) => failed[i]))].sort((a, b) => a - b)) {
      const atRisk = times.filter((x) => x >= tf).length;
      const deaths = times.filter((x, i) => x === tf && failed[i]).length;
      S *= 1 - deaths / atRisk;
      expect(Math.abs(turnbullF(d, tf) - (1 - S))).toBeLessThan(1e-9);
    }
    // 10 failures, 10 running at 500 h: the last box holds the 0.5 left beyond 500 h.
    const last = t.intervals[t.intervals.length - 1]!;
    expect(last.lower).toBe(500);
    expect(last.upper).toBe(Number.POSITIVE_INFINITY);
    expect(last.mass).toBeCloseTo(0.5, 9);
  });

  const smallCases: [string, IntervalLifeData][] = [
    [
      'overlapping inspection intervals with counts',
      prepareIntervalLifeData({ start: [0, 2, 1, 3, 5, 4, 6], end: [3, 4, 6, 8, Number.POSITIVE_INFINITY, 7, 9], counts: [2, 1, 3, 1, 2, 1, 1] }),
    ],
    [
      'exact, left, interval and right together',
      prepareIntervalLifeData({ start: [0, 2, 2, 3, 5, 1, 4], end: [2, 2, 5, 3, Number.POSITIVE_INFINITY, 4, Number.POSITIVE_INFINITY] }),
    ],
  ];
  for (const [name, d] of smallCases) {
    it(`${name}: F agrees with a brute-force EM on every elementary cell (1e-6)`, () => {
      const t = turnbull(d);
      expect(t.converged).toBe(true);
      expect(t.kuhnTuckerExcess).toBeLessThan(1e-6);
      const ends = t.intervals.map((iv) => iv.upper).filter((v) => Number.isFinite(v));
      const bf = bruteForceF(d, ends, 20000);
      ends.forEach((x, k) => expect(Math.abs(turnbullF(d, x) - (bf[k] as number)), `F(${x})`).toBeLessThan(1e-6));
    });
  }

  it('seeded random inspection data: masses sum to 1 and the Kuhn–Tucker conditions hold (Gentleman & Geyer 1994)', () => {
    const rng = createRng(11, 0);
    const start: number[] = [];
    const end: number[] = [];
    for (let i = 0; i < 200; i++) {
      const a = Math.floor(rng.uniform() * 10);
      const w = Math.floor(rng.uniform() * 4);
      start.push(a);
      end.push(rng.uniform() < 0.15 && a > 0 ? Number.POSITIVE_INFINITY : a + w + (a === 0 && w === 0 ? 1 : 0));
    }
    const t = turnbull(prepareIntervalLifeData({ start, end }));
    expect(t.converged).toBe(true);
    expect(t.intervals.reduce((s, iv) => s + iv.mass, 0)).toBeCloseTo(1, 12);
    expect(t.kuhnTuckerExcess).toBeLessThan(1e-6);
    for (const iv of t.intervals) expect(iv.cdfAfter).toBeGreaterThanOrEqual(iv.cdfBefore);
  });
});
