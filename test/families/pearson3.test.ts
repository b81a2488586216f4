/**
 * Pearson type III and log-Pearson type III against SciPy's `pearson3` (scipy.stats 1.17.1),
 * cross-checked with 60-digit mpmath incomplete gamma values (test/fixtures/pearson3.json from
 * scripts/fixtures/pearson3.py; the points where SciPy was off say "source": "mpmath").
 * Both tails, positive and negative skew (the sign trap: F = Q(α, x) for skew < 0).
 * Tolerances: DEVELOPERS.md policy, 1e-12 relative (1e-10 in far tails below 1e-20), plus
 * 16·cond·ε for the conditioning the fixture records with each point.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { getFamily } from '../../core/families/index.js';
import { LogPearson3Distribution } from '../../core/families/logpearson3.js';
import { productMoments } from '../../core/families/pearson3.js';
import { prepareSample } from '../../core/sample.js';
import { createRng } from '../../core/random/index.js';

interface Ref {
  value: number;
  source: string;
  cond: number;
}
interface Point {
  y: number;
  w: number;
  cdf?: Ref;
  sf?: Ref;
  logcdf?: Ref;
  logsf?: Ref;
  logpdf: Ref;
}
interface Quant {
  p: number;
  ppf: { value: number };
  isf: { value: number };
}
interface Fixture {
  sets: { parameters: { mean: number; sd: number; skew: number }; points: Point[]; quantiles: Quant[] }[];
}

const FIX = JSON.parse(readFileSync(new URL('../fixtures/pearson3.json', import.meta.url), 'utf8')) as Fixture;
const EPS = 2 ** -52;

function rel(a: number, b: number): number {
  return a === b ? 0 : Math.abs(a - b) / Math.abs(b);
}
function tol(value: number, cond: number): number {
  return (Math.abs(value) < 1e-20 ? 1e-10 : 1e-12) + 16 * cond * EPS;
}

const P3 = getFamily('pearson3');

describe('Pearson III distribution functions vs SciPy pearson3 / mpmath, both tails', () => {
  it('the fixture covers negative skews and far tails', () => {
    expect(FIX.sets.filter((s) => s.parameters.skew < 0).length).toBeGreaterThanOrEqual(4);
    const tiny = FIX.sets.flatMap((s) => s.points).filter((p) => p.cdf && p.cdf.value < 1e-100);
    expect(tiny.length).toBeGreaterThanOrEqual(3);
  });
  for (const set of FIX.sets) {
    const d = P3.make(set.parameters);
    const tag = JSON.stringify(set.parameters);
    it(`${tag}: cdf, sf, logcdf, logsf, logpdf`, () => {
      for (const pt of set.points) {
        const checks: [string, number, Ref | undefined][] = [
          ['cdf', d.cdf(pt.y), pt.cdf],
          ['sf', d.sf(pt.y), pt.sf],
          ['logcdf', d.logCdf(pt.y), pt.logcdf],
          ['logsf', d.logSf(pt.y), pt.logsf],
          ['logpdf', d.logPdf(pt.y), pt.logpdf],
        ];
        for (const [name, got, ref] of checks) {
          if (!ref) continue;
          const bound = tol(name.startsWith('log') ? Math.exp(ref.value) : ref.value, ref.cond);
          expect(rel(got, ref.value), `${name} at w = ${pt.w}`).toBeLessThanOrEqual(bound);
        }
      }
    });
    it(`${tag}: quantile and isf down to 1e-300`, () => {
      for (const q of set.quantiles) {
        // A quantile's error in y: relative 1e-12, or 1e-12·sd absolute near y = 0.
        const scale = (v: number) => Math.max(Math.abs(v), set.parameters.sd);
        expect(Math.abs(d.quantile(q.p) - q.ppf.value) / scale(q.ppf.value), `ppf(${q.p})`).toBeLessThanOrEqual(1e-12);
        expect(Math.abs(d.isf(q.p) - q.isf.value) / scale(q.isf.value), `isf(${q.p})`).toBeLessThanOrEqual(1e-12);
      }
    });
  }
});

describe('the sign trap and the normal limit', () => {
  it('skew −g is the mirror image of skew +g about the mean (F₋(μ − t) = S₊(μ + t))', () => {
    const pos = P3.make({ mean: 5, sd: 2, skew: 0.8 });
    const neg = P3.make({ mean: 5, sd: 2, skew: -0.8 });
    for (const t of [-4, -1, 0, 0.5, 3, 10]) {
      expect(rel(neg.cdf(5 - t), pos.sf(5 + t))).toBeLessThanOrEqual(1e-13);
      expect(rel(neg.logSf(5 - t), pos.logCdf(5 + t))).toBeLessThanOrEqual(1e-13);
    }
    expect(neg.support.upper).toBeCloseTo(5 + 2 * 2 / 0.8, 12);
    expect(neg.support.lower).toBe(-Infinity);
  });
  it('small skews approach the normal continuously (Edgeworth: the change is about γ(w³ − 3w)φ(w)/6)', () => {
    const normal = P3.make({ mean: 0, sd: 1, skew: 0 });
    for (const g of [1e-3, 1e-4, -1e-4]) {
      const d = P3.make({ mean: 0, sd: 1, skew: g });
      for (const w of [-2, 1, 3]) {
        const phi = Math.exp(-w * w / 2) / Math.sqrt(2 * Math.PI);
        const predicted = -(g * (w * w - 1) * phi) / 6; // F(w) − Φ(w) to first order in γ
        expect(Math.abs(d.cdf(w) - normal.cdf(w) - predicted)).toBeLessThanOrEqual(10 * g * g);
      }
    }
  });
});

describe('log-Pearson III = Pearson III of log10 Q', () => {
  it('distribution functions at q = 10^y equal the Pearson III ones at y; density carries 1/(q ln 10)', () => {
    for (const set of FIX.sets.slice(0, 3)) {
      const lp = getFamily('logpearson3').make(set.parameters);
      const p3 = P3.make(set.parameters);
      for (const pt of set.points) {
        const q = Math.pow(10, pt.y);
        if (!(q > 0 && Number.isFinite(q))) continue;
        const y = Math.log10(q);
        expect(lp.cdf(q)).toBe(p3.cdf(y));
        expect(lp.logSf(q)).toBe(p3.logSf(y));
        expect(lp.logPdf(q)).toBeCloseTo(p3.logPdf(y) - Math.log(q) - Math.log(Math.LN10), 10);
      }
    }
  });
  it('mean E[10^Y] from the gamma moment generating function; infinite where the moment does not exist', () => {
    // E[e^{cY}] = e^{cξ}(1 − cβ)^{−α} (gamma MGF), computed here directly in the long form.
    const mu = 3, sd = 0.25, g = 0.4;
    const c = Math.LN10, alpha = 4 / g ** 2, beta = (sd * g) / 2, xi = mu - (2 * sd) / g;
    const direct = Math.exp(c * xi) * Math.pow(1 - c * beta, -alpha);
    const d = new LogPearson3Distribution(mu, sd, g);
    expect(rel(d.mean(), direct)).toBeLessThanOrEqual(1e-11);
    expect(new LogPearson3Distribution(3, 1, 1).mean()).toBe(Infinity); // cσγ/2 = 1.15 ≥ 1
  });
});

describe('fits', () => {
  it('productMoments: mean, sd (n − 1) and g = m3/m2^1.5 of a small sample (hand computation)', () => {
    // 1, 2, 3, 10: mean 4, deviations −3, −2, −1, 6; m2 = 50/4, m3 = (−27 − 8 − 1 + 216)/4 = 45.
    const m = productMoments([1, 2, 3, 10]);
    expect(m.mean).toBe(4);
    expect(m.sd).toBeCloseTo(Math.sqrt(50 / 3), 14);
    expect(m.skew).toBeCloseTo(45 / Math.pow(12.5, 1.5), 14);
  });
  it('maximum likelihood: the score vanishes at an interior estimate (central differences)', () => {
    const xs = Array.from(P3.random({ mean: 10, sd: 2, skew: 0.6 }, createRng(20261204, 3), 300));
    const r = P3.fit(prepareSample(xs));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.converged).toBe(true);
    expect(r.warnings).toBeUndefined();
    const ll = (p: Record<string, number>) => xs.reduce((s, x) => s + P3.make(p).logPdf(x), 0);
    for (const name of ['mean', 'sd', 'skew']) {
      const h = 1e-5;
      const up = { ...r.parameters, [name]: (r.parameters[name] as number) + h };
      const dn = { ...r.parameters, [name]: (r.parameters[name] as number) - h };
      expect(Math.abs((ll(up) - ll(dn)) / (2 * h))).toBeLessThan(1e-3);
    }
    expect(r.logLikelihood).toBeCloseTo(ll(r.parameters as Record<string, number>), 9);
  });
  it('a sample whose likelihood has no interior maximum is reported as such, not ranked as converged', () => {
    const xs = [3.1, 2.7, 3.6, 2.9, 3.3, 4.4, 3.0, 2.8, 3.9, 3.2, 3.5, 2.6, 5.1, 3.4, 3.0];
    const r = P3.fit(prepareSample(xs));
    expect(r.ok && r.converged).toBe(false);
    expect(r.ok && r.warnings?.[0]).toMatch(/no interior maximum/);
  });
});
