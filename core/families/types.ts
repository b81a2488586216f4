import type { Sample } from '../sample.js';
import type { Rng } from '../random/index.js';

/** Names of the model families Plumbline can fit. */
export type FamilyName = 'normal' | 'lognormal' | 'gamma' | 'weibull' | 'exponential' | 'gumbel' | 'gev' | 'weibull3' | 'lognormal3' | 'pearson3' | 'logpearson3' | 'genpareto' | 'genlogistic';

/** Parameters by role name, e.g. `{ shape: 1.4, scale: 722 }`. Never positional. */
export type Parameters = Readonly<Record<string, number>>;

export interface Interval {
  readonly lower: number;
  readonly upper: number;
}

/** One parameter's admissible range (open bounds unless `lowerInclusive`). */
export interface ParameterBound {
  readonly lower: number;
  readonly upper: number;
  readonly lowerInclusive?: boolean;
}

/** A fully specified member of a family. All functions are total over the reals. */
export interface Distribution {
  readonly family: FamilyName;
  readonly parameters: Parameters;
  /** Closed support [lower, upper]; ±Infinity where unbounded. */
  readonly support: Interval;
  pdf(x: number): number;
  logPdf(x: number): number;
  cdf(x: number): number;
  /** Survival function 1 - F(x), computed directly (not as 1 - cdf). */
  sf(x: number): number;
  logCdf(x: number): number;
  logSf(x: number): number;
  /**
   * Optional batch form of logCdf and logSf for hot loops (the Anderson–Darling statistic):
   * outLogCdf[i] = ln F(xs[i]) and outLogSf[i] = ln S(xs[i]) for i < xs.length, computed together
   * in one pass, with the same tail accuracy as logCdf and logSf.
   */
  logCdfSfInto?(xs: Float64Array, outLogCdf: Float64Array, outLogSf: Float64Array): void;
  /** Inverse cdf: the x with F(x) = p, p in [0, 1]. */
  quantile(p: number): number;
  /** Inverse survival function: the x with 1 - F(x) = q, accurate for tiny q. */
  isf(q: number): number;
  mean(): number;
  variance(): number;
}

/** Result of a successful maximum-likelihood fit. */
export interface FitSuccess {
  readonly ok: true;
  readonly family: FamilyName;
  readonly parameters: Parameters;
  readonly logLikelihood: number;
  /** Newton/bracketing iterations (0 for closed forms). */
  readonly iterations: number;
  readonly converged: boolean;
  /** How the estimate was obtained, in words, e.g. "closed form" or "Newton on the profile equation". */
  readonly method: string;
  /** Plain-words warnings about the estimate (e.g. a threshold on its bound); absent when none. */
  readonly warnings?: readonly string[];
}

/** The family cannot be fitted to this sample (e.g. zeros or negatives for a positive family). */
export interface NotApplicable {
  readonly ok: false;
  readonly family: FamilyName;
  readonly reason: string;
  /** How many values lie outside the support (0 when the reason is something else). */
  readonly offendingCount: number;
}

/**
 * The likelihood has no interior maximum on this sample: it keeps rising towards the edge of the
 * parameter space (a threshold model whose likelihood is unbounded as the threshold approaches the
 * smallest value, or whose threshold runs off to -∞). There is no maximum-likelihood estimate, so
 * this is not a fit: it is never ranked, tested, or used for a decision number.
 */
export interface NoInteriorMaximum {
  readonly ok: false;
  readonly kind: 'no-interior-maximum';
  readonly family: FamilyName;
  /** What happened and what applies instead, in plain words. */
  readonly reason: string;
  readonly offendingCount: 0;
  /** Where the likelihood keeps rising. */
  readonly edge: 'threshold-at-smallest-value' | 'threshold-to-minus-infinity';
}

export type FitOutcome = FitSuccess | NotApplicable | NoInteriorMaximum;

export interface Family {
  readonly name: FamilyName;
  /** Display name, e.g. "Weibull". */
  readonly label: string;
  /** Parameter names in display order. */
  readonly parameterNames: readonly string[];
  readonly parameterBounds: Readonly<Record<string, ParameterBound>>;
  /** Number of parameters estimated from the data (m in the chi-square dof k - 1 - m). */
  readonly estimatedParameters: number;
  /** Validate and build a distribution; throws ParameterError on bad parameters. */
  make(parameters: Parameters): Distribution;
  /** null when the family can be fitted to this sample, else the reason. */
  applicable(sample: Sample): NotApplicable | null;
  /** Maximum-likelihood fit of a complete sample. Never throws for applicable data. */
  fit(sample: Sample): FitOutcome;
  /** n random variates, for the parametric bootstrap. */
  random(parameters: Parameters, rng: Rng, n: number): Float64Array;
}
