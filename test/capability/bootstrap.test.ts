import { describe, expect, it } from 'vitest';
import {
  capabilityBootstrapIntervals,
  combineCapabilityBootstrap,
  compareModels,
  fitModelSpec,
  makeModel,
  percentileIntervals,
  runCapabilityBootstrapRange,
  splitCapabilityBootstrap,
  INLINE_BOOTSTRAP_WORK,
  expandedZ,
  studentTUpper,
  type ModelSpec,
} from '../../core/capability/index.js';
import { createRng } from '../../core/random/index.js';
import { normalCdf, normalQuantile } from '../../core/special/index.js';

const truth: ModelSpec = { kind: 'boxcox', lambda: 0, mean: 0, sd: 0.25 };
const sample = makeModel(truth).draw(createRng(11, 0), 60).sort();
const fitted = fitModelSpec({ kind: 'boxcox' }, sample);
const limits = { lsl: 0.45, usl: 2.3 };

describe('capability bootstrap: plan, split, combine', () => {
  it('any split of the replicates gives the same values in the same order (replicate i uses stream i)', () => {
    const job = { model: fitted, n: 60, ...limits, seed: 99 };
    const whole = runCapabilityBootstrapRange({ ...job, start: 0, end: 60 });
    const parts = splitCapabilityBootstrap(job, 60, 7).map((j) => runCapabilityBootstrapRange(j));
    const combined = combineCapabilityBootstrap(parts.reverse());
    expect(combined.values).toEqual(whole.values);
    expect(combined.completed).toBe(60);
    expect(() => combineCapabilityBootstrap([parts[0]!, parts[2]!])).toThrow(/do not tile/);
  });
  it('reports progress and stops when cancelled', () => {
    const seen: number[] = [];
    let n = 0;
    const signal = { get aborted() { return n >= 5; } };
    const r = runCapabilityBootstrapRange({ model: fitted, n: 60, ...limits, seed: 1, start: 0, end: 40 }, { signal, onProgress: (d) => { seen.push(d); n = d; } });
    expect(r.cancelled).toBe(true);
    expect(r.completed).toBe(5);
    expect(seen).toEqual([1, 2, 3, 4, 5]);
    expect(() => capabilityBootstrapIntervals(r, 0.05, {}, {})).toThrow(/cancelled/);
  });
});

describe('BCa ends (Efron 1987)', () => {
  it('with no bias (half the replicates below) and no acceleration, the ends are the plain α/2 and 1 - α/2 order statistics', () => {
    // replicates 1..999 and estimate 500: z0 = Φ⁻¹(499.5/999) = 0, a = 0 → 25th and 975th values
    const values = { start: 0, end: 999, completed: 999, failed: 0, cancelled: false, values: { Ppu: Array.from({ length: 999 }, (_, i) => i + 1) } };
    const [iv] = capabilityBootstrapIntervals(values, 0.05, { Ppu: 500 }, {});
    expect(iv!.biasCorrection).toBeCloseTo(0, 14);
    expect(iv!.lower).toBe(25);
    expect(iv!.upper).toBe(975);
  });
  it('a bias correction z0 moves both ends to Φ(2z0 ∓ z) (Efron & Tibshirani 1993, §14.3, BC case)', () => {
    const list = Array.from({ length: 999 }, (_, i) => i + 1);
    const values = { start: 0, end: 999, completed: 999, failed: 0, cancelled: false, values: { Ppu: list } };
    const [iv] = capabilityBootstrapIntervals(values, 0.1, { Ppu: 700.5 }, {}); // 700 below → z0 = Φ⁻¹(0.7007)
    const z0 = normalQuantile(700 / 999);
    const z = -normalQuantile(0.05);
    expect(iv!.lower).toBe(Math.ceil(1000 * normalCdf(2 * z0 - z) - 1e-9));
    expect(iv!.upper).toBe(Math.ceil(1000 * normalCdf(2 * z0 + z) - 1e-9));
  });
  it('percentileIntervals: interval brackets the estimate; too much work inline gives a stated absence, not a number', () => {
    const r = percentileIntervals(fitted, sample, limits, 0.1, 5, 199);
    expect(r.intervals?.length).toBe(4);
    for (const iv of r.intervals!) expect(iv.lower <= iv.estimate && iv.estimate <= iv.upper).toBe(true);
    const big = percentileIntervals(fitted, sample, limits, 0.1, 5, Math.ceil(INLINE_BOOTSTRAP_WORK / 60) + 1);
    expect(big.intervals).toBeNull();
    expect(big.note).toMatch(/No bootstrap interval/);
  });
});

describe('model comparison', () => {
  const n = (mean: number, sd: number) => makeModel({ kind: 'family', family: 'normal', parameters: { mean, sd } });
  it('rejected models are kept apart and never enter the spread; one normal row with the n - 1 sigma', () => {
    const good = makeModel(fitted);
    const bad = makeModel({ kind: 'family', family: 'exponential', parameters: { rate: 1 } });
    const c = compareModels({ mean: 1, sd: 0.25, rejectedBy: [] }, [
      { model: 'Box–Cox', dist: good, rejectedBy: [] },
      { model: 'exponential', dist: bad, rejectedBy: ['Anderson–Darling'] },
    ], limits, null);
    expect(c.passing.map((r) => r.model)).toEqual(['normal', 'Box–Cox']);
    expect(c.rejected.map((r) => r.model)).toEqual(['exponential']);
    expect(c.rejected[0]!.ppmTotal).toBeGreaterThan(1e5); // the exponential's huge ppm ...
    expect(c.spread!.highest).toBeLessThan(1e5); // ... is not in the spread
    expect(c.passing.filter((r) => r.kind === 'normal')).toHaveLength(1);
    expect(c.passing[0]!.sigma).toMatch(/n - 1/);
    // normal row: ppm below = 1e6·Φ((0.45 - 1)/0.25)
    expect(c.passing[0]!.ppmBelow).toBeCloseTo(1e6 * normalCdf(-2.2), 6);
    expect(n(0, 1).cdf(0)).toBeCloseTo(0.5, 15);
  });
  it('upper limit only with a natural bound: no ppm below, Ppu only, and the normal model\'s mass below the bound is flagged', () => {
    const c = compareModels({ mean: 1, sd: 0.4, rejectedBy: [] }, [{ model: 'Box–Cox', dist: makeModel(fitted), rejectedBy: [] }], { lsl: null, usl: 2.3 }, 0);
    for (const r of c.passing) {
      expect(r.ppmBelow).toBe(0);
      expect(r.indices.map((i) => i.name)).toEqual(['Ppk', 'Ppu']);
    }
    expect(c.passing[0]!.ppmBelowNaturalBound).toBeCloseTo(1e6 * normalCdf(-2.5), 6);
    expect(c.passing[1]!.ppmBelowNaturalBound).toBe(0); // the Box–Cox model lives on x > 0
  });
});

describe('small-sample expansion of the bootstrap levels (Hesterberg 2015)', () => {
  it('Student-t quantiles by the Cornish–Fisher series agree with SciPy t.ppf (printed here) to 2e-4 relative for ν ≥ 10', () => {
    // scipy.stats.t.ppf(0.975, ν) and t.ppf(0.95, ν), SciPy 1.17.1
    const ref: [number, number, number][] = [
      [10, 2.228138851986274, 1.8124611228116756],
      [49, 2.0095752371292392, 1.6765508926168535],
      [124, 1.9792801166048548, 1.6572349701508473],
      [1000, 1.9623390808264083, 1.6463788172854643],
    ];
    for (const [nu, t975, t95] of ref) {
      expect(Math.abs(studentTUpper(0.025, nu) / t975 - 1)).toBeLessThan(2e-4);
      expect(Math.abs(studentTUpper(0.05, nu) / t95 - 1)).toBeLessThan(2e-4);
    }
  });
  it("z' = √(n/(n - 1))·t(1 - α/2, n - 1): 2.030 at n = 50, approaching 1.960 as n grows", () => {
    expect(expandedZ(0.05, 50)).toBeCloseTo(Math.sqrt(50 / 49) * 2.0095752371292392, 6);
    expect(expandedZ(0.05, 1e6)).toBeCloseTo(-normalQuantile(0.025), 5);
  });
});
