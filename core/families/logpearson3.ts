/**
 * The log-Pearson type III family: log10 Q ~ Pearson III with parameters `mean`, `sd` and `skew`
 * of the base-10 logarithms of the flows (USGS Bulletin 17C, England et al. 2018, Techniques and
 * Methods 4-B5, §5). Every distribution function is the Pearson III one at y = log10 q
 * (pearson3.ts, sign trap included); the density carries the Jacobian 1/(q ln 10).
 * Support: [10^ξ, ∞) for skew > 0, [0, 10^ξ] for skew < 0, [0, ∞) for skew 0 (lognormal).
 *
 * Moments: with c = ln 10 and t = cσγ/2 (= cβ), E[Q^k] = exp(k c ξ)(1 − k t)^(−α) when k t < 1
 * (the gamma moment generating function), written without the cancellation of ξ against α as
 *   ln E[Q^k] = k c μ − (4/γ²) · log1pmx(−k t),   log1pmx(u) = ln(1 + u) − u,
 * which tends to k c μ + (k c σ)²/2 (the lognormal) as γ → 0. Infinite when k t ≥ 1.
 *
 * Fit (maximum likelihood): the Pearson III fit of log10 q (the Jacobian does not depend on the
 * parameters); the log-likelihood adds Σ −ln(q ln 10). Bulletin 17C's estimator is the expected
 * moments algorithm (core/flood/ema.ts), the default of a flood run.
 */
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { log1pmx } from '../special/index.js';
import { familyBasics } from './define.js';
import { POSITIVE, REAL } from './parameters.js';
import { fitPearson3Values, ML_EDGE_WARNING, NORMAL_SKEW, Pearson3Distribution, pearson3Draws } from './pearson3.js';
import type { Distribution, Family, FitOutcome, Interval, Parameters } from './types.js';

const LN10 = Math.LN10;
const BOUNDS = Object.freeze({ mean: REAL, sd: POSITIVE, skew: REAL });

export class LogPearson3Distribution implements Distribution {
  readonly family = 'logpearson3' as const;
  readonly parameters: Parameters;
  readonly support: Interval;
  /** The Pearson III distribution of log10 Q. */
  readonly base: Pearson3Distribution;
  constructor(mu: number, sigma: number, gamma: number) {
    this.base = new Pearson3Distribution(mu, sigma, gamma);
    this.parameters = Object.freeze({ mean: mu, sd: sigma, skew: gamma });
    const s = this.base.support;
    this.support = Object.freeze({
      lower: s.lower === Number.NEGATIVE_INFINITY ? 0 : Math.pow(10, s.lower),
      upper: Math.pow(10, s.upper),
    });
  }
  /** Whether q lies at or below 0 (outside the support, where log10 is undefined). */
  private static nonPositive(q: number): boolean {
    return q <= 0;
  }
  logPdf(q: number): number {
    if (q !== q) return Number.NaN;
    if (LogPearson3Distribution.nonPositive(q) || q === Number.POSITIVE_INFINITY) return Number.NEGATIVE_INFINITY;
    const lp = this.base.logPdf(Math.log10(q));
    return lp === Number.NEGATIVE_INFINITY ? lp : lp - Math.log(q) - Math.log(LN10);
  }
  pdf(q: number): number {
    return Math.exp(this.logPdf(q));
  }
  cdf(q: number): number {
    if (q !== q) return Number.NaN;
    return LogPearson3Distribution.nonPositive(q) ? 0 : this.base.cdf(Math.log10(q));
  }
  sf(q: number): number {
    if (q !== q) return Number.NaN;
    return LogPearson3Distribution.nonPositive(q) ? 1 : this.base.sf(Math.log10(q));
  }
  logCdf(q: number): number {
    if (q !== q) return Number.NaN;
    return LogPearson3Distribution.nonPositive(q) ? Number.NEGATIVE_INFINITY : this.base.logCdf(Math.log10(q));
  }
  logSf(q: number): number {
    if (q !== q) return Number.NaN;
    return LogPearson3Distribution.nonPositive(q) ? 0 : this.base.logSf(Math.log10(q));
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return this.support.lower;
    return Math.pow(10, this.base.quantile(p));
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 1) return this.support.lower;
    return Math.pow(10, this.base.isf(q));
  }
  /** ln E[Q^k] (Infinity when the moment does not exist). */
  logRawMoment(k: number): number {
    const { mu, sigma, gamma } = this.base;
    const c = LN10 * k;
    if (Math.abs(gamma) < NORMAL_SKEW) return c * mu + (c * sigma) ** 2 / 2;
    const t = (c * sigma * gamma) / 2;
    if (t >= 1) return Number.POSITIVE_INFINITY;
    return c * mu - (4 / (gamma * gamma)) * log1pmx(-t);
  }
  mean(): number {
    return Math.exp(this.logRawMoment(1));
  }
  variance(): number {
    const l1 = this.logRawMoment(1);
    const l2 = this.logRawMoment(2);
    if (!Number.isFinite(l2)) return Number.POSITIVE_INFINITY;
    return Math.exp(2 * l1) * Math.expm1(l2 - 2 * l1);
  }
}

const basics = familyBasics({
  name: 'logpearson3',
  label: 'log-Pearson type III',
  bounds: BOUNDS,
  support: 'positive',
  build: (p) => new LogPearson3Distribution(p.mean, p.sd, p.skew),
});
const { make, applicable } = basics;

function fit(sample: Sample): FitOutcome {
  const na = applicable(sample);
  if (na) return na;
  const n = sample.n;
  const ys = new Float64Array(n);
  for (let i = 0; i < n; i++) ys[i] = Math.log10(sample.sorted[i] as number);
  const r = fitPearson3Values(ys);
  const logLikelihood = r.logLikelihood - sample.sumLog() - n * Math.log(LN10);
  return {
    ok: true,
    family: 'logpearson3',
    parameters: r.parameters,
    logLikelihood,
    iterations: r.iterations,
    converged: r.converged,
    method: 'maximum likelihood of the Pearson III model of log10 values (general maximiser from the moments of log10 x, |skew| < 2)',
    ...(r.atEdge ? { warnings: [ML_EDGE_WARNING] } : {}),
  };
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const ys = pearson3Draws(d.parameters.mean as number, d.parameters.sd as number, d.parameters.skew as number, rng, n);
  for (let i = 0; i < n; i++) ys[i] = Math.pow(10, ys[i] as number);
  return ys;
}

export const logpearson3: Family = basics.family({ fit, random });
