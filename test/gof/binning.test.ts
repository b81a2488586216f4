import { describe, expect, it } from 'vitest';
import { InputError, getFamily, prepareSample, type FamilyName } from '../../core/index.js';
import { chooseBinCount, equiprobableBins, equiprobableEdges, lowerBound, mooreBinCount } from '../../core/gof/index.js';
import { fixture, rel } from './fixture.js';

describe('number of bins', () => {
  it("follows Moore's 2·n^(2/5), capped at floor(n/5), raised to m + 2", () => {
    // Hand-computed from the rule (Moore 1986 in D'Agostino & Stephens ch. 3; Cochran 1952/1954 ≥ 5 per bin):
    // n = 1000: 2·1000^0.4 = 31.70 → 32 (cap 200); n = 100: 2·100^0.4 = 12.62 → 13 (cap 20);
    // n = 20: 2·20^0.4 = 6.63 → 7, cap 4; n = 25: 7.25 → 7, cap 5;
    // n = 15, m = 1: 5.91 → 6, cap 3 = m + 2; n = 15, m = 2: cap 3 < m + 2 = 4 → not computable.
    expect(mooreBinCount(1000)).toBe(32);
    const cases: [number, number, number | null][] = [
      [1000, 2, 32],
      [100, 2, 13],
      [20, 2, 4],
      [25, 2, 5],
      [15, 1, 3],
      [15, 2, null],
      [19, 2, null], // cap floor(19/5) = 3 < 4
      [10, 1, null], // cap 2 < 3
    ];
    for (const [n, m, k] of cases) {
      const c = chooseBinCount(n, m);
      if (k === null) {
        expect(c.computable, `n=${n} m=${m}`).toBe(false);
        if (!c.computable) expect(c.reason).toMatch(/at least \d+ values/);
      } else {
        expect(c.computable && c.k, `n=${n} m=${m}`).toBe(k);
      }
    }
  });

  it('says in words how k was chosen', () => {
    const c = chooseBinCount(20, 2);
    expect(c.computable && c.kRule).toMatch(/Moore.*7.*capped at floor\(n\/5\) = 4/);
    const u = chooseBinCount(200, 2, 10);
    expect(u.computable && u.kRule).toMatch(/chosen by the user/);
  });

  it('honours a user k only with ≥ 5 expected per bin, else says the largest k allowed', () => {
    // Rule: n/k ≥ 5 (Cochran 1952/1954): for n = 103 the largest k is floor(103/5) = 20.
    expect(chooseBinCount(103, 2, 20)).toMatchObject({ computable: true, k: 20 });
    let err: unknown;
    try {
      chooseBinCount(103, 2, 21);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).code).toBe('bins-too-many');
    expect((err as InputError).message).toContain('largest number of bins allowed is 20');
    // k too small for dof ≥ 1 (k - 1 - m ≥ 1): common practice, no source.
    expect(() => chooseBinCount(103, 2, 3)).toThrow(/at least 4 bins/);
    expect(() => chooseBinCount(103, 2, 2.5)).toThrow(InputError);
  });
});

describe('equiprobable bins', () => {
  const families: FamilyName[] = ['normal', 'lognormal', 'gamma', 'weibull', 'exponential'];

  it('expected counts all n/k, observed summing to n, outer edges at the support (null = infinite)', () => {
    // Definition of equiprobable bins (common practice, no source).
    const x = prepareSample(fixture.D1.values);
    for (const f of families) {
      const fam = getFamily(f);
      const fit = fam.fit(x);
      if (!fit.ok) throw new Error(f);
      const dist = fam.make(fit.parameters);
      const rows = equiprobableBins(dist, x.sorted, 7);
      expect(rows).toHaveLength(7);
      for (const r of rows) expect(r.expected).toBe(20 / 7);
      expect(rows.reduce((s, r) => s + r.observed, 0)).toBe(20);
      expect(rows[0]?.lower).toBe(f === 'normal' ? null : 0);
      expect(rows[6]?.upper).toBeNull();
      for (let j = 1; j < 7; j++) expect(rows[j]?.lower).toBe(rows[j - 1]?.upper);
    }
  });

  it('D1: inner edges are the fitted quantiles j/4 and counts match SciPy (scripts/fixtures/gof.py)', () => {
    for (const f of families) {
      const ref = fixture.D1.models[f];
      if (!ref) throw new Error(f);
      const dist = getFamily(f).make(ref.parameters);
      const edges = equiprobableEdges(dist, fixture.D1.k);
      ref.innerEdges.forEach((e, j) => {
        // SciPy ppf; 1e-9 relative (family quantiles are checked tighter in test/families).
        expect(rel(edges[j + 1] as number, e), `${f} edge ${j + 1}`).toBeLessThan(1e-9);
      });
      const rows = equiprobableBins(dist, prepareSample(fixture.D1.values).sorted, fixture.D1.k);
      expect(rows.map((r) => r.observed)).toEqual(ref.observed);
    }
  });

  it('counts a value lying exactly on an inner edge in the bin above it ([lower, upper))', () => {
    // Counting rule [lower, upper) from the specification; checked against a brute-force filter.
    const dist = getFamily('exponential').make({ rate: 1 });
    const k = 5;
    const edges = equiprobableEdges(dist, k);
    const inner = Array.from(edges.subarray(1, k));
    const values = [...inner, ...inner, 0.01, 0.3, 0.9, 2.5, 4, inner[2] as number].sort((a, b) => a - b);
    const rows = equiprobableBins(dist, values, k);
    for (let j = 0; j < k; j++) {
      const lo = edges[j] as number;
      const hi = edges[j + 1] as number;
      const brute = values.filter((v) => v >= lo && v < hi).length;
      expect(rows[j]?.observed, `bin ${j}`).toBe(brute);
    }
    // The edge value itself: first inner edge appears twice and lands in bin 1, not bin 0.
    expect(rows[0]?.observed).toBe(values.filter((v) => v < (inner[0] as number)).length);
    expect(lowerBound([1, 2, 2, 2, 3], 2)).toBe(1);
    expect(lowerBound([1, 2, 2, 2, 3], 2.5)).toBe(4);
  });
});
