import { describe, expect, it } from 'vitest';
import { c4, d2, d4Pair, individualsChart, subgroupChart } from '../../core/capability/index.js';
import { createRng } from '../../core/random/index.js';

// Control-chart factors printed in Montgomery, Introduction to Statistical Quality Control,
// Appendix VI (to 3 decimals; from memory of the table, and each also follows from c4/d2, which
// test/capability/capability.test.ts checks against SciPy): A3, B3, B4 for subgroups of 5 and 10,
// D4 for n = 2 and E2 = 3/d2(2) for individuals.
const MONTGOMERY = { A3: { 5: 1.427, 10: 0.975 }, B3: { 5: 0, 10: 0.284 }, B4: { 5: 2.089, 10: 1.716 }, D4_2: 3.267, E2: 2.66 };

function groupsOf(size: number, k: number, seed: number, shift: (i: number) => number = () => 0) {
  const rng = createRng(seed, 0);
  return Array.from({ length: k }, (_, i) => ({ label: i + 1, values: Array.from({ length: size }, () => 10 + shift(i) + rng.normal()) }));
}

describe('subgroup chart (X̄ and S)', () => {
  for (const size of [5, 10] as const) {
    it(`equal subgroups of ${size}: limits are x̿ ± A3·s̄, B3·s̄ and B4·s̄ with Montgomery's factors (3 decimals)`, () => {
      const ch = subgroupChart(groupsOf(size, 25, size));
      const sBar = ch.dispersion.center;
      const p = ch.location.points[0]!;
      expect((p.upper - ch.location.center) / sBar).toBeCloseTo(MONTGOMERY.A3[size], 3);
      expect((ch.location.center - p.lower) / sBar).toBeCloseTo(MONTGOMERY.A3[size], 3);
      const d = ch.dispersion.points[0]!;
      expect(d.lower / sBar).toBeCloseTo(MONTGOMERY.B3[size], 3);
      expect(d.upper / sBar).toBeCloseTo(MONTGOMERY.B4[size], 3);
      // equal sizes: σ̂ = s̄/c4
      expect(ch.sigma).toBeCloseTo(sBar / c4(size), 12);
    });
  }
  it('a shifted subgroup is caught beyond the limits and the process is called unstable', () => {
    const stable = subgroupChart(groupsOf(5, 25, 3));
    expect(stable.location.points[12]!.beyond).toBeNull();
    const shifted = subgroupChart(groupsOf(5, 25, 3, (i) => (i === 12 ? 4 : 0)));
    expect(shifted.stable).toBe(false);
    expect(shifted.location.points[12]!.beyond).toBe('above');
    expect(shifted.statement).toMatch(/do not predict its future/);
  });
});

describe('individuals and moving-range chart', () => {
  it("D4 for pairs is 1 + 3·d3(2)/d2(2) = 3.267 and the individuals half-width is E2·MR̄ with E2 = 2.660 (Montgomery)", () => {
    expect(d4Pair()).toBeCloseTo(MONTGOMERY.D4_2, 3);
    // the table's 2.660 is 3/1.128 with d2 rounded; the exact 3/d2(2) = 2.6587 agrees to 2 decimals
    expect(3 / d2(2)).toBeCloseTo(MONTGOMERY.E2, 2);
    const x = [5, 7, 6, 8, 7, 6, 9, 7];
    const ch = individualsChart(x, null);
    // hand computation: mean 6.875, moving ranges 2,1,2,1,1,3,2 → MR̄ = 12/7
    expect(ch.location.center).toBeCloseTo(6.875, 14);
    expect(ch.dispersion.center).toBeCloseTo(12 / 7, 14);
    expect(ch.location.points[0]!.upper).toBeCloseTo(6.875 + (3 * (12 / 7)) / d2(2), 12);
    expect(ch.dispersion.points[0]!.upper).toBeCloseTo(d4Pair() * (12 / 7), 12);
    expect(ch.orderFrom).toBe('row order');
  });
  it('sorts by the order column before the moving ranges', () => {
    const x = [1, 10, 2, 11];
    const order = [1, 3, 2, 4]; // in time: 1, 2, 10, 11
    const ch = individualsChart(x, order);
    expect(ch.location.points.map((p) => p.value)).toEqual([1, 2, 10, 11]);
    expect(ch.dispersion.points.map((p) => p.value)).toEqual([1, 8, 1]);
    expect(ch.orderFrom).toBe('order column');
  });
  it('a step change shows points beyond the limits', () => {
    const rng = createRng(5, 0);
    const x = Array.from({ length: 60 }, (_, i) => (i < 40 ? 0 : 5) + rng.normal());
    const ch = individualsChart(x, null);
    expect(ch.stable).toBe(false);
    expect(ch.location.points.slice(40).some((p) => p.beyond === 'above')).toBe(true);
  });
});
