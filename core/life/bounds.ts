/**
 * Confidence bounds on B-lives (quantiles) and on reliability at a time, under a fitted model.
 *  - Likelihood ratio (default): the quantity replaces one parameter (models.ts), and its profile
 *    likelihood is inverted at χ²₁(confidence) (core/optimize profileInterval; Lawless 2003, §B.4,
 *    §5.1.2; Meeker & Escobar 1998, "Statistical Methods for Reliability Data", §8.3).
 *  - Fisher matrix (Wald on a log or log-log scale): observed information inverted, delta method for
 *    ln x_p and for ln(-ln R) (Meeker & Escobar 1998, §8.4; Lawless 2003, §B.2).
 * Both are two-sided at `confidence`; each end alone is a one-sided bound at (1 + confidence)/2.
 */
import { getFamily } from '../families/index.js';
import { normalQuantile } from '../special/index.js';
import { IDENTITY, LOG, between, numericalGradient, observedInformation, profileInterval } from '../optimize/index.js';
import type { LifeData } from './data.js';
import { logLikelihoodOf, type CensoredFitSuccess } from './fit.js';
import { lifeModel, toParameters, toVector, type LifeFamilyName } from './models.js';

export type BoundMethod = 'likelihood-ratio' | 'fisher-matrix';

/**
 * Where the bounds get the log-likelihood of a family's parameter vector: right-censored LifeData,
 * or any other likelihood given as a function (e.g. interval-censored data, interval-likelihood.ts).
 */
export type LikelihoodSource = LifeData | { readonly logLikelihoodOf: (family: LifeFamilyName) => (v: Float64Array) => number };

export function likelihoodOf(family: LifeFamilyName, data: LikelihoodSource): (v: Float64Array) => number {
  return 'logLikelihoodOf' in data ? data.logLikelihoodOf(family) : logLikelihoodOf(family, data);
}

export interface BoundedEstimate {
  readonly estimate: number;
  readonly lower: number;
  readonly upper: number;
  readonly confidence: number;
  readonly method: string;
  /** false when a side could not be closed (the end is then the range limit) or the information was singular. */
  readonly boundsFound: boolean;
}

export interface BLife extends BoundedEstimate {
  /** Percent failed, e.g. 10 for B10. */
  readonly percent: number;
}

export interface ReliabilityAt extends BoundedEstimate {
  readonly time: number;
}

const LR_TEXT = 'likelihood ratio (profile likelihood), two-sided';
const FM_TEXT = 'Fisher matrix (observed information, delta method on ln x_p; on x_p for the normal model), two-sided';

/**
 * The log-likelihood `ll` at the parameters whose p-quantile is x_p and whose other parameters are
 * `others` (models.ts `fromQuantile`); -∞ where those parameters are not finite or not valid.
 */
export function logLikelihoodAtQuantile(family: LifeFamilyName, ll: (v: Float64Array) => number, others: Float64Array, p: number, xp: number): number {
  const model = lifeModel(family);
  try {
    const params = model.fromQuantile(Array.from(others), p, xp);
    for (const k of model.names) if (!Number.isFinite(params[k] as number)) return Number.NEGATIVE_INFINITY;
    getFamily(family).make(params);
    return ll(toVector(model, params));
  } catch {
    return Number.NEGATIVE_INFINITY;
  }
}

/** The log-likelihood with parameter vector [x_p, other parameters...] for a fixed p. */
function quantileParametrised(fit: CensoredFitSuccess, data: LikelihoodSource, p: number) {
  const model = lifeModel(fit.family);
  const ll = likelihoodOf(fit.family, data);
  return (v: Float64Array): number => {
    const xp = v[0] as number;
    if (!Number.isFinite(xp) || (model.quantileScale === 'log' && !(xp > 0))) return Number.NEGATIVE_INFINITY;
    return logLikelihoodAtQuantile(fit.family, ll, v.subarray(1), p, xp);
  };
}

export function othersOf(fit: CensoredFitSuccess): { values: number[]; transforms: ReturnType<typeof lifeModel>['transforms'][number][] } {
  const model = lifeModel(fit.family);
  const v = toVector(model, fit.parameters);
  const values: number[] = [];
  const transforms = [];
  for (let i = 0; i < v.length; i++) {
    if (i === model.replaced) continue;
    values.push(v[i] as number);
    transforms.push(model.transforms[i]!);
  }
  return { values, transforms };
}

function waldLog(fit: CensoredFitSuccess, data: LikelihoodSource, g: (v: Float64Array) => number, confidence: number) {
  const model = lifeModel(fit.family);
  const ll = likelihoodOf(fit.family, data);
  const theta = toVector(model, fit.parameters);
  const info = observedInformation(ll, theta);
  if (!info.covariance) return null;
  const grad = numericalGradient(g, theta);
  const k = theta.length;
  let v = 0;
  for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) v += (grad[i] as number) * (info.covariance[i * k + j] as number) * (grad[j] as number);
  if (!(v >= 0)) return null;
  const z = normalQuantile(0.5 + confidence / 2);
  const c = g(theta);
  return { lower: c - z * Math.sqrt(v), upper: c + z * Math.sqrt(v) };
}

export function bLife(fit: CensoredFitSuccess, data: LikelihoodSource, percent: number, confidence: number, method: BoundMethod = 'likelihood-ratio'): BLife {
  if (!(percent > 0 && percent < 100)) throw new RangeError(`B-life percent must be in (0, 100), got ${percent}`);
  if (!(confidence > 0 && confidence < 1)) throw new RangeError(`confidence must be in (0, 1), got ${confidence}`);
  const p = percent / 100;
  const fam = getFamily(fit.family);
  const model = lifeModel(fit.family);
  const estimate = fam.make(fit.parameters).quantile(p);
  if (method === 'fisher-matrix') {
    const logScale = model.quantileScale === 'log';
    const w = waldLog(fit, data, (v) => (logScale ? Math.log : (q: number) => q)(fam.make(toParameters(model, v)).quantile(p)), confidence);
    return {
      percent,
      estimate,
      lower: w ? (logScale ? Math.exp(w.lower) : w.lower) : Number.NaN,
      upper: w ? (logScale ? Math.exp(w.upper) : w.upper) : Number.NaN,
      confidence,
      method: FM_TEXT,
      boundsFound: w !== null,
    };
  }
  const ll = quantileParametrised(fit, data, p);
  const o = othersOf(fit);
  const x = Float64Array.of(estimate, ...o.values);
  const iv = profileInterval(ll, { x, value: ll(x) }, 0, confidence, { transforms: [model.quantileScale === 'log' ? LOG : IDENTITY, ...o.transforms] });
  return { percent, estimate, lower: iv.lower, upper: iv.upper, confidence, method: LR_TEXT, boundsFound: iv.lowerFound && iv.upperFound };
}

export function reliabilityAt(fit: CensoredFitSuccess, data: LikelihoodSource, time: number, confidence: number, method: BoundMethod = 'likelihood-ratio'): ReliabilityAt {
  if (!(time > 0)) throw new RangeError(`reliability time must be > 0, got ${time}`);
  const fam = getFamily(fit.family);
  const model = lifeModel(fit.family);
  const dist = fam.make(fit.parameters);
  const estimate = dist.sf(time);
  if (method === 'fisher-matrix') {
    // ln(-ln R): the log cumulative hazard, unbounded on both sides.
    const w = waldLog(fit, data, (v) => Math.log(-fam.make(toParameters(model, v)).logSf(time)), confidence);
    return {
      time,
      estimate,
      lower: w ? Math.exp(-Math.exp(w.upper)) : Number.NaN,
      upper: w ? Math.exp(-Math.exp(w.lower)) : Number.NaN,
      confidence,
      method: 'Fisher matrix (observed information, delta method on ln(-ln R)), two-sided',
      boundsFound: w !== null,
    };
  }
  // Parameter of interest: p = F(time), with x_p = time fixed.
  const llFull = likelihoodOf(fit.family, data);
  const ll = (v: Float64Array): number => {
    const p = v[0] as number;
    if (!(p > 0 && p < 1)) return Number.NEGATIVE_INFINITY;
    return logLikelihoodAtQuantile(fit.family, llFull, v.subarray(1), p, time);
  };
  const o = othersOf(fit);
  const p0 = dist.cdf(time);
  const x = Float64Array.of(p0, ...o.values);
  const iv = profileInterval(ll, { x, value: ll(x) }, 0, confidence, { transforms: [between(0, 1), ...o.transforms] });
  return {
    time,
    estimate,
    lower: 1 - iv.upper,
    upper: 1 - iv.lower,
    confidence,
    method: LR_TEXT,
    boundsFound: iv.lowerFound && iv.upperFound,
  };
}

/** Profile-likelihood interval of one named parameter (e.g. the Weibull shape). */
export function parameterInterval(fit: CensoredFitSuccess, data: LikelihoodSource, name: string, confidence: number): BoundedEstimate {
  const model = lifeModel(fit.family);
  const ll = likelihoodOf(fit.family, data);
  const idx = model.names.indexOf(name);
  if (idx < 0) throw new RangeError(`${fit.family} has no parameter ${name}`);
  const x = toVector(model, fit.parameters);
  const iv = profileInterval(ll, { x, value: ll(x) }, idx, confidence, { transforms: model.transforms });
  return { estimate: x[idx] as number, lower: iv.lower, upper: iv.upper, confidence, method: LR_TEXT, boundsFound: iv.lowerFound && iv.upperFound };
}
