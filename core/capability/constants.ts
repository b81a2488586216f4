/**
 * Control-chart constants for the within-subgroup sigma of normally distributed data.
 *
 * c4(n) = E[s]/σ for a subgroup of n (s with divisor n - 1), in closed form
 *   c4(n) = √(2/(n-1)) · Γ(n/2) / Γ((n-1)/2)
 * (computed in log space through ln Γ so that large n does not overflow).
 *
 * d2(n) = E[R]/σ, the mean range of n standard normal values:
 *   d2(n) = ∫ (1 - Φ(x)ⁿ - (1 - Φ(x))ⁿ) dx over the real line
 * (Tippett 1925, Biometrika 17:364-387), integrated here by composite Gauss–Legendre on [-12, 12]
 * (the integrand is below 1e-30 outside that range for the subgroup sizes used). 1 - Φ(x) is taken
 * as Φ(-x), never by subtraction.
 *
 * Checked against shared/references.md (SciPy): c4 = 0.797885, 0.886227, 0.921318, 0.939986 and
 * d2 = 1.128379, 1.692569, 2.058751, 2.325929 for n = 2..5, and against an independent SciPy
 * integration (scripts/fixtures/capability.py).
 */
import { CompensatedSum } from '../compensated.js';
import { InputError } from '../errors.js';
import { lnGamma, normalCdf } from '../special/index.js';

/** c4(n), n ≥ 2. */
export function c4(n: number): number {
  checkSize(n);
  return Math.exp(0.5 * Math.log(2 / (n - 1)) + lnGamma(n / 2) - lnGamma((n - 1) / 2));
}

// 10-point Gauss–Legendre nodes and weights on [-1, 1] (Abramowitz & Stegun 1964, Table 25.4).
const GL_X = [
  0.1488743389816312, 0.4333953941292472, 0.6794095682990244, 0.8650633666889845, 0.9739065285171717,
];
const GL_W = [
  0.2955242247147529, 0.2692667193099963, 0.219086362515982, 0.1494513491505806, 0.0666713443086881,
];

const d2Cache = new Map<number, number>();

/** d2(n), n ≥ 2. */
export function d2(n: number): number {
  checkSize(n);
  const cached = d2Cache.get(n);
  if (cached !== undefined) return cached;
  const integrand = (x: number): number => {
    const lower = normalCdf(x);
    const upper = normalCdf(-x);
    return 1 - Math.pow(lower, n) - Math.pow(upper, n);
  };
  // The integrand is even; integrate [0, 12] in 96 panels and double.
  const panels = 96;
  const h = 12 / panels;
  const sum = new CompensatedSum();
  for (let k = 0; k < panels; k++) {
    const mid = (k + 0.5) * h;
    for (let j = 0; j < GL_X.length; j++) {
      const dx = 0.5 * h * (GL_X[j] as number);
      const w = 0.5 * h * (GL_W[j] as number);
      for (const x of [mid - dx, mid + dx]) {
        sum.add(w * integrand(x));
      }
    }
  }
  const value = 2 * sum.value;
  d2Cache.set(n, value);
  return value;
}

const d3Cache = new Map<number, number>();

/**
 * d3(n) = sd(R)/σ, the standard deviation of the range of n standard normal values, from the second
 * moment of the range
 *   E[R²] = 2 ∫∫_{x<y} (1 - Φ(y)ⁿ - Φ(-x)ⁿ + (Φ(y) - Φ(x))ⁿ) dx dy
 * (David & Nagaraja 2003, Order Statistics, §4.2 [from memory]), d3 = √(E[R²] - d2²). Integrated with
 * y = x + w over x in [-9, 9] and w in [0, 13] by composite 10-point Gauss–Legendre on panels of
 * width 0.5 (the rule of d2); the integrand is P(min ≤ x, max ≥ x + w), below 1e-17 outside that
 * box for n ≤ 25. Checked against d3(2) = √(2(1 - 2/π)) (closed form) and a SciPy dblquad integration
 * (scripts/fixtures/capability-constants.py).
 */
export function d3(n: number): number {
  checkSize(n);
  const cached = d3Cache.get(n);
  if (cached !== undefined) return cached;
  const nodes = (a: number, b: number, panels: number): { x: number[]; w: number[] } => {
    const h = (b - a) / panels;
    const xs: number[] = [];
    const ws: number[] = [];
    for (let k = 0; k < panels; k++) {
      const mid = a + (k + 0.5) * h;
      for (let j = 0; j < GL_X.length; j++) {
        const dx = 0.5 * h * (GL_X[j] as number);
        const w = 0.5 * h * (GL_W[j] as number);
        xs.push(mid - dx, mid + dx);
        ws.push(w, w);
      }
    }
    return { x: xs, w: ws };
  };
  const gx = nodes(-9, 9, 36);
  const gw = nodes(0, 13, 26);
  const lower = gx.x.map((x) => normalCdf(x));
  const upperTail = gx.x.map((x) => normalCdf(-x));
  const sum = new CompensatedSum();
  for (let j = 0; j < gw.x.length; j++) {
    const w = gw.x[j] as number;
    const inner = new CompensatedSum();
    for (let i = 0; i < gx.x.length; i++) {
      const x = gx.x[i] as number;
      const fy = normalCdf(x + w);
      const g = 1 - Math.pow(fy, n) - Math.pow(upperTail[i] as number, n) + Math.pow(fy - (lower[i] as number), n);
      inner.add((gx.w[i] as number) * g);
    }
    sum.add((gw.w[j] as number) * inner.value);
  }
  const m2 = 2 * sum.value;
  const d = d2(n);
  const value = Math.sqrt(m2 - d * d);
  d3Cache.set(n, value);
  return value;
}

function checkSize(n: number): void {
  if (!Number.isInteger(n) || n < 2) {
    throw new InputError(`A subgroup must have at least 2 values for c4/d2 (got ${String(n)}).`, { value: String(n) }, 'bad-option');
  }
}
