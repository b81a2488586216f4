/**
 * The generalised extreme value (GEV) family, parameters `location` (μ), `scale` (σ) and
 * `shape` (ξ), in the sign convention of Coles (2001, An Introduction to Statistical Modeling of
 * Extreme Values, §3.1.3):
 *   F(x) = exp(-t(x)),  t(x) = (1 + ξz)^(-1/ξ),  z = (x - μ)/σ,  1 + ξz > 0,
 * so ξ > 0 is a heavy (Fréchet-type) upper tail, ξ = 0 the Gumbel and ξ < 0 a bounded upper tail
 * at μ - σ/ξ. NOTE: many hydrology texts (and Hosking's L-moment papers) use κ = -ξ, and so does
 * SciPy's `genextreme`, whose shape c equals -ξ.
 *
 * Numerics: everything goes through h = ln(1 + ξz)/ξ = log1p(ξz)/ξ (→ z as ξ → 0, with full
 * relative accuracy for tiny ξ because log1p is exact to rounding), t = e^{-h}:
 *   ln f = -ln σ - (1 + ξ)h - e^{-h},  ln F = -e^{-h},  S = -expm1(-e^{-h}),  ln S = log1mexp(-e^{-h}).
 * Quantiles x = μ + σ·expm1(-ξ ln y)/ξ with y = -ln p (lower tail) or y = -log1p(-q) (upper
 * tail, isf), and -σ ln y at ξ = 0. Mean μ + σ(Γ(1-ξ) - 1)/ξ (ξ < 1) and variance
 * σ²(Γ(1-2ξ) - Γ(1-ξ)²)/ξ² (ξ < 1/2), written through lnΓ with expm1, and for |ξ| < 0.01 through
 * the series lnΓ(1-ξ) = γξ + Σ_{k≥2} ζ(k)ξ^k/k (Abramowitz & Stegun 6.1.33), which removes the
 * cancellation as ξ → 0.
 *
 * Fit: maximum likelihood with the maximiser of core/optimize (Nelder–Mead then Newton), in the
 * coordinates (μ from the median in units of the starting scale, ln σ, ln(ξ + 1)). The shape is
 * searched on ξ > -1: below -1 the likelihood is unbounded (Smith 1985, Biometrika 72:67-90), and
 * an estimate that runs onto that edge is reported as a failed fit. Otherwise the unconstrained
 * maximum is reported. On short records the shape is poorly determined and can take values that
 * extrapolate wildly (Martins & Stedinger 2000, Water Resources Research 36:737-744 [from memory]):
 * beyond the advisory ±0.5 (`shapeGuard`) the estimate carries a warning. A constraint |ξ| ≤ c is
 * applied only when asked for (`shapeConstraint`); when it binds, the fit says so, reports the
 * unconstrained shape beside the held one, and the return-level intervals are labelled as those
 * of the constrained model.
 * Starts: the Gumbel fit (ξ = 0) and the probability-weighted-moment estimate of Hosking, Wallis
 * & Wood (1985, Technometrics 27:251-261); the better likelihood wins.
 */
import { maximize, above, affine, between, LOG } from '../optimize/index.js';
import type { Rng } from '../random/index.js';
import type { Sample } from '../sample.js';
import { CompensatedSum } from '../compensated.js';
import { lnGamma, log1mexp } from '../special/index.js';
import { familyBasics } from './define.js';
import { EULER_GAMMA, gumbel, powerOfTwoRescale } from './gumbel.js';
import { POSITIVE, REAL } from './parameters.js';
import type { Distribution, Family, FitOutcome, FitSuccess, NotApplicable, Parameters } from './types.js';

const BOUNDS = Object.freeze({ location: REAL, scale: POSITIVE, shape: REAL });
/** Advisory size of the fitted shape: beyond |ξ| = 0.5 the estimate carries a warning (not a constraint). */
export const GEV_SHAPE_GUARD = 0.5;

// ζ(2..15) (mpmath, 20 digits).
const ZETA = [
  0, 0, 1.6449340668482264, 1.2020569031595943, 1.0823232337111382, 1.0369277551433699, 1.0173430619844491,
  1.0083492773819228, 1.0040773561979443, 1.0020083928260822, 1.0009945751278181, 1.0004941886041195,
  1.000246086553308, 1.0001227133475785, 1.0000612481350587, 1.000030588236307,
];

/** lnΓ(1 - a) for |a| small by its series (|a| ≤ 0.02: terms to a^15 reach double precision). */
function lnGamma1mSeries(a: number): number {
  let s = 0;
  let p = a;
  for (let k = 2; k <= 15; k++) {
    p *= a;
    s += ((ZETA[k] as number) * p) / k;
  }
  return EULER_GAMMA * a + s;
}

function lnGamma1m(a: number): number {
  return Math.abs(a) <= 0.02 ? lnGamma1mSeries(a) : lnGamma(1 - a);
}

/** h = log1p(ξz)/ξ, or z when ξ = 0; NaN outside the support (1 + ξz ≤ 0). */
function hOf(xi: number, z: number): number {
  if (xi === 0) return z;
  const u = xi * z;
  if (!(u > -1)) return Number.NaN;
  return Math.log1p(u) / xi;
}

class GevDistribution implements Distribution {
  readonly family = 'gev' as const;
  readonly parameters: Parameters;
  readonly support: { lower: number; upper: number };
  private readonly logScale: number;
  constructor(
    private readonly mu: number,
    private readonly sigma: number,
    private readonly xi: number,
  ) {
    this.parameters = Object.freeze({ location: mu, scale: sigma, shape: xi });
    this.logScale = Math.log(sigma);
    const end = mu - sigma / xi;
    this.support = Object.freeze({
      lower: xi > 0 ? end : Number.NEGATIVE_INFINITY,
      upper: xi < 0 ? end : Number.POSITIVE_INFINITY,
    });
  }
  /** h at x, or ±Infinity outside the support (-∞: below a lower end point, +∞: above an upper one). */
  private h(x: number): number {
    const z = (x - this.mu) / this.sigma;
    const h = hOf(this.xi, z);
    if (h === h) return h;
    return this.xi > 0 ? Number.NEGATIVE_INFINITY : Number.POSITIVE_INFINITY;
  }
  logPdf(x: number): number {
    if (x !== x) return Number.NaN;
    if (!Number.isFinite(x)) return Number.NEGATIVE_INFINITY;
    const h = this.h(x);
    if (!Number.isFinite(h)) return Number.NEGATIVE_INFINITY;
    return -this.logScale - (1 + this.xi) * h - Math.exp(-h);
  }
  pdf(x: number): number {
    return Math.exp(this.logPdf(x));
  }
  cdf(x: number): number {
    if (x !== x) return Number.NaN;
    return Math.exp(-Math.exp(-this.h(x)));
  }
  sf(x: number): number {
    if (x !== x) return Number.NaN;
    return -Math.expm1(-Math.exp(-this.h(x)));
  }
  logCdf(x: number): number {
    if (x !== x) return Number.NaN;
    return -Math.exp(-this.h(x));
  }
  logSf(x: number): number {
    if (x !== x) return Number.NaN;
    return log1mexp(-Math.exp(-this.h(x)));
  }
  /** x at y = -ln F (y > 0). */
  private fromY(y: number): number {
    const ly = Math.log(y);
    if (this.xi === 0) return this.mu - this.sigma * ly;
    return this.mu + (this.sigma * Math.expm1(-this.xi * ly)) / this.xi;
  }
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return Number.NaN;
    if (p === 0) return this.support.lower;
    if (p === 1) return this.support.upper;
    return this.fromY(-Math.log(p));
  }
  isf(q: number): number {
    if (!(q >= 0 && q <= 1)) return Number.NaN;
    if (q === 0) return this.support.upper;
    if (q === 1) return this.support.lower;
    return this.fromY(-Math.log1p(-q));
  }
  mean(): number {
    const xi = this.xi;
    if (xi >= 1) return Number.POSITIVE_INFINITY;
    if (xi === 0) return this.mu + EULER_GAMMA * this.sigma;
    // (Γ(1-ξ) - 1)/ξ = expm1(lnΓ(1-ξ))/ξ
    return this.mu + (this.sigma * Math.expm1(lnGamma1m(xi))) / xi;
  }
  variance(): number {
    const xi = this.xi;
    if (xi >= 0.5) return Number.POSITIVE_INFINITY;
    const s2 = this.sigma * this.sigma;
    if (xi === 0) return (Math.PI * Math.PI * s2) / 6;
    // Γ(1-2ξ) - Γ(1-ξ)² = Γ(1-ξ)²·expm1(D), D = lnΓ(1-2ξ) - 2 lnΓ(1-ξ) = Σ_{k≥2} ζ(k)(2^k - 2)ξ^k/k.
    let D: number;
    const g1 = lnGamma1m(xi);
    if (Math.abs(xi) <= 0.01) {
      D = 0;
      let p = xi;
      let two = 2;
      for (let k = 2; k <= 15; k++) {
        p *= xi;
        two *= 2;
        D += ((ZETA[k] as number) * (two - 2) * p) / k;
      }
    } else D = lnGamma(1 - 2 * xi) - 2 * g1;
    return (s2 * Math.exp(2 * g1) * Math.expm1(D)) / (xi * xi);
  }
}

const basics = familyBasics({ name: 'gev', label: 'GEV', bounds: BOUNDS, support: 'real', build: (p) => new GevDistribution(p.location, p.scale, p.shape) });
const { make } = basics;

function applicable(sample: Sample): NotApplicable | null {
  const na = basics.applicable(sample);
  if (na) return na;
  if (sample.n < 3) {
    return { ok: false, family: 'gev', reason: `the GEV model has 3 parameters and needs at least 3 values; the sample has ${sample.n}`, offendingCount: 0 };
  }
  return null;
}

/** ln L of a GEV model (compensated); -Infinity when a value lies outside the support. */
export function gevLogLikelihood(sorted: ArrayLike<number>, mu: number, sigma: number, xi: number): number {
  if (!(sigma > 0) || !Number.isFinite(mu) || !Number.isFinite(xi)) return Number.NEGATIVE_INFINITY;
  const n = sorted.length;
  const sum = new CompensatedSum();
  for (let i = 0; i < n; i++) {
    const h = hOf(xi, ((sorted[i] as number) - mu) / sigma);
    if (h !== h) return Number.NEGATIVE_INFINITY;
    const v = -(1 + xi) * h - Math.exp(-h);
    if (!Number.isFinite(v)) return Number.NEGATIVE_INFINITY;
    sum.add(v);
  }
  return -n * Math.log(sigma) + sum.value;
}

/**
 * Probability-weighted-moment start (Hosking, Wallis & Wood 1985 [from memory]), in their sign
 * convention k = -ξ: c = 2/(3 + τ₃) - ln 2/ln 3, k ≈ 7.8590c + 2.9554c²,
 * σ = λ₂k/((1 - 2^{-k})Γ(1 + k)), μ = λ₁ - σ(1 - Γ(1 + k))/k. Returns null when it fails.
 */
export function gevPwmStart(sorted: ArrayLike<number>): { location: number; scale: number; shape: number } | null {
  const n = sorted.length;
  if (n < 3) return null;
  let b0 = 0;
  let b1 = 0;
  let b2 = 0;
  for (let i = 0; i < n; i++) {
    const x = sorted[i] as number;
    b0 += x;
    b1 += (x * i) / (n - 1);
    b2 += (x * i * (i - 1)) / ((n - 1) * (n - 2));
  }
  b0 /= n;
  b1 /= n;
  b2 /= n;
  const l1 = b0;
  const l2 = 2 * b1 - b0;
  const l3 = 6 * b2 - 6 * b1 + b0;
  if (!(l2 > 0)) return null;
  const t3 = l3 / l2;
  const cc = 2 / (3 + t3) - Math.LN2 / Math.log(3);
  let k = 7.859 * cc + 2.9554 * cc * cc;
  k = Math.max(-0.45, Math.min(0.45, k));
  if (Math.abs(k) < 1e-8) k = 1e-8;
  const g = Math.exp(lnGamma(1 + k));
  const scale = (l2 * k) / (-Math.expm1(-k * Math.LN2) * g);
  const location = l1 - (scale * (1 - g)) / k;
  if (!(scale > 0) || !Number.isFinite(location)) return null;
  return { location, scale, shape: -k };
}

export interface GevFitOptions {
  /**
   * Advisory size of the shape (default 0.5): an estimate with |ξ| beyond it is reported as it is,
   * with a warning that it is poorly determined. It does not constrain the fit.
   */
  readonly shapeGuard?: number;
  /**
   * A constraint |ξ| ≤ c applied to the fit (none by default). When the maximum lies beyond it the
   * fit is refitted with ξ held at ±c, says so, and reports the unconstrained shape beside it.
   */
  readonly shapeConstraint?: number | null;
}

export interface GevFit extends FitSuccess {
  /** True when the estimate is held at a constraint or runs onto the ξ → -1 edge (a bound hit). */
  readonly shapeOnGuard: boolean;
  /** The advisory size (or the constraint, when one is applied). */
  readonly shapeGuard: number;
  /** The constraint |ξ| ≤ c applied, or null for the unconstrained maximum. */
  readonly shapeConstraint: number | null;
  /** The unconstrained maximum-likelihood shape, when a constraint held the reported one elsewhere. */
  readonly unconstrainedShape?: number;
  readonly warnings: readonly string[];
}

/** Below ξ = -1 the GEV likelihood is unbounded (Smith 1985); the search keeps ξ above it. */
const SHAPE_FLOOR = -1;

/** Maximum-likelihood GEV fit (see the file header); unconstrained unless `shapeConstraint` is given. */
export function fitGev(sample: Sample, opts: GevFitOptions = {}): GevFit | NotApplicable {
  const na = applicable(sample);
  if (na) return na;
  const guard = opts.shapeGuard ?? GEV_SHAPE_GUARD;
  if (!(guard > 0)) throw new RangeError(`fitGev: shapeGuard must be positive, got ${guard}`);
  const constraint = opts.shapeConstraint ?? null;
  if (constraint !== null && !(constraint > 0 && constraint <= 1)) throw new RangeError(`fitGev: shapeConstraint must lie in (0, 1], got ${constraint}`);
  const rs = powerOfTwoRescale(sample);
  if (rs) {
    // Magnitudes near the ends of the double range: fit x/2^k and scale back (see gumbel.ts).
    const r = fitGev(rs.sample, opts);
    if (!r.ok) return r;
    return {
      ...r,
      parameters: Object.freeze({
        location: (r.parameters.location as number) * rs.factor,
        scale: (r.parameters.scale as number) * rs.factor,
        shape: r.parameters.shape as number,
      }),
      logLikelihood: r.logLikelihood - sample.n * rs.log2 * Math.LN2,
      method: `${r.method} (fitted on x/2^${rs.log2})`,
    };
  }
  const xs = sample.sorted;
  const ll = (th: Float64Array): number => gevLogLikelihood(xs, th[0] as number, th[1] as number, th[2] as number);
  const starts: number[][] = [];
  const g = gumbel.fit(sample);
  if (g.ok) starts.push([g.parameters.location as number, g.parameters.scale as number, 0]);
  const pwm = gevPwmStart(xs);
  if (pwm) starts.push([pwm.location, pwm.scale, pwm.shape]);
  // Location measured from the median in units of the starting scale: the search, its numerical
  // derivatives and its stopping tests are then the same in any units (scale-free convergence).
  const spread = starts[0]?.[1] ?? (sample.max - sample.min);
  const locationTr = affine(xs[Math.floor(sample.n / 2)] as number, spread > 0 && Number.isFinite(spread) ? spread : 1);
  const maximise = (lo: number, hi: number | null) => {
    const shapeTr = hi === null ? above(lo) : between(lo, hi);
    let best: ReturnType<typeof maximize> | null = null;
    for (const s0 of starts) {
      const s = [s0[0] as number, s0[1] as number, hi === null ? Math.max(lo + 0.05, s0[2] as number) : Math.max(0.9 * lo, Math.min(0.9 * hi, s0[2] as number))];
      if (!Number.isFinite(ll(Float64Array.from(s)))) continue;
      const r = maximize(ll, s, { transforms: [locationTr, LOG, shapeTr], xtol: 1e-10 });
      if (!best || r.value > best.value) best = r;
    }
    return best;
  };
  const free = maximise(SHAPE_FLOOR, null);
  if (!free) {
    return { ok: false, family: 'gev', reason: 'no starting point gives a finite GEV likelihood', offendingCount: 0 };
  }
  let [mu, sigma, xi] = Array.from(free.x) as [number, number, number];
  let value = free.value;
  let converged = free.converged;
  let iterations = free.iterations;
  const warnings: string[] = [];
  let onGuard = false;
  let unconstrainedShape: number | undefined;
  const fmt = (v: number): string => String(Number(v.toPrecision(4)));
  if (xi < SHAPE_FLOOR + 1e-3) {
    onGuard = true;
    converged = false;
    warnings.push(
      `The GEV shape estimate ran onto its lower edge ξ = ${SHAPE_FLOOR}, below which the likelihood is unbounded (Smith 1985): there is no regular maximum, so treat this fit as failed; use the Gumbel model or a longer record.`,
    );
  } else if (constraint !== null && Math.abs(xi) > constraint) {
    const fixed = xi > 0 ? constraint : -constraint;
    const r = maximize((th) => gevLogLikelihood(xs, th[0] as number, th[1] as number, fixed), [mu, sigma], { transforms: [locationTr, LOG], xtol: 1e-10 });
    unconstrainedShape = xi;
    mu = r.x[0] as number;
    sigma = r.x[1] as number;
    xi = fixed;
    value = r.value;
    converged = r.converged;
    iterations += r.iterations;
    onGuard = true;
    warnings.push(
      `The GEV shape is held at the constraint ξ = ${fixed} (|ξ| ≤ ${constraint} was requested); the unconstrained maximum-likelihood shape is ${fmt(unconstrainedShape)}. ` +
        'The held value is not an estimate: return levels and their intervals are those of the constrained model.',
    );
  } else if (Math.abs(xi) > guard) {
    warnings.push(
      `The GEV shape estimate ξ = ${fmt(xi)} is beyond ±${guard}: on a short record the shape is poorly determined and long return levels rest mostly on it (Martins & Stedinger 2000, Water Resources Research 36:737-744 [from memory]). It is reported unconstrained; consider the Gumbel model, a longer record or a regional shape.`,
    );
  }
  if (sample.n < 25) {
    warnings.push(`Only ${sample.n} values: the GEV shape is poorly determined from a short record, and return levels far beyond the record depend mostly on it (common practice, no source).`);
  }
  const what = constraint === null ? `unconstrained (ξ > ${SHAPE_FLOOR})` : `with the shape constrained to |ξ| ≤ ${constraint}`;
  return {
    ok: true,
    family: 'gev',
    parameters: Object.freeze({ location: mu, scale: sigma, shape: xi }),
    logLikelihood: value,
    iterations,
    converged,
    method: `maximum likelihood (Nelder–Mead then Newton), ${what}${onGuard && constraint !== null ? '; shape held at the constraint' : ''}`,
    shapeOnGuard: onGuard,
    shapeGuard: constraint ?? guard,
    shapeConstraint: constraint,
    ...(unconstrainedShape !== undefined ? { unconstrainedShape } : {}),
    warnings,
  };
}

function fit(sample: Sample): FitOutcome {
  return fitGev(sample);
}

function random(parameters: Parameters, rng: Rng, n: number): Float64Array {
  const d = make(parameters);
  const mu = d.parameters.location as number;
  const sigma = d.parameters.scale as number;
  const xi = d.parameters.shape as number;
  const out = new Float64Array(n);
  // F⁻¹(U) with y = -ln U a standard exponential variate.
  for (let i = 0; i < n; i++) {
    const ly = Math.log(rng.exponential());
    out[i] = xi === 0 ? mu - sigma * ly : mu + (sigma * Math.expm1(-xi * ly)) / xi;
  }
  return out;
}

export const gev: Family = basics.family({ applicable, fit, random });
