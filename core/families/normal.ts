/**
 * The normal family, parameters `mean` (location) and `sd` (scale).
 * Tails: cdf, sf and their logs from the special functions normalCdf, normalSf, normalLogCdf,
 * normalLogSf (never 1 - Φ); quantiles from normalQuantile and normalIsf.
 * Fit: closed-form maximum likelihood, mean = x̄ and sd = √(Σ(x - x̄)²/n) (the MLE divides by n,
 * not n - 1).
 */
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { normalCdf, normalIsf, normalLogCdf, normalLogCdfSfAt, normalLogSf, normalQuantile, normalSf } from '../special/index.js';
import { familyBasics } from './define.js';
import { mleStandardDeviation, sampleMean } from './moments.js';
import { POSITIVE, REAL } from './parameters.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';

const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);
const SUPPORT: Interval = Object.freeze({ lower: Number.NEGATIVE_INFINITY, upper: Number.POSITIVE_INFINITY });
const BOUNDS = Object.freeze({ mean: REAL, sd: POSITIVE });

class NormalDistribution implements Distribution {
  readonly family = 'normal' as const;
  readonly parameters: Parameters;
  readonly support = SUPPORT;
  private readonly logNorm: number;
  constructor(
    private readonly mu: number,
    private readonly sigma: number,
  ) {
    this.parameters = Object.freeze({ mean: mu, sd: sigma });
    this.logNorm = -Math.log(sigma) - LN_SQRT_2PI;
  }
  logPdf(x: number): number {
    const z = (x - this.mu) / this.sigma;
    return this.logNorm - 0.5 * z * z;
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  cdf(x: number): number {
    return normalCdf((x - this.mu) / this.sigma);
  }
  sf(x: number): number {
    return normalSf((x - this.mu) / this.sigma);
  }
  logCdf(x: number): number {
    return normalLogCdf((x - this.mu) / this.sigma);
  }
  logSf(x: number): number {
    return normalLogSf((x - this.mu) / this.sigma);
  }
  /** logCdf and logSf of each x together, from one tail evaluation each (special normalLogCdfSfAt). */
  logCdfSfInto(xs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void {
    const mu = this.mu;
    const sigma = this.sigma;
    for (let i = 0; i < xs.length; i++) normalLogCdfSfAt(((xs[i] as number) - mu) / sigma, outLogCdf, outLogSf, i);
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return Number.NEGATIVE_INFINITY;
    if (p === 1) return Number.POSITIVE_INFINITY;
    return this.mu + this.sigma * normalQuantile(p);
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return Number.POSITIVE_INFINITY;
    if (q === 1) return Number.NEGATIVE_INFINITY;
    return this.mu + this.sigma * normalIsf(q);
  }
  mean(): number {
    return this.mu;
  }
  variance(): number {
    return this.sigma * this.sigma;
  }
}

const basics = familyBasics({ name: 'normal', label: 'normal', bounds: BOUNDS, support: 'real', build: (p) => new NormalDistribution(p.mean, p.sd) });
const { make, applicable } = basics;

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const n = sample.n;
  const mean = sampleMean(sample);
  const sd = mleStandardDeviation(sample);
  // At the MLE Σ(x - mean)²/sd² = n exactly, so ln L = -n ln sd - n ln √(2π) - n/2.
  const logLikelihood = -n * (Math.log(sd) + LN_SQRT_2PI + 0.5);
  return {
    ok: true,
    family: 'normal',
    parameters: Object.freeze({ mean, sd }),
    logLikelihood,
    iterations: 0,
    converged: true,
    method: 'closed form: mean = sample mean, sd = √(Σ(x - mean)²/n) (maximum likelihood, divisor n)',
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const mu = d.parameters.mean as number;
  const sigma = d.parameters.sd as number;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = mu + sigma * rng.normal();
  return out;
}

export const normal: Family = basics.family({ fit, random });
