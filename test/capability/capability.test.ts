import { describe, expect, it } from 'vitest';
import {
  c4,
  capability,
  checkResolution,
  d2,
  normalIndices,
  percentileCapability,
  ppmOutOfSpec,
} from '../../core/capability/index.js';
import { normal } from '../../core/families/index.js';
import type { Distribution } from '../../core/families/index.js';
import { prepareSample } from '../../core/sample.js';
import { createRng } from '../../core/random/index.js';
import { readFixture, relFloored as rel } from '../helpers/fixtures.js';

// Reference values: scripts/fixtures/capability.py (SciPy 1.17.1).
const fx = readFixture('capability.json');

const byName = (list: readonly { name: string }[], name: string) => {
  const r = list.find((x) => x.name === name);
  if (!r) throw new Error(`no ${name}`);
  return r as never as { estimate: number; lower: number; upper: number; confidence: number };
};

describe('control-chart constants', () => {
  it('c4 and d2 match shared/references.md to the printed digits (SciPy, exact)', () => {
    const c4Ref = [0.797885, 0.886227, 0.921318, 0.939986];
    const d2Ref = [1.128379, 1.692569, 2.058751, 2.325929];
    for (let n = 2; n <= 5; n++) {
      expect(c4(n)).toBeCloseTo(c4Ref[n - 2]!, 6);
      expect(d2(n)).toBeCloseTo(d2Ref[n - 2]!, 6);
    }
  });
  it('c4 (closed form and integrated) and d2 (quad) agree with the SciPy fixture to 1e-12', () => {
    for (const [k, v] of Object.entries(fx.c4 as Record<string, number>)) {
      expect(rel(c4(Number(k)), v)).toBeLessThan(1e-12);
      expect(rel(c4(Number(k)), fx.c4Integrated[k])).toBeLessThan(1e-11);
    }
    for (const [k, v] of Object.entries(fx.d2 as Record<string, number>)) expect(rel(d2(Number(k)), v)).toBeLessThan(1e-12);
  });
  it('rejects a subgroup size below 2', () => {
    expect(() => c4(1)).toThrow();
    expect(() => d2(1.5)).toThrow();
  });
});

describe('normal-theory indices', () => {
  it('NIST e-Handbook §6.1.6 example (from memory, shared/references.md): USL 20, LSL 8, mean 16, s 2 → Cp 1.0, Cpk 0.6667', () => {
    const r = normalIndices(16, 2, { lsl: 8, usl: 20 }, 50, 49, 0.05, false);
    expect(byName(r, 'Cp').estimate).toBeCloseTo(1.0, 10);
    expect(byName(r, 'Cpk').estimate).toBeCloseTo(0.6667, 4);
    expect(byName(r, 'Cpu').estimate).toBeCloseTo(0.6667, 4);
    expect(byName(r, 'Cpl').estimate).toBeCloseTo(1.3333, 4);
  });
  it('D1 set (shared/references.md, LSL 5, USL 35): Pp 0.826792, Ppk 0.629189; intervals vs SciPy fixture', () => {
    const d = fx.D1;
    const r = capability(d.values, { lsl: d.lsl, usl: d.usl, target: d.target, alpha: d.alpha });
    expect(r.sdOverall).toBeCloseTo(6.047468, 6);
    const pp = byName(r.overall, 'Pp');
    const ppk = byName(r.overall, 'Ppk');
    expect(pp.estimate).toBeCloseTo(0.826792, 6);
    expect(ppk.estimate).toBeCloseTo(0.629189, 6);
    // chi-square interval (Pp) and Bissell (Ppk, Ppu, Ppl), same formulas evaluated by SciPy; the
    // chi-square quantiles come from core/special's inverse incomplete gamma (1e-9 relative).
    expect(rel(pp.lower, d.PpInterval[0])).toBeLessThan(1e-9);
    expect(rel(pp.upper, d.PpInterval[1])).toBeLessThan(1e-9);
    expect(rel(ppk.lower, d.PpkInterval[0])).toBeLessThan(1e-9);
    expect(rel(ppk.upper, d.PpkInterval[1])).toBeLessThan(1e-9);
    for (const nm of ['Ppu', 'Ppl']) {
      const x = byName(r.overall, nm);
      expect(rel(x.estimate, d[nm])).toBeLessThan(1e-12);
      expect(rel(x.lower, d[`${nm}Interval`][0])).toBeLessThan(1e-9);
    }
    const cpm = byName(r.overall, 'Cpm');
    expect(rel(cpm.estimate, d.Cpm)).toBeLessThan(1e-12);
    expect(rel(cpm.lower, d.CpmInterval[0])).toBeLessThan(1e-8);
    expect(rel(cpm.upper, d.CpmInterval[1])).toBeLessThan(1e-8);
    // ppm under the normal model, vs scipy.stats.norm (moderate tails).
    expect(rel(r.normalPpm.belowLsl, d.ppmBelow)).toBeLessThan(1e-9);
    expect(rel(r.normalPpm.aboveUsl, d.ppmAbove)).toBeLessThan(1e-9);
    expect(r.cautions.join(' ')).toMatch(/lower confidence bound/);
    expect(r.warnings.join(' ')).toMatch(/Only 20 values/);
  });
  it('one-sided specifications give only the indices that exist', () => {
    const d = fx.D1;
    const up = capability(d.values, { usl: d.usl });
    expect(up.overall.map((x) => x.name)).toEqual(['Ppk', 'Ppu']);
    expect(rel(byName(up.overall, 'Ppk').estimate, d.Ppu)).toBeLessThan(1e-12);
    expect(up.normalPpm.belowLsl).toBe(0);
    const lo = capability(d.values, { lsl: d.lsl });
    expect(lo.overall.map((x) => x.name)).toEqual(['Ppk', 'Ppl']);
    expect(rel(byName(lo.overall, 'Ppk').estimate, d.Ppl)).toBeLessThan(1e-12);
  });
  it('intervals widen as confidence rises and contain the estimate (property, common practice, no source)', () => {
    const d = fx.D1;
    let prevWidth = 0;
    for (const a of [0.5, 0.2, 0.1, 0.05, 0.01, 0.001]) {
      const r = capability(d.values, { lsl: d.lsl, usl: d.usl, alpha: a });
      for (const x of r.overall) {
        expect(x.lower).toBeLessThan(x.estimate);
        expect(x.upper).toBeGreaterThan(x.estimate);
      }
      const ppk = byName(r.overall, 'Ppk');
      expect(ppk.upper - ppk.lower).toBeGreaterThan(prevWidth);
      prevWidth = ppk.upper - ppk.lower;
    }
  });
  it('rejects missing or crossed limits and constant data', () => {
    expect(() => capability([1, 2, 3], {})).toThrow(/at least one specification limit/);
    expect(() => capability([1, 2, 3], { lsl: 5, usl: 4 })).toThrow();
    expect(() => capability([2, 2, 2], { lsl: 1, usl: 4 })).toThrow();
  });
});

describe('within-subgroup sigma', () => {
  const s = fx.subgrouped;
  it('pooled s / c4 and Cp, Cpk with intervals match the SciPy fixture', () => {
    const r = capability(s.values, { lsl: s.lsl, usl: s.usl, subgroups: s.labels, alpha: s.alpha });
    expect(r.within).not.toBeNull();
    const w = r.within!;
    expect(w.method).toBe('pooled');
    expect(w.dof).toBe(s.pooledDof);
    expect(rel(w.sigma, s.pooledSigma)).toBeLessThan(1e-12);
    const cp = byName(w.indices, 'Cp');
    const cpk = byName(w.indices, 'Cpk');
    expect(rel(cp.estimate, s.pooled.Cp)).toBeLessThan(1e-12);
    expect(rel(cp.lower, s.pooled.CpInterval[0])).toBeLessThan(1e-9);
    expect(rel(cp.upper, s.pooled.CpInterval[1])).toBeLessThan(1e-9);
    expect(rel(cpk.estimate, s.pooled.Cpk)).toBeLessThan(1e-12);
    expect(rel(cpk.lower, s.pooled.CpkInterval[0])).toBeLessThan(1e-9);
    expect(rel(r.sdOverall, s.overallSd)).toBeLessThan(1e-12);
  });
  it('R-bar/d2 matches the SciPy fixture; string labels and Int32Array labels agree', () => {
    const r = capability(s.values, { lsl: s.lsl, usl: s.usl, subgroups: Int32Array.from(s.labels), withinMethod: 'range' });
    expect(rel(r.within!.sigma, s.rangeSigma)).toBeLessThan(1e-12);
    expect(rel(byName(r.within!.indices, 'Cp').lower, s.range.CpInterval[0])).toBeLessThan(1e-9);
    const r2 = capability(s.values, { lsl: s.lsl, usl: s.usl, subgroups: (s.labels as number[]).map((l) => `lot-${l}`) });
    expect(rel(r2.within!.sigma, s.pooledSigma)).toBeLessThan(1e-12);
  });
  it('one-sided limit with subgroups: Cpk = Cpu from the pooled sigma (same formulas as the fixture)', () => {
    const r = capability(s.values, { usl: s.usl, subgroups: s.labels });
    const w = r.within!;
    expect(w.indices.map((x) => x.name)).toEqual(['Cpk', 'Cpu']);
    const mean = (s.values as number[]).reduce((a, b) => a + b, 0) / s.values.length;
    expect(rel(byName(w.indices, 'Cpk').estimate, (s.usl - mean) / (3 * s.pooledSigma))).toBeLessThan(1e-12);
  });
  it('refuses subgroups with a prepared (sorted) sample and mismatched lengths', () => {
    expect(() => capability(s.values.slice(1), { lsl: 1, subgroups: s.labels })).toThrow(/same length/);
    expect(() => capability(prepareSample(s.values), { lsl: 1, subgroups: s.labels })).toThrow(/original order/);
  });
});

describe('ppm out of spec and the percentile method', () => {
  // A lognormal adapter on the normal family (ln x), so this test does not depend on another
  // engineer's lognormal file: cdf(x) = Φ((ln x - μ)/σ), sf(x) = Φ(-(ln x - μ)/σ).
  const lognormalOf = (meanlog: number, sdlog: number) => {
    const z = normal.make({ mean: meanlog, sd: sdlog });
    return { cdf: (x: number) => z.cdf(Math.log(x)), sf: (x: number) => z.sf(Math.log(x)) };
  };
  // Relative 1e-12 where well conditioned, 1e-10 in the far tails (tolerance policy); the far-tail
  // cases (z = -8, 9, 10.5) need core/special's tail-accurate normal cdf/sf.
  it('matches scipy.stats norm/lognorm cdf and sf (fixture): within 1e-3 ppm absolute, relative 1e-12 / 1e-10 in far tails', () => {
    for (const c of fx.ppm) {
      const dist = c.family === 'normal' ? normal.make(c.parameters) : lognormalOf(c.parameters.meanlog, c.parameters.sdlog);
      const r = ppmOutOfSpec(dist, c.lsl, c.usl);
      for (const [got, want] of [[r.belowLsl, c.below], [r.aboveUsl, c.above]] as const) {
        expect(Math.abs(got - want)).toBeLessThan(1e-3);
        if (want > 0) expect(rel(got, want)).toBeLessThan(want > 1e-3 ? 1e-12 : 1e-10);
      }
      expect(r.total).toBeCloseTo(r.belowLsl + r.aboveUsl, 12);
    }
  });
  it('percentile method (ISO 22514-2) uses the fitted 0.135 %, 50 % and 99.865 % quantiles', () => {
    const p = fx.percentileLognormal;
    const z = normal.make({ mean: p.parameters.meanlog, sd: p.parameters.sdlog });
    const dist = {
      family: 'lognormal',
      parameters: p.parameters,
      quantile: (q: number) => Math.exp(z.quantile(q)),
      isf: (q: number) => Math.exp(z.isf(q)),
    } as unknown as Distribution;
    const r = percentileCapability(dist, { lsl: p.lsl, usl: p.usl });
    expect(rel(r.lowerQuantile, p.lower)).toBeLessThan(1e-9);
    expect(rel(r.median, p.median)).toBeLessThan(1e-12);
    expect(rel(r.upperQuantile, p.upper)).toBeLessThan(1e-9);
    const pp = r.indices.find((x) => x.name === 'Pp')!.estimate;
    expect(rel(pp, (p.usl - p.lsl) / (p.upper - p.lower))).toBeLessThan(1e-9);
    const ppk = r.indices.find((x) => x.name === 'Ppk')!.estimate;
    expect(rel(ppk, Math.min((p.usl - p.median) / (p.upper - p.median), (p.median - p.lsl) / (p.median - p.lower)))).toBeLessThan(1e-9);
    // with a failing normality gate, capability() attaches it
    const c = capability(fx.D1.values, { lsl: p.lsl, usl: p.usl, normality: { passes: false, alpha: 0.05, pValue: 0.01 }, nonNormal: dist });
    expect(c.percentile?.family).toBe('lognormal');
    expect(c.normality?.statement).toMatch(/fails/);
    const c2 = capability(fx.D1.values, { lsl: p.lsl, usl: p.usl, normality: { passes: true, alpha: 0.05 }, nonNormal: dist });
    expect(c2.percentile).toBeNull();
  });
});

describe('measurement resolution (thresholds: common practice, no source)', () => {
  it('flags values on a coarse grid and reports the step', () => {
    // 60 values read to the nearest 0.5 with sd about 1: step/sd ≈ 0.5
    const vals: number[] = [];
    for (let i = 0; i < 60; i++) vals.push(10 + 0.5 * Math.round(2 * Math.sin(i * 1.7)));
    const sorted = Float64Array.from(vals).sort();
    const mean = vals.reduce((a, b) => a + b) / vals.length;
    const sd = Math.sqrt(vals.reduce((a, b) => a + (b - mean) ** 2, 0) / (vals.length - 1));
    const r = checkResolution(sorted, sd);
    expect(r.coarse).toBe(true);
    expect(r.gridStep).toBeCloseTo(0.5, 9);
    expect(r.warning).toMatch(/Anderson–Darling/);
  });
  it('finds a decimal grid despite binary rounding, and does not flag fine data', () => {
    const vals = [12.4, 15.1, 9.8, 22.7, 18.3, 11.6, 14.9, 27.5, 10.2, 13.7];
    const r = checkResolution(Float64Array.from(vals).sort(), 5.9);
    expect(r.gridStep).toBeCloseTo(0.1, 9);
    expect(r.coarse).toBe(false);
    const fine = Float64Array.from({ length: 200 }, (_, i) => Math.sin(i * 12.9898) * 43758.5453 % 1).sort();
    const f = checkResolution(fine, 0.5);
    expect(f.coarse).toBe(false);
    expect(f.distinct).toBe(200);
  });
});

describe('the Cp interval within subgroups is the exact chi-square interval (coverage by simulation)', () => {
  it('nominal 90 % at ν = 5 (5 subgroups of 2): coverage within 4 binomial SE of 0.90', () => {
    // For normal subgroups ν s_p²/σ² ~ χ²_ν exactly (Kotz & Johnson 1993 [from memory]), so the interval on
    // s_p covers the true Cp with probability 0.90; applied to the c4-corrected σ̂ it covered 88.5 %.
    // Seeded Monte Carlo, R = 20000: SE = √(0.9·0.1/R) = 0.0021; tolerance 4 SE (DEVELOPERS.md).
    const R = 20000;
    const sigma = 2;
    const limits = { lsl: 40, usl: 60 };
    const trueCp = (limits.usl - limits.lsl) / (6 * sigma);
    const labels = [0, 0, 1, 1, 2, 2, 3, 3, 4, 4];
    const rng = createRng(20261204, 0);
    let covered = 0;
    for (let i = 0; i < R; i++) {
      const xs = normal.random({ mean: 50, sd: sigma }, rng, labels.length);
      const w = capability(xs, { ...limits, subgroups: labels, alpha: 0.1 }).within!;
      expect(w.dof).toBe(5);
      const cp = byName(w.indices, 'Cp');
      if (cp.lower <= trueCp && trueCp <= cp.upper) covered++;
    }
    const se = Math.sqrt((0.9 * 0.1) / R);
    expect(Math.abs(covered / R - 0.9)).toBeLessThan(4 * se);
  });
});
