/**
 * Numerical derivatives by central differences with steps scaled to each coordinate
 * (h = ε^(1/3)·max(|x|, 1) for the gradient, ε^(1/4)·max(|x|, 1) for the Hessian: the steps that
 * balance truncation and rounding error for second-order formulas; Nocedal & Wright 2006,
 * "Numerical Optimization", §8.1).
 */
export type Objective = (x: Float64Array) => number;

const GRAD_STEP = Math.cbrt(Number.EPSILON);
const HESS_STEP = Math.pow(Number.EPSILON, 0.25);

function step(x: number, base: number): number {
  const h = base * Math.max(Math.abs(x), 1);
  // Make x + h exactly representable so the difference quotient uses the true step.
  const t = x + h;
  return t - x;
}

/** Central-difference gradient of f at x. Returns NaN entries where f is not finite nearby. */
export function numericalGradient(f: Objective, x: ArrayLike<number>, scale = 1): Float64Array {
  const n = x.length;
  const p = Float64Array.from(x as ArrayLike<number>);
  const g = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const xi = p[i] as number;
    const h = step(xi, GRAD_STEP * scale);
    p[i] = xi + h;
    const fp = f(p);
    p[i] = xi - h;
    const fm = f(p);
    p[i] = xi;
    g[i] = (fp - fm) / (2 * h);
  }
  return g;
}

/**
 * Central-difference Hessian of f at x (symmetric n×n, row-major Float64Array). Diagonal terms by
 * the three-point formula, off-diagonal by the four-point formula.
 */
export function numericalHessian(f: Objective, x: ArrayLike<number>, scale = 1): Float64Array {
  const n = x.length;
  const p = Float64Array.from(x as ArrayLike<number>);
  const H = new Float64Array(n * n);
  const f0 = f(p);
  const h = new Float64Array(n);
  for (let i = 0; i < n; i++) h[i] = step(p[i] as number, HESS_STEP * scale);
  for (let i = 0; i < n; i++) {
    const xi = p[i] as number;
    const hi = h[i] as number;
    p[i] = xi + hi;
    const fp = f(p);
    p[i] = xi - hi;
    const fm = f(p);
    p[i] = xi;
    H[i * n + i] = (fp - 2 * f0 + fm) / (hi * hi);
    for (let j = 0; j < i; j++) {
      const xj = p[j] as number;
      const hj = h[j] as number;
      p[i] = xi + hi;
      p[j] = xj + hj;
      const fpp = f(p);
      p[j] = xj - hj;
      const fpm = f(p);
      p[i] = xi - hi;
      const fmm = f(p);
      p[j] = xj + hj;
      const fmp = f(p);
      p[i] = xi;
      p[j] = xj;
      const v = (fpp - fpm - fmp + fmm) / (4 * hi * hj);
      H[i * n + j] = v;
      H[j * n + i] = v;
    }
  }
  return H;
}
