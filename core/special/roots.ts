/**
 * Bracketed root finding for the fitting and goodness-of-fit code.
 *
 * - findRoot: Brent's method (Brent, R. P. (1973), "Algorithms for Minimization without
 *   Derivatives", Prentice-Hall, ch. 4, procedure zero): inverse quadratic interpolation or secant
 *   steps, falling back to bisection whenever they would not shrink the bracket fast enough, so it
 *   never takes more than about (log2(width/tol))² evaluations and usually far fewer.
 * - newtonBracketed: Newton's method on a bracket kept by the signs of f (Numerical Recipes, 3rd
 *   ed., §9.4 "rtsafe"): a bisection step replaces any Newton step that would leave the bracket or
 *   that does not halve the step before last.
 * Both throw BracketError (code 'not-computable') if f(lower) and f(upper) do not differ in sign.
 */
import { PlumblineError } from '../errors.js';

export interface RootOptions {
  /** Relative tolerance on the root (default 1e-12). */
  relTol?: number;
  /** Absolute tolerance on the root, for roots at or near 0 (default 0: relative only, plus 4 ulps). */
  absTol?: number;
  /** Maximum number of iterations (default 200). */
  maxIterations?: number;
}

export interface RootResult {
  /** The best estimate of the root. */
  root: number;
  /** Function evaluations after the two at the bracket ends (Brent) or iterations (Newton). */
  iterations: number;
  /** Whether the tolerance was met (false: the iteration limit was reached; root is the best so far). */
  converged: boolean;
  /** f at the original lower end. */
  fLower: number;
  /** f at the original upper end. */
  fUpper: number;
  /** f at the returned root. */
  fRoot: number;
}

/** The interval given to a root finder does not bracket a root (f has the same sign at both ends). */
export class BracketError extends PlumblineError {
  readonly lower: number;
  readonly upper: number;
  readonly fLower: number;
  readonly fUpper: number;
  constructor(lower: number, upper: number, fLower: number, fUpper: number) {
    super(
      'not-computable',
      `root finder: [${String(lower)}, ${String(upper)}] does not bracket a root (f = ${String(fLower)} and ${String(fUpper)}).`,
    );
    this.name = 'BracketError';
    this.lower = lower;
    this.upper = upper;
    this.fLower = fLower;
    this.fUpper = fUpper;
  }
}

const EPS = 2.220446049250313e-16;

function checkBracket(lower: number, upper: number, fl: number, fu: number): void {
  if (!(lower < upper) || Number.isNaN(fl) || Number.isNaN(fu) || (fl > 0 && fu > 0) || (fl < 0 && fu < 0)) {
    throw new BracketError(lower, upper, fl, fu);
  }
}

/** Brent's method on [lower, upper]; f(lower) and f(upper) must differ in sign (or one be 0). */
export function findRoot(f: (x: number) => number, lower: number, upper: number, opts: RootOptions = {}): RootResult {
  const relTol = opts.relTol ?? 1e-12;
  const absTol = opts.absTol ?? 0;
  const maxIter = opts.maxIterations ?? 200;
  const fLower = f(lower);
  const fUpper = f(upper);
  checkBracket(lower, upper, fLower, fUpper);
  if (fLower === 0) return { root: lower, iterations: 0, converged: true, fLower, fUpper, fRoot: 0 };
  if (fUpper === 0) return { root: upper, iterations: 0, converged: true, fLower, fUpper, fRoot: 0 };
  // Brent (1973), procedure zero: b is the best estimate, a the previous one, c the contrapoint.
  let a = lower;
  let b = upper;
  let fa = fLower;
  let fb = fUpper;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let it = 1; it <= maxIter; it++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * EPS * Math.abs(b) + 0.5 * Math.max(absTol, relTol * Math.abs(b));
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) {
      return { root: b, iterations: it - 1, converged: true, fLower, fUpper, fRoot: fb };
    }
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s; // secant
        q = 1 - s;
      } else {
        const qq = fa / fc; // inverse quadratic interpolation
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return { root: b, iterations: maxIter, converged: false, fLower, fUpper, fRoot: fb };
}

/** What `newtonBracketed` needs at x: the value and the derivative of f. */
export interface ValueAndDerivative {
  f: number;
  df: number;
}

/**
 * Newton's method kept inside [lower, upper] (f must change sign there), starting at x0 (clamped
 * into the bracket; the midpoint if omitted or not finite). `fdf` may return the same object each
 * time to avoid allocation.
 */
export function newtonBracketed(
  fdf: (x: number) => ValueAndDerivative,
  lower: number,
  upper: number,
  x0?: number,
  opts: RootOptions = {},
): RootResult {
  const relTol = opts.relTol ?? 1e-12;
  const absTol = opts.absTol ?? 0;
  const maxIter = opts.maxIterations ?? 200;
  const fLower = fdf(lower).f;
  const fUpper = fdf(upper).f;
  checkBracket(lower, upper, fLower, fUpper);
  if (fLower === 0) return { root: lower, iterations: 0, converged: true, fLower, fUpper, fRoot: 0 };
  if (fUpper === 0) return { root: upper, iterations: 0, converged: true, fLower, fUpper, fRoot: 0 };
  // Orient so that f(lo) < 0 < f(hi).
  let lo = fLower < 0 ? lower : upper;
  let hi = fLower < 0 ? upper : lower;
  let x = x0 !== undefined && Number.isFinite(x0) ? Math.min(Math.max(x0, lower), upper) : 0.5 * (lower + upper);
  let dxOld = Math.abs(upper - lower);
  let dx = dxOld;
  let r = fdf(x);
  let fx = r.f;
  let dfx = r.df;
  for (let it = 1; it <= maxIter; it++) {
    if (fx === 0) return { root: x, iterations: it - 1, converged: true, fLower, fUpper, fRoot: 0 };
    const newtonOut = ((x - hi) * dfx - fx) * ((x - lo) * dfx - fx) > 0 || !Number.isFinite(dfx) || dfx === 0;
    if (newtonOut || Math.abs(2 * fx) > Math.abs(dxOld * dfx)) {
      dxOld = dx;
      dx = 0.5 * (hi - lo);
      x = lo + dx;
    } else {
      dxOld = dx;
      dx = fx / dfx;
      x -= dx;
    }
    const tol = Math.max(absTol, relTol * Math.abs(x), 4 * EPS * Math.abs(x));
    r = fdf(x);
    fx = r.f;
    dfx = r.df;
    if (Math.abs(dx) <= tol) return { root: x, iterations: it, converged: true, fLower, fUpper, fRoot: fx };
    if (fx < 0) lo = x;
    else hi = x;
    if (Math.abs(hi - lo) <= tol) return { root: x, iterations: it, converged: true, fLower, fUpper, fRoot: fx };
  }
  return { root: x, iterations: maxIter, converged: false, fLower, fUpper, fRoot: fx };
}
