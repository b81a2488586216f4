/**
 * The generalized Pareto family, parameters `location` (μ), `scale` (σ), `shape` (ξ):
 *   S(x) = (1 + ξz)^(−1/ξ), z = (x − μ)/σ  (ξ = 0: e^(−z)),
 * support [μ, ∞) for ξ ≥ 0 and [μ, μ − σ/ξ] for ξ < 0 (Hosking & Wallis 1997 A.5 with ξ = −k;
 * Coles 2001 §4.2). Written through t = ln(1 + ξz)/ξ = −ln S (log1p; t = z as ξ → 0):
 * ln S = −t, S = e^(−t), F = −expm1(−t), ln F = log1mexp(−t), ln f = −ln σ − (1 + ξ)t;
 * quantiles x = μ + σ expm1(ξt)/ξ with t = −ln(1 − p) (log1p) or −ln q.
 * Mean μ + σ/(1 − ξ) (ξ < 1), variance σ²/((1 − ξ)²(1 − 2ξ)) (ξ < 1/2), else infinite.
 *
 * Fit (maximum likelihood): the location's estimate is the smallest value (the likelihood grows
 * as μ rises to it for ξ > −1, the density being largest at the bound); scale and shape then
 * maximise the likelihood of the excesses over it (core/flood/pot.ts fitGpdMl). The fit says so.
 */
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { log1mexp } from '../special/index.js';
import { fitGpdMl } from '../flood/pot.js';
import { familyBasics } from './define.js';
import { POSITIVE, REAL } from './parameters.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';
import { SMALL_SHAPE, shapeLog } from './shape-log.js';

const BOUNDS = Object.freeze({ location: REAL, scale: POSITIVE, shape: REAL });
const SMALL = SMALL_SHAPE;

class GenParetoDistribution implements Distribution {
  readonly family = 'genpareto' as const;
  readonly parameters: Parameters;
  readonly support: Interval;
  private readonly logScale: number;
  constructor(
    private readonly mu: number,
    private readonly sigma: number,
    private readonly xi: number,
  ) {
    this.parameters = Object.freeze({ location: mu, scale: sigma, shape: xi });
    this.support = Object.freeze({ lower: mu, upper: xi < 0 ? mu - sigma / xi : Number.POSITIVE_INFINITY });
    this.logScale = Math.log(sigma);
  }
  /** t = −ln S(x) inside the support. */
  private t(x: number): number {
    const z = (x - this.mu) / this.sigma;
    return shapeLog(z, this.xi);
  }
  private where(x: number): number {
    if (x <= this.support.lower) return -1;
    if (x >= this.support.upper) return 1;
    return 0;
  }
  logPdf(x: number): number {
    if (x !== x) return Number.NaN;
    if (x < this.support.lower || x > this.support.upper || !Number.isFinite(x)) return Number.NEGATIVE_INFINITY;
    if (x === this.support.upper) return this.xi < -1 ? Number.POSITIVE_INFINITY : this.xi === -1 ? -this.logScale : Number.NEGATIVE_INFINITY;
    return -this.logScale - (1 + this.xi) * this.t(x);
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  cdf(x: number): number {
    if (x !== x) return Number.NaN;
    const w = this.where(x);
    return w < 0 ? 0 : w > 0 ? 1 : -Math.expm1(-this.t(x));
  }
  sf(x: number): number {
    if (x !== x) return Number.NaN;
    const w = this.where(x);
    return w < 0 ? 1 : w > 0 ? 0 : Math.exp(-this.t(x));
  }
  logCdf(x: number): number {
    if (x !== x) return Number.NaN;
    const w = this.where(x);
    return w < 0 ? Number.NEGATIVE_INFINITY : w > 0 ? 0 : log1mexp(-this.t(x));
  }
  logSf(x: number): number {
    if (x !== x) return Number.NaN;
    const w = this.where(x);
    return w < 0 ? 0 : w > 0 ? Number.NEGATIVE_INFINITY : -this.t(x);
  }
  private fromT(t: number): number {
    const e = Math.abs(this.xi) < SMALL ? t : Math.expm1(this.xi * t) / this.xi;
    return Math.min(this.mu + this.sigma * e, this.support.upper);
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return this.support.lower;
    if (p === 1) return this.support.upper;
    return this.fromT(-Math.log1p(-p));
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return this.support.upper;
    if (q === 1) return this.support.lower;
    return this.fromT(-Math.log(q));
  }
  mean(): number {
    return this.xi < 1 ? this.mu + this.sigma / (1 - this.xi) : Number.POSITIVE_INFINITY;
  }
  variance(): number {
    return this.xi < 0.5 ? (this.sigma * this.sigma) / ((1 - this.xi) ** 2 * (1 - 2 * this.xi)) : Number.POSITIVE_INFINITY;
  }
}

const basics = familyBasics({ name: 'genpareto', label: 'generalized Pareto', bounds: BOUNDS, support: 'real', build: (p) => new GenParetoDistribution(p.location, p.scale, p.shape) });
const { make, applicable } = basics;

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const u = sample.min;
  const y = Array.from(sample.sorted, (x) => x - u);
  const f = fitGpdMl(y);
  return {
    ok: true,
    family: 'genpareto',
    parameters: Object.freeze({ location: u, scale: f.scale, shape: f.shape }),
    logLikelihood: f.logLikelihood as number,
    iterations: 0,
    converged: f.converged,
    method: 'maximum likelihood with the location at the smallest value (its boundary estimate); scale and shape by the general maximiser',
    warnings: ['the location is estimated by the smallest value; for peaks over a threshold fix it at the threshold instead (--threshold)'],
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = d.isf(1 - rng.uniform());
  return out;
}

export const genpareto: Family = basics.family({ fit, random });
