/**
 * Chi-square distribution with k degrees of freedom through the incomplete gamma function:
 * F(x) = P(k/2, x/2), 1 − F(x) = Q(k/2, x/2) (Abramowitz & Stegun 26.4.19), each tail computed
 * directly; critical values from the inverse of Q.
 */
import { gammaP, gammaQ, logGammaP, logGammaQ } from './incomplete-gamma.js';
import { gammaQInv } from './incomplete-gamma-inverse.js';

/** P(X ≤ x) for X ~ χ²(dof). */
export function chiSquareCdf(x: number, dof: number): number {
  if (!(dof > 0) || Number.isNaN(x)) return Number.NaN;
  return x <= 0 ? 0 : gammaP(dof / 2, x / 2);
}

/** P(X > x) for X ~ χ²(dof), computed directly (no 1 − cdf). */
export function chiSquareSf(x: number, dof: number): number {
  if (!(dof > 0) || Number.isNaN(x)) return Number.NaN;
  return x <= 0 ? 1 : gammaQ(dof / 2, x / 2);
}

/** ln P(X ≤ x), finite where the cdf underflows. */
export function chiSquareLogCdf(x: number, dof: number): number {
  if (!(dof > 0) || Number.isNaN(x)) return Number.NaN;
  return x <= 0 ? Number.NEGATIVE_INFINITY : logGammaP(dof / 2, x / 2);
}

/** ln P(X > x), finite where the survival function underflows (large statistics). */
export function chiSquareLogSf(x: number, dof: number): number {
  if (!(dof > 0) || Number.isNaN(x)) return Number.NaN;
  return x <= 0 ? 0 : logGammaQ(dof / 2, x / 2);
}

/** Upper critical value: x with P(X > x) = alpha. */
export function chiSquareIsf(alpha: number, dof: number): number {
  if (!(dof > 0)) return Number.NaN;
  return 2 * gammaQInv(dof / 2, alpha);
}
