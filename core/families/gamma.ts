/**
 * The gamma family (location 0), parameters `shape` (k) and `scale` (θ).
 * Tails: cdf/sf are the regularized incomplete gamma P(k, x/θ) and Q(k, x/θ), each computed
 * directly, and their logs by logGammaP/logGammaQ; quantiles by gammaPInv/gammaQInv.
 *
 * Fit (maximum likelihood): the shape solves ln k - ψ(k) = s with s = ln(mean) - mean(ln x) > 0,
 * by Newton safeguarded by a bracket (core/special newtonBracketed): 1/(2s) < k < 1/s, which
 * follows from 1/(2k) < ln k - ψ(k) < 1/k for every k > 0 (Alzer 1997, Math. Comp. 66:373-389
 * [from memory]; test/families/fits.test.ts checks it against mpmath values for k = 1e-8 … 1e12). The start is Minka's (2002, "Estimating a gamma
 * distribution") approximation k₀ = (3 - s + √((s - 3)² + 24s))/(12s), close to Choi & Wette (1969).
 * Then scale = mean/k.
 */
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import {
  BracketError,
  gammaP,
  gammaPInv,
  gammaQ,
  gammaQInv,
  lnGamma,
  lnGammaStirlingCorrection,
  log1mexp,
  log1pmx,
  logGammaP,
  logGammaQ,
  newtonBracketed,
  trigamma,
} from '../special/index.js';
import type { ValueAndDerivative } from '../special/index.js';
import { familyBasics } from './define.js';
import { sampleMean } from './moments.js';
import { POSITIVE } from './parameters.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';

const SUPPORT: Interval = Object.freeze({ lower: 0, upper: Number.POSITIVE_INFINITY });
const BOUNDS = Object.freeze({ shape: POSITIVE, scale: POSITIVE });

class GammaDistribution implements Distribution {
  readonly family = 'gamma' as const;
  readonly parameters: Parameters;
  readonly support = SUPPORT;
  private readonly logScale: number;
  private readonly logNorm: number;
  constructor(
    private readonly k: number,
    private readonly theta: number,
  ) {
    this.parameters = Object.freeze({ shape: k, scale: theta });
    this.logScale = Math.log(theta);
    this.logNorm = -lnGamma(k) - this.logScale;
  }
  logPdf(x: number): number {
    if (x !== x) return Number.NaN;
    if (x < 0 || x === Number.POSITIVE_INFINITY) return Number.NEGATIVE_INFINITY;
    if (x === 0) {
      if (this.k < 1) return Number.POSITIVE_INFINITY;
      return this.k === 1 ? -this.logScale : Number.NEGATIVE_INFINITY;
    }
    const z = x / this.theta;
    return this.logNorm + (this.k - 1) * (Math.log(x) - this.logScale) - z;
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  cdf(x: number): number {
    if (!(x > 0)) return x === x ? 0 : Number.NaN;
    if (x === Number.POSITIVE_INFINITY) return 1;
    return gammaP(this.k, x / this.theta);
  }
  sf(x: number): number {
    if (!(x > 0)) return x === x ? 1 : Number.NaN;
    if (x === Number.POSITIVE_INFINITY) return 0;
    return gammaQ(this.k, x / this.theta);
  }
  logCdf(x: number): number {
    if (!(x > 0)) return x === x ? Number.NEGATIVE_INFINITY : Number.NaN;
    if (x === Number.POSITIVE_INFINITY) return 0;
    return logGammaP(this.k, x / this.theta);
  }
  logSf(x: number): number {
    if (!(x > 0)) return x === x ? 0 : Number.NaN;
    if (x === Number.POSITIVE_INFINITY) return Number.NEGATIVE_INFINITY;
    return logGammaQ(this.k, x / this.theta);
  }
  /**
   * logCdf and logSf of each x together with one incomplete gamma evaluation per point: the tail
   * below the shape (z = x/θ < k, where P is the smaller side, the median lying near k − 1/3) as
   * ln P, above it ln Q, each by the tail-accurate logGammaP/logGammaQ; the other side as
   * log1mexp of it, ln(1 − e^l), which keeps full relative accuracy on either side.
   */
  logCdfSfInto(xs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void {
    const k = this.k;
    const theta = this.theta;
    for (let i = 0; i < xs.length; i++) {
      const x = xs[i] as number;
      if (!(x > 0) || x === Number.POSITIVE_INFINITY) {
        outLogCdf[i] = this.logCdf(x);
        outLogSf[i] = this.logSf(x);
        continue;
      }
      const z = x / theta;
      if (z < k) {
        const lp = logGammaP(k, z);
        outLogCdf[i] = lp;
        outLogSf[i] = log1mexp(lp);
      } else {
        const lq = logGammaQ(k, z);
        outLogSf[i] = lq;
        outLogCdf[i] = log1mexp(lq);
      }
    }
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return 0;
    if (p === 1) return Number.POSITIVE_INFINITY;
    return this.theta * gammaPInv(this.k, p);
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return Number.POSITIVE_INFINITY;
    if (q === 1) return 0;
    return this.theta * gammaQInv(this.k, q);
  }
  mean(): number {
    return this.k * this.theta;
  }
  variance(): number {
    return this.k * this.theta * this.theta;
  }
}

const basics = familyBasics({ name: 'gamma', label: 'gamma', bounds: BOUNDS, support: 'positive', build: (p) => new GammaDistribution(p.shape, p.scale) });
const { make, applicable } = basics;

/** Shift k up to at least this before using the asymptotic series below. */
const SERIES_FROM = 20;

/**
 * ln k - ψ(k), computed without cancelling ln k against ψ(k) for large k: for K ≥ 20 the
 * asymptotic series 1/(2K) + Σ B₂ⱼ/(2j K²ʲ) (Abramowitz & Stegun 6.3.18), truncated after
 * B₁₂ (next term < 1e-18 relative at K = 20); smaller k are shifted up by ψ(k) = ψ(k+1) - 1/k.
 */
export function logMinusDigamma(k: number): number {
  let shift = 0;
  let acc = 0;
  let K = k;
  while (K < SERIES_FROM) {
    acc += 1 / K;
    K += 1;
    shift++;
  }
  const r = 1 / (K * K);
  const series =
    0.5 / K +
    r * (1 / 12 - r * (1 / 120 - r * (1 / 252 - r * (1 / 240 - r * (1 / 132 - r * (691 / 32760 - r / 12))))));
  return shift === 0 ? series : series + acc - Math.log(K / k);
}

/** d/dk [ln k - ψ(k)] = 1/k - ψ'(k) < 0, by the asymptotic series for large k (A&S 6.4.12). */
function logMinusDigammaDerivative(k: number): number {
  if (k < SERIES_FROM) return 1 / k - trigamma(k);
  const r = 1 / (k * k);
  return -r * (0.5 + (1 / k) * (1 / 6 - r * (1 / 30 - r * (1 / 42 - r / 30))));
}

/** s = ln(mean) - mean(ln x) ≥ 0, computed stably when the data are tightly clustered. */
function logMeanMinusMeanLog(sample: Sample): number {
  const n = sample.n;
  const meanLog = sample.sumLog() / n;
  const mean = sampleMean(sample);
  const lnMean = Math.log(mean);
  const direct = lnMean - meanLog;
  // Absolute rounding error of the direct difference is a few ulps of its terms.
  if (direct > 1e-3 * Math.max(1, Math.abs(lnMean))) return direct;
  // Stable form: s = (1/n) Σ [u - log1p(u)], u = x/mean - 1 (Σu = 0), each term ≥ 0, with
  // log1pmx avoiding the cancellation of u against log1p(u) for small |u|.
  const xs = sample.sorted;
  const m = mean;
  let s = 0;
  let c = 0;
  for (let i = 0; i < n; i++) {
    const term = -log1pmx((xs[i] as number) / m - 1); // u - log1p(u) ≥ 0, accurate near u = 0
    const t = s + term;
    if (s >= term) c += s - t + term;
    else c += term - t + s;
    s = t;
  }
  return (s + c) / n;
}

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const n = sample.n;
  const mean = sampleMean(sample);
  const s = logMeanMinusMeanLog(sample);
  const k0 = (3 - s + Math.sqrt((s - 3) * (s - 3) + 24 * s)) / (12 * s);
  // Alzer's bracket, widened by 0.1 % so that rounding in s cannot put the root on its edge.
  const lower = (0.5 / s) * 0.999;
  const upper = (1 / s) * 1.001;
  const scratch: ValueAndDerivative = { f: 0, df: 0 };
  const equation = (k: number): ValueAndDerivative => {
    scratch.f = logMinusDigamma(k) - s;
    scratch.df = logMinusDigammaDerivative(k);
    return scratch;
  };
  const start = Math.min(Math.max(k0, lower), upper);
  let r;
  try {
    r = newtonBracketed(equation, lower, upper, start, { relTol: 1e-12 });
  } catch (e) {
    // Cannot happen by Alzer's bounds; should rounding ever defeat them, widen a thousandfold.
    if (!(e instanceof BracketError)) throw e;
    r = newtonBracketed(equation, lower / 1000, upper * 1000, start, { relTol: 1e-12 });
  }
  const shape = r.root;
  const scale = mean / shape;
  // ln L = (k - 1) Σ ln x - Σx/θ - n lnΓ(k) - n k ln θ with Σx/θ = n k and θ = mean/k, rewritten
  // with Stirling's formula lnΓ(k) = (k - ½) ln k - k + ½ ln 2π + lnΓ*(k) as
  //   ln L = n [-k s + ½ ln(k/2π) - lnΓ*(k) - mean(ln x)],
  // which has no cancellation for large k (k s → ½), unlike the four terms of size n k ln k.
  const logLikelihood =
    n * (-shape * s + 0.5 * Math.log(shape / (2 * Math.PI)) - lnGammaStirlingCorrection(shape) - sample.sumLog() / n);
  return {
    ok: true,
    family: 'gamma',
    parameters: Object.freeze({ shape, scale }),
    logLikelihood,
    iterations: r.iterations,
    converged: r.converged,
    method:
      'maximum likelihood: shape by Newton (safeguarded by the bracket 1/(2s) < k < 1/s) on ln k - ψ(k) = ln(mean) - mean(ln x), scale = mean/k',
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const shape = d.parameters.shape as number;
  const scale = d.parameters.scale as number;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = scale * rng.gamma(shape);
  return out;
}

export const gamma: Family = basics.family({ fit, random });
