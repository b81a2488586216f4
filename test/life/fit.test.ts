import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { getFamily } from '../../core/families/index.js';
import { prepareSample } from '../../core/sample.js';
import { censoredLogLikelihood, fitCensored, prepareLifeData, LIFE_FAMILIES, type LifeFamilyName } from '../../core/life/index.js';
import { expectReferenceFit, readFixture, rel } from '../helpers/fixtures.js';

// Fixture: scripts/fixtures/life.py (SciPy 1.17.1 CensoredData fits refined by mpmath score roots).
const fx = readFixture('life.json');

describe('censored maximum likelihood', () => {
  const nist = prepareLifeData({ times: fx.nist.times, failed: fx.nist.failed });

  it('NIST e-Handbook §8.4.1.3: Weibull shape 1.7208, scale 606.53', () => {
    // references.md: NIST §8.4.1.3 example, SciPy CensoredData 1.7208 / 606.53 (page: 1.7207 / 606.5280).
    const f = fitCensored('weibull', nist);
    expect(f.ok).toBe(true);
    if (!f.ok) return;
    expect(f.parameters.shape).toBeCloseTo(1.7208, 4);
    expect(f.parameters.scale).toBeCloseTo(606.53, 2);
    expect(nist.n).toBe(20);
    expect(nist.failures).toBe(10);
    expect(nist.suspensions).toBe(10);
  });

  for (const set of ['nist', 'simulated'] as const) {
    for (const fam of LIFE_FAMILIES) {
      it(`${set}: ${fam} matches the tightly solved SciPy/mpmath reference`, () => {
        // Fixture life.py: mpmath root of the censored score equations (≤ 1e-8 relative, DEVELOPERS.md);
        // SciPy's own fit is compared at 1e-5 (the tolerance its optimiser reached here).
        const ref = fx[set].fits[fam];
        const data = prepareLifeData({ times: fx[set].times, failed: fx[set].failed });
        expectReferenceFit(fitCensored(fam, data), ref);
      });
    }
  }

  it('censoring nothing reproduces the complete-data fit (property)', () => {
    // Property (issue 4): with no suspensions the censored likelihood is the complete one.
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0.5, max: 50, noNaN: true }), { minLength: 5, maxLength: 30 }),
        fc.constantFrom(...LIFE_FAMILIES),
        (xs, fam: LifeFamilyName) => {
          if (new Set(xs).size < 3) return true;
          const data = prepareLifeData({ times: xs, failed: xs.map(() => 1) });
          const c = fitCensored(fam, data);
          const u = getFamily(fam).fit(prepareSample(xs));
          expect(c.ok && u.ok).toBe(true);
          if (!c.ok || !u.ok) return false;
          expect(Math.abs(c.logLikelihood - u.logLikelihood)).toBeLessThan(1e-8 * Math.max(1, Math.abs(u.logLikelihood)));
          for (const [k, v] of Object.entries(u.parameters)) expect(rel(c.parameters[k] as number, v)).toBeLessThan(1e-6);
          return true;
        },
      ),
      { numRuns: 60, seed: 4 },
    );
  });

  it('rejects bad status values and non-positive times with typed errors', () => {
    // Common practice, no source: status must be 0/1; life times must be > 0.
    expect(() => prepareLifeData({ times: [1, 2], failed: [1, 2] })).toThrow(/status/);
    expect(() => prepareLifeData({ times: [0, 2], failed: [1, 1] })).toThrow(/> 0/);
    expect(() => prepareLifeData({ times: [1, 2], failed: [1] })).toThrow(/entries/);
  });

  it('grouping tied (time, status) pairs leaves the log-likelihood unchanged', () => {
    // Σ ln f over failures + Σ ln S over suspensions summed unit by unit (Lawless 2003 §2.2).
    const d = prepareLifeData({ times: fx.nist.times, failed: fx.nist.failed });
    expect(d.groups.times.length).toBe(11); // 10 distinct failures + one group of 10 suspensions at 500 h
    const dist = getFamily('gamma').make({ shape: 2.1, scale: 270 });
    let direct = 0;
    fx.nist.times.forEach((t: number, i: number) => (direct += fx.nist.failed[i] ? dist.logPdf(t) : dist.logSf(t)));
    expect(censoredLogLikelihood(dist, d)).toBeCloseTo(direct, 11);
  });
});
