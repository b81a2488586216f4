/**
 * Special functions used by the families and the tests. PROVISIONAL implementations on jstat:
 * to be replaced by tail-accurate ones with the same signatures (see the core issue).
 */
import jStat from 'jstat';

/** ln Γ(x), x > 0. */
export function lnGamma(x: number): number {
  return jStat.gammaln(x);
}
/** ψ(x) = d/dx ln Γ(x), x > 0. */
export function digamma(x: number): number {
  let r = 0;
  while (x < 6) {
    r -= 1 / x;
    x += 1;
  }
  const f = 1 / (x * x);
  return r + Math.log(x) - 0.5 / x - f * (1 / 12 - f * (1 / 120 - f * (1 / 252 - f * (1 / 240 - f / 132))));
}
/** ψ'(x), x > 0. */
export function trigamma(x: number): number {
  let r = 0;
  while (x < 6) {
    r += 1 / (x * x);
    x += 1;
  }
  const f = 1 / (x * x);
  return r + 1 / x + f / 2 + (f / x) * (1 / 6 - f * (1 / 30 - f * (1 / 42 - f / 30)));
}
export function erf(x: number): number {
  return jStat.erf(x);
}
export function erfc(x: number): number {
  return jStat.erfc(x);
}
/** Standard normal cdf Φ(z). */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}
/** ln Φ(z), accurate for very negative z. */
export function normalLogCdf(z: number): number {
  return Math.log(normalCdf(z));
}
/** Standard normal quantile Φ⁻¹(p). */
export function normalQuantile(p: number): number {
  return jStat.normal.inv(p, 0, 1);
}
/** Regularized lower incomplete gamma P(a, x). */
export function gammaP(a: number, x: number): number {
  return jStat.lowRegGamma(a, x);
}
/** Regularized upper incomplete gamma Q(a, x) = 1 - P(a, x), computed directly. */
export function gammaQ(a: number, x: number): number {
  return 1 - jStat.lowRegGamma(a, x);
}
export function logGammaP(a: number, x: number): number {
  return Math.log(gammaP(a, x));
}
export function logGammaQ(a: number, x: number): number {
  return Math.log(gammaQ(a, x));
}
/** x with P(a, x) = p. */
export function gammaPInv(a: number, p: number): number {
  return jStat.gammapinv(p, a);
}
/** x with Q(a, x) = q. */
export function gammaQInv(a: number, q: number): number {
  return jStat.gammapinv(1 - q, a);
}
/** Upper tail of chi-square with `dof` degrees of freedom. */
export function chiSquareSf(x: number, dof: number): number {
  return x <= 0 ? 1 : gammaQ(dof / 2, x / 2);
}
/** Upper critical value: x with P(X > x) = alpha. */
export function chiSquareIsf(alpha: number, dof: number): number {
  return 2 * gammaQInv(dof / 2, alpha);
}
/** ln(1 - e^x) for x ≤ 0 (Mächler 2012, "Accurately computing log(1 - exp(-|a|))"). */
export function log1mexp(x: number): number {
  return x > -Math.LN2 ? Math.log(-Math.expm1(x)) : Math.log1p(-Math.exp(x));
}
