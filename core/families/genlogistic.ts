/**
 * The generalized logistic family (Hosking & Wallis 1997 A.7, with Plumbline's shape s = −k),
 * parameters `location` (μ), `scale` (σ), `shape` (s):
 *   F(x) = 1/(1 + e^(−y)),  y = ln(1 + s z)/s,  z = (x − μ)/σ  (s = 0: y = z, the logistic),
 * support x > μ − σ/s for s > 0, x < μ − σ/s for s < 0. With y: ln F = −log1pexp(−y),
 * ln S = −log1pexp(y), ln f = ln F + ln S − s y − ln σ (dy/dx = e^(−sy)/σ); quantiles
 * x = μ + σ expm1(s y)/s with y = ln p − ln(1 − p) (log1p).
 * Mean μ + σ(1 − g₁)/k, variance σ²(g₂ − g₁²)/k² with k = −s, g_r = rkπ/sin(rkπ) (|k| < 1/r);
 * the logistic's π²σ²/3 at s = 0.
 * Fit (maximum likelihood): the general maximiser over (μ, ln σ, s) from the L-moment fit.
 */
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { IDENTITY, LOG, maximize } from '../optimize/index.js';
import { log1pexp } from '../special/index.js';
import { CompensatedSum } from '../compensated.js';
import { fitByLMoments } from '../lmoments/family-fits.js';
import { sampleLMoments } from '../lmoments/sample-lmoments.js';
import { familyBasics } from './define.js';
import { POSITIVE, REAL } from './parameters.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';
import { SMALL_SHAPE, shapeLog } from './shape-log.js';

const BOUNDS = Object.freeze({ location: REAL, scale: POSITIVE, shape: REAL });
const SMALL = SMALL_SHAPE;

class GenLogisticDistribution implements Distribution {
  readonly family = 'genlogistic' as const;
  readonly parameters: Parameters;
  readonly support: Interval;
  private readonly logScale: number;
  constructor(
    private readonly mu: number,
    private readonly sigma: number,
    private readonly s: number,
  ) {
    this.parameters = Object.freeze({ location: mu, scale: sigma, shape: s });
    const edge = mu - sigma / s;
    this.support = Object.freeze(
      Math.abs(s) < SMALL ? { lower: Number.NEGATIVE_INFINITY, upper: Number.POSITIVE_INFINITY } : s > 0 ? { lower: edge, upper: Number.POSITIVE_INFINITY } : { lower: Number.NEGATIVE_INFINITY, upper: edge },
    );
    this.logScale = Math.log(sigma);
  }
  private y(x: number): number {
    const z = (x - this.mu) / this.sigma;
    return shapeLog(z, this.s);
  }
  private where(x: number): number {
    if (x <= this.support.lower) return -1;
    if (x >= this.support.upper) return 1;
    return 0;
  }
  logPdf(x: number): number {
    if (x !== x) return Number.NaN;
    if (this.where(x) !== 0) return Number.NEGATIVE_INFINITY;
    const y = this.y(x);
    return -log1pexp(-y) - log1pexp(y) - this.s * y - this.logScale;
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  cdf(x: number): number {
    if (x !== x) return Number.NaN;
    const w = this.where(x);
    return w < 0 ? 0 : w > 0 ? 1 : Math.exp(-log1pexp(-this.y(x)));
  }
  sf(x: number): number {
    if (x !== x) return Number.NaN;
    const w = this.where(x);
    return w < 0 ? 1 : w > 0 ? 0 : Math.exp(-log1pexp(this.y(x)));
  }
  logCdf(x: number): number {
    if (x !== x) return Number.NaN;
    const w = this.where(x);
    return w < 0 ? Number.NEGATIVE_INFINITY : w > 0 ? 0 : -log1pexp(-this.y(x));
  }
  logSf(x: number): number {
    if (x !== x) return Number.NaN;
    const w = this.where(x);
    return w < 0 ? 0 : w > 0 ? Number.NEGATIVE_INFINITY : -log1pexp(this.y(x));
  }
  private fromY(y: number): number {
    const e = Math.abs(this.s) < SMALL ? y : Math.expm1(this.s * y) / this.s;
    const x = this.mu + this.sigma * e;
    return Math.min(Math.max(x, this.support.lower), this.support.upper);
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return this.support.lower;
    if (p === 1) return this.support.upper;
    return this.fromY(Math.log(p) - Math.log1p(-p));
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return this.support.upper;
    if (q === 1) return this.support.lower;
    return this.fromY(Math.log1p(-q) - Math.log(q));
  }
  mean(): number {
    const k = -this.s;
    if (Math.abs(k) < SMALL) return this.mu;
    if (Math.abs(k) >= 1) return k < 0 ? Number.POSITIVE_INFINITY : Number.NEGATIVE_INFINITY;
    const g1 = (k * Math.PI) / Math.sin(k * Math.PI);
    return this.mu + (this.sigma * (1 - g1)) / k;
  }
  variance(): number {
    const k = -this.s;
    if (Math.abs(k) < SMALL) return (Math.PI * Math.PI * this.sigma * this.sigma) / 3;
    if (Math.abs(k) >= 0.5) return Number.POSITIVE_INFINITY;
    const g1 = (k * Math.PI) / Math.sin(k * Math.PI);
    const g2 = (2 * k * Math.PI) / Math.sin(2 * k * Math.PI);
    return (this.sigma * this.sigma * (g2 - g1 * g1)) / (k * k);
  }
}

const basics = familyBasics({ name: 'genlogistic', label: 'generalized logistic', bounds: BOUNDS, support: 'real', build: (p) => new GenLogisticDistribution(p.location, p.scale, p.shape) });
const { make, applicable } = basics;

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  if (sample.n < 5) return { ok: false, family: 'genlogistic', reason: `the generalized logistic fit needs at least 5 values; the sample has ${sample.n}`, offendingCount: 0 };
  const start = fitByLMoments('genlogistic', sampleLMoments(sample.sorted)).parameters;
  const xs = sample.sorted;
  const ll = (t: Float64Array): number => {
    if (!(t[1] as number > 0)) return Number.NEGATIVE_INFINITY;
    const d = new GenLogisticDistribution(t[0] as number, t[1] as number, t[2] as number);
    const acc = new CompensatedSum();
    for (let i = 0; i < xs.length; i++) acc.add(d.logPdf(xs[i] as number));
    return acc.value;
  };
  const r = maximize(ll, [start.location as number, start.scale as number, start.shape as number], { transforms: [IDENTITY, LOG, IDENTITY] });
  return {
    ok: true,
    family: 'genlogistic',
    parameters: Object.freeze({ location: r.x[0] as number, scale: r.x[1] as number, shape: r.x[2] as number }),
    logLikelihood: r.value,
    iterations: r.iterations,
    converged: r.converged,
    method: 'maximum likelihood by the general maximiser from the L-moment fit',
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = d.quantile(rng.uniform());
  return out;
}

export const genlogistic: Family = basics.family({ fit, random });
