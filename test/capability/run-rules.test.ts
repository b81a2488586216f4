import { describe, expect, it } from 'vitest';
import { individualsChart, runRuleSignals, subgroupRangeChart } from '../../core/capability/index.js';
import { createRng } from '../../core/random/index.js';

// The Western Electric zone rules (Statistical Quality Control Handbook, 1956 [from memory]):
// 2 = two of three beyond 2σ on one side, 3 = four of five beyond 1σ on one side, 4 = eight in a row on one side.
const ones = (n: number): number[] => Array.from({ length: n }, () => 1);

describe('Western Electric run rules 2-4 (known centre 0 and sigma 1)', () => {
  it('rule 2: two of three beyond 2 sigma on the same side signal at the completing point; on opposite sides they do not', () => {
    expect(runRuleSignals([0.5, 2.2, -0.3, 2.5], 0, ones(4))[3]).toEqual([2]);
    expect(runRuleSignals([0.5, 2.2, -0.3, 2.5], 0, ones(4)).slice(0, 3).flat()).toEqual([]);
    expect(runRuleSignals([0.5, 2.2, -0.3, -2.5], 0, ones(4)).flat()).toEqual([]);
    // 2.2 and 2.5 four points apart: not within three successive points
    expect(runRuleSignals([2.2, 0.1, -0.2, 2.5], 0, ones(4)).flat()).toEqual([]);
  });
  it('rule 3: four of five beyond 1 sigma on one side; three of five do not', () => {
    expect(runRuleSignals([1.2, 1.5, -0.5, 1.1, 1.3], 0, ones(5))[4]).toEqual([3]);
    expect(runRuleSignals([1.2, 1.5, -0.5, 0.9, 1.3], 0, ones(5)).flat()).toEqual([]);
  });
  it('rule 4: eight in a row on one side (signals at the 8th and each further one); seven do not; a point on the line breaks the run', () => {
    const eight = [-0.5, 0.2, 0.1, 0.3, 0.4, 0.2, 0.1, 0.6, 0.3];
    const s = runRuleSignals(eight, 0, ones(eight.length));
    expect(s[7]).toEqual([]);
    expect(s[8]).toEqual([4]);
    expect(runRuleSignals([0.2, 0.1, 0.3, 0, 0.4, 0.2, 0.1, 0.6], 0, ones(8)).flat()).toEqual([]);
  });
  it('per-point sigma: a subgroup mean of 4 values 1.1 sigma out is 2.2 standard errors out', () => {
    expect(runRuleSignals([1.1, 0, 1.1], 0, [0.5, 0.5, 0.5])[2]).toEqual([2]);
    expect(runRuleSignals([1.1, 0, 1.1], 0, [1, 1, 1])[2]).toEqual([]);
  });
});

// In-control average run length (seeded simulation, standard normal points, known limits):
// rule 1 alone 1/(2Φ(-3)) = 370.40 (exact); rules 1-4 together 91.75 (Champ & Woodall 1987,
// Technometrics 29:393-399, Table 1 [from memory]). Tolerance: 3 Monte Carlo standard errors.
function runLength(z: number[], withRuns: boolean): number | null {
  const runs = withRuns ? runRuleSignals(z, 0, ones(z.length)) : null;
  for (let i = 0; i < z.length; i++) if (Math.abs(z[i] as number) > 3 || (runs && (runs[i] as number[]).length > 0)) return i + 1;
  return null;
}
function arl(withRuns: boolean, runsOf: number, length: number, seed: number): { mean: number; se: number } {
  const lengths: number[] = [];
  for (let r = 0; r < runsOf; r++) {
    const rng = createRng(seed, r);
    const l = runLength(Array.from({ length }, () => rng.normal()), withRuns);
    expect(l).not.toBeNull();
    lengths.push(l as number);
  }
  const mean = lengths.reduce((a, b) => a + b, 0) / runsOf;
  const sd = Math.sqrt(lengths.reduce((a, b) => a + (b - mean) ** 2, 0) / (runsOf - 1));
  return { mean, se: sd / Math.sqrt(runsOf) };
}

describe('false-alarm rate of the rules (seeded simulation)', () => {
  it('rules 1-4: in-control average run length 91.75 (Champ & Woodall 1987, from memory), within 3 Monte Carlo se', () => {
    const a = arl(true, 4000, 1200, 20261205);
    // measured: 90.83 (se 1.37)
    expect(Math.abs(a.mean - 91.75)).toBeLessThan(3 * a.se);
    expect(a.se).toBeLessThan(2);
  });
  it('rule 1 alone: 370.4 = 1/(2Φ(-3)), within 3 Monte Carlo se', () => {
    const a = arl(false, 2000, 5000, 20261206);
    // measured: 373.30 (se 8.35)
    expect(Math.abs(a.mean - 370.4)).toBeLessThan(3 * a.se);
  });
});

describe('run rules on the charts', () => {
  it('individuals: a sustained shift with no point beyond the limits is flagged (rule 4 or 3) and the process is not called stable', () => {
    // a fast oscillation (period about 3 points) around 10, then the same around 10.15
    const x = Array.from({ length: 42 }, (_, i) => (i >= 30 ? 10.15 : 10) + 0.1 * Math.sin(2.1 * i));
    const c = individualsChart(x, null);
    expect(c.pointsBeyond).toBe(0);
    expect(c.runSignals).toBeGreaterThan(0);
    expect(c.stable).toBe(false);
    const flagged = c.location.points.filter((p) => p.runRules && p.runRules.length > 0);
    expect(flagged.length).toBe(c.runSignals);
    expect(Math.min(...flagged.map((p) => p.label as number))).toBeGreaterThan(30);
    expect(c.statement).toMatch(/complete a run signal \(rule/);
  });
  it('a chart without beyond points or runs says both rules were checked', () => {
    const c = individualsChart([5, 5.2, 4.9, 5.1, 5.0, 4.95, 5.05, 4.97, 5.1, 4.9], null);
    expect(c.runSignals).toBe(0);
    expect(c.stable).toBe(true);
    expect(c.statement).toMatch(/^No point lies beyond the 3-sigma limits, and no run of values signals \(Western Electric/);
  });
  it('X̄ and R: the location points carry the rules, the range points never do', () => {
    const groups = Array.from({ length: 20 }, (_, i) => ({ label: i + 1, values: [0, 1, 2, 3].map((k) => (i >= 10 ? 10.2 : 10) + 0.1 * Math.sin(7 * i + k)) }));
    const c = subgroupRangeChart(groups);
    expect(c.runSignals).toBeGreaterThan(0);
    expect(c.dispersion.points.every((p) => p.runRules === undefined)).toBe(true);
  });
});
