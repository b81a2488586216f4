/**
 * Box–Cox power transformation with λ by maximum likelihood (Box & Cox 1964, JRSS B 26:211-252):
 *
 *   y(λ) = (x^λ - 1)/λ  (λ ≠ 0),   ln x  (λ = 0),   x > 0,
 *   ℓ(λ) = (λ - 1) Σ ln xᵢ - (n/2) ln σ̂²(λ),   σ̂²(λ) = Σ (yᵢ - ȳ)²/n,
 *
 * the profile log-likelihood of λ under y ~ Normal (constants dropped; the same function as SciPy's
 * `boxcox_llf`). λ̂ maximises ℓ; the 100(1 - α) % profile-likelihood interval is
 * { λ : ℓ(λ) ≥ ℓ(λ̂) - χ²₁,₁₋α / 2 } (as SciPy's `boxcox(x, alpha=...)`).
 *
 * Numerics: λ̂ is invariant to the scale of x (x → c·x only adds -n ln c to ℓ), so the work is done
 * on uᵢ = xᵢ/g with g the geometric mean (Σ ln uᵢ = 0) and ℓ is shifted back by -n ln g. y is
 * expm1(λ ln u)/λ, exact as λ → 0. The score dℓ/dλ = -n Σ(yᵢ - ȳ)(y'ᵢ - ȳ')/Σ(yᵢ - ȳ)², with
 * y' = dy/dλ = (ln u)²·g(λ ln u), g(t) = (t·eᵗ - expm1 t)/t² (series 1/2 + t/3 + t²/8 + t³/30 +
 * t⁴/144 + t⁵/840 near 0), is solved by Brent's method on a bracket grown from [-2, 2]; the
 * interval ends by Brent's method on ℓ(λ) - ℓ(λ̂) + q/2 on each side.
 */
import { CompensatedSum } from '../compensated.js';
import { InputError, PlumblineError } from '../errors.js';
import { chiSquareIsf, findRoot } from '../special/index.js';

/** y(λ) of one positive value. */
export function boxCoxTransform(x: number, lambda: number): number {
  if (!(x > 0)) return Number.NaN;
  const l = Math.log(x);
  return lambda === 0 ? l : Math.expm1(lambda * l) / lambda;
}

/** x from y(λ): (1 + λy)^(1/λ), exp(y) at λ = 0; 0 when 1 + λy ≤ 0 with λ > 0 (below the transform's range), ∞ when 1 + λy ≤ 0 with λ < 0. */
export function boxCoxInverse(y: number, lambda: number): number {
  if (lambda === 0) return Math.exp(y);
  const t = lambda * y;
  if (!(t > -1)) return lambda > 0 ? 0 : Number.POSITIVE_INFINITY;
  return Math.exp(Math.log1p(t) / lambda);
}

/** The range of y(λ) over x in (0, ∞): (-1/λ, ∞) for λ > 0, (-∞, -1/λ) for λ < 0, the real line at 0. */
export function boxCoxRange(lambda: number): { readonly lower: number; readonly upper: number } {
  if (lambda > 0) return { lower: -1 / lambda, upper: Number.POSITIVE_INFINITY };
  if (lambda < 0) return { lower: Number.NEGATIVE_INFINITY, upper: -1 / lambda };
  return { lower: Number.NEGATIVE_INFINITY, upper: Number.POSITIVE_INFINITY };
}

function dydLambdaFactor(t: number): number {
  if (Math.abs(t) < 1e-3) return 0.5 + t * (1 / 3 + t * (1 / 8 + t * (1 / 30 + t * (1 / 144 + t / 840))));
  return (t * Math.exp(t) - Math.expm1(t)) / (t * t);
}

/** The centred logarithms ln(xᵢ/g) of a positive sample and n ln g. */
export interface CentredLogs {
  readonly u: Float64Array;
  readonly nLogG: number;
}

export function centredLogs(values: ArrayLike<number>): CentredLogs {
  const n = values.length;
  const u = new Float64Array(n);
  const s = new CompensatedSum();
  for (let i = 0; i < n; i++) {
    const x = values[i] as number;
    if (!(x > 0) || !Number.isFinite(x)) {
      throw new InputError(`The Box–Cox transformation needs positive finite values (value ${i + 1} is ${String(x)}).`, { value: String(x) }, 'bad-input');
    }
    u[i] = Math.log(x);
    s.add(u[i] as number);
  }
  const m = s.value / n;
  for (let i = 0; i < n; i++) u[i] = (u[i] as number) - m;
  return { u, nLogG: s.value };
}

interface LlfPoint {
  readonly llf: number;
  readonly score: number;
}

/** ℓ(λ) of the centred logs (without the -n ln g shift) and its derivative. */
function evaluate(c: CentredLogs, lambda: number): LlfPoint {
  const { u } = c;
  const n = u.length;
  const sy = new CompensatedSum();
  const sd = new CompensatedSum();
  const y = new Float64Array(n);
  const d = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const l = u[i] as number;
    const t = lambda * l;
    y[i] = lambda === 0 ? l : Math.expm1(t) / lambda;
    d[i] = l * l * dydLambdaFactor(t);
    sy.add(y[i] as number);
    sd.add(d[i] as number);
  }
  const my = sy.value / n;
  const md = sd.value / n;
  const ss = new CompensatedSum();
  const sp = new CompensatedSum();
  for (let i = 0; i < n; i++) {
    const a = (y[i] as number) - my;
    ss.add(a * a);
    sp.add(a * ((d[i] as number) - md));
  }
  const v = ss.value / n;
  if (!(v > 0) || !Number.isFinite(v)) return { llf: Number.NaN, score: Number.NaN };
  return { llf: -0.5 * n * Math.log(v), score: (-n * sp.value) / ss.value };
}

/** SciPy's `boxcox_llf`: ℓ(λ) = (λ - 1) Σ ln x - (n/2) ln σ̂²(λ). */
export function boxCoxLogLikelihood(values: ArrayLike<number>, lambda: number): number {
  const c = centredLogs(values);
  return evaluate(c, lambda).llf - c.nLogG;
}

export interface BoxCoxFit {
  readonly lambda: number;
  /** ℓ(λ̂) on the original data (SciPy's boxcox_llf at λ̂). */
  readonly logLikelihood: number;
  /** Profile-likelihood interval for λ; an end that could not be reached within |λ| ≤ LAMBDA_LIMIT is null. */
  readonly lower: number | null;
  readonly upper: number | null;
  readonly confidence: number;
  readonly method: string;
}

/** λ is searched in [-LAMBDA_LIMIT, LAMBDA_LIMIT] (common practice, no source: beyond it the transform is not a useful model). */
export const LAMBDA_LIMIT = 20;

function bracketScore(c: CentredLogs): [number, number] {
  let lo = -2;
  let hi = 2;
  while (!(evaluate(c, lo).score > 0)) {
    if (lo <= -LAMBDA_LIMIT) throw new PlumblineError('not-computable', `The Box–Cox likelihood has no maximum with λ ≥ ${-LAMBDA_LIMIT}.`);
    hi = lo;
    lo = Math.max(2 * lo, -LAMBDA_LIMIT);
  }
  while (!(evaluate(c, hi).score < 0)) {
    if (hi >= LAMBDA_LIMIT) throw new PlumblineError('not-computable', `The Box–Cox likelihood has no maximum with λ ≤ ${LAMBDA_LIMIT}.`);
    lo = hi;
    hi = Math.min(2 * hi, LAMBDA_LIMIT);
  }
  return [lo, hi];
}

function lambdaOf(c: CentredLogs): number {
  const [lo, hi] = bracketScore(c);
  return findRoot((l) => evaluate(c, l).score, lo, hi, { relTol: 1e-13, absTol: 1e-14 }).root;
}

function checkSize(values: ArrayLike<number>): void {
  if (values.length < 3) throw new InputError('The Box–Cox transformation needs at least 3 values.', {}, 'not-computable');
}

/** λ̂ alone (for bootstrap replicates). */
export function fitBoxCoxLambda(values: ArrayLike<number>): number {
  checkSize(values);
  return lambdaOf(centredLogs(values));
}

/** λ̂ by maximum likelihood and its profile-likelihood interval at confidence 1 - alpha. */
export function fitBoxCox(values: ArrayLike<number>, alpha = 0.05): BoxCoxFit {
  checkSize(values);
  const c = centredLogs(values);
  const lambda = lambdaOf(c);
  const top = evaluate(c, lambda).llf;
  const drop = chiSquareIsf(alpha, 1) / 2;
  const g = (l: number): number => evaluate(c, l).llf - top + drop;
  const end = (dir: 1 | -1): number | null => {
    let step = 0.5;
    let inner = lambda;
    for (;;) {
      const outer = lambda + dir * step;
      if (Math.abs(outer) > LAMBDA_LIMIT) return null;
      const v = g(outer);
      if (!Number.isFinite(v)) return null;
      if (v < 0) return findRoot(g, Math.min(inner, outer), Math.max(inner, outer), { relTol: 1e-12, absTol: 1e-14 }).root;
      inner = outer;
      step *= 2;
    }
  };
  return {
    lambda,
    logLikelihood: top - c.nLogG,
    lower: end(-1),
    upper: end(1),
    confidence: 1 - alpha,
    method: 'Box–Cox (1964) λ by maximum likelihood of the normal model on y(λ); profile-likelihood interval ℓ(λ) ≥ ℓ(λ̂) - χ²₁/2',
  };
}
