import { describe, expect, it } from 'vitest';
import { analyze, computeEvidence, createRng, getFamily, prepareSample } from '../../core/index.js';
import { empiricalCdf, histogramBars, thinMonotone } from '../../core/evidence/index.js';

describe('thinning for drawing', () => {
  it('keeps the first and last points (min and max), at most cap points, in order', () => {
    // Invariants stated in core/evidence/thin.ts (common practice, no source).
    const rng = createRng(11);
    for (const n of [10, 2000, 100_000]) {
      const x = new Float64Array(n);
      const y = new Float64Array(n);
      let a = 0;
      for (let i = 0; i < n; i++) {
        a += rng.exponential() * (i % 1000 === 0 ? 50 : 1); // gaps and dense stretches
        x[i] = a;
        y[i] = Math.log((i + 0.6) / (n - i - 0.4 + 1));
      }
      for (const cap of [16, 200, 2000]) {
        const keep = thinMonotone(x, y, cap);
        expect(keep[0]).toBe(0);
        expect(keep[keep.length - 1]).toBe(n - 1);
        expect(keep.length).toBeLessThanOrEqual(Math.max(cap, 16));
        if (n <= cap) expect(keep.length).toBe(n);
        for (let j = 1; j < keep.length; j++) expect(keep[j] as number).toBeGreaterThan(keep[j - 1] as number);
      }
    }
  });
});

describe('empirical CDF', () => {
  it('steps at the distinct values; the step heights sum to n', () => {
    // Definition of the ECDF: F_n(x) = #{x_i ≤ x}/n.
    const data = [3, 1, 2, 2, 5, 5, 5, 9];
    const s = prepareSample(data);
    const e = empiricalCdf(s.sorted, 2000);
    expect(e.x).toEqual([1, 2, 3, 5, 9]);
    expect(e.cumulativeCount).toEqual([1, 3, 4, 7, 8]);
    expect(e.p[4]).toBe(1);
    const heights = e.cumulativeCount.map((c, j) => c - (j === 0 ? 0 : (e.cumulativeCount[j - 1] as number)));
    expect(heights.reduce((a, b) => a + b, 0)).toBe(8);
    expect(e.thinned).toBe(false);
    expect(e.total).toBe(5);
  });

  it('thinned to the cap for 10^5 values, still ending at n with the extremes kept', () => {
    const n = 100_000;
    const x = getFamily('normal').random({ mean: 0, sd: 1 }, createRng(3), n);
    const s = prepareSample(x);
    const e = empiricalCdf(s.sorted, 1000);
    expect(e.x.length).toBeLessThanOrEqual(1000);
    expect(e.thinned).toBe(true);
    expect(e.x[0]).toBe(s.min);
    expect(e.x[e.x.length - 1]).toBe(s.max);
    expect(e.cumulativeCount[e.cumulativeCount.length - 1]).toBe(n);
    const heights = e.cumulativeCount.map((c, j) => c - (j === 0 ? 0 : (e.cumulativeCount[j - 1] as number)));
    expect(heights.reduce((a, b) => a + b, 0)).toBe(n);
    expect(heights.every((h) => h > 0)).toBe(true);
  });
});

describe('histogram on equiprobable bins and the observed/expected table', () => {
  it('bars are finite, contiguous, cover the data, and their areas sum to 1; contributions sum to the chi-square statistic', () => {
    // Pearson (1900): X² = Σ (O - E)²/E; density-scaled bars integrate to 1 by construction.
    const x = getFamily('weibull').random({ shape: 1.8, scale: 100 }, createRng(5), 400);
    const report = analyze(x, { families: ['normal', 'weibull', 'exponential'] });
    const s = prepareSample(x);
    const ev = computeEvidence(s, report);
    expect(ev.candidates.map((c) => c.family)).toEqual(report.candidates.map((c) => c.family));
    for (const ce of ev.candidates) {
      const rc = report.candidates.find((c) => c.family === ce.family);
      if (!rc || !rc.chiSquare.computable) throw new Error('chi-square expected to be computable for n = 400');
      expect(ce.histogram.source).toBe('report');
      expect(ce.histogram.k).toBe(rc.chiSquare.k);
      const bars = ce.histogram.bars;
      let area = 0;
      let observed = 0;
      bars.forEach((b, j) => {
        expect(Number.isFinite(b.lower) && Number.isFinite(b.upper)).toBe(true);
        expect(b.upper).toBeGreaterThan(b.lower);
        if (j > 0) expect(b.lower).toBe(bars[j - 1]?.upper);
        area += b.density * (b.upper - b.lower);
        observed += b.observed;
      });
      expect(observed).toBe(400);
      expect(Math.abs(area - 1)).toBeLessThan(1e-12);
      expect(bars[0]?.lower).toBeLessThanOrEqual(s.min);
      expect(bars[bars.length - 1]?.upper).toBeGreaterThanOrEqual(s.max);
      const x2 = ce.bins.rows.reduce((a, r) => a + r.contribution, 0);
      expect(Math.abs(x2 - rc.chiSquare.statistic) / rc.chiSquare.statistic).toBeLessThan(1e-12);
    }
    // Densities and CDFs share one ascending grid; a CDF is nondecreasing in [0, 1].
    for (let j = 1; j < ev.densities.x.length; j++) expect(ev.densities.x[j] as number).toBeGreaterThan(ev.densities.x[j - 1] as number);
    for (const c of ev.cdf.fitted.curves) {
      expect(c.y.length).toBe(ev.densities.x.length);
      for (let j = 1; j < c.y.length; j++) expect(c.y[j] as number).toBeGreaterThanOrEqual(c.y[j - 1] as number);
    }
  });

  it('when the chi-square test is not computable (n = 8), display bins are made the same way and say so', () => {
    // Cochran (1952) 5-per-bin rule: 8 values allow floor(8/5) = 1 bin, too few for any dof, so the
    // report has no bins; the display uses equiprobable bins under the fit with k = 2
    // (Moore round(2·8^0.4) = 5, capped at max(2, floor(8/5))).
    const x = [12.1, 13.4, 9.8, 11.0, 10.6, 12.9, 11.7, 10.2];
    const report = analyze(x, { families: ['normal'] });
    expect(report.candidates[0]?.chiSquare.computable).toBe(false);
    const ev = computeEvidence(prepareSample(x), report);
    const h = ev.candidates[0]?.histogram;
    expect(h?.source).toBe('display');
    expect(h?.k).toBe(2);
    expect(h?.bars.reduce((a, b) => a + b.observed, 0)).toBe(8);
    expect(h?.bars.every((b) => b.expected === 4)).toBe(true);
    expect(ev.candidates[0]?.bins.source).toBe('display');
  });

  it('an open outer bin is drawn from the data extreme, or one neighbouring-bin width beyond its inner edge', () => {
    // The display-edge rule of core/evidence/histogram.ts (common practice, no source); hand-computed.
    const rows = [
      { lower: null, upper: 10, observed: 0, expected: 2 },
      { lower: 10, upper: 14, observed: 3, expected: 2 },
      { lower: 14, upper: null, observed: 3, expected: 2 },
    ];
    const bars = histogramBars(rows, 6, 11, 30);
    // Lower: min(data min 11, 10 - 4) = 6. Upper: max(data max 30, 14 + 4) = 30.
    expect(bars[0]?.lower).toBe(6);
    expect(bars[0]?.openLower).toBe(true);
    expect(bars[2]?.upper).toBe(30);
    expect(bars[1]?.density).toBe(3 / (6 * 4));
  });

  it('a sample of 10^5 gives thinned series within the cap and keeps every statistic on the full data', () => {
    const n = 100_000;
    const x = getFamily('lognormal').random({ meanlog: 2, sdlog: 0.5 }, createRng(9), n);
    const report = analyze(x, { families: ['normal', 'lognormal'] });
    const ev = computeEvidence(prepareSample(x), report, { maxPoints: 1500 });
    expect(ev.maxPoints).toBe(1500);
    for (const c of ev.candidates) {
      expect(c.probabilityPlot.points.x.length).toBeLessThanOrEqual(1500);
      expect(c.probabilityPlot.thinned).toBe(true);
      expect(c.probabilityPlot.total).toBe(n);
      expect(c.probabilityPlot.points.rank[0]).toBe(1);
      expect(c.probabilityPlot.points.rank[c.probabilityPlot.points.rank.length - 1]).toBe(n);
      expect(c.bins.rows.reduce((a, r) => a + r.observed, 0)).toBe(n);
    }
    expect(ev.cdf.empirical.cumulativeCount[ev.cdf.empirical.cumulativeCount.length - 1]).toBe(n);
  });
});
