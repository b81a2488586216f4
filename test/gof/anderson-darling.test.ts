import { describe, expect, it } from 'vitest';
import { createRng, getFamily, prepareSample, type FamilyName } from '../../core/index.js';
import { andersonDarlingStatistic, type LogCdfSf } from '../../core/gof/index.js';
import type { Distribution } from '../../core/families/types.js';
import { fixture, rel } from './fixture.js';

// A² for D1 at each model's MLE, shared/references.md (SciPy), printed to 5 decimals.
const PUBLISHED_A2: Partial<Record<FamilyName, number>> = {
  normal: 0.61625,
  lognormal: 0.17836,
  gamma: 0.28443,
  weibull: 0.53535,
  exponential: 4.12317,
};

describe('Anderson–Darling A²', () => {
  const sample = prepareSample(fixture.D1.values);

  it('D1 at our own MLE of each model matches the references.md table to the printed digits', () => {
    expect(Object.keys(PUBLISHED_A2)).toHaveLength(5);
    for (const [f, a2] of Object.entries(PUBLISHED_A2) as [FamilyName, number][]) {
      const fam = getFamily(f);
      const fit = fam.fit(sample);
      if (!fit.ok) throw new Error(f);
      expect(Math.abs(andersonDarlingStatistic(fam.make(fit.parameters), sample.sorted) - a2), f).toBeLessThanOrEqual(0.5e-5);
    }
  });

  it('D1 at the tightly solved MLE matches 50-digit mpmath (scripts/fixtures/gof.py) to 1e-10 relative', () => {
    for (const [f, ref] of Object.entries(fixture.D1.models)) {
      const a2 = andersonDarlingStatistic(getFamily(f as FamilyName).make(ref.parameters), sample.sorted);
      expect(rel(a2, ref.a2), f).toBeLessThan(1e-10);
    }
  });

  it('normal with the n - 1 sd: 0.60668 (references.md) and mpmath', () => {
    const m = fixture.D1.models['normal']?.parameters;
    if (!m) throw new Error('fixture');
    const sd1 = (m['sd'] as number) * Math.sqrt(20 / 19);
    const a2 = andersonDarlingStatistic(getFamily('normal').make({ mean: m['mean'] as number, sd: sd1 }), sample.sorted);
    expect(a2).toBeCloseTo(0.60668, 5);
    expect(rel(a2, fixture.D1.normalA2WithNMinus1Sd)).toBeLessThan(1e-10);
  });

  it('keeps far-tail observations where 1 - F rounds to 0 (mpmath reference)', () => {
    for (const t of fixture.tails) {
      const dist = getFamily(t.family as FamilyName).make(t.parameters);
      const last = t.values[t.values.length - 1] as number;
      expect(1 - dist.cdf(last)).toBe(0); // the naive form would give ln 0 = -Infinity here
      const a2 = andersonDarlingStatistic(dist, t.values);
      expect(rel(a2, t.a2), t.family).toBeLessThan(1e-12);
    }
  });

  it('past one batch chunk (n = 5,001): the batch form gives, bit for bit, the sum of the definition\'s terms in order', () => {
    // The statistic adds the terms chunk by chunk (2048 points) with a compensated sum carried across
    // chunks; the straightforward form is one call of logCdf/logSf per point with the same sum. The
    // per-point functions are checked against SciPy above; here the chunked path must equal them.
    const x = prepareSample(getFamily('gamma').random({ shape: 3, scale: 2 }, createRng(20261205, 1), 5001));
    const n = x.n;
    for (const f of ['normal', 'lognormal', 'gamma', 'weibull', 'exponential'] as FamilyName[]) {
      const fit = getFamily(f).fit(x);
      if (!fit.ok) throw new Error(f);
      const dist: Distribution & LogCdfSf = getFamily(f).make(fit.parameters);
      let s = 0;
      let c = 0;
      for (let i = 1; i <= n; i++) {
        const v = x.sorted[i - 1] as number;
        const term = (2 * i - 1) * dist.logCdf(v) + (2 * (n - i) + 1) * dist.logSf(v);
        const t = s + term;
        if (Math.abs(s) >= Math.abs(term)) c += s - t + term;
        else c += term - t + s;
        s = t;
      }
      const plain = -n - (s + c) / n;
      expect(andersonDarlingStatistic(dist, x.sorted), f).toBe(plain);
      const logs = x.logs();
      if (dist.logCdfSfFromLogsInto && logs) expect(andersonDarlingStatistic(dist, x.sorted, logs), `${f} from ln x`).toBe(plain);
    }
  });

  it('seeded n = 500 samples at fixed parameters match SciPy logcdf/logsf to 1e-10 relative', () => {
    for (const s of fixture.samples) {
      const a2 = andersonDarlingStatistic(getFamily(s.family as FamilyName).make(s.parameters), s.values);
      expect(rel(a2, s.a2), s.family).toBeLessThan(1e-10);
    }
  });
});
