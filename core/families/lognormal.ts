/**
 * The lognormal family (location 0): ln X is normal with mean `meanlog` and standard deviation
 * `sdlog`. Tails: cdf and sf are Φ(±z), z = (ln x - meanlog)/sdlog, and their logs ln Φ(±z).
 * Fit: closed-form maximum likelihood on the logs, meanlog = mean(ln x),
 * sdlog = √(Σ(ln x - meanlog)²/n) (divisor n), with compensated sums.
 */
import { CompensatedSum } from '../compensated.js';
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { normalCdf, normalIsf, normalLogCdf, normalLogCdfSfAt, normalLogSf, normalQuantile, normalSf } from '../special/index.js';
import { familyBasics } from './define.js';
import { POSITIVE, REAL } from './parameters.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';

const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);
const SUPPORT: Interval = Object.freeze({ lower: 0, upper: Number.POSITIVE_INFINITY });
const BOUNDS = Object.freeze({ meanlog: REAL, sdlog: POSITIVE });

class LognormalDistribution implements Distribution {
  readonly family = 'lognormal' as const;
  readonly parameters: Parameters;
  readonly support = SUPPORT;
  private readonly logNorm: number;
  constructor(
    private readonly mu: number,
    private readonly sigma: number,
  ) {
    this.parameters = Object.freeze({ meanlog: mu, sdlog: sigma });
    this.logNorm = -Math.log(sigma) - LN_SQRT_2PI;
  }
  logPdf(x: number): number {
    if (x <= 0) return x === x ? Number.NEGATIVE_INFINITY : Number.NaN;
    if (x === Number.POSITIVE_INFINITY) return Number.NEGATIVE_INFINITY;
    const lx = Math.log(x);
    const z = (lx - this.mu) / this.sigma;
    return this.logNorm - lx - 0.5 * z * z;
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  private z(x: number): number {
    // At and below the support edge z = -∞, so cdf = 0, sf = 1 and their logs fall out of Φ.
    if (!(x > 0)) return x === x ? Number.NEGATIVE_INFINITY : Number.NaN;
    return (Math.log(x) - this.mu) / this.sigma;
  }
  cdf(x: number): number {
    return normalCdf(this.z(x));
  }
  sf(x: number): number {
    return normalSf(this.z(x));
  }
  logCdf(x: number): number {
    return normalLogCdf(this.z(x));
  }
  logSf(x: number): number {
    return normalLogSf(this.z(x));
  }
  /** logCdf and logSf of each x together, from one tail evaluation each (special normalLogCdfSfAt). */
  logCdfSfInto(xs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void {
    for (let i = 0; i < xs.length; i++) normalLogCdfSfAt(this.z(xs[i] as number), outLogCdf, outLogSf, i);
  }
  /** The same from ln x (the sample's cached logs, all finite since x > 0): z = (ln x - μ)/σ as above. */
  logCdfSfFromLogsInto(logs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void {
    const mu = this.mu;
    const sigma = this.sigma;
    for (let i = 0; i < logs.length; i++) normalLogCdfSfAt(((logs[i] as number) - mu) / sigma, outLogCdf, outLogSf, i);
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return 0;
    if (p === 1) return Number.POSITIVE_INFINITY;
    return Math.exp(this.mu + this.sigma * normalQuantile(p));
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return Number.POSITIVE_INFINITY;
    if (q === 1) return 0;
    return Math.exp(this.mu + this.sigma * normalIsf(q));
  }
  mean(): number {
    return Math.exp(this.mu + 0.5 * this.sigma * this.sigma);
  }
  variance(): number {
    const s2 = this.sigma * this.sigma;
    return Math.expm1(s2) * Math.exp(2 * this.mu + s2);
  }
}

const basics = familyBasics({ name: 'lognormal', label: 'lognormal', bounds: BOUNDS, support: 'positive', build: (p) => new LognormalDistribution(p.meanlog, p.sdlog) });
const { make, applicable } = basics;

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const n = sample.n;
  const sumLog = sample.sumLog(); // every value is > 0
  const meanlog = sumLog / n;
  const ss = new CompensatedSum();
  sample.logBlocks((logs) => {
    for (let i = 0; i < logs.length; i++) {
      const d = (logs[i] as number) - meanlog;
      ss.add(d * d);
    }
  });
  const sdlog = Math.sqrt(ss.value / n);
  // At the MLE Σ(ln x - meanlog)²/sdlog² = n, so ln L = -Σ ln x - n ln sdlog - n ln √(2π) - n/2.
  const logLikelihood = -sumLog - n * (Math.log(sdlog) + LN_SQRT_2PI + 0.5);
  return {
    ok: true,
    family: 'lognormal',
    parameters: Object.freeze({ meanlog, sdlog }),
    logLikelihood,
    iterations: 0,
    converged: true,
    method: 'closed form on ln x: meanlog = mean of ln x, sdlog = √(Σ(ln x - meanlog)²/n) (maximum likelihood, divisor n)',
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const mu = d.parameters.meanlog as number;
  const sigma = d.parameters.sdlog as number;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = Math.exp(mu + sigma * rng.normal());
  return out;
}

export const lognormal: Family = basics.family({ fit, random });
