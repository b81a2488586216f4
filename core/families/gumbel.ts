/**
 * The Gumbel (extreme value type I, largest) family, parameters `location` (μ) and `scale` (β):
 *   F(x) = exp(-e^{-z}),  z = (x - μ)/β.
 * Tails: ln F = -e^{-z} exactly; S = -expm1(-e^{-z}) and ln S = log1mexp(-e^{-z}), so the upper
 * tail keeps its relative accuracy where F rounds to 1. Quantiles: x = μ - β ln(-ln p), and the
 * inverse survival function x = μ - β ln(-log1p(-q)) for small q (return levels at q = 1/T).
 * Mean μ + γβ, variance π²β²/6.
 *
 * Fit (maximum likelihood): the scale is the root of the profile equation
 *   g(β) = β - x̄ + Σ x_i w_i / Σ w_i = 0,   w_i = exp(-(x_i - x_min)/β)
 * (e.g. Coles 2001, An Introduction to Statistical Modeling of Extreme Values, §3.3 [from memory];
 * the shift by x_min keeps every weight in (0, 1]). g is increasing, g'(β) = 1 + Var_w(x)/β²,
 * and g → x_min - x̄ < 0 as β → 0, so the root is unique; it is solved by Newton safeguarded by
 * a bracket, from the moment estimate β₀ = s√6/π. Then μ = x_min - β ln((1/n) Σ w_i).
 */
import type { Rng } from '../random/index.js';
import { prepareSample, type Sample } from '../sample.js';
import { CompensatedSum } from '../compensated.js';
import { log1mexp } from '../special/index.js';
import { familyBasics } from './define.js';
import { positiveRootNewton } from './newton.js';
import { POSITIVE, REAL } from './parameters.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';

/** Euler–Mascheroni constant. */
export const EULER_GAMMA = 0.5772156649015329;
const SUPPORT: Interval = Object.freeze({ lower: Number.NEGATIVE_INFINITY, upper: Number.POSITIVE_INFINITY });
const BOUNDS = Object.freeze({ location: REAL, scale: POSITIVE });

class GumbelDistribution implements Distribution {
  readonly family = 'gumbel' as const;
  readonly parameters: Parameters;
  readonly support = SUPPORT;
  private readonly logScale: number;
  constructor(
    private readonly mu: number,
    private readonly beta: number,
  ) {
    this.parameters = Object.freeze({ location: mu, scale: beta });
    this.logScale = Math.log(beta);
  }
  /** e^{-z}. */
  private t(x: number): number {
    return Math.exp(-(x - this.mu) / this.beta);
  }
  logPdf(x: number): number {
    if (x !== x) return Number.NaN;
    if (!Number.isFinite(x)) return Number.NEGATIVE_INFINITY;
    const z = (x - this.mu) / this.beta;
    return -this.logScale - z - Math.exp(-z);
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  cdf(x: number): number {
    return x !== x ? Number.NaN : Math.exp(-this.t(x));
  }
  sf(x: number): number {
    return x !== x ? Number.NaN : -Math.expm1(-this.t(x));
  }
  logCdf(x: number): number {
    return x !== x ? Number.NaN : -this.t(x);
  }
  logSf(x: number): number {
    if (x !== x) return Number.NaN;
    return log1mexp(-this.t(x));
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return Number.NEGATIVE_INFINITY;
    if (p === 1) return Number.POSITIVE_INFINITY;
    return this.mu - this.beta * Math.log(-Math.log(p));
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return Number.POSITIVE_INFINITY;
    if (q === 1) return Number.NEGATIVE_INFINITY;
    return this.mu - this.beta * Math.log(-Math.log1p(-q));
  }
  mean(): number {
    return this.mu + EULER_GAMMA * this.beta;
  }
  variance(): number {
    return (Math.PI * Math.PI * this.beta * this.beta) / 6;
  }
}

const basics = familyBasics({ name: 'gumbel', label: 'Gumbel', bounds: BOUNDS, support: 'real', build: (p) => new GumbelDistribution(p.location, p.scale) });
const { make, applicable } = basics;

/** Σw, Σw·y, Σw·y² with w = exp(-(x - x_min)/β), y = x - x̄ (compensated first two). */
function sums(sorted: Float64Array, xmin: number, xbar: number, beta: number, out: Float64Array): void {
  let s0 = 0;
  let c0 = 0;
  let s1 = 0;
  let c1 = 0;
  let s2 = 0;
  for (let i = 0; i < sorted.length; i++) {
    const x = sorted[i] as number;
    const w = Math.exp(-(x - xmin) / beta);
    const y = x - xbar;
    let t = s0 + w;
    c0 += Math.abs(s0) >= w ? s0 - t + w : w - t + s0;
    s0 = t;
    const wy = w * y;
    t = s1 + wy;
    c1 += Math.abs(s1) >= Math.abs(wy) ? s1 - t + wy : wy - t + s1;
    s1 = t;
    s2 += wy * y;
  }
  out[0] = s0 + c0;
  out[1] = s1 + c1;
  out[2] = s2;
}

/** ln L of a Gumbel model at (μ, β) (compensated). */
export function gumbelLogLikelihood(sorted: ArrayLike<number>, mu: number, beta: number): number {
  const sum = new CompensatedSum();
  for (let i = 0; i < sorted.length; i++) {
    const z = ((sorted[i] as number) - mu) / beta;
    sum.add(-z - Math.exp(-z));
  }
  return -sorted.length * Math.log(beta) + sum.value;
}

/**
 * Values whose magnitude is near the ends of the double range are fitted on x / 2^k (an exact
 * rescaling) so that squared deviations neither overflow nor underflow; location and scale are
 * then multiplied back by 2^k and ln L shifted by -n·k·ln 2 (maximum likelihood is
 * scale-equivariant). Returns null when no rescaling is needed.
 */
const RESCALE_BELOW = Math.pow(2, -500);
const RESCALE_ABOVE = Math.pow(2, 500);

export function powerOfTwoRescale(sample: Sample): { sample: Sample; factor: number; log2: number } | null {
  const maxAbs = Math.max(Math.abs(sample.min), Math.abs(sample.max));
  if (maxAbs === 0 || (maxAbs >= RESCALE_BELOW && maxAbs <= RESCALE_ABOVE)) return null;
  const k = Math.floor(Math.log2(maxAbs));
  // 2^-k may not be representable for k near ±1023: divide in two steps.
  const k1 = Math.trunc(k / 2);
  const k2 = k - k1;
  const f1 = Math.pow(2, -k1);
  const f2 = Math.pow(2, -k2);
  const ys = new Float64Array(sample.n);
  for (let i = 0; i < sample.n; i++) ys[i] = ((sample.sorted[i] as number) * f1) * f2;
  return { sample: prepareSample(ys, { alreadySorted: true }), factor: Math.pow(2, k1) * Math.pow(2, k2), log2: k };
}

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const rs = powerOfTwoRescale(sample);
  if (rs) {
    const r = fit(rs.sample);
    if (!r.ok) return r;
    return {
      ...r,
      parameters: Object.freeze({ location: (r.parameters.location as number) * rs.factor, scale: (r.parameters.scale as number) * rs.factor }),
      logLikelihood: r.logLikelihood - sample.n * rs.log2 * Math.LN2,
      method: `${r.method} (fitted on x/2^${rs.log2} to stay inside the double range)`,
    };
  }
  const xs = sample.sorted;
  const n = sample.n;
  const xmin = sample.min;
  const xbar = sample.mean;
  const sd = Math.sqrt(sample.sumSqDev / (n - 1));
  const buf = new Float64Array(3);
  // g(β) = β + Σw·y/Σw, g'(β) = 1 + [Σw·y²/Σw - (Σw·y/Σw)²]/β² (y = x - x̄, so Σw·y/Σw = x̃_w - x̄).
  const root = positiveRootNewton(
    (beta, out) => {
      sums(xs, xmin, xbar, beta, buf);
      const m1 = (buf[1] as number) / (buf[0] as number);
      const m2 = (buf[2] as number) / (buf[0] as number);
      out[0] = beta + m1;
      out[1] = 1 + Math.max(m2 - m1 * m1, 0) / (beta * beta);
    },
    0,
    Number.POSITIVE_INFINITY,
    (sd * Math.sqrt(6)) / Math.PI,
    true,
    1e-13,
  );
  const beta = root.root;
  sums(xs, xmin, xbar, beta, buf);
  const mu = xmin - beta * Math.log((buf[0] as number) / n);
  return {
    ok: true,
    family: 'gumbel',
    parameters: Object.freeze({ location: mu, scale: beta }),
    logLikelihood: gumbelLogLikelihood(xs, mu, beta),
    iterations: root.iterations,
    converged: root.converged,
    method: 'maximum likelihood: scale by safeguarded Newton on the profile equation, location in closed form',
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const mu = d.parameters.location as number;
  const beta = d.parameters.scale as number;
  const out = new Float64Array(n);
  // F⁻¹(U) = μ - β ln(-ln U) and -ln U is a standard exponential variate.
  for (let i = 0; i < n; i++) out[i] = mu - beta * Math.log(rng.exponential());
  return out;
}

export const gumbel: Family = basics.family({ fit, random });
