/**
 * The noncentral t distribution with ν > 0 degrees of freedom (not necessarily whole) and
 * noncentrality δ: T = (Z + δ)/√(V/ν), Z standard normal, V ~ χ²_ν independent of Z. Used by the
 * EMA quantile intervals (ema-intervals.ts), whose normal-theory case is the exact noncentral-t
 * interval of a normal quantile (e.g. Stedinger 1983, J. Hydraul. Eng. 109(1):13-27 [from memory]).
 *
 * CDF by conditioning on V: P(T ≤ t) = E[Φ(t√(V/ν) − δ)], one integral over the χ²_ν density,
 * taken in s = ln V by the trapezoid rule. The integrand e^{s} f(e^{s}) Φ(·) is smooth and falls
 * off like exp(νs/2) on the left and doubly exponentially on the right, so the rule converges
 * geometrically in the step (Trefethen & Weideman 2014, SIAM Review 56(3):385-458, §5): the step is
 * a twentieth of the standard deviation of ln V (≈ √(2/ν), at most 1/20 for small ν) and the range
 * ends where the log integrand is 46 below its peak (e^{−46} ≈ 1e-20). Absolute error below 1e-12
 * against SciPy's `nct.cdf` on the fixture cases (test/flood/ema-intervals.test.ts), which is what
 * the interval needs (probabilities 0.005 … 0.995). Not meant for tail probabilities below 1e-12.
 *
 * Quantile by Brent's method on a bracket grown from the normal approximation
 * t ≈ δ + z √(1 + δ²/(2ν)) (e.g. Johnson, Kotz & Balakrishnan 1995, vol. 2, ch. 31 [from memory]).
 */
import { InputError } from '../errors.js';
import { findRoot, lnGamma, normalCdf, normalQuantile } from '../special/index.js';

function check(df: number): void {
  if (!(df > 0) || !Number.isFinite(df)) throw new InputError(`the noncentral t needs positive finite degrees of freedom (got ${String(df)})`, {}, 'bad-input');
}

/** P(T ≤ t) for T noncentral t(ν = df, δ = noncentrality). */
export function noncentralTCdf(t: number, df: number, noncentrality: number): number {
  check(df);
  if (t === Number.POSITIVE_INFINITY) return 1;
  if (t === Number.NEGATIVE_INFINITY) return 0;
  const half = df / 2;
  const c = half * Math.log(2) + lnGamma(half);
  // log of e^{s} f_χ²(e^{s}) = (ν/2) s − e^{s}/2 − c, peak at s = ln ν.
  const logW = (s: number): number => half * s - Math.exp(s) / 2 - c;
  const s0 = Math.log(df);
  const top = logW(s0);
  const h = Math.min(1, Math.sqrt(2 / df)) / 20;
  const scale = t / Math.sqrt(df);
  const term = (s: number): number => Math.exp(logW(s)) * normalCdf(scale * Math.exp(s / 2) - noncentrality);
  let sum = term(s0);
  for (let s = s0 + h; logW(s) > top - 46; s += h) sum += term(s);
  for (let s = s0 - h; logW(s) > top - 46; s -= h) sum += term(s);
  return Math.min(1, Math.max(0, sum * h));
}

/** The p-quantile of the noncentral t(ν = df, δ = noncentrality), 0 < p < 1. */
export function noncentralTQuantile(p: number, df: number, noncentrality: number): number {
  check(df);
  if (!(p > 0 && p < 1)) throw new InputError(`a quantile needs a probability in (0, 1) (got ${String(p)})`, {}, 'bad-input');
  const z = normalQuantile(p);
  const guess = noncentrality + z * Math.sqrt(1 + (noncentrality * noncentrality) / (2 * df));
  const f = (t: number): number => noncentralTCdf(t, df, noncentrality) - p;
  let step = Math.max(1, Math.abs(guess) * 0.1);
  let lo = guess - step;
  let hi = guess + step;
  for (let i = 0; i < 200 && f(lo) > 0; i++) {
    step *= 2;
    lo -= step;
  }
  step = Math.max(1, Math.abs(guess) * 0.1);
  for (let i = 0; i < 200 && f(hi) < 0; i++) {
    step *= 2;
    hi += step;
  }
  return findRoot(f, lo, hi, { relTol: 1e-10, absTol: 1e-12 }).root;
}
