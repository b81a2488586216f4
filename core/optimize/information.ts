/**
 * Observed Fisher information -∇²ℓ at the maximum and its inverse (the asymptotic covariance of
 * the maximum-likelihood estimate), for Fisher-matrix (Wald) bounds (Lawless 2003, "Statistical
 * Models and Methods for Lifetime Data", 2nd ed., §B.2 and §4.1).
 */
import { numericalHessian } from './derivatives.js';
import { inverseSpd } from './linalg.js';

export interface ObservedInformation {
  /** -∇²ℓ in the natural parameters, row-major n×n. */
  readonly information: Float64Array;
  /** Its inverse, or null when the information is not positive definite (no Wald bounds). */
  readonly covariance: Float64Array | null;
  /** Standard errors √diag(covariance) (NaN where the covariance is not available). */
  readonly standardErrors: Float64Array;
  readonly n: number;
}

export function observedInformation(logLik: (theta: Float64Array) => number, theta: ArrayLike<number>): ObservedInformation {
  const n = theta.length;
  const H = numericalHessian(logLik, theta);
  const info = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) info[i] = -(H[i] as number);
  const cov = inverseSpd(info, n);
  const se = new Float64Array(n);
  for (let i = 0; i < n; i++) se[i] = cov ? Math.sqrt(cov[i * n + i] as number) : Number.NaN;
  return { information: info, covariance: cov, standardErrors: se, n };
}
