/**
 * The bootstrap memo (core/gof/bootstrap-memo.ts) reuses replicate statistics only where they
 * cannot differ: families whose A² and X² null distributions are parameter-free (David & Johnson
 * 1948 [from memory]; the reason the published A² tables exist), drawn from the same streams.
 */
import { describe, expect, it } from 'vitest';
import { clearReplicateMemo, parameterFreeKey } from '../../core/gof/bootstrap-memo.js';
import { replicateStatistics, runBootstrapRange, type BootstrapJob } from '../../core/gof/index.js';
import { getFamily, type FamilyName, type Parameters } from '../../core/index.js';

const CASES: readonly [FamilyName, Parameters, Parameters][] = [
  ['normal', { mean: 10, sd: 2 }, { mean: -3e4, sd: 5e3 }],
  ['lognormal', { meanlog: 1, sdlog: 0.5 }, { meanlog: -7, sdlog: 2.5 }],
  ['exponential', { rate: 0.5 }, { rate: 3e3 }],
  ['weibull', { shape: 1.5, scale: 4 }, { shape: 0.6, scale: 2e5 }],
  ['gumbel', { location: 100, scale: 20 }, { location: -2, scale: 0.01 }],
];

describe('replicate statistics of parameter-free families do not depend on the parameters', () => {
  for (const [family, a, b] of CASES) {
    it(`${family}: 200 replicates at n = 37, k = 7: A²* equal to 1e-8, X²* exactly; counts with the memo equal fresh counts`, () => {
      const fam = getFamily(family);
      for (let i = 0; i < 200; i++) {
        const ra = replicateStatistics(fam, { parameters: a, n: 37, seed: 99 }, i, 7);
        const rb = replicateStatistics(fam, { parameters: b, n: 37, seed: 99 }, i, 7);
        expect(Math.abs(ra.a2 - rb.a2), `replicate ${i}`).toBeLessThanOrEqual(1e-8 * ra.a2);
        expect(rb.x2, `replicate ${i}`).toBe(ra.x2);
      }
      const job = (parameters: Parameters, observed: number, x2: number): BootstrapJob => ({
        family, parameters, n: 37, observed, seed: 7, start: 0, end: 199, chiSquare: { observed: x2, k: 7 },
      });
      // An attainable X² (replicate 0's), so that ties with the observed value occur and are compared too.
      const x2 = replicateStatistics(fam, { parameters: b, n: 37, seed: 7 }, 0, 7).x2;
      clearReplicateMemo();
      runBootstrapRange(job(a, 0.5, x2)); // fills the memo at the first parameters
      const recalled = runBootstrapRange(job(b, 0.6, x2));
      clearReplicateMemo();
      const fresh = runBootstrapRange(job(b, 0.6, x2));
      expect(recalled).toEqual(fresh);
      expect(fresh.exceed).toBeGreaterThan(0);
      expect(fresh.chiSquareTies).toBeGreaterThan(0);
    });
  }

  it('gamma (shape matters), and a cancelled range, are never remembered', () => {
    expect(parameterFreeKey({ family: 'gamma', n: 20, seed: 1, start: 0, end: 99 }, 4)).toBeNull();
    expect(parameterFreeKey({ family: 'weibull', n: 20, seed: 1, start: 0, end: 99 }, 4)).not.toBeNull();
    clearReplicateMemo();
    const job: BootstrapJob = { family: 'normal', parameters: { mean: 0, sd: 1 }, n: 20, observed: 0.5, seed: 3, start: 0, end: 99 };
    let calls = 0;
    const signal = { get aborted() { return ++calls > 10; } };
    const cut = runBootstrapRange(job, { signal });
    expect(cut.cancelled).toBe(true);
    expect(cut.completed).toBe(10);
    const whole = runBootstrapRange(job);
    expect(whole.completed).toBe(99);
    expect(whole.cancelled).toBe(false);
  });
});

describe('a chi-square-only job (A² decided by its table) skips A²* and counts the same X²*', () => {
  it('gamma n = 50, k = 8, B = 199: chi-square counts, refits and failures equal the full job; exceed is 0', () => {
    // Same replicate streams, same refits (core/gof/bootstrap.ts replicateStatistics); no outside source needed: an identity of the code path.
    const fam = getFamily('gamma');
    const parameters = { shape: 0.7, scale: 12 };
    const x2 = replicateStatistics(fam, { parameters, n: 50, seed: 11 }, 3, 8).x2;
    const base: BootstrapJob = { family: 'gamma', parameters, n: 50, observed: 0.4, seed: 11, start: 0, end: 199, chiSquare: { observed: x2, k: 8 } };
    const full = runBootstrapRange(base);
    const only = runBootstrapRange({ ...base, chiSquareOnly: true });
    expect(only.chiSquareExceed).toBe(full.chiSquareExceed);
    expect(only.chiSquareTies).toBe(full.chiSquareTies);
    expect(only.valid).toBe(full.valid);
    expect(only.failed).toBe(full.failed);
    expect(full.exceed).toBeGreaterThan(0);
    expect(only.exceed).toBe(0);
  });
});
