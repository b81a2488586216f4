import { describe, expect, it } from 'vitest';
import { getFamily, prepareSample, createRng, type Distribution } from '../../core/index.js';
import { probabilityPlot } from '../../core/evidence/index.js';
import { relFloored as rel } from '../helpers/fixtures.js';


function dist(family: 'normal' | 'lognormal' | 'gamma' | 'weibull' | 'exponential', p: Record<string, number>): Distribution {
  return getFamily(family).make(p);
}

describe('probability plot coordinates', () => {
  it('exponential: -ln(1 - p) with Benard median ranks (i - 0.3)/(n + 0.4)', () => {
    // Hand-computable: n = 5, p_i = (i - 0.3)/5.4, y_i = -ln(1 - p_i). Values from
    // python3: -numpy.log1p(-(i-0.3)/5.4), i = 1..5 (Benard & Bos-Levenbach 1953 positions).
    const expected = [0.13883644485421578, 0.3780661339200499, 0.6931471805599453, 1.1557707025080581, 2.043073897508961];
    const data = [12, 40, 75, 130, 260];
    const s = prepareSample(data);
    const d = dist('exponential', { rate: 1 / 103.4 });
    const pp = probabilityPlot(d, s.sorted, s.logs(), 2000, 0.05);
    expect(pp.scale).toBe('exponential');
    expect(pp.xTransform).toBe('identity');
    expect(pp.plottingPosition.formula).toBe('(i - 0.3)/(n + 0.4)');
    expect(pp.points.x).toEqual(data);
    expect(pp.points.rank).toEqual([1, 2, 3, 4, 5]);
    pp.points.y.forEach((y, j) => expect(rel(y, expected[j] as number)).toBeLessThan(1e-14));
    // The fitted line of an exponential with mean 103.4: x = 103.4 · (-ln(1 - p)) (hand algebra).
    pp.fittedLine.x.forEach((x, j) => expect(rel(x, 103.4 * (expected[j] as number))).toBeLessThan(1e-12));
  });

  it('normal: Blom z = Φ⁻¹((i - 3/8)/(n + 1/4)) against x', () => {
    // SciPy 1.17.1: scipy.stats.norm.ppf((i - 0.375)/(10.25)), i = 1..10.
    const z = [-1.54663527139923, -1.0004905456193152, -0.6554235052344266, -0.3754617702355184, -0.12258084388880242, 0.12258084388880255, 0.3754617702355184, 0.6554235052344266, 1.0004905456193152, 1.54663527139923];
    const data = [9.1, 9.6, 9.8, 9.9, 10.0, 10.05, 10.2, 10.4, 10.7, 11.2];
    const s = prepareSample(data);
    const pp = probabilityPlot(dist('normal', { mean: 10, sd: 0.5 }), s.sorted, s.logs(), 2000, 0.05);
    expect(pp.plottingPosition.name).toBe('Blom');
    pp.points.y.forEach((y, j) => expect(Math.abs(y - (z[j] as number))).toBeLessThan(1e-12));
    // Fitted line x = mean + sd · z (hand algebra).
    pp.fittedLine.x.forEach((x, j) => expect(Math.abs(x - (10 + 0.5 * (z[j] as number)))).toBeLessThan(1e-12));
    // Ticks sit at their own z: Φ⁻¹(0.5) = 0, Φ⁻¹(0.9) = 1.2815515655446004 (SciPy norm.ppf(0.9)).
    const t50 = pp.probabilityTicks.find((t) => t.p === 0.5);
    const t90 = pp.probabilityTicks.find((t) => t.p === 0.9);
    expect(Math.abs(t50?.y ?? Number.NaN)).toBeLessThan(1e-15);
    expect(Math.abs((t90?.y ?? Number.NaN) - 1.2815515655446004)).toBeLessThan(1e-12);
  });

  it('Weibull: ln(-ln(1 - p)) against ln x, a straight line of slope 1/shape', () => {
    // python3: numpy.log(-numpy.log1p(-(i-0.3)/5.4)), i = 1..5 (median ranks).
    const expected = [-1.974458694379373, -0.9726861412053714, -0.36651292058166435, 0.1447673963435997, 0.7144554862576666];
    const data = [310, 560, 720, 980, 1400];
    const s = prepareSample(data);
    const shape = 2.2;
    const scale = 900;
    const pp = probabilityPlot(dist('weibull', { shape, scale }), s.sorted, s.logs(), 2000, 0.05);
    expect(pp.xTransform).toBe('ln');
    pp.points.x.forEach((x, j) => expect(rel(x, Math.log(data[j] as number))).toBeLessThan(1e-15));
    pp.points.y.forEach((y, j) => expect(Math.abs(y - (expected[j] as number))).toBeLessThan(1e-13));
    // Weibull quantile: ln Q(p) = ln(scale) + ln(-ln(1-p))/shape (hand algebra).
    pp.fittedLine.x.forEach((x, j) => expect(Math.abs(x - (Math.log(scale) + (expected[j] as number) / shape))).toBeLessThan(1e-12));
  });

  it('lognormal plots z against ln x; gamma is a Q–Q plot whose fitted line is y = x', () => {
    const data = [1.2, 2.5, 3.1, 4.4, 6.0, 9.5, 14.0];
    const s = prepareSample(data);
    const ln = probabilityPlot(dist('lognormal', { meanlog: 1.5, sdlog: 0.8 }), s.sorted, s.logs(), 2000, 0.05);
    expect(ln.scale).toBe('lognormal');
    // ln Q(p) = meanlog + sdlog·z (hand algebra): the fitted line is linear in the plotted z.
    ln.fittedLine.x.forEach((x, j) => expect(Math.abs(x - (1.5 + 0.8 * (ln.points.y[j] as number)))).toBeLessThan(1e-12));
    const g = probabilityPlot(dist('gamma', { shape: 2, scale: 3 }), s.sorted, s.logs(), 2000, 0.05);
    expect(g.scale).toBe('quantile-quantile');
    expect(g.probabilityTicks).toEqual([]);
    g.fittedLine.x.forEach((x, j) => expect(rel(x, g.points.y[j] as number)).toBeLessThan(1e-14));
    // The median point: Blom p_4 = 3.625/7.25 = 0.5 exactly; gamma(2, 3) median
    // (SciPy 1.17.1: scipy.stats.gamma.ppf(0.5, 2, scale=3) = 5.035040970049984).
    expect(rel(g.points.y[3] as number, 5.035040970049984)).toBeLessThan(1e-9);
  });

  it('the order-statistic band contains the fitted line at every plotted point (every family, n = 60 and thinned n = 20000)', () => {
    // Beta(i, n+1-i) quantiles at 2.5% and 97.5% bracket its median, and the Blom/Benard positions lie
    // inside (David & Nagaraja 2003 [from memory]); checked here for each family.
    const cases: [Parameters<typeof dist>[0], Record<string, number>][] = [
      ['normal', { mean: 5, sd: 2 }],
      ['lognormal', { meanlog: 0.3, sdlog: 0.6 }],
      ['gamma', { shape: 1.7, scale: 2 }],
      ['weibull', { shape: 1.3, scale: 4 }],
      ['exponential', { rate: 0.25 }],
    ];
    for (const n of [60, 20000]) {
      for (const [family, params] of cases) {
        const d = dist(family, params);
        const x = getFamily(family).random(params, createRng(7, n), n);
        const s = prepareSample(x);
        const pp = probabilityPlot(d, s.sorted, s.logs(), 500, 0.05);
        expect(pp.points.x.length).toBeLessThanOrEqual(500);
        // No rank was dropped from the line here, so line and band align index by index.
        expect(pp.fittedLine.y).toEqual(pp.band.y);
        pp.fittedLine.x.forEach((lx, j) => {
          const lo = pp.band.lower[j];
          const hi = pp.band.upper[j];
          expect(lo).not.toBeNull();
          expect(hi).not.toBeNull();
          expect(lo as number).toBeLessThanOrEqual(lx);
          expect(hi as number).toBeGreaterThanOrEqual(lx);
          expect(hi as number).toBeGreaterThan(lo as number);
        });
      }
    }
  });
});
