/**
 * The two-parameter Weibull family (location 0), parameters `shape` (k) and `scale` (λ):
 * S(x) = exp(-(x/λ)^k).
 * Tails: ln S(x) = -(x/λ)^k exactly, F(x) = -expm1(-(x/λ)^k), ln F(x) = log1mexp(-(x/λ)^k) (and
 * ln F = k ln(x/λ) - (x/λ)^k/2 where (x/λ)^k would underflow); (x/λ)^k = exp(k ln(x/λ)).
 * Quantiles by inverting ln S: x = λ (-ln q)^(1/k), with -log1p(-p) for the lower tail.
 *
 * Fit (maximum likelihood): the shape is the root of the profile equation
 *   g(c) = Σ x^c ln x / Σ x^c - 1/c - mean(ln x) = 0,
 * solved by Newton safeguarded by a bracket. The data enter only through y = ln x - ln max(x) ≤ 0
 * (g does not change under this shift), so the weights x^c/max^c = exp(c·y) lie in (0, 1] and
 * cannot overflow. g is increasing (g' = weighted variance of y + 1/c²) and negative at
 * c = -1/mean(y), which is therefore a strict lower bound. The start is Menon's (1963) moment
 * estimate on the logs, c₀ = π/(√6·sd(ln x)) [from memory]. Then scale = (Σ x^c/n)^(1/c).
 */
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { lnGamma, log1mexp } from '../special/index.js';
import { familyBasics } from './define.js';
import { positiveRootNewton } from './newton.js';
import { POSITIVE } from './parameters.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';

const SUPPORT: Interval = Object.freeze({ lower: 0, upper: Number.POSITIVE_INFINITY });
const BOUNDS = Object.freeze({ shape: POSITIVE, scale: POSITIVE });
/** Below this k·ln(x/λ), (x/λ)^k < 4e-18 and ln F = k ln(x/λ) - (x/λ)^k/2 to double precision. */
const TINY_EXPONENT = -40;

class WeibullDistribution implements Distribution {
  readonly family = 'weibull' as const;
  readonly parameters: Parameters;
  readonly support = SUPPORT;
  private readonly logScale: number;
  private readonly logShapeOverScale: number;
  constructor(
    private readonly k: number,
    private readonly lambda: number,
  ) {
    this.parameters = Object.freeze({ shape: k, scale: lambda });
    this.logScale = Math.log(lambda);
    this.logShapeOverScale = Math.log(k) - this.logScale;
  }
  /** k ln(x/λ) for x > 0. */
  private t(x: number): number {
    return this.k * (Math.log(x) - this.logScale);
  }
  logPdf(x: number): number {
    if (x !== x) return Number.NaN;
    if (x < 0 || x === Number.POSITIVE_INFINITY) return Number.NEGATIVE_INFINITY;
    if (x === 0) {
      if (this.k < 1) return Number.POSITIVE_INFINITY;
      return this.k === 1 ? -this.logScale : Number.NEGATIVE_INFINITY;
    }
    const lz = Math.log(x) - this.logScale;
    return this.logShapeOverScale + (this.k - 1) * lz - Math.exp(this.k * lz);
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  cdf(x: number): number {
    if (!(x > 0)) return x === x ? 0 : Number.NaN;
    return -Math.expm1(-Math.exp(this.t(x)));
  }
  sf(x: number): number {
    if (!(x > 0)) return x === x ? 1 : Number.NaN;
    return Math.exp(-Math.exp(this.t(x)));
  }
  logCdf(x: number): number {
    if (!(x > 0)) return x === x ? Number.NEGATIVE_INFINITY : Number.NaN;
    const t = this.t(x);
    const u = Math.exp(t);
    return t < TINY_EXPONENT ? t - 0.5 * u : log1mexp(-u);
  }
  logSf(x: number): number {
    if (!(x > 0)) return x === x ? 0 : Number.NaN;
    return -Math.exp(this.t(x));
  }
  /** logCdf and logSf of each x together (the same numbers; t and (x/λ)^k computed once). */
  logCdfSfInto(xs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void {
    const k = this.k;
    const logScale = this.logScale;
    for (let i = 0; i < xs.length; i++) {
      const x = xs[i] as number;
      if (!(x > 0)) {
        outLogCdf[i] = x === x ? Number.NEGATIVE_INFINITY : Number.NaN;
        outLogSf[i] = x === x ? 0 : Number.NaN;
        continue;
      }
      const t = k * (Math.log(x) - logScale);
      const u = Math.exp(t);
      outLogCdf[i] = t < TINY_EXPONENT ? t - 0.5 * u : log1mexp(-u);
      outLogSf[i] = -u;
    }
  }
  /** The same from ln x (the sample's cached logs of x > 0): t = k(ln x - ln λ) as above. */
  logCdfSfFromLogsInto(logs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void {
    const k = this.k;
    const logScale = this.logScale;
    for (let i = 0; i < logs.length; i++) {
      const t = k * ((logs[i] as number) - logScale);
      const u = Math.exp(t);
      outLogCdf[i] = t < TINY_EXPONENT ? t - 0.5 * u : log1mexp(-u);
      outLogSf[i] = -u;
    }
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return 0;
    if (p === 1) return Number.POSITIVE_INFINITY;
    return this.lambda * Math.exp(Math.log(-Math.log1p(-p)) / this.k);
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return Number.POSITIVE_INFINITY;
    if (q === 1) return 0;
    return this.lambda * Math.exp(Math.log(-Math.log(q)) / this.k);
  }
  mean(): number {
    return this.lambda * Math.exp(lnGamma(1 + 1 / this.k));
  }
  variance(): number {
    // λ²[Γ(1+2/k) - Γ(1+1/k)²] written as λ²Γ(1+1/k)²·expm1(lnΓ(1+2/k) - 2 lnΓ(1+1/k)) to avoid
    // cancelling two nearly equal numbers for large k.
    const g1 = lnGamma(1 + 1 / this.k);
    const g2 = lnGamma(1 + 2 / this.k);
    return this.lambda * this.lambda * Math.exp(2 * g1) * Math.expm1(g2 - 2 * g1);
  }
}

const basics = familyBasics({ name: 'weibull', label: 'Weibull', bounds: BOUNDS, support: 'positive', build: (p) => new WeibullDistribution(p.shape, p.scale) });
const { make, applicable } = basics;

/**
 * One block of the pass over the logs at shape c, carried in `acc` = [s0, c0, s1, c1, s2]:
 * S0 = Σw, S1 = Σw·y, S2 = Σw·y² with w = exp(c·y), y = ln x - ln max. S0 and S1 are compensated
 * (Neumaier, the compensation carried across blocks); S2 feeds only the derivative.
 */
function addWeightedSums(logs: Float64Array, logMax: number, c: number, acc: Float64Array): void {
  let s0 = acc[0] as number;
  let c0 = acc[1] as number;
  let s1 = acc[2] as number;
  let c1 = acc[3] as number;
  let s2 = acc[4] as number;
  for (let i = 0; i < logs.length; i++) {
    const y = (logs[i] as number) - logMax;
    const w = Math.exp(c * y);
    const wy = w * y;
    let t = s0 + w;
    if (Math.abs(s0) >= w) c0 += s0 - t + w;
    else c0 += w - t + s0;
    s0 = t;
    t = s1 + wy;
    if (Math.abs(s1) >= Math.abs(wy)) c1 += s1 - t + wy;
    else c1 += wy - t + s1;
    s1 = t;
    s2 += wy * y;
  }
  acc[0] = s0;
  acc[1] = c0;
  acc[2] = s1;
  acc[3] = c1;
  acc[4] = s2;
}

/** The pass over every ln x (sample.logBlocks) at shape c: out = [S0, S1, S2]. */
function weightedSums(sample: Sample, logMax: number, c: number, acc: Float64Array, out: Float64Array): void {
  acc.fill(0);
  sample.logBlocks((block) => addWeightedSums(block, logMax, c, acc));
  out[0] = (acc[0] as number) + (acc[1] as number);
  out[1] = (acc[2] as number) + (acc[3] as number);
  out[2] = acc[4] as number;
}

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const n = sample.n;
  const logMax = Math.log(sample.max); // every value is > 0
  // One pass for Σy (compensated; y = ln x - ln max is formed exactly near the top, so clustered
  // data keep their digits) and Σy² (for Menon's start only).
  const first = new Float64Array(3); // [Σy, its compensation, Σy²], carried across blocks
  sample.logBlocks((logs) => {
    let ys = first[0] as number;
    let yc = first[1] as number;
    let yy = first[2] as number;
    for (let i = 0; i < logs.length; i++) {
      const y = (logs[i] as number) - logMax;
      const t = ys + y;
      if (Math.abs(ys) >= Math.abs(y)) yc += ys - t + y;
      else yc += y - t + ys;
      ys = t;
      yy += y * y;
    }
    first[0] = ys;
    first[1] = yc;
    first[2] = yy;
  });
  const ys = first[0] as number;
  const yc = first[1] as number;
  const yy = first[2] as number;
  const sumY = ys + yc;
  const meanY = sumY / n; // < 0: the values are not all equal
  const sdLog = Math.sqrt(Math.max(yy / n - meanY * meanY, 0));
  const lower = -1 / meanY;
  const start = Math.max(Math.PI / (Math.sqrt(6) * sdLog), 1.5 * lower);
  const sums = new Float64Array(3);
  const acc = new Float64Array(5);
  // The last evaluation: shape c, ln S0(c) and A(c) = S1/S0 = d ln S0/dc.
  let lastC = Number.NaN;
  let lastLogS0 = Number.NaN;
  let lastA = Number.NaN;
  const profile = (c: number, out: Float64Array): void => {
    weightedSums(sample, logMax, c, acc, sums);
    const s0 = sums[0] as number;
    const a = (sums[1] as number) / s0;
    lastC = c;
    lastLogS0 = Math.log(s0);
    lastA = a;
    out[0] = a - 1 / c - meanY;
    out[1] = Math.max((sums[2] as number) / s0 - a * a, 0) + 1 / (c * c);
  };
  const r = positiveRootNewton(profile, lower, Number.POSITIVE_INFINITY, start, true, 1e-12);
  const shape = r.root;
  // ln S0 at the root from the last evaluation, to first order: the final Newton step moved c by at
  // most 1e-12 relative, so the neglected ½·Var·Δc² is below 1e-24 and a further pass is saved.
  if (!(Math.abs(shape - lastC) <= 1e-8 * shape)) profile(shape, new Float64Array(2));
  const logS0 = lastLogS0 + lastA * (shape - lastC);
  const logScaleOverMax = (logS0 - Math.log(n)) / shape; // ln(λ / max)
  const logScale = logMax + logScaleOverMax;
  const scale = Math.exp(logScale);
  // At the MLE Σ(x/λ)^k = n, so ln L = n ln k - n ln λ + (k - 1) Σ ln(x/λ) - n, with
  // Σ ln(x/λ) = Σy - n ln(λ/max) free of the cancellation between Σ ln x and n ln λ.
  const sumLogRatio = sumY - n * logScaleOverMax;
  const logLikelihood = n * (Math.log(shape) - logScale - 1) + (shape - 1) * sumLogRatio;
  return {
    ok: true,
    family: 'weibull',
    parameters: Object.freeze({ shape, scale }),
    logLikelihood,
    iterations: r.iterations,
    converged: r.converged,
    method:
      'maximum likelihood: shape by Newton (safeguarded by a bracket) on the profile equation Σx^k ln x/Σx^k - 1/k - mean(ln x) = 0, scale = (Σx^k/n)^(1/k)',
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const invShape = 1 / (d.parameters.shape as number);
  const scale = d.parameters.scale as number;
  const out = new Float64Array(n);
  // Inversion of ln S(x) = -(x/λ)^k = ln U: x = λ E^(1/k) with E = -ln U standard exponential.
  for (let i = 0; i < n; i++) out[i] = scale * Math.pow(rng.exponential(), invShape);
  return out;
}

export const weibull: Family = basics.family({ fit, random });
