/**
 * Special functions: the one public entry of core/special. One concept per file; see each file for
 * its algorithm and published source.
 */
export { erf, erfc, erfcx } from './erf.js';
export { normalCdf, normalLogCdf, normalLogPdf, normalLogSf, normalPdf, normalPdfOverCdf, normalSf } from './normal.js';
export { normalIsf, normalLogIsf, normalLogQuantile, normalQuantile } from './normal-quantile.js';
export { lnGamma, lnGamma1p, lnGammaStirlingCorrection } from './gamma-function.js';
export { digamma, trigamma } from './polygamma.js';
export { log1mexp, log1pexp, log1pmx, logAddExp, logSumExp } from './log-exp.js';

// PROVISIONAL (jstat) until core/special/incomplete-gamma.ts lands.
import jStat from 'jstat';
/** Regularized lower incomplete gamma P(a, x). */
export function gammaP(a: number, x: number): number {
  return jStat.lowRegGamma(a, x);
}
/** Regularized upper incomplete gamma Q(a, x). */
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
