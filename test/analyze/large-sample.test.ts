/**
 * The memory-saving paths of prepareSample for very large samples give the same report as the
 * ordinary path: ln x visited block by block instead of cached (past LOG_CACHE_MAX_N values; here
 * forced at a small n with the logCacheMaxN seam), and a caller's Float64Array sorted in place
 * instead of copied. The ordinary path's fits and statistics are themselves checked against SciPy
 * in test/families and test/gof; here the reference is that path.
 */
import { describe, expect, it } from 'vitest';
import { analyze, createRng, LOG_CACHE_MAX_N, prepareSample, sampleSummary } from '../../core/index.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

function gammaValues(n: number, seed: number): Float64Array {
  const rng = createRng(seed);
  return Float64Array.from({ length: n }, () => 12.5 * rng.gamma(4));
}

describe('ln x by blocks equals the cached ln x', () => {
  it('the cache limit is what the memory budget assumes (2^24 values)', () => {
    expect(LOG_CACHE_MAX_N).toBe(2 ** 24);
  });

  it('Σ ln x and every block in order, across block edges (n = 150,001)', () => {
    const v = gammaValues(150_001, 31);
    const cached = prepareSample(v);
    const blocks = prepareSample(v, { logCacheMaxN: 1000 });
    expect(blocks.logs()).toBeNull();
    expect(blocks.sumLog()).toBe(cached.sumLog()); // the same Neumaier sum, the same order: bit for bit
    const logs = cached.logs() as Float64Array;
    let seen = 0;
    blocks.logBlocks((block, start) => {
      expect(start).toBe(seen);
      for (let i = 0; i < block.length; i++) if (block[i] !== logs[start + i]) throw new Error(`ln x differs at ${start + i}`);
      seen += block.length;
    });
    expect(seen).toBe(v.length);
  });

  it('five families: the same fits, log-likelihoods, A² and p-values (n = 150,001)', () => {
    const v = gammaValues(150_001, 32);
    const a = analyze(prepareSample(v));
    const b = analyze(prepareSample(v, { logCacheMaxN: 1000 }));
    expect(b.candidates.map((c) => c.family)).toEqual(a.candidates.map((c) => c.family));
    for (const [i, ca] of a.candidates.entries()) {
      const cb = b.candidates[i]!;
      for (const [k, x] of Object.entries(ca.parameters)) expect(rel(cb.parameters[k] as number, x), `${ca.family} ${k}`).toBe(0);
      expect(rel(cb.logLikelihood, ca.logLikelihood), `${ca.family} ln L`).toBe(0);
      // A² without the cached logs goes through logCdfSfInto on x instead of ln x: last-digit differences.
      expect(rel(cb.andersonDarling.statistic, ca.andersonDarling.statistic), `${ca.family} A²`).toBeLessThan(1e-9);
      if (ca.andersonDarling.pValue !== null) expect(rel(cb.andersonDarling.pValue as number, ca.andersonDarling.pValue), `${ca.family} p`).toBeLessThan(1e-6);
    }
  });

  it('refuses ln x when a value is not positive', () => {
    const s = prepareSample(Float64Array.from([0, 1, 2]), { logCacheMaxN: 1 });
    expect(() => s.logBlocks(() => {})).toThrow(/every value > 0/);
    expect(Number.isNaN(s.sumLog())).toBe(true);
  });
});

describe('sorting a caller’s array in place', () => {
  it('sorts the given array itself and summarises it as the copying path does', () => {
    const v = gammaValues(20_000, 33);
    const copy = Float64Array.from(v);
    const ordinary = prepareSample(copy);
    const inPlace = prepareSample(v, { inPlace: true });
    expect(inPlace.sorted).toBe(v); // no copy
    expect(Array.from(v)).toEqual(Array.from(ordinary.sorted));
    expect([inPlace.sum, inPlace.mean, inPlace.sumSqDev, inPlace.distinct]).toEqual([ordinary.sum, ordinary.mean, ordinary.sumSqDev, ordinary.distinct]);
  });

  it('names a non-finite value by its place, as the copying path does', () => {
    const v = Float64Array.from([1, 2, Number.NaN, 4]);
    expect(() => prepareSample(v, { inPlace: true })).toThrow(/Value #3 is not a finite number/);
    expect(() => prepareSample(Float64Array.from(v))).toThrow(/Value #3 is not a finite number/);
  });
});

describe('a sample handed to another thread (cli/second-thread.ts)', () => {
  it('rebuilt from the sorted values, their summary and their ln x: the same sample and the same report', () => {
    const v = gammaValues(30_001, 34);
    const own = prepareSample(v);
    const logs = own.logs() as Float64Array;
    const rebuilt = prepareSample(own.sorted, { alreadySorted: true, summary: sampleSummary(own), logs });
    expect(rebuilt.logs()).toBe(logs); // the given array, not a new pass
    const fields = (s: typeof own): unknown[] => [s.n, s.min, s.max, s.sum, s.mean, s.sumSqDev, s.nonPositive, s.negative, s.zeros, s.distinct, s.sumLog()];
    expect(fields(rebuilt)).toEqual(fields(own));
    // Without ln x the rebuilt sample visits them block by block, with the same Σ ln x.
    const noLogs = prepareSample(own.sorted, { alreadySorted: true, summary: sampleSummary(own), logCacheMaxN: 0 });
    expect(noLogs.logs()).toBeNull();
    expect(noLogs.sumLog()).toBe(own.sumLog());
    expect(JSON.stringify(analyze(rebuilt))).toBe(JSON.stringify(analyze(prepareSample(v))));
  });

  it('ln x kept in the radix sort\'s scratch: each equals Math.log of its sorted value (n = 70,000, values on shared memory too)', () => {
    const v = gammaValues(70_000, 35);
    const shared = new Float64Array(new SharedArrayBuffer(v.length * 8));
    shared.set(v);
    for (const s of [prepareSample(v), prepareSample(Float64Array.from(v), { inPlace: true }), prepareSample(shared, { inPlace: true })]) {
      const logs = s.logs() as Float64Array;
      expect(logs.length).toBe(v.length);
      for (let i = 0; i < logs.length; i++) if (logs[i] !== Math.log(s.sorted[i] as number)) throw new Error(`ln x differs at ${i}`);
    }
  });
});
