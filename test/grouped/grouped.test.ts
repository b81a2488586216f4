import { describe, expect, it } from 'vitest';
import { type FamilyName, getFamily, normal } from '../../core/families/index.js';
import {
  analyzeGrouped,
  fitGrouped,
  GROUPED_AD_NOTE,
  groupedChiSquare,
  groupedLogLikelihood,
  logClassProbability,
  mergeCells,
  prepareGrouped,
} from '../../core/grouped/index.js';
import { readFixture, relFloored as rel } from '../helpers/fixtures.js';

// Reference values: scripts/fixtures/grouped.py (SciPy 1.17.1: the same grouped likelihood
// maximised by scipy.optimize.minimize Nelder–Mead then Newton polishing on central differences; chi-square with the same merging and refitting rule).
const fx = readFixture('grouped.json');
const num = (v: number | string): number => (v === 'Infinity' ? Number.POSITIVE_INFINITY : v === '-Infinity' ? Number.NEGATIVE_INFINITY : (v as number));

function dataOf(s: { lower: (number | string)[]; upper: (number | string)[]; count: number[] }) {
  return prepareGrouped(s.lower.map((l, i) => ({ lower: num(l), upper: num(s.upper[i]!), count: s.count[i]! })));
}

describe('grouped-data maximum likelihood vs SciPy (fixture)', () => {
  for (const s of fx.sets) {
    for (const [fam, ref] of Object.entries(s.fits as Record<string, { parameters: Record<string, number>; logLikelihood: number; chiSquare: Record<string, unknown> }>)) {
      it(`${s.name}: ${fam}`, () => {
        const data = dataOf(s);
        const r = fitGrouped(fam as FamilyName, data);
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        expect(r.converged).toBe(true);
        // ln L at the maximum: both maximisers reach the same value to ~1e-12 relative.
        expect(Math.abs(r.logLikelihood - ref.logLikelihood)).toBeLessThan(1e-9 * Math.abs(ref.logLikelihood));
        // Parameters: Nelder–Mead's xatol 1e-13 in ln-space, but a flat maximum turns a 1e-14
        // change in ln L into ~1e-7 in the parameters: 1e-6 relative allowed.
        for (const k of Object.keys(ref.parameters)) expect(rel(r.parameters[k] as number, ref.parameters[k]!)).toBeLessThan(1e-6);
        // our maximum is at least as high as SciPy's (to rounding)
        expect(r.logLikelihood).toBeGreaterThanOrEqual(ref.logLikelihood - 1e-10 * Math.abs(ref.logLikelihood));
        const c = groupedChiSquare(fam as FamilyName, r.parameters, data, { alpha: 0.05 });
        expect(c.computable).toBe(ref.chiSquare.computable);
        if (c.computable && ref.chiSquare.computable) {
          expect(c.k).toBe(ref.chiSquare.k);
          expect(c.dof).toBe(ref.chiSquare.dof);
          expect(c.refitted).toBe(ref.chiSquare.refitted);
          expect(c.bins.map((b) => b.observed)).toEqual(ref.chiSquare.observed);
          expect(rel(c.statistic, ref.chiSquare.statistic as number)).toBeLessThan(1e-5);
          expect(Math.abs(c.pValue - (ref.chiSquare.pValue as number))).toBeLessThan(1e-5);
          let sumE = 0;
          for (const b of c.bins) {
            sumE += b.expected;
            expect(b.expected).toBeGreaterThanOrEqual(5);
          }
          expect(sumE).toBeCloseTo(data.total, 8);
          expect(c.dofRule).toMatch(/Cramér 1946/);
        }
      });
    }
  }
});

describe('class probabilities in log space', () => {
  // Reference: mpmath at 50 digits (scripts/fixtures/grouped.py, tailChecks). Relative 1e-10 on
  // ln P (far-tail log values, tolerance policy); exact 0 where P rounds to 1.
  for (const t of fx.tailChecks) {
    it(`${t.family} ln P(${t.lower} < X ≤ ${t.upper})`, () => {
      const d = getFamily(t.family).make(t.parameters);
      const lp = logClassProbability(d, t.lower, t.upper);
      if (t.logP === 0) expect(Math.abs(lp)).toBeLessThan(1e-300);
      else expect(rel(lp, t.logP)).toBeLessThan(1e-10);
    });
  }
  it('the whole line has probability 1', () => {
    const d = normal.make({ mean: 0, sd: 1 });
    expect(Math.abs(logClassProbability(d, Number.NEGATIVE_INFINITY, Number.POSITIVE_INFINITY))).toBe(0);
  });
});

describe('grouped input and the chi-square rules', () => {
  it('merges left to right until ≥ 5 expected, the remainder joining the last cell (Cochran 1952)', () => {
    expect(mergeCells([1, 2, 3, 6, 0.5, 9, 2, 1])).toEqual([[0, 1, 2], [3], [4, 5, 6, 7]]);
    expect(mergeCells([10, 10])).toEqual([[0], [1]]);
    expect(mergeCells([1, 1])).toEqual([[0, 1]]);
  });
  it('rejects gaps, overlaps, bad counts and all-zero counts', () => {
    expect(() => prepareGrouped([{ lower: 0, upper: 1, count: 2 }, { lower: 2, upper: 3, count: 1 }])).toThrow(/contiguous/);
    expect(() => prepareGrouped([{ lower: 0, upper: 2, count: 2 }, { lower: 1, upper: 3, count: 1 }])).toThrow(/contiguous/);
    expect(() => prepareGrouped([{ lower: 1, upper: 0, count: 2 }])).toThrow(/below/);
    expect(() => prepareGrouped([{ lower: 0, upper: 1, count: -1 }])).toThrow(/≥ 0/);
    expect(() => prepareGrouped([{ lower: 0, upper: 1, count: 0 }])).toThrow(/zero/);
  });
  it('positive families are not applicable to counts at or below 0; AD is not offered and says why', () => {
    const data = prepareGrouped([
      { lower: Number.NEGATIVE_INFINITY, upper: -1, count: 4 },
      { lower: -1, upper: 1, count: 10 },
      { lower: 1, upper: 3, count: 12 },
      { lower: 3, upper: Number.POSITIVE_INFINITY, count: 5 },
    ]);
    const a = analyzeGrouped(data);
    const ln = a.candidates.find((c) => c.fit.family === 'lognormal')!;
    expect(ln.fit.ok).toBe(false);
    const nm = a.candidates.find((c) => c.fit.family === 'normal')!;
    expect(nm.fit.ok).toBe(true);
    expect(a.notes[0]).toBe(GROUPED_AD_NOTE);
    expect(GROUPED_AD_NOTE).toMatch(/individual values/);
  });
  it('the grouped likelihood is maximal at the fit (perturbing any parameter lowers it)', () => {
    const data = dataOf(fx.sets[0]);
    for (const fam of ['gamma', 'weibull'] as const) {
      const r = fitGrouped(fam, data);
      if (!r.ok) throw new Error('fit failed');
      const family = getFamily(fam);
      for (const k of Object.keys(r.parameters)) {
        for (const f of [0.999, 1.001]) {
          const p = { ...r.parameters, [k]: (r.parameters[k] as number) * f };
          expect(groupedLogLikelihood(family, p, data)).toBeLessThan(r.logLikelihood);
        }
      }
    }
  });
});
