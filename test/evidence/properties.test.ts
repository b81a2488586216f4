import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyze, computeEvidence, isPlumblineError, prepareSample, type Evidence } from '../../core/index.js';

// Invariants of issue 6 applied to the plot data (seeded property tests, fast-check): counts sum to
// n, nothing non-finite reaches the page (null marks a gap), permutation changes nothing.

function nonFinite(o: unknown, path: string, out: string[]): void {
  if (typeof o === 'number') {
    if (!Number.isFinite(o)) out.push(`${path}=${o}`);
  } else if (Array.isArray(o)) o.forEach((v, i) => nonFinite(v, `${path}[${i}]`, out));
  else if (o && typeof o === 'object') for (const [k, v] of Object.entries(o)) nonFinite(v, `${path}.${k}`, out);
}

function evidenceOf(values: number[], maxPoints: number): Evidence | null {
  let report;
  try {
    report = analyze(values);
  } catch (e) {
    if (isPlumblineError(e)) return null; // refused with a typed error (all equal, too few): fine
    throw e;
  }
  return computeEvidence(prepareSample(values), report, { maxPoints });
}

const sampleArb = fc.oneof(
  fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }), { minLength: 4, maxLength: 150 }),
  fc.array(fc.double({ min: 1e-3, max: 1e4, noNaN: true, noDefaultInfinity: true }), { minLength: 4, maxLength: 150 }),
  // heavy ties from rounding
  fc.array(fc.integer({ min: 1, max: 6 }), { minLength: 4, maxLength: 150 }),
  // far tails of the double range
  fc.array(fc.constantFrom(1e-300, 3e-300, 1e-299, 5e-298, 1e300, 4e300, 2e301), { minLength: 4, maxLength: 20 }),
  // next to the largest double (about 1.8e308), where a naive width or grid step overflows
  fc.array(fc.double({ min: 0.3e308, max: 1.7e308, noNaN: true, noDefaultInfinity: true }), { minLength: 4, maxLength: 40 }),
  fc.array(fc.double({ min: -1.7e308, max: 1.7e308, noNaN: true, noDefaultInfinity: true }), { minLength: 4, maxLength: 40 }),
);

describe('evidence properties', () => {
  it('counts sum to n, all numbers finite, thinning within the cap, bands ordered', () => {
    fc.assert(
      fc.property(sampleArb, fc.integer({ min: 16, max: 64 }), (values, cap) => {
        const ev = evidenceOf(values, cap);
        if (ev === null) return;
        const n = values.length;
        const bad: string[] = [];
        nonFinite(ev, 'evidence', bad);
        expect(bad).toEqual([]);
        expect(ev.cdf.empirical.cumulativeCount[ev.cdf.empirical.cumulativeCount.length - 1]).toBe(n);
        expect(ev.cdf.empirical.x.length).toBeLessThanOrEqual(cap);
        for (const c of ev.candidates) {
          expect(c.bins.rows.reduce((a, r) => a + r.observed, 0)).toBe(n);
          expect(Math.abs(c.bins.rows.reduce((a, r) => a + r.expected, 0) - n)).toBeLessThan(1e-9 * n);
          const pp = c.probabilityPlot;
          expect(pp.points.x.length).toBeLessThanOrEqual(cap);
          expect(pp.points.x.length + pp.omitted).toBeGreaterThan(0);
          pp.band.lower.forEach((lo, j) => {
            const hi = pp.band.upper[j];
            if (lo !== null && hi !== null && lo !== undefined && hi !== undefined) expect(lo).toBeLessThanOrEqual(hi);
          });
          c.histogram.bars.forEach((b, j) => {
            expect(b.upper).toBeGreaterThan(b.lower);
            if (j > 0) expect(b.lower).toBe(c.histogram.bars[j - 1]?.upper);
          });
        }
      }),
      { seed: 20261201, numRuns: 250 },
    );
  });

  it('permuting the data changes nothing', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0.5, max: 500, noNaN: true, noDefaultInfinity: true }), { minLength: 6, maxLength: 80 }),
        fc.integer({ min: 0, max: 1e9 }),
        (values, seed) => {
          const shuffled = [...values];
          let s = seed;
          for (let i = shuffled.length - 1; i > 0; i--) {
            s = (s * 1103515245 + 12345) % 2147483648;
            const j = s % (i + 1);
            [shuffled[i], shuffled[j]] = [shuffled[j] as number, shuffled[i] as number];
          }
          expect(evidenceOf(shuffled, 32)).toEqual(evidenceOf(values, 32));
        },
      ),
      { seed: 7, numRuns: 100 },
    );
  });
});
