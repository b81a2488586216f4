/**
 * Parameter-free A² decisions, checked sample by sample, which explain two cells of
 * docs/size-study.md as Monte Carlo error.
 *
 * The Weibull A² decision below n = 100 is a parametric bootstrap that refits every replicate. With
 * maximum-likelihood estimates the statistic is parameter-free (ln x is location-scale: D'Agostino &
 * Stephens 1986, ch. 4, extreme-value case), and Plumbline draws Weibull values by inversion,
 * x = λ·E^(1/k) with E = -ln U, so the same random streams give the same ln x up to an affine map
 * whatever (k, λ). The whole decision (observed A² and every replicate's A²) is then the same
 * function of the uniform draws for every true shape: a size that differs between shape cells of
 * docs/size-study.md (6.45 % at shape 3.5, n = 10, R = 2000) can only be Monte Carlo error.
 */
import { describe, expect, it } from 'vitest';
import { analyze, createRng, evaluateFamilies, getFamily } from '../../core/index.js';

describe('Weibull A² bootstrap: the same decision for every true shape on the same random streams', () => {
  it('n = 10, B = 99: A², bootstrap p and decision agree sample by sample for shapes 0.8 and 3.5 (300 samples)', () => {
    let rejected = 0;
    for (let i = 0; i < 300; i++) {
      const run = (shape: number) => {
        const xs = getFamily('weibull').random({ shape, scale: 4 }, createRng(20261204, i), 10);
        const ad = analyze(xs, { families: ['weibull'], pMethod: 'bootstrap', bootstrapReplicates: 99, seed: 1000 + i }).candidates[0]?.andersonDarling;
        if (!ad) throw new Error('no Weibull fit');
        return ad;
      };
      const a = run(0.8);
      const b = run(3.5);
      expect(a.method).toBe('bootstrap');
      // A² agrees to rounding (the fit stops at relative 1e-10); the counts, hence p, exactly.
      expect(Math.abs(a.statistic - b.statistic)).toBeLessThan(1e-7 * a.statistic);
      expect(b.pValue, `sample ${i}`).toBe(a.pValue);
      expect(b.failedReplicates ?? 0).toBe(a.failedReplicates ?? 0);
      if (a.rejected) rejected++;
    }
    expect(rejected).toBeGreaterThan(0); // the check covers rejections too
  });
});

describe('lognormal A² table decision: the normal test of ln x, sample by sample', () => {
  it('n = 20: on 2000 lognormal samples the table p of the lognormal fit equals the normal table p of ln x (to 1e-12)', () => {
    // D'Agostino & Stephens (1986), Table 4.9 is applied to ln x; its size is parameter-free, so the
    // lognormal cells of docs/size-study.md measure the same size as the normal ones (5.03 % at
    // n = 20 on 100,000 samples, scripts/size-study-tables.ts): a lognormal cell's 5.61 % is
    // Monte Carlo error of its own 10,000 streams, not a lognormal-specific defect.
    let rejected = 0;
    for (let i = 0; i < 2000; i++) {
      const xs = getFamily('lognormal').random({ meanlog: 1, sdlog: 0.5 }, createRng(20261204 + 1020, i), 20);
      const [ln] = evaluateFamilies(xs, ['lognormal']);
      const [no] = evaluateFamilies(Float64Array.from(xs, Math.log), ['normal']);
      if (!ln?.ok || !no?.ok || !ln.table || !no.table) throw new Error('fit');
      expect(Math.abs(ln.table.pValue - no.table.pValue)).toBeLessThan(1e-12);
      if (ln.table.pValue < 0.05) rejected++;
    }
    expect(rejected).toBeGreaterThan(0);
  });
});
