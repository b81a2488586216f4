/**
 * The X̄ and R chart (core/capability/control-chart.ts subgroupRangeChart) and its constants:
 * d3 against SciPy (scripts/fixtures/capability-constants.py: dblquad of the range's second moment)
 * and the closed form at n = 2; d2, d3, A2, D3, D4 against Montgomery's printed table (Introduction
 * to Statistical Quality Control, Appendix VI, written into the fixture from memory, edition not
 * checked); and Montgomery's piston-ring X̄ and R example (from memory: 25 subgroups of 5,
 * x̿ = 74.001 mm, R̄ = 0.023 mm, X̄ limits 73.988 and 74.014, R limits 0 and 0.049, Cp 1.68 with
 * specifications 74.000 ± 0.05 mm).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeDataset, type DatasetReport } from '../../core/index.js';
import { capability, d2, d3, rangeChartFactors, subgroupChart, subgroupRangeChart } from '../../core/capability/index.js';

interface Row {
  n: number;
  d2: number;
  d3: number;
  A2: number;
  D3: number;
  D4: number;
  montgomery: { A2: number; d2: number; d3: number; D3: number; D4: number };
}
const fx = JSON.parse(readFileSync(new URL('../fixtures/capability-constants.json', import.meta.url), 'utf8')) as { d3ClosedFormAt2: number; rows: Row[] };

describe('d3: standard deviation of the range of n standard normals', () => {
  it('d3(2) = √(2(1 - 2/π)) (closed form)', () => {
    expect(Math.abs(d3(2) - fx.d3ClosedFormAt2) / fx.d3ClosedFormAt2).toBeLessThan(1e-12);
  });
  it('d3(n), n = 2..10, agrees with SciPy dblquad to 1e-9 relative (the fixture integration is to 1e-12 relative, ours by Gauss–Legendre)', () => {
    for (const r of fx.rows) expect(Math.abs(d3(r.n) - r.d3) / r.d3, `n = ${r.n}`).toBeLessThan(1e-9);
  });
});

describe('X̄ and R factors against Montgomery\'s table (from memory)', () => {
  it('d2 and d3 round to the printed three decimals', () => {
    for (const r of fx.rows) {
      expect(Math.abs(d2(r.n) - r.montgomery.d2), `d2(${r.n})`).toBeLessThanOrEqual(0.0005 + 1e-12);
      expect(Math.abs(d3(r.n) - r.montgomery.d3), `d3(${r.n})`).toBeLessThanOrEqual(0.0005 + 1e-12);
    }
  });
  it('A2, D3, D4 match the printed values to one unit in the third decimal (the table was computed from rounded d2, d3: n = 3 gives 1 + 3·0.888/1.693 = 2.574 printed, 2.5746 exact)', () => {
    for (const r of fx.rows) {
      const f = rangeChartFactors(r.n);
      expect(Math.abs(f.A2 - r.montgomery.A2), `A2(${r.n})`).toBeLessThanOrEqual(0.0011);
      expect(Math.abs(f.D3 - r.montgomery.D3), `D3(${r.n})`).toBeLessThanOrEqual(0.0011);
      expect(Math.abs(f.D4 - r.montgomery.D4), `D4(${r.n})`).toBeLessThanOrEqual(0.0011);
      // and the same factors as SciPy's integration to 1e-9
      expect(Math.abs(f.D4 - r.D4) / r.D4).toBeLessThan(1e-9);
      expect(Math.abs(f.A2 - r.A2) / r.A2).toBeLessThan(1e-9);
    }
  });
});

// 25 subgroups of 5 with x̄ᵢ = 74.001 and Rᵢ = 0.023 (so x̿ and R̄ are the example's)
const offsets = [-0.0115, -0.004, 0, 0.004, 0.0115];
const pistonGroups = Array.from({ length: 25 }, (_, i) => ({ label: i + 1, values: offsets.map((o) => 74.001 + o) }));

describe('Montgomery\'s piston-ring X̄ and R example (from memory)', () => {
  const chart = subgroupRangeChart(pistonGroups);
  it('centre lines x̿ = 74.001 and R̄ = 0.023; X̄ limits 73.988 and 74.014; R limits 0 and 0.049 (to the printed digits)', () => {
    expect(chart.kind).toBe('subgroup means and ranges');
    expect(chart.location.center).toBeCloseTo(74.001, 9);
    expect(chart.dispersion.center).toBeCloseTo(0.023, 12);
    const p = chart.location.points[0]!;
    expect(Number(p.lower.toFixed(3))).toBe(73.988);
    expect(Number(p.upper.toFixed(3))).toBe(74.014);
    const r = chart.dispersion.points[0]!;
    expect(r.lower).toBe(0);
    expect(Number(r.upper.toFixed(3))).toBe(0.049);
    expect(chart.factors?.n).toBe(5);
    // x̿ ± A2·R̄ and D4·R̄ exactly, with the integrated factors
    expect(p.upper - 74.001).toBeCloseTo(chart.factors!.A2 * 0.023, 12);
    expect(r.upper).toBeCloseTo(chart.factors!.D4 * 0.023, 12);
    expect(chart.stable).toBe(true);
  });
  it('Cp from σ̂ = R̄/d2 with specifications 74.000 ± 0.05: σ̂ = 0.0099 and Cp = 0.10/(6·0.0099) = 1.68 as printed (the example rounds σ̂ first; unrounded, Cp = 1.6855)', () => {
    const values = pistonGroups.flatMap((g) => g.values);
    const subgroups = pistonGroups.flatMap((g) => g.values.map(() => g.label));
    const rep = capability(values, { lsl: 73.95, usl: 74.05, subgroups, withinMethod: 'range' });
    const cp = rep.within?.indices.find((i) => i.name === 'Cp');
    expect(cp).toBeDefined();
    const sigma = 0.1 / (6 * cp!.estimate);
    expect(Number(sigma.toFixed(4))).toBe(0.0099);
    expect(Math.abs(sigma - 0.023 / d2(5))).toBeLessThan(1e-12);
    expect(Number((0.1 / (6 * Number(sigma.toFixed(4)))).toFixed(2))).toBe(1.68);
    expect(cp!.estimate).toBeCloseTo(0.1 / (6 * (0.023 / 2.325929)), 5);
  });
  it('a subgroup range beyond D4·R̄ is flagged on the R panel', () => {
    const groups = pistonGroups.map((g, i) => (i === 7 ? { ...g, values: [74.001 - 0.03, 74.001, 74.001, 74.001, 74.001 + 0.03] } : g));
    const c = subgroupRangeChart(groups);
    expect(c.dispersion.points[7]!.beyond).toBe('above');
    expect(c.stable).toBe(false);
  });
  it('unequal subgroup sizes: each subgroup\'s limits use its own d2, d3 (no single factor set)', () => {
    const groups = [...pistonGroups.slice(0, 10), { label: 'short', values: [74.0, 74.01, 74.005] }];
    const c = subgroupRangeChart(groups);
    expect(c.factors).toBeUndefined();
    const last = c.dispersion.points[10]!;
    expect(last.upper).toBeCloseTo((d2(3) + 3 * d3(3)) * c.sigma, 12);
  });
});

describe('the report carries the X̄ and R chart beside the X̄ and S chart', () => {
  it('analyzeDataset with a subgroup column: capability.rangeChart on the same subgroups', () => {
    const values = pistonGroups.flatMap((g, i) => g.values.map((v, j) => v + 0.001 * ((i * 7 + j * 3) % 5)));
    const subgroups = pistonGroups.flatMap((g) => g.values.map(() => g.label));
    const r = analyzeDataset({ values, subgroups }, { lsl: 73.95, usl: 74.05, capabilityReplicates: 19 }) as DatasetReport;
    const cap = r.capability!;
    expect(cap.stability?.kind).toBe('subgroup means and standard deviations');
    expect(cap.rangeChart?.kind).toBe('subgroup means and ranges');
    expect(cap.rangeChart?.location.points).toHaveLength(25);
    expect(cap.rangeChart?.location.center).toBeCloseTo(cap.stability!.location.center, 12);
    expect(subgroupChart(pistonGroups).kind).toBe('subgroup means and standard deviations');
  });
});
