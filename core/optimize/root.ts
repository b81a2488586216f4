/**
 * Brent's bracketed root finder for the profile-likelihood intervals and the threshold profiles:
 * a thin adapter over `findRoot` in core/special (Brent 1973, "Algorithms for Minimization without
 * Derivatives", ch. 4), not a second implementation. The contract differs in two ways only:
 * - the caller may pass f at the bracket ends when it already has them (each evaluation here is a
 *   full inner maximisation), so they are not computed again;
 * - tolerances are given Brent-style (`rtol` relative, `xtol` absolute) and mapped onto findRoot's.
 */
import { findRoot } from '../special/index.js';

export interface RootResult {
  readonly x: number;
  readonly iterations: number;
  readonly converged: boolean;
}

export function brentRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  opts: { xtol?: number; rtol?: number; maxIterations?: number; fa?: number; fb?: number } = {},
): RootResult {
  const fa = opts.fa;
  const fb = opts.fb;
  const g = fa === undefined && fb === undefined ? f : (x: number): number => (x === a && fa !== undefined ? fa : x === b && fb !== undefined ? fb : f(x));
  const lower = Math.min(a, b);
  const upper = Math.max(a, b);
  const r = findRoot(g, lower, upper, {
    // findRoot's step tolerance is 2ε|x| + ½·max(absTol, relTol·|x|); Brent's is 2·rtol·|x| + ½·xtol.
    relTol: 4 * (opts.rtol ?? 4 * Number.EPSILON),
    absTol: opts.xtol ?? 0,
    maxIterations: opts.maxIterations,
  });
  return { x: r.root, iterations: r.iterations, converged: r.converged };
}
