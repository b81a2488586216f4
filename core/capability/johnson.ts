/**
 * Johnson's system of transformations to normality (Johnson 1949, Biometrika 36:149-176),
 *   z = γ + δ·f((x - ξ)/λ),   SU: f(u) = asinh u;  SB: f(u) = ln(u/(1 - u)), ξ < x < ξ + λ;
 *   SL: z = γ + δ·ln(x - ξ), x > ξ (λ absorbed in γ),
 * chosen and fitted by the percentile method of Slifker & Shapiro (1980, Technometrics 22:239-246):
 * for a chosen ζ > 0 take the sample quantiles x₋₃ζ, x₋ζ, xζ, x₃ζ at the probabilities Φ(-3ζ),
 * Φ(-ζ), Φ(ζ), Φ(3ζ), with m = x₃ζ - xζ, n = x₋ζ - x₋₃ζ, p = xζ - x₋ζ:
 *   mn/p² > 1 → SU,  < 1 → SB,  = 1 → SL,
 * and the parameters solve the four percentile equations z(x_q) = q exactly (SL: three of them):
 *   SU: δ = 2ζ / acosh(½(m/p + n/p)),  γ = δ·asinh((n/p - m/p) / (2√(mn/p² - 1))),
 *       λ = 2p√(mn/p² - 1) / ((m/p + n/p - 2)√(m/p + n/p + 2)),
 *       ξ = (xζ + x₋ζ)/2 + p(n/p - m/p) / (2(m/p + n/p - 2));
 *   SB: δ = ζ / acosh(½√((1 + p/m)(1 + p/n))),
 *       γ = δ·asinh((p/n - p/m)√((1 + p/m)(1 + p/n) - 4) / (2(p²/mn - 1))),
 *       λ = p√(((1 + p/m)(1 + p/n) - 2)² - 4) / (p²/mn - 1),
 *       ξ = (xζ + x₋ζ)/2 - λ/2 + p(p/n - p/m) / (2(p²/mn - 1));
 *   SL: δ = 2ζ / ln(m/p),  γ = δ·ln((m/p - 1) / (p√(m/p))),  ξ = (xζ + x₋ζ)/2 - (p/2)(m/p + 1)/(m/p - 1)
 * (the equations as recalled from the paper [from memory]: no readable copy of the paper or of a
 * worked example from it was found, test/capability/worked-example.test.ts; each fit is checked in
 * the tests by putting the four quantiles back through z(x), against a numerical solution of the
 * four percentile equations, and against SciPy's johnsonsu/johnsonsb).
 * Sample quantiles: position nP + ½ with linear interpolation between order statistics (NumPy's
 * 'hazen' rule). ζ = 0.524 (so 3ζ ≈ 1.57 and the outer quantiles are the 5.8 % and 94.2 % points;
 * common practice, no source). SL is chosen when |mn/p² - 1| ≤ SL_TOLERANCE (common practice, no
 * source), since an exact 1 does not occur in data, and m/p > 1 (SL's long tail is the upper one; a
 * left-skewed sample near the boundary gets SU or SB by the ratio instead).
 */
import { InputError, PlumblineError } from '../errors.js';
import { normalCdf, normalQuantile } from '../special/index.js';

export type JohnsonType = 'SU' | 'SB' | 'SL';

export interface JohnsonParameters {
  readonly type: JohnsonType;
  /** γ: shape (location of z). */
  readonly gamma: number;
  /** δ > 0: shape (scale of z). */
  readonly delta: number;
  /** ξ: location (SB, SL: the lower end of the support). */
  readonly xi: number;
  /** λ > 0: scale (SB: the width of the support); 1 for SL. */
  readonly lambda: number;
}

export interface JohnsonFit extends JohnsonParameters {
  readonly zeta: number;
  /** mn/p², the ratio that chose the type. */
  readonly ratio: number;
  /** The four sample quantiles x₋₃ζ, x₋ζ, xζ, x₃ζ. */
  readonly quantiles: readonly [number, number, number, number];
  readonly method: string;
}

export const JOHNSON_ZETA = 0.524;
export const SL_TOLERANCE = 0.01;

/** Sample quantile at probability P by position nP + ½ (linear interpolation, clamped to the extremes). */
export function hazenQuantile(sorted: ArrayLike<number>, prob: number): number {
  const n = sorted.length;
  const pos = n * prob + 0.5; // 1-based position
  if (pos <= 1) return sorted[0] as number;
  if (pos >= n) return sorted[n - 1] as number;
  const i = Math.floor(pos);
  const f = pos - i;
  const a = sorted[i - 1] as number;
  const b = sorted[i] as number;
  return a + f * (b - a);
}

/** z of x under the fitted transformation (±∞ outside an SB/SL support). */
export function johnsonZ(p: JohnsonParameters, x: number): number {
  if (p.type === 'SU') return p.gamma + p.delta * Math.asinh((x - p.xi) / p.lambda);
  if (p.type === 'SL') {
    const d = x - p.xi;
    return d <= 0 ? Number.NEGATIVE_INFINITY : p.gamma + p.delta * Math.log(d);
  }
  const a = x - p.xi;
  const b = p.xi + p.lambda - x;
  if (a <= 0) return Number.NEGATIVE_INFINITY;
  if (b <= 0) return Number.POSITIVE_INFINITY;
  return p.gamma + p.delta * Math.log(a / b);
}

/** x of z: the inverse transformation. */
export function johnsonX(p: JohnsonParameters, z: number): number {
  const w = (z - p.gamma) / p.delta;
  if (p.type === 'SU') return p.xi + p.lambda * Math.sinh(w);
  if (p.type === 'SL') return p.xi + Math.exp(w);
  // logistic, written to avoid overflow for either sign of w
  const s = w >= 0 ? 1 / (1 + Math.exp(-w)) : Math.exp(w) / (1 + Math.exp(w));
  return p.xi + p.lambda * s;
}

/** ln f(x), the log density (for checks against SciPy). */
export function johnsonLogPdf(p: JohnsonParameters, x: number): number {
  const z = johnsonZ(p, x);
  if (!Number.isFinite(z)) return Number.NEGATIVE_INFINITY;
  const c = -0.5 * z * z - 0.5 * Math.log(2 * Math.PI) + Math.log(p.delta);
  if (p.type === 'SU') {
    const u = (x - p.xi) / p.lambda;
    return c - Math.log(p.lambda) - 0.5 * Math.log1p(u * u);
  }
  if (p.type === 'SL') return c - Math.log(x - p.xi);
  // dz/dx = δ λ / ((x - ξ)(ξ + λ - x))
  return c + Math.log(p.lambda) - Math.log(x - p.xi) - Math.log(p.xi + p.lambda - x);
}

export function johnsonCdf(p: JohnsonParameters, x: number): number {
  return normalCdf(johnsonZ(p, x));
}

export function johnsonSf(p: JohnsonParameters, x: number): number {
  return normalCdf(-johnsonZ(p, x));
}

/** The support (lower, upper) of the fitted model. */
export function johnsonSupport(p: JohnsonParameters): { readonly lower: number; readonly upper: number } {
  if (p.type === 'SU') return { lower: Number.NEGATIVE_INFINITY, upper: Number.POSITIVE_INFINITY };
  if (p.type === 'SL') return { lower: p.xi, upper: Number.POSITIVE_INFINITY };
  return { lower: p.xi, upper: p.xi + p.lambda };
}

/** Choose and fit the Johnson curve by Slifker & Shapiro's percentile method on sorted values. */
export function fitJohnson(sorted: ArrayLike<number>, zeta = JOHNSON_ZETA): JohnsonFit {
  const n = sorted.length;
  if (n < 8) throw new InputError('The Johnson percentile fit needs at least 8 values.', {}, 'not-computable');
  const q = [-3 * zeta, -zeta, zeta, 3 * zeta].map((z) => hazenQuantile(sorted, normalCdf(z))) as [number, number, number, number];
  const [x3m, x1m, x1, x3] = q;
  const m = x3 - x1;
  const nn = x1m - x3m;
  const p = x1 - x1m;
  if (!(m > 0 && nn > 0 && p > 0)) {
    throw new PlumblineError('not-computable', 'The Johnson percentile fit needs four distinct sample quantiles (too many tied values).');
  }
  const ratio = (m * nn) / (p * p);
  const mp = m / p;
  const np_ = nn / p;
  const mid = (x1 + x1m) / 2;
  const method = `Slifker & Shapiro (1980) percentile method, ζ = ${zeta}, quantiles at ${[-3 * zeta, -zeta, zeta, 3 * zeta].map((z) => (100 * normalCdf(z)).toFixed(2) + ' %').join(', ')}`;
  let par: JohnsonParameters;
  if (Math.abs(ratio - 1) <= SL_TOLERANCE && mp > 1) {
    const delta = (2 * zeta) / Math.log(mp);
    const gamma = delta * Math.log((mp - 1) / (p * Math.sqrt(mp)));
    const xi = mid - (p / 2) * ((mp + 1) / (mp - 1));
    par = { type: 'SL', gamma, delta, xi, lambda: 1 };
  } else if (ratio > 1) {
    const s = mp + np_;
    const r = Math.sqrt(ratio - 1);
    const delta = (2 * zeta) / Math.acosh(0.5 * s);
    const gamma = delta * Math.asinh((np_ - mp) / (2 * r));
    const lambda = (2 * p * r) / ((s - 2) * Math.sqrt(s + 2));
    const xi = mid + (p * (np_ - mp)) / (2 * (s - 2));
    par = { type: 'SU', gamma, delta, xi, lambda };
  } else {
    const pm = p / m;
    const pn = p / nn;
    const prod = (1 + pm) * (1 + pn);
    const e = pm * pn - 1;
    const delta = zeta / Math.acosh(0.5 * Math.sqrt(prod));
    const gamma = delta * Math.asinh(((pn - pm) * Math.sqrt(prod - 4)) / (2 * e));
    const lambda = (p * Math.sqrt((prod - 2) * (prod - 2) - 4)) / e;
    const xi = mid - lambda / 2 + (p * (pn - pm)) / (2 * e);
    par = { type: 'SB', gamma, delta, xi, lambda };
  }
  for (const v of [par.gamma, par.delta, par.xi, par.lambda]) {
    if (!Number.isFinite(v)) throw new PlumblineError('not-computable', `The Johnson ${par.type} percentile fit has no finite solution for these quantiles.`);
  }
  return { ...par, zeta, ratio, quantiles: q, method };
}

/** Quantile of the fitted model at probability P (lower tail). */
export function johnsonQuantile(p: JohnsonParameters, prob: number): number {
  return johnsonX(p, normalQuantile(prob));
}
