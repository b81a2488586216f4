/**
 * The Pearson type III family by its moments: parameters `mean` (μ), `sd` (σ) and `skew` (γ).
 * With α = 4/γ², β = σγ/2 and ξ = μ − 2σ/γ, Y = ξ + βG with G ~ Gamma(α, 1) (e.g. USGS Bulletin
 * 17C, England et al. 2018, Techniques and Methods 4-B5, eqs. 5-7; Hosking & Wallis 1997, App. A.9).
 *
 * The sign trap: for γ < 0, β < 0, so the gamma variable runs the other way: F(y) = Q(α, x) and
 * S(y) = P(α, x). Both signs use the same standardized gamma argument
 *   x = (y − ξ)/β = α + 2w/γ = α(1 + γw/2),  w = (y − μ)/σ,
 * written from w so that ξ (large when |γ| is small) never cancels against y.
 * Support: [ξ, ∞) for γ > 0, (−∞, ξ] for γ < 0, the whole line for γ = 0.
 *
 * |γ| < NORMAL_SKEW: the normal distribution N(μ, σ²). Below this the skew changes a tail
 * probability at w standard deviations by about γ(w³ − 3w)/6 relative (the Edgeworth term,
 * e.g. Kendall & Stuart vol. 1 §6.18 [from memory]), under 1e-5 even at w = 8, while the gamma
 * route at α = 4/γ² ≥ 4e12 loses about 2ε/γ of relative precision in w in forming x; SciPy's
 * `pearson3` switches at 1.6e-5 for the same reason (scipy.stats source, _norm2pearson_transition).
 *
 * Quantiles: the gamma inverse (gammaPInv/gammaQInv) for the start, then Newton steps on ln F or
 * ln S (the smaller tail) in y, which removes the error the inverse's relative tolerance in x
 * leaves after the subtraction of α.
 *
 * Fit (maximum likelihood): by the general maximiser over (μ, ln σ, γ) from the sample moments,
 * with |γ| < 2: for |γ| ≥ 2 (α ≤ 1) the density is infinite or finite and non-zero at the bound ξ
 * and the likelihood grows without limit as ξ approaches the smallest value, so there is no
 * interior maximum there (e.g. Bobée & Ashkar 1991, The Gamma Family and Derived Distributions
 * Applied in Hydrology, ch. 7 [from memory]); a fit that stops at that edge says so.
 */
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { between, IDENTITY, LOG, maximize } from '../optimize/index.js';
import {
  gammaP,
  gammaPInv,
  gammaQ,
  gammaQInv,
  logGammaDensity,
  logGammaP,
  logGammaQ,
  normalCdf,
  normalIsf,
  normalLogCdf,
  normalLogPdf,
  normalLogSf,
  normalQuantile,
  normalSf,
} from '../special/index.js';
import { CompensatedSum } from '../compensated.js';
import { familyBasics } from './define.js';
import { POSITIVE, REAL } from './parameters.js';
import type { Distribution, Family, FamilyName, FitOutcome, Interval, Parameters } from './types.js';

/** Below this |skew| the family is the normal distribution (see the file comment). */
export const NORMAL_SKEW = 1e-6;
const BOUNDS = Object.freeze({ mean: REAL, sd: POSITIVE, skew: REAL });
const REAL_LINE: Interval = Object.freeze({ lower: Number.NEGATIVE_INFINITY, upper: Number.POSITIVE_INFINITY });
const NEWTON_STEPS = 4;

/** The Pearson III distribution of Y; LP3 reuses it on log10 of the flows. */
export class Pearson3Distribution implements Distribution {
  readonly family: FamilyName = 'pearson3';
  readonly parameters: Parameters;
  readonly support: Interval;
  /** Shape α = 4/γ² (Infinity for the normal case). */
  readonly alpha: number;
  private readonly normalCase: boolean;
  private readonly positive: boolean;
  /** ln |β| = ln(σ|γ|/2). */
  private readonly logAbsBeta: number;
  private readonly logSd: number;
  constructor(
    readonly mu: number,
    readonly sigma: number,
    readonly gamma: number,
  ) {
    this.parameters = Object.freeze({ mean: mu, sd: sigma, skew: gamma });
    this.normalCase = Math.abs(gamma) < NORMAL_SKEW;
    this.positive = gamma > 0;
    this.alpha = this.normalCase ? Number.POSITIVE_INFINITY : 4 / (gamma * gamma);
    this.logAbsBeta = Math.log(sigma) + Math.log(Math.abs(gamma) / 2);
    this.logSd = Math.log(sigma);
    if (this.normalCase) this.support = REAL_LINE;
    else {
      const edge = mu - (2 * sigma) / gamma;
      this.support = Object.freeze(
        this.positive ? { lower: edge, upper: Number.POSITIVE_INFINITY } : { lower: Number.NEGATIVE_INFINITY, upper: edge },
      );
    }
  }
  /** Standardized gamma argument x = α(1 + γw/2), clamped at 0 (the bound). */
  private gammaArg(y: number): number {
    const w = (y - this.mu) / this.sigma;
    const x = this.alpha + (2 * w) / this.gamma;
    return x > 0 ? x : 0;
  }
  /** −1 below the support, +1 above, 0 inside (NaN never reaches this). */
  private outside(y: number): number {
    if (y <= this.support.lower) return -1;
    if (y >= this.support.upper) return 1;
    return 0;
  }
  logPdf(y: number): number {
    if (y !== y) return Number.NaN;
    if (!Number.isFinite(y)) return Number.NEGATIVE_INFINITY;
    if (this.normalCase) return normalLogPdf((y - this.mu) / this.sigma) - this.logSd;
    if (y < this.support.lower || y > this.support.upper) return Number.NEGATIVE_INFINITY;
    const x = this.gammaArg(y);
    if (x === 0) {
      if (this.alpha < 1) return Number.POSITIVE_INFINITY;
      return this.alpha === 1 ? -this.logAbsBeta : Number.NEGATIVE_INFINITY;
    }
    return logGammaDensity(this.alpha, x) - this.logAbsBeta;
  }
  pdf(y: number): number {
    return Math.exp(this.logPdf(y));
  }
  cdf(y: number): number {
    if (y !== y) return Number.NaN;
    if (this.normalCase) return normalCdf((y - this.mu) / this.sigma);
    const o = this.outside(y);
    if (o !== 0) return o < 0 ? 0 : 1;
    const x = this.gammaArg(y);
    return this.positive ? gammaP(this.alpha, x) : gammaQ(this.alpha, x);
  }
  sf(y: number): number {
    if (y !== y) return Number.NaN;
    if (this.normalCase) return normalSf((y - this.mu) / this.sigma);
    const o = this.outside(y);
    if (o !== 0) return o < 0 ? 1 : 0;
    const x = this.gammaArg(y);
    return this.positive ? gammaQ(this.alpha, x) : gammaP(this.alpha, x);
  }
  logCdf(y: number): number {
    if (y !== y) return Number.NaN;
    if (this.normalCase) return normalLogCdf((y - this.mu) / this.sigma);
    const o = this.outside(y);
    if (o !== 0) return o < 0 ? Number.NEGATIVE_INFINITY : 0;
    const x = this.gammaArg(y);
    return this.positive ? logGammaP(this.alpha, x) : logGammaQ(this.alpha, x);
  }
  logSf(y: number): number {
    if (y !== y) return Number.NaN;
    if (this.normalCase) return normalLogSf((y - this.mu) / this.sigma);
    const o = this.outside(y);
    if (o !== 0) return o < 0 ? 0 : Number.NEGATIVE_INFINITY;
    const x = this.gammaArg(y);
    return this.positive ? logGammaQ(this.alpha, x) : logGammaP(this.alpha, x);
  }
  /** y from the standardized gamma value x: μ + σ(x − α)γ/2. */
  private fromGamma(x: number): number {
    return this.mu + (this.sigma * (x - this.alpha) * this.gamma) / 2;
  }
  /** Newton polishing on ln(tail) = ln(target) in y; `lower` picks the cdf side. */
  private polish(y: number, logTarget: number, lower: boolean): number {
    let cur = y;
    for (let i = 0; i < NEWTON_STEPS; i++) {
      if (!(cur > this.support.lower && cur < this.support.upper)) return cur;
      const lt = lower ? this.logCdf(cur) : this.logSf(cur);
      const lf = this.logPdf(cur);
      if (!Number.isFinite(lt) || !Number.isFinite(lf)) return cur;
      // d ln F/dy = f/F; d ln S/dy = −f/S.
      const step = ((lt - logTarget) * Math.exp(lt - lf)) * (lower ? -1 : 1);
      let next = cur + step;
      if (!(next > this.support.lower && next < this.support.upper)) next = (cur + (step < 0 ? this.support.lower : this.support.upper)) / 2;
      if (!Number.isFinite(next)) return cur;
      if (Math.abs(next - cur) <= 1e-15 * Math.max(Math.abs(next), this.sigma * 1e-3)) return next;
      cur = next;
    }
    return cur;
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return this.support.lower;
    if (p === 1) return this.support.upper;
    if (this.normalCase) return this.mu + this.sigma * normalQuantile(p);
    if (p > 0.5) return this.isf(1 - p);
    const x = this.positive ? gammaPInv(this.alpha, p) : gammaQInv(this.alpha, p);
    return this.polish(this.fromGamma(x), Math.log(p), true);
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return this.support.upper;
    if (q === 1) return this.support.lower;
    if (this.normalCase) return this.mu + this.sigma * normalIsf(q);
    if (q > 0.5) return this.quantile(1 - q);
    const x = this.positive ? gammaQInv(this.alpha, q) : gammaPInv(this.alpha, q);
    return this.polish(this.fromGamma(x), Math.log(q), false);
  }
  mean(): number {
    return this.mu;
  }
  variance(): number {
    return this.sigma * this.sigma;
  }
}

const basics = familyBasics({
  name: 'pearson3',
  label: 'Pearson type III',
  bounds: BOUNDS,
  support: 'real',
  build: (p) => new Pearson3Distribution(p.mean, p.sd, p.skew),
});
const { make, applicable } = basics;

/** Sample mean, sd (divisor n − 1) and the bias-unadjusted moment skew g = m3/m2^1.5 of the values. */
export function productMoments(values: ArrayLike<number>): { mean: number; sd: number; skew: number } {
  const n = values.length;
  const s = new CompensatedSum();
  for (let i = 0; i < n; i++) s.add(values[i] as number);
  const mean = s.value / n;
  const m2 = new CompensatedSum();
  const m3 = new CompensatedSum();
  for (let i = 0; i < n; i++) {
    const d = (values[i] as number) - mean;
    m2.add(d * d);
    m3.add(d * d * d);
  }
  const v2 = m2.value / n;
  return { mean, sd: Math.sqrt(m2.value / (n - 1)), skew: m3.value / n / Math.pow(v2, 1.5) };
}

/** Largest |skew| the maximum-likelihood search may reach (the likelihood has no maximum beyond 2). */
const ML_SKEW_LIMIT = 2;

/** Maximum-likelihood Pearson III fit of values (used for Y = log10 Q by the LP3 family). */
export function fitPearson3Values(values: Float64Array): { parameters: Parameters; logLikelihood: number; iterations: number; converged: boolean; atEdge: boolean } {
  const pm = productMoments(values);
  const start = [pm.mean, pm.sd, Math.max(-1.9, Math.min(1.9, pm.skew))];
  const logLik = (t: Float64Array): number => {
    const sd = t[1] as number;
    const g = t[2] as number;
    if (!(sd > 0) || !(Math.abs(g) < ML_SKEW_LIMIT)) return Number.NEGATIVE_INFINITY;
    const d = new Pearson3Distribution(t[0] as number, sd, g);
    const acc = new CompensatedSum();
    for (let i = 0; i < values.length; i++) acc.add(d.logPdf(values[i] as number));
    return acc.value;
  };
  const r = maximize(logLik, start, { transforms: [IDENTITY, LOG, between(-ML_SKEW_LIMIT, ML_SKEW_LIMIT)] });
  const skew = r.x[2] as number;
  const atEdge = Math.abs(skew) > ML_SKEW_LIMIT * (1 - 1e-4);
  return {
    parameters: Object.freeze({ mean: r.x[0] as number, sd: r.x[1] as number, skew }),
    logLikelihood: r.value,
    iterations: r.iterations,
    converged: r.converged && !atEdge,
    atEdge,
  };
}

export const ML_EDGE_WARNING =
  'the likelihood has no interior maximum: the skew ran to ±2, where the lower (or upper) bound of the distribution reaches the data and the likelihood grows without limit; use moments (EMA) or L-moments instead';

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const r = fitPearson3Values(sample.sorted);
  return {
    ok: true,
    family: 'pearson3',
    parameters: r.parameters,
    logLikelihood: r.logLikelihood,
    iterations: r.iterations,
    converged: r.converged,
    method: 'maximum likelihood over (mean, ln sd, skew) by the general maximiser from the sample moments, |skew| < 2',
    ...(r.atEdge ? { warnings: [ML_EDGE_WARNING] } : {}),
  };
}

/** Pearson III draws: ξ + βG (the normal when |γ| < NORMAL_SKEW). */
export function pearson3Draws(mu: number, sigma: number, gamma: number, rng: Rng, n: number): Float64Array {
  const out = new Float64Array(n);
  if (Math.abs(gamma) < NORMAL_SKEW) {
    for (let i = 0; i < n; i++) out[i] = mu + sigma * rng.normal();
    return out;
  }
  const alpha = 4 / (gamma * gamma);
  const half = (sigma * gamma) / 2;
  for (let i = 0; i < n; i++) out[i] = mu + half * (rng.gamma(alpha) - alpha);
  return out;
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  return pearson3Draws(d.parameters.mean as number, d.parameters.sd as number, d.parameters.skew as number, rng, n);
}

export const pearson3: Family = basics.family({ fit, random });
