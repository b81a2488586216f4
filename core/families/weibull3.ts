/**
 * Three-parameter Weibull: a `threshold` γ below which nothing fails, F(x) = 1 - exp(-((x - γ)/λ)^k)
 * for x > γ; parameters `shape` (k), `scale` (λ), `threshold` (γ). Every distribution function is
 * the two-parameter Weibull's at x - γ.
 *
 * Fit (maximum likelihood, complete samples), shared with the three-parameter lognormal
 * (`fitWithThreshold`, exported for lognormal3.ts):
 *  1. Profile over the threshold, kept below the smallest value m: for δ = m - γ on a log-spaced
 *     grid from 1e-8·R to 1e3·R (R = range of the data) the two-parameter fit of x - γ gives the
 *     profile log-likelihood (the shift has unit Jacobian).
 *  2. At the highest interior local maximum of the grid, the profile's slope is the threshold
 *     score ∂ ln L/∂γ at the conditional estimates (envelope theorem); its root in ln δ between the
 *     grid neighbours is found by Brent's method (a bracketed 1-D search). If the score does not
 *     change sign there, golden-section search on the profile and Newton polishing of all three
 *     parameters (core/optimize) are used instead.
 *  3. When the profile keeps rising as γ → m (no interior maximum: the Weibull likelihood is
 *     unbounded there when the shape is < 1), or keeps rising as γ → -∞ (no finite threshold),
 *     there is no maximum-likelihood estimate: the outcome is `NoInteriorMaximum` (not a fit), so
 *     it is never ranked, tested or used for a decision number. The log-likelihood at the end of
 *     the search grid is arbitrary (it grows without bound as the grid is extended), so no
 *     number from it is reported.
 * Smith (1985, Biometrika 72:67-90): for shape > 2 the estimate is regular; for 1 < shape ≤ 2 it
 * exists but its usual standard errors do not hold; for shape < 1 no local maximum need exist.
 * The Anderson–Darling p-value of a threshold model is by parametric bootstrap (no table).
 */
import type { Rng } from '../random/index.js';
import { kahanSum } from '../compensated.js';
import { prepareSample, type Sample } from '../sample.js';
import { below, brentRoot, maximize, LOG, type Transform } from '../optimize/index.js';
import { checkApplicable } from './applicability.js';
import { POSITIVE, REAL, readParameter } from './parameters.js';
import type { Distribution, Family, FamilyName, FitOutcome, FitSuccess, NoInteriorMaximum, NotApplicable, ParameterBound, Parameters } from './types.js';
import { weibull } from './weibull.js';

/** A two-parameter distribution moved right by `threshold`. */
class ShiftedDistribution implements Distribution {
  readonly support;
  constructor(
    readonly family: FamilyName,
    readonly parameters: Parameters,
    private readonly base: Distribution,
    private readonly threshold: number,
  ) {
    this.support = Object.freeze({ lower: threshold + base.support.lower, upper: threshold + base.support.upper });
  }
  pdf(x: number): number {
    return this.base.pdf(x - this.threshold);
  }
  logPdf(x: number): number {
    return this.base.logPdf(x - this.threshold);
  }
  cdf(x: number): number {
    return this.base.cdf(x - this.threshold);
  }
  sf(x: number): number {
    return this.base.sf(x - this.threshold);
  }
  logCdf(x: number): number {
    return this.base.logCdf(x - this.threshold);
  }
  logSf(x: number): number {
    return this.base.logSf(x - this.threshold);
  }
  quantile(p: number): number {
    return this.threshold + this.base.quantile(p);
  }
  isf(q: number): number {
    return this.threshold + this.base.isf(q);
  }
  mean(): number {
    return this.threshold + this.base.mean();
  }
  variance(): number {
    return this.base.variance();
  }
}

export interface ThresholdSpec {
  readonly name: FamilyName;
  readonly label: string;
  readonly base: Family;
  /** The base family's parameter names (without the threshold), in order. */
  readonly baseNames: readonly string[];
  readonly baseBounds: Readonly<Record<string, ParameterBound>>;
  /** Optimiser transforms for the base parameters. */
  readonly baseTransforms: readonly Transform[];
  /** ∂ ln L/∂γ at base parameters `p` and threshold γ (sorted data, all > γ). */
  thresholdScore(p: Parameters, sorted: Float64Array, threshold: number): number;
  /** Extra warnings from the fitted base parameters (e.g. the Weibull shape regime). */
  regimeWarnings(params: Parameters): string[];
}

const GRID_POINTS = 45;
const GRID_LO = 1e-8;
const GRID_HI = 1e3;

export function makeThreshold(spec: ThresholdSpec, parameters: Parameters): Distribution {
  const base: Record<string, number> = {};
  for (const k of spec.baseNames) base[k] = readParameter(spec.name, parameters, k, spec.baseBounds[k]!);
  const threshold = readParameter(spec.name, parameters, 'threshold', REAL);
  return new ShiftedDistribution(spec.name, Object.freeze({ ...base, threshold }), spec.base.make(base), threshold);
}

export function applicableThreshold(spec: ThresholdSpec, sample: Sample): NotApplicable | null {
  const na = checkApplicable(spec.name, spec.label, sample, 'real');
  if (na) return na;
  if (sample.n < 3 || sample.distinct < 3) {
    return {
      ok: false,
      family: spec.name,
      reason: `the ${spec.label} model has 3 parameters and needs at least 3 distinct values; the sample has ${sample.distinct}`,
      offendingCount: 0,
    };
  }
  return null;
}

function logLik3(spec: ThresholdSpec, sorted: Float64Array): (v: Float64Array) => number {
  return (v: Float64Array) => {
    const th = v[spec.baseNames.length] as number;
    if (!(th < (sorted[0] as number))) return Number.NEGATIVE_INFINITY;
    const p: Record<string, number> = { threshold: th };
    spec.baseNames.forEach((k, i) => (p[k] = v[i] as number));
    let d: Distribution;
    try {
      d = makeThreshold(spec, p);
    } catch {
      return Number.NEGATIVE_INFINITY;
    }
    const r = kahanSum(sorted, (x) => d.logPdf(x));
    return Number.isNaN(r) ? Number.NEGATIVE_INFINITY : r;
  };
}

/** The outcome when the profile keeps rising to an edge of the threshold's range. */
function noInteriorMaximum(spec: ThresholdSpec, smallest: number, where: 'min' | 'far'): NoInteriorMaximum {
  const reason =
    where === 'min'
      ? `The ${spec.label} likelihood has no interior maximum on these data: the likelihood is unbounded as the threshold approaches the smallest value (${String(smallest)}), so there is no maximum-likelihood estimate and the model is not ranked or tested. Use the two-parameter model, or a threshold chosen by another published method.`
      : `The ${spec.label} likelihood has no interior maximum on these data: it keeps increasing as the threshold moves far below the data (no finite threshold), so there is no maximum-likelihood estimate and the model is not ranked or tested. Use the two-parameter model.`;
  return {
    ok: false,
    kind: 'no-interior-maximum',
    family: spec.name,
    reason,
    offendingCount: 0,
    edge: where === 'min' ? 'threshold-at-smallest-value' : 'threshold-to-minus-infinity',
  };
}

export function fitWithThreshold(spec: ThresholdSpec, sample: Sample): FitOutcome {
  const na = applicableThreshold(spec, sample);
  if (na) return na;
  const xs = sample.sorted;
  const n = sample.n;
  const m = sample.min;
  const R = sample.max - sample.min;
  const shifted = new Float64Array(n);
  let evaluations = 0;
  const profileAt = (lnDelta: number): { ll: number; params: Parameters | null } => {
    evaluations++;
    const delta = Math.exp(lnDelta);
    const g = m - delta;
    for (let i = 0; i < n; i++) shifted[i] = (xs[i] as number) - g;
    // The smallest shifted value is exactly delta > 0 only up to rounding; guard it.
    if (!((shifted[0] as number) > 0)) return { ll: Number.NEGATIVE_INFINITY, params: null };
    // x - threshold can overflow for data near the largest double: that threshold is unusable.
    if (!Number.isFinite(shifted[n - 1] as number)) return { ll: Number.NEGATIVE_INFINITY, params: null };
    const f = spec.base.fit(prepareSample(shifted, { alreadySorted: true }));
    if (!f.ok || !Number.isFinite(f.logLikelihood)) return { ll: Number.NEGATIVE_INFINITY, params: null };
    return { ll: f.logLikelihood, params: f.parameters };
  };
  const a = Math.log(GRID_LO * R);
  const b = Math.log(GRID_HI * R);
  const us: number[] = [];
  const lls: number[] = [];
  for (let i = 0; i < GRID_POINTS; i++) {
    const u = a + ((b - a) * i) / (GRID_POINTS - 1);
    us.push(u);
    lls.push(profileAt(u).ll);
  }
  // Highest interior local maximum of the grid.
  let best = -1;
  for (let i = 1; i < GRID_POINTS - 1; i++) {
    const v = lls[i] as number;
    if (v >= (lls[i - 1] as number) && v >= (lls[i + 1] as number) && Number.isFinite(v) && (best < 0 || v > (lls[best] as number))) best = i;
  }
  const warnings: string[] = [];
  const baseFail = (where: 'min' | 'far'): FitOutcome => noInteriorMaximum(spec, m, where);
  const notEvaluable: NotApplicable = { ok: false, family: spec.name, reason: `the ${spec.label} likelihood could not be evaluated`, offendingCount: 0 };
  if (!lls.some(Number.isFinite)) return notEvaluable;
  if (best < 0) {
    const iMax = lls.indexOf(Math.max(...lls.filter(Number.isFinite)));
    return baseFail(iMax >= GRID_POINTS / 2 ? 'far' : 'min');
  }
  if ((lls[0] as number) > (lls[best] as number)) {
    warnings.push(
      `The ${spec.label} likelihood rises again, above this local maximum, as the threshold approaches the smallest value; the local maximum is reported (the usual practice for threshold models, Smith 1985).`,
    );
  }
  // The profile's slope in γ is the threshold score at the conditional estimates (envelope
  // theorem), so the maximum is the root of that score in ln δ, bracketed by the grid neighbours
  // of the best point and solved by Brent's method; golden-section search on the profile itself
  // is the fallback when the score does not change sign there.
  const scoreAt = (u: number): number => {
    const r = profileAt(u);
    if (!r.params) return Number.NaN;
    return spec.thresholdScore(r.params, xs, m - Math.exp(u));
  };
  let uStar = Number.NaN;
  let how = '';
  const sLo = scoreAt(us[best - 1] as number);
  const sHi = scoreAt(us[best + 1] as number);
  if (sLo * sHi < 0) {
    const root = brentRoot(scoreAt, us[best - 1] as number, us[best + 1] as number, { fa: sLo, fb: sHi, rtol: 1e-15, xtol: 1e-14 });
    uStar = root.x;
    how = `Brent root of the threshold score on the profile (${root.iterations} steps)`;
  }
  if (!Number.isFinite(uStar) || !(profileAt(uStar).ll >= (lls[best] as number))) {
    const gr = (Math.sqrt(5) - 1) / 2;
    let lo = us[best - 1] as number;
    let hi = us[best + 1] as number;
    let x1 = hi - gr * (hi - lo);
    let x2 = lo + gr * (hi - lo);
    let f1 = profileAt(x1).ll;
    let f2 = profileAt(x2).ll;
    for (let it = 0; it < 200 && hi - lo > 1e-10 * Math.max(1, Math.abs(lo)); it++) {
      if (f1 >= f2) {
        hi = x2;
        x2 = x1;
        f2 = f1;
        x1 = hi - gr * (hi - lo);
        f1 = profileAt(x1).ll;
      } else {
        lo = x1;
        x1 = x2;
        f1 = f2;
        x2 = lo + gr * (hi - lo);
        f2 = profileAt(x2).ll;
      }
    }
    uStar = 0.5 * (lo + hi);
    how = 'golden-section search on the profile';
  }
  const prof = profileAt(uStar);
  if (!prof.params) return notEvaluable;
  const ll = logLik3(spec, xs);
  let theta = Float64Array.from([...spec.baseNames.map((k) => prof.params![k] as number), m - Math.exp(uStar)]);
  let value = ll(theta);
  let converged = how.startsWith('Brent');
  let stop = 'score root';
  let extraIterations = 0;
  if (!converged) {
    // Newton polish of all three parameters when the score route was not available.
    const r = maximize(ll, theta, { transforms: [...spec.baseTransforms, below(m)], skipSimplex: true, xtol: 1e-11 });
    extraIterations = r.iterations;
    stop = r.reason;
    if (r.value >= value && Number.isFinite(r.value)) {
      theta = Float64Array.from(r.x);
      value = r.value;
      converged = r.converged;
    }
  }
  const params: Record<string, number> = {};
  spec.baseNames.forEach((k, i) => (params[k] = theta[i] as number));
  params.threshold = theta[spec.baseNames.length] as number;
  warnings.push(...spec.regimeWarnings(params));
  const out: FitSuccess = {
    ok: true,
    family: spec.name,
    parameters: Object.freeze(params),
    logLikelihood: value,
    iterations: evaluations + extraIterations,
    converged,
    method: `maximum likelihood: profile over the threshold kept below the smallest value (log grid, then ${how}${stop === 'score root' ? '' : `, then Newton polishing of all three parameters; stop: ${stop}`})`,
    ...(warnings.length > 0 ? { warnings } : {}),
  };
  return out;
}

export function randomThreshold(spec: ThresholdSpec, parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = makeThreshold(spec, parameters);
  const base: Record<string, number> = {};
  for (const k of spec.baseNames) base[k] = d.parameters[k] as number;
  const out = spec.base.random(base, rng, n);
  const th = d.parameters.threshold as number;
  for (let i = 0; i < n; i++) out[i] = (out[i] as number) + th;
  return out;
}

const SPEC: ThresholdSpec = {
  name: 'weibull3',
  label: 'three-parameter Weibull',
  base: weibull,
  baseNames: ['shape', 'scale'],
  baseBounds: { shape: POSITIVE, scale: POSITIVE },
  baseTransforms: [LOG, LOG],
  thresholdScore(p: Parameters, xs: Float64Array, g: number): number {
    // ∂/∂γ Σ [ln k - k ln λ + (k - 1) ln(x - γ) - ((x - γ)/λ)^k] = Σ [-(k - 1)/(x - γ) + (k/λ)((x - γ)/λ)^(k-1)].
    const k = p.shape as number;
    const lam = p.scale as number;
    let s = 0;
    for (let i = 0; i < xs.length; i++) {
      const y = (xs[i] as number) - g;
      s += -(k - 1) / y + (k / lam) * Math.exp((k - 1) * Math.log(y / lam));
    }
    return s;
  },
  regimeWarnings(p: Parameters): string[] {
    const k = p.shape as number;
    if (k <= 1) return [`Fitted shape ${k.toPrecision(4)} ≤ 1: the three-parameter Weibull likelihood is unbounded near the smallest value, and this local maximum may not be meaningful (Smith 1985).`];
    if (k <= 2) return [`Fitted shape ${k.toPrecision(4)} is between 1 and 2: the threshold estimate exists but the usual large-sample standard errors do not apply (Smith 1985); use bootstrap or profile-likelihood uncertainty.`];
    return [];
  },
};

/** The `Family` of a threshold model: the base family's parameters followed by `threshold`. */
export function thresholdFamily(spec: ThresholdSpec): Family {
  return Object.freeze({
    name: spec.name,
    label: spec.label,
    parameterNames: Object.freeze([...spec.baseNames, 'threshold']),
    parameterBounds: Object.freeze({ ...spec.baseBounds, threshold: REAL }),
    estimatedParameters: spec.baseNames.length + 1,
    make: (p: Parameters) => makeThreshold(spec, p),
    applicable: (s: Sample) => applicableThreshold(spec, s),
    fit: (s: Sample) => fitWithThreshold(spec, s),
    random: (p: Parameters, rng: Rng, n: number) => randomThreshold(spec, p, rng, n),
  });
}

export const weibull3: Family = thresholdFamily(SPEC);
