/**
 * Newton's method safeguarded by a one-sided or two-sided bracket, for the Weibull profile
 * equation. The function must be monotone on the bracket with one sign change.
 * A Newton step that leaves the bracket (or is not finite) is replaced by bisection in log space
 * (the unknown is a positive shape), so convergence is guaranteed; near the root the steps are
 * Newton's and converge quadratically.
 *
 * Why not core/special's `newtonBracketed`: that one needs a finite bracket and evaluates f at
 * both of its ends and again at the accepted root. For the Weibull profile equation every
 * evaluation is a pass over all n values (10^6 exp calls), the lower end is known analytically
 * and the upper end is unbounded; this variant takes neither end evaluation nor a confirming
 * one, about half the passes. The gamma shape (O(1) evaluations) uses `newtonBracketed`.
 */

export interface RootResult {
  readonly root: number;
  readonly iterations: number;
  readonly converged: boolean;
}

/** Evaluates f(x) into out[0] and f'(x) into out[1] (one pass over the data for both). */
export type ValueAndDerivative = (x: number, out: Float64Array) => void;

/**
 * Find the root of a monotone f in (lower, upper), 0 ≤ lower < upper ≤ ∞, starting from `start`.
 * `increasing` says whether f rises through its root. Stops when a step changes x by at most
 * `relTol`·x, or when the bracket has shrunk to that width.
 */
export function positiveRootNewton(
  f: ValueAndDerivative,
  lower: number,
  upper: number,
  start: number,
  increasing: boolean,
  relTol = 1e-12,
  maxIterations = 300,
): RootResult {
  const out = new Float64Array(2);
  let lo = lower;
  let hi = upper;
  let x = start > lo && start < hi ? start : fallback(lo, hi, start);
  for (let it = 1; it <= maxIterations; it++) {
    f(x, out);
    const fx = out[0] as number;
    const dfx = out[1] as number;
    if (fx === 0) return { root: x, iterations: it, converged: true };
    if (fx !== fx) return { root: x, iterations: it, converged: false };
    if (fx < 0 === increasing) lo = x;
    else hi = x;
    let next = x - fx / dfx;
    if (!(next > lo && next < hi)) next = fallback(lo, hi, x);
    if (Math.abs(next - x) <= relTol * next || (hi - lo) <= relTol * lo) {
      return { root: next, iterations: it, converged: true };
    }
    x = next;
  }
  return { root: x, iterations: maxIterations, converged: false };
}

/** A point strictly inside (lo, hi): geometric mean when both ends are finite and positive. */
function fallback(lo: number, hi: number, x: number): number {
  if (lo > 0 && hi < Number.POSITIVE_INFINITY) return Math.sqrt(lo * hi);
  if (hi === Number.POSITIVE_INFINITY) return 4 * Math.max(lo, x, Number.MIN_VALUE);
  return hi / 4; // lo = 0
}
