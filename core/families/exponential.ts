/**
 * The exponential family (location 0), parameter `rate` (mean 1/rate).
 * Tails: ln S(x) = -rate·x exactly, F(x) = -expm1(-rate·x), ln F via log1mexp; quantiles from
 * -log1p(-p)/rate and -ln(q)/rate.
 * Fit: closed-form maximum likelihood, rate = 1/x̄.
 */
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { log1mexp } from '../special/index.js';
import { familyBasics } from './define.js';
import { sampleMean } from './moments.js';
import { POSITIVE } from './parameters.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';

const SUPPORT: Interval = Object.freeze({ lower: 0, upper: Number.POSITIVE_INFINITY });
const BOUNDS = Object.freeze({ rate: POSITIVE });

class ExponentialDistribution implements Distribution {
  readonly family = 'exponential' as const;
  readonly parameters: Parameters;
  readonly support = SUPPORT;
  private readonly logRate: number;
  constructor(private readonly rate: number) {
    this.parameters = Object.freeze({ rate });
    this.logRate = Math.log(rate);
  }
  logPdf(x: number): number {
    if (x < 0) return Number.NEGATIVE_INFINITY;
    return this.logRate - this.rate * x; // NaN stays NaN
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  cdf(x: number): number {
    if (x <= 0) return x === x ? 0 : Number.NaN;
    return -Math.expm1(-this.rate * x);
  }
  sf(x: number): number {
    if (x <= 0) return x === x ? 1 : Number.NaN;
    return Math.exp(-this.rate * x);
  }
  logCdf(x: number): number {
    if (x <= 0) return x === x ? Number.NEGATIVE_INFINITY : Number.NaN;
    return log1mexp(-this.rate * x);
  }
  logSf(x: number): number {
    if (x <= 0) return x === x ? 0 : Number.NaN;
    return -this.rate * x;
  }
  /** logCdf and logSf of each x together (the same numbers; -rate·x computed once). */
  logCdfSfInto(xs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void {
    const rate = this.rate;
    for (let i = 0; i < xs.length; i++) {
      const x = xs[i] as number;
      if (x <= 0 || x !== x) {
        outLogCdf[i] = x === x ? Number.NEGATIVE_INFINITY : Number.NaN;
        outLogSf[i] = x === x ? 0 : Number.NaN;
        continue;
      }
      const ls = -rate * x;
      outLogCdf[i] = log1mexp(ls);
      outLogSf[i] = ls;
    }
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return 0; // not -0
    if (p === 1) return Number.POSITIVE_INFINITY;
    return -Math.log1p(-p) / this.rate;
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return Number.POSITIVE_INFINITY;
    if (q === 1) return 0; // not -0
    return -Math.log(q) / this.rate;
  }
  mean(): number {
    return 1 / this.rate;
  }
  variance(): number {
    return 1 / (this.rate * this.rate);
  }
}

const basics = familyBasics({ name: 'exponential', label: 'exponential', bounds: BOUNDS, support: 'positive', build: (p) => new ExponentialDistribution(p.rate) });
const { make, applicable } = basics;

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const n = sample.n;
  const rate = 1 / sampleMean(sample);
  // At the MLE rate·Σx = n, so ln L = n ln rate - n.
  const logLikelihood = n * (Math.log(rate) - 1);
  return {
    ok: true,
    family: 'exponential',
    parameters: Object.freeze({ rate }),
    logLikelihood,
    iterations: 0,
    converged: true,
    method: 'closed form: rate = 1/sample mean (maximum likelihood)',
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const rate = make(parameters).parameters.rate as number;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = rng.exponential() / rate;
  return out;
}

export const exponential: Family = basics.family({ fit, random });
