import { describe, expect, it } from 'vitest';
import { COVERAGE_SETUP, FAMILY_SETUPS, JOHNSON_SETUP, WEIBULL_SETUP, simulateOne } from '../../scripts/capability-coverage.js';
import { EXPONENTIAL_INTERVAL_WITHHELD, JOHNSON_INTERVAL_WITHHELD, fitModelSpec, intervalWithheld, makeModel, percentileIntervals } from '../../core/capability/index.js';
import { createRng } from '../../core/random/index.js';
import { readFixture } from '../helpers/fixtures.js';

// The committed seeded simulation (scripts/capability-coverage.ts → test/fixtures/capability-coverage.json):
// 1000 simulated samples per n, each with the report's 999-replicate BCa interval (expanded levels).
const fx = readFixture('capability-coverage.json');

describe('coverage of the capability bootstrap interval (committed simulation)', () => {
  it('the committed setup is the script\'s (nominal 95 %, 999 replicates, 1000 samples) and covers n = 50 and 125', () => {
    expect(fx.setup).toEqual(JSON.parse(JSON.stringify(COVERAGE_SETUP)));
    expect(fx.setup.alpha).toBe(0.05);
    expect(fx.setup.replicates).toBe(999);
    expect(fx.results.map((r: { n: number }) => r.n)).toEqual(expect.arrayContaining([50, 125]));
  });
  for (const r of fx.results as { n: number; coverage: Record<string, { covered: number; simulations: number; coverage: number; standardError: number }> }[]) {
    it(`n = ${r.n}: coverage of Pp, Ppk, Ppu, Ppl within 1.5 points of 95 % (Monte Carlo se about 0.7 point)`, () => {
      expect(Object.keys(r.coverage).sort()).toEqual(['Pp', 'Ppk', 'Ppl', 'Ppu']);
      for (const c of Object.values(r.coverage)) {
        expect(c.simulations).toBe(1000);
        expect(c.coverage).toBeCloseTo(c.covered / c.simulations, 12);
        expect(Math.abs(c.coverage - 0.95)).toBeLessThanOrEqual(0.015);
        expect(c.standardError).toBeCloseTo(Math.sqrt((c.coverage * (1 - c.coverage)) / 1000), 12);
      }
    });
  }
  it('the committed numbers come from the committed code: the first simulated sample at n = 50 is reproduced exactly', () => {
    const r50 = fx.results.find((r: { n: number }) => r.n === 50);
    const again = simulateOne(50, 0);
    expect(again).toEqual(r50.firstSamples[0]);
  });
});

// The percentile method on a fitted family, as the report gives it without a transformation
// (scripts/capability-coverage.ts --weibull → test/fixtures/capability-coverage-weibull.json): a Weibull
// process (shape 2, scale 1), each sample and replicate refitted as a Weibull by maximum likelihood.
// Committed: n = 50 94.9/95.2/95.0/95.1 %, n = 125 95.7/95.8/95.8/95.2 % (Pp/Ppk/Ppu/Ppl; se about 0.7 point).
const wx = readFixture('capability-coverage-weibull.json');

describe('coverage of the interval under a fitted family (committed simulation, Weibull)', () => {
  it('the committed setup is the script\'s and the first sample at n = 50 is reproduced exactly', () => {
    expect(wx.setup).toEqual(JSON.parse(JSON.stringify(WEIBULL_SETUP)));
    expect(wx.results.map((r: { n: number }) => r.n)).toEqual([50, 125]);
    const r50 = wx.results.find((r: { n: number }) => r.n === 50);
    expect(simulateOne(50, 0, WEIBULL_SETUP)).toEqual(r50.firstSamples[0]);
  });
  for (const r of wx.results as { n: number; coverage: Record<string, { covered: number; simulations: number; coverage: number }> }[]) {
    it(`n = ${r.n}: Pp, Ppk, Ppu, Ppl each within 1.5 points of 95 %`, () => {
      expect(Object.keys(r.coverage).sort()).toEqual(['Pp', 'Ppk', 'Ppl', 'Ppu']);
      for (const c of Object.values(r.coverage)) {
        expect(c.simulations).toBe(1000);
        expect(c.coverage).toBeCloseTo(c.covered / c.simulations, 12);
        expect(Math.abs(c.coverage - 0.95)).toBeLessThanOrEqual(0.015);
      }
    });
  }
});

// The other fitted families the percentile method can use (scripts/capability-coverage.ts --gamma,
// --lognormal, --exponential → test/fixtures/capability-coverage-families.json; 1000 samples × 999
// replicates, nominal 95 %, se about 0.7 point). Committed: gamma n = 50 95.2/95.3/95.5/95.1,
// n = 125 94.2/96.4/93.9/95.5 (Pp/Ppk/Ppu/Ppl): within 1.5 points; lognormal n = 50 94.8/96.6/94.9/96.0,
// n = 125 95.5/96.5/95.2/95.7: Ppk over-covers by 1.5-1.6 points (wide, the conservative side; reported,
// offered); exponential n = 50 96.0/89.5/96.0/96.4, n = 125 95.2/90.1/95.2/95.5: Ppk under-covers with
// the truth below the lower end in 8.1 and 7.0 % of samples, so with both limits it is withheld.
const fam = readFixture('capability-coverage-families.json');
type Cov = Record<string, { covered: number; simulations: number; coverage: number; truthBelowLower: number; truthAboveUpper: number }>;
const cov = (f: string, n: number): Cov => fam.setups[f].results.find((r: { n: number }) => r.n === n).coverage;

describe('coverage of the interval under the other fitted families (committed simulation)', () => {
  it('the committed setups are the script\'s, and the first sample of each at n = 50 is reproduced exactly', () => {
    for (const f of ['gamma', 'lognormal', 'exponential'] as const) {
      expect(fam.setups[f].setup).toEqual(JSON.parse(JSON.stringify(FAMILY_SETUPS[f])));
      expect(fam.setups[f].results.map((r: { n: number }) => r.n)).toEqual([50, 125]);
      expect(simulateOne(50, 0, FAMILY_SETUPS[f])).toEqual(fam.setups[f].results[0].firstSamples[0]);
    }
  });
  it('each count is consistent: covered + misses below + misses above = 1000 samples', () => {
    for (const f of ['gamma', 'lognormal', 'exponential']) for (const n of [50, 125]) for (const c of Object.values(cov(f, n))) {
      expect(c.simulations).toBe(1000);
      expect(c.covered + c.truthBelowLower + c.truthAboveUpper).toBe(1000);
    }
  });
  it('gamma: every index within 1.5 points of 95 % at n = 50 and 125', () => {
    for (const n of [50, 125]) for (const c of Object.values(cov('gamma', n))) expect(Math.abs(c.coverage - 0.95)).toBeLessThanOrEqual(0.015 + 1e-12);
  });
  it('lognormal: Pp, Ppu, Ppl within 1.5 points; Ppk over-covers (96.6 and 96.5 %), its misses below the lower end at most 1.8 % (the conservative side)', () => {
    for (const n of [50, 125]) {
      const c = cov('lognormal', n);
      for (const k of ['Pp', 'Ppu', 'Ppl']) expect(Math.abs(c[k]!.coverage - 0.95)).toBeLessThanOrEqual(0.015);
      expect(c['Ppk']!.coverage).toBeGreaterThan(0.95);
      expect(c['Ppk']!.truthBelowLower / 1000).toBeLessThanOrEqual(0.025);
    }
    expect(cov('lognormal', 50)['Ppk']!.coverage).toBeCloseTo(0.966, 3);
  });
  it('exponential with both limits: Ppk under-covers on the side that overstates capability, so its interval is withheld (the note quotes these numbers); Ppu, the one-sided case, covers', () => {
    const c50 = cov('exponential', 50);
    const c125 = cov('exponential', 125);
    expect([c50['Ppk']!.coverage, c125['Ppk']!.coverage]).toEqual([0.895, 0.901]);
    expect([c50['Ppk']!.truthBelowLower, c125['Ppk']!.truthBelowLower]).toEqual([81, 70]);
    expect(EXPONENTIAL_INTERVAL_WITHHELD).toContain('covered 89.5 and 90.1 % instead of 95 %, with the true Ppk below the lower end in 8.1 and 7.0 % of samples');
    for (const c of [c50, c125]) expect(Math.abs(c['Ppu']!.coverage - 0.95)).toBeLessThanOrEqual(0.015);
    const spec = { kind: 'family' as const, family: 'exponential' as const, parameters: { rate: 1 } };
    expect(intervalWithheld(spec, { lsl: 0.0005, usl: 7.5 })).toBe(EXPONENTIAL_INTERVAL_WITHHELD);
    expect(intervalWithheld(spec, { lsl: null, usl: 7.5 })).toBeNull();
    const x = makeModel(spec).draw(createRng(1, 0), 40).sort();
    expect(percentileIntervals(spec, x, { lsl: 0.0005, usl: 7.5 }, 0.05, 1, 99).note).toBe(EXPONENTIAL_INTERVAL_WITHHELD);
    expect(percentileIntervals(spec, x, { lsl: null, usl: 7.5 }, 0.05, 1, 99).intervals).not.toBeNull();
  });
});

// The Johnson setup (scripts/capability-coverage.ts --johnson → test/fixtures/capability-coverage-johnson.json):
// what the report's interval would be under a Johnson curve (the report withholds it: see below).
// At n = 125 it is within 1.5 points; at n = 50 it over-covers by up to 2.8 points. The two-sided
// rate is a mixture (see the variants below): samples fitted as SU over-cover, samples fitted as SB
// have a lower end that is too high.
const jx = readFixture('capability-coverage-johnson.json');

describe('coverage with the Johnson curve (committed simulation, reported)', () => {
  it('the committed setup is the script\'s and the first sample at n = 125 is reproduced exactly', () => {
    expect(jx.setup).toEqual(JSON.parse(JSON.stringify(JOHNSON_SETUP)));
    const r125 = jx.results.find((r: { n: number }) => r.n === 125);
    expect(simulateOne(125, 0, JOHNSON_SETUP)).toEqual(r125.firstSamples[0]);
  });
  it('n = 125 within 1.5 points of 95 %; at n = 50 three of the four indices are more than 1.5 points off (why the interval is withheld)', () => {
    for (const r of jx.results as { n: number; coverage: Record<string, { coverage: number; simulations: number }> }[]) {
      const off = Object.values(r.coverage).filter((c) => Math.abs(c.coverage - 0.95) > 0.015);
      for (const c of Object.values(r.coverage)) expect(c.simulations).toBe(1000);
      expect(off).toHaveLength(r.n === 50 ? 3 : 0);
    }
  });
});

// Why (scripts/capability-coverage-variants.ts → test/fixtures/capability-coverage-johnson-variants.json):
// the same 1000 samples × 999 replicates per n, several interval rules from the same replicates, and
// the report's rule split by the Johnson type fitted to each sample.
const vx = readFixture('capability-coverage-johnson-variants.json');
type Cell = { samples: number; coverage: number; truthBelow: number };
type VariantRun = { n: number; samples: number; coverage: Record<string, Record<string, number>>; truthBelowInterval: Record<string, Record<string, number>>; reportBySampleType: Record<string, Record<string, Cell>> };

describe('Johnson interval coverage by rule and by fitted type (committed diagnostic run)', () => {
  it('its report rule is the committed coverage run: the same rates at n = 50 and 125 (same seeds, same code path)', () => {
    expect(vx.setup).toEqual({ ...JSON.parse(JSON.stringify(JOHNSON_SETUP)), simulations: 1000, replicates: 999 });
    for (const r of vx.results as VariantRun[]) {
      const committed = jx.results.find((x: { n: number }) => x.n === r.n);
      expect(r.samples).toBe(1000);
      for (const [k, c] of Object.entries(committed.coverage as Record<string, { coverage: number }>)) expect(r.coverage.report![k]).toBeCloseTo(100 * c.coverage, 9);
    }
  });
  it('the cause: samples fitted SU over-cover (at least 98.5 %), samples fitted SB have the truth below the interval in 5.8-18.8 % (nominal 2.5 %)', () => {
    const sb: number[] = [];
    for (const r of vx.results as VariantRun[]) {
      for (const c of Object.values(r.reportBySampleType.SU!)) expect(c.coverage).toBeGreaterThanOrEqual(98.5);
      for (const c of Object.values(r.reportBySampleType.SB!)) {
        expect(c.samples).toBeGreaterThanOrEqual(300);
        sb.push(c.truthBelow);
      }
    }
    expect(Math.min(...sb)).toBe(5.8);
    expect(Math.max(...sb)).toBe(18.8);
  });
  it('not the rule: without expansion, acceleration or bias correction n = 50 still over-covers Pp by more than 1.5 points, except the plain percentile, which under-covers Ppu instead', () => {
    const r50 = (vx.results as VariantRun[]).find((r) => r.n === 50)!;
    for (const rule of ['bca', 'bc', 'bc-plain']) expect(r50.coverage[rule]!.Pp).toBeGreaterThan(96.5);
    expect(r50.coverage.percentile!.Ppu).toBeLessThan(95);
  });
  it('not fixed by resampling the data instead (nonparametric bootstrap): Ppk 3.4 points short at n = 125', () => {
    const r125 = (vx.results as VariantRun[]).find((r) => r.n === 125)!;
    expect(r125.coverage.nonparametric!.Ppk).toBe(91.6);
    expect(Math.abs(r125.coverage.nonparametric!.Ppk! - 95)).toBeGreaterThan(1.5);
  });
  it('the report\'s note quotes these numbers: SB fitted to 30-37 % of the samples, the truth below the lower end in 5.8-18.8 % of them', () => {
    const all = (vx.results as VariantRun[]).flatMap((r) => Object.values(r.coverage.report!));
    expect(Math.min(...all)).toBe(93.5);
    expect(Math.max(...all)).toBe(97.8);
    const sbShare = (vx.results as VariantRun[]).map((r) => r.reportBySampleType.SB!.Pp!.samples / r.samples);
    expect(Math.min(...sbShare)).toBeGreaterThanOrEqual(0.3);
    expect(Math.max(...sbShare)).toBeLessThanOrEqual(0.37);
    expect(JOHNSON_INTERVAL_WITHHELD).toMatch(/SB curve for 30-37 % of the samples.*5\.8-18\.8 % of cases instead of 2\.5 %/);
  });
});

// The calibration attempts (scripts/capability-coverage-calibration.ts → test/fixtures/capability-coverage-johnson-calibration.json),
// on the same seeded samples: smoothed resampling (1000 samples × 999 replicates per n) and a double
// bootstrap (500 samples × 299 outer × 99 inner per n, run as samples 0-199 and 200-499 and summed here).
const cx = readFixture('capability-coverage-johnson-calibration.json');
type CalibrationCell = { samples: number; coverage: number };
type CalibrationRun = { n: number; samples: number; setup: { firstSample: number }; rules: Record<string, Record<string, CalibrationCell>> };

/** Coverage per n, rule and index, parts of the same n and rule summed (counts from the printed shares, exact at 0.1 % of 200 or more samples). */
function calibrationCoverage(): Map<string, { covered: number; samples: number }> {
  const out = new Map<string, { covered: number; samples: number }>();
  for (const run of cx.runs as CalibrationRun[]) {
    for (const [rule, cells] of Object.entries(run.rules)) {
      for (const [k, c] of Object.entries(cells)) {
        const key = `${run.n} ${rule} ${k}`;
        const was = out.get(key) ?? { covered: 0, samples: 0 };
        out.set(key, { covered: was.covered + Math.round((c.coverage / 100) * c.samples), samples: was.samples + c.samples });
      }
    }
  }
  return out;
}

describe('no tried rule calibrates the Johnson interval (committed runs)', () => {
  const cov = calibrationCoverage();
  const rules = [...new Set([...cov.keys()].map((k) => k.split(' ')[1] as string))];
  it('the runs are of the committed Johnson setup, at n = 50 and 125, with the sample counts stated', () => {
    for (const run of cx.runs as (CalibrationRun & { setup: Record<string, unknown> })[]) {
      const { simulations, replicates: _b, firstSample: _first, ...rest } = run.setup;
      const { simulations: _m, replicates: _r, ...johnson } = JSON.parse(JSON.stringify(JOHNSON_SETUP));
      expect(rest).toEqual(johnson);
      expect(run.samples).toBe(simulations);
    }
    expect(rules.sort()).toEqual(['double-boot-t', 'double-calibrated', 'double-percentile', 'smoothed-0-bc', 'smoothed-0-bca', 'smoothed-0-percentile', 'smoothed-0.5-bc', 'smoothed-0.5-bca', 'smoothed-0.5-percentile', 'smoothed-1-bc', 'smoothed-1-bca', 'smoothed-1-percentile']);
    for (const [key, c] of cov) expect(c.samples, key).toBe(key.split(' ')[1]!.startsWith('double') ? 500 : 1000);
  });
  for (const rule of rules) {
    it(`${rule}: some index at n = 50 or 125 is more than 1.5 points from 95 %`, () => {
      const worst = Math.max(...[...cov].filter(([k]) => k.split(' ')[1] === rule).map(([, c]) => Math.abs(c.covered / c.samples - 0.95)));
      expect(worst).toBeGreaterThan(0.015);
    });
  }
});

describe('the report withholds the Johnson interval', () => {
  const x = makeModel(JOHNSON_SETUP.truth).draw(createRng(JOHNSON_SETUP.dataSeed, 0), 50).sort();
  const spec = fitModelSpec({ kind: 'johnson' }, x);
  it('percentileIntervals gives no interval under a Johnson curve, only the note, without running replicates', () => {
    expect(intervalWithheld(spec)).toBe(JOHNSON_INTERVAL_WITHHELD);
    // a replicate count far beyond the inline work bound would otherwise give the work note instead
    const r = percentileIntervals(spec, x, JOHNSON_SETUP.limits, 0.05, 1, 1e9);
    expect(r.intervals).toBeNull();
    expect(r.note).toBe(JOHNSON_INTERVAL_WITHHELD);
  });
  it('a Box–Cox model of the same sample keeps its interval', () => {
    const b = fitModelSpec({ kind: 'boxcox' }, x);
    expect(intervalWithheld(b)).toBeNull();
    expect(percentileIntervals(b, x, JOHNSON_SETUP.limits, 0.05, 1, 59).intervals?.length ?? 0).toBeGreaterThan(0);
  });
});
