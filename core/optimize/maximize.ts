/**
 * Maximise a smooth function of a few parameters (a log-likelihood). The search runs in an
 * unconstrained space given by one Transform per parameter (log for a positive parameter, ...):
 * first Nelder–Mead for robustness from a rough start, then Newton polishing with a
 * central-difference Hessian and gradient, damped à la Levenberg–Marquardt when the Hessian is not
 * negative definite, with a backtracking line search (Nocedal & Wright 2006, ch. 3 and §8.1).
 * Stops when the Newton step is ≤ xtol relative to each coordinate (default 1e-10), or when the
 * predicted gain is below the rounding level of f (the surface allows no finer answer).
 */
import { numericalGradient, numericalHessian, type Objective } from './derivatives.js';
import { cholesky, choleskySolve } from './linalg.js';
import { nelderMead } from './nelder-mead.js';
import { fromFreeVector, toFreeVector, type Transform } from './transforms.js';

export interface MaximizeOptions {
  /** One transform per parameter (natural → free); identity where absent. */
  readonly transforms?: readonly Transform[];
  /** Relative tolerance on the parameters in the free space (default 1e-10). */
  readonly xtol?: number;
  /** Maximum Newton iterations after the simplex stage (default 100). */
  readonly maxIterations?: number;
  /** Skip the Nelder–Mead stage (when the start is already close, e.g. a warm start). */
  readonly skipSimplex?: boolean;
  /** Relative initial simplex step in the free space (default 0.1). */
  readonly initialStep?: number;
}

export type StopReason =
  | 'step below tolerance'
  | 'gain below rounding level'
  | 'iteration limit'
  | 'no ascent direction'
  | 'non-finite objective';

export interface MaximizeResult {
  /** Maximiser in the natural parameter space. */
  readonly x: Float64Array;
  /** The same point in the free (transformed) space. */
  readonly free: Float64Array;
  readonly value: number;
  /** Simplex iterations + Newton iterations. */
  readonly iterations: number;
  readonly converged: boolean;
  readonly reason: StopReason;
  /** Number of objective evaluations. */
  readonly evaluations: number;
}

export function maximize(f: (theta: Float64Array) => number, theta0: ArrayLike<number>, opts: MaximizeOptions = {}): MaximizeResult {
  const tr = opts.transforms;
  const xtol = opts.xtol ?? 1e-10;
  const maxIt = opts.maxIterations ?? 100;
  let evaluations = 0;
  const g: Objective = (z) => {
    evaluations++;
    const v = f(fromFreeVector(z, tr));
    return Number.isNaN(v) ? Number.NEGATIVE_INFINITY : v;
  };
  let z = toFreeVector(theta0, tr);
  for (let i = 0; i < z.length; i++) {
    if (!Number.isFinite(z[i] as number)) throw new RangeError(`maximize: start value #${i + 1} is outside its transform's range`);
  }
  let iterations = 0;
  let fz = g(z);
  if (!opts.skipSimplex) {
    const nm = nelderMead(g, z, { initialStep: opts.initialStep ?? 0.1, xtol: 1e-6, ftol: 1e-13 });
    iterations += nm.iterations;
    if (nm.value >= fz || !Number.isFinite(fz)) {
      z = nm.x;
      fz = nm.value;
    }
  }
  const done = (converged: boolean, reason: StopReason): MaximizeResult => ({
    x: fromFreeVector(z, tr),
    free: z,
    value: fz,
    iterations,
    converged,
    reason,
    evaluations,
  });
  if (!Number.isFinite(fz)) return done(false, 'non-finite objective');
  const n = z.length;
  let noiseSteps = 0;
  for (let it = 0; it < maxIt; it++) {
    iterations++;
    const grad = numericalGradient(g, z);
    const H = numericalHessian(g, z);
    // A = -H should be positive definite near a maximum; damp it until it is.
    const A = new Float64Array(n * n);
    let diagMax = 0;
    for (let i = 0; i < n * n; i++) A[i] = -(H[i] as number);
    for (let i = 0; i < n; i++) diagMax = Math.max(diagMax, Math.abs(A[i * n + i] as number));
    let lambda = 0;
    let L = cholesky(A, n);
    while (!L && lambda < 1e12 * Math.max(diagMax, 1)) {
      lambda = lambda === 0 ? 1e-8 * Math.max(diagMax, 1) : lambda * 10;
      const B = Float64Array.from(A);
      for (let i = 0; i < n; i++) B[i * n + i] = (B[i * n + i] as number) + lambda;
      L = cholesky(B, n);
    }
    if (!L || grad.some((v) => !Number.isFinite(v))) return done(false, 'no ascent direction');
    const d = choleskySolve(L, n, grad);
    let decrement = 0;
    for (let i = 0; i < n; i++) decrement += (d[i] as number) * (grad[i] as number);
    let relStep = 0;
    for (let i = 0; i < n; i++) relStep = Math.max(relStep, Math.abs(d[i] as number) / Math.max(Math.abs(z[i] as number), 1));
    const roundLevel = 8 * Number.EPSILON * Math.max(Math.abs(fz), 1);
    // Backtracking line search on f (accept any non-decrease). Near the optimum the predicted gain
    // falls below the rounding level of f, so f can no longer rank the points: there the full Newton
    // step (driven by the gradient, which still carries information) is taken as long as f does not
    // drop by more than rounding, for a few more iterations.
    const atNoise = lambda === 0 && decrement <= roundLevel;
    let t = 1;
    let accepted = false;
    let zNew = z;
    let fNew = fz;
    for (let k = 0; k < 60; k++) {
      const trial = new Float64Array(n);
      for (let i = 0; i < n; i++) trial[i] = (z[i] as number) + t * (d[i] as number);
      const ft = g(trial);
      if (ft >= fz || (atNoise && k === 0 && ft >= fz - roundLevel)) {
        zNew = trial;
        fNew = ft;
        accepted = true;
        break;
      }
      if (atNoise) break;
      t *= 0.5;
    }
    if (accepted) {
      z = zNew;
      fz = fNew;
    }
    if (lambda === 0 && relStep <= xtol) return done(true, 'step below tolerance');
    if (atNoise) {
      noiseSteps++;
      if (!accepted || noiseSteps >= 4) return done(true, 'gain below rounding level');
      continue;
    }
    if (!accepted) return done(false, 'no ascent direction');
  }
  return done(false, 'iteration limit');
}
