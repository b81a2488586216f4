/**
 * Inverses of the regularized incomplete gamma functions: x with P(a, x) = p, x with Q(a, x) = q.
 *
 * Method (after DiDonato & Morris 1986, ACM TOMS 12:377-393, §4-5): starting values from
 * - the leading term of the series, P ≈ x^a/Γ(a+1), which gives a lower bound for the root;
 * - Wilson & Hilferty's cube-root normal approximation (1931, PNAS 17:684-688),
 *   x ≈ a(1 − 1/(9a) + z/(3√a))³ with z the normal quantile of the tail probability (a ≥ 1);
 * - the upper-tail asymptote Q ≈ x^{a−1} e^{−x}/Γ(a) (A&S 6.5.32) solved by fixed-point steps;
 * the best of these (smallest residual) then polished by Halley's method on
 * g(u) = ln F(a, e^u) − ln target, u = ln x, with F the smaller tail (P if p ≤ q, else Q):
 *   g′ = ±h, g″ = ±h(a − x) − h², h = x·f(x)/F(x), f the gamma density;
 * each step safeguarded by the bracket that the residual signs have established (bisection in u
 * when the step leaves it). Working on ln x and ln F keeps every case from x = 1e-300 to 1e6 and
 * tail probabilities down to 1e-300 within a few iterations; stops at |Δu| ≤ 1e-13 (relative
 * 1e-13 in x, one cubically convergent step after the error is below 1e-5).
 */
import { lnGamma1p } from './gamma-function.js';
import { logGammaDensity, logGammaP, logGammaQ } from './incomplete-gamma.js';
import { normalLogIsf, normalLogQuantile } from './normal-quantile.js';

const MAX_ITER = 100;

/** Residual g(u) for the chosen tail. */
function residual(a: number, x: number, upper: boolean, logTarget: number): number {
  return (upper ? logGammaQ(a, x) : logGammaP(a, x)) - logTarget;
}

// The bracket [BR[0], BR[1]] in u = ln x established so far. Module state in a typed array: no
// closure and no boxed doubles, so a call allocates nothing.
const BR = new Float64Array(2);

/** Narrows the bracket with a residual g at u; s = +1 when g increases with u (P), −1 (Q). */
function note(u: number, g: number, s: number): void {
  if (s * g < 0) {
    if (u > (BR[0] as number)) BR[0] = u;
  } else if (u < (BR[1] as number)) BR[1] = u;
}

/** Solves F(a, x) = e^{logTarget} for x, F = Q if `upper` else P. */
function solve(a: number, logTarget: number, upper: boolean): number {
  const lnG1 = lnGamma1p(a);
  BR[0] = Number.NEGATIVE_INFINITY;
  BR[1] = Number.POSITIVE_INFINITY;
  const s = upper ? -1 : 1;
  // P(a, x) ≤ x^a/Γ(a+1) for every x (P = x^a/Γ(a+1)·₁F₁(a; a+1; −x), A&S 6.5.12, and ₁F₁ ≤ 1),
  // so x_s = (p Γ(a+1))^{1/a} is a lower bound for the root: it opens the bracket without an
  // evaluation (less a rounding margin). It is also the start when a < 1 or nothing beats it.
  const logP = upper ? Math.log1p(-Math.exp(logTarget)) : logTarget;
  const us = (logP + lnG1) / a;
  BR[0] = us - 1e-12 * Math.max(1, Math.abs(us));
  let bestU = us;
  let bestG = Number.POSITIVE_INFINITY;
  if (a < 1) {
    bestG = residual(a, Math.exp(us), upper, logTarget);
    if (Number.isFinite(bestG)) note(us, bestG, s);
    else bestG = Number.POSITIVE_INFINITY;
  }
  if (a >= 1) {
    const z = upper ? normalLogIsf(logTarget) : normalLogQuantile(logTarget);
    const t = 1 - 1 / (9 * a) + z / (3 * Math.sqrt(a));
    if (t > 0) {
      const u = Math.log(a * t * t * t);
      const g = residual(a, Math.exp(u), upper, logTarget);
      if (Number.isFinite(g)) {
        note(u, g, s);
        if (!(Math.abs(g) >= Math.abs(bestG))) {
          bestU = u;
          bestG = g;
        }
      }
    }
  }
  if (upper) {
    const c = -logTarget - (lnG1 - Math.log(a)); // −ln q − ln Γ(a)
    if (c > 1) {
      let x = c;
      for (let i = 0; i < 4; i++) x = c + (a - 1) * Math.log(x);
      if (x > 0) {
        const u = Math.log(x);
        const g = residual(a, x, upper, logTarget);
        if (Number.isFinite(g)) {
          note(u, g, s);
          if (!(Math.abs(g) >= Math.abs(bestG))) {
            bestU = u;
            bestG = g;
          }
        }
      }
    }
  }
  if (bestG === Number.POSITIVE_INFINITY) {
    bestU = us;
    bestG = residual(a, Math.exp(us), upper, logTarget);
    note(us, bestG, s);
  }
  let u = bestU;
  let g = bestG;
  for (let it = 0; it < MAX_ITER && g !== 0; it++) {
    const x = Math.exp(u);
    const h = Math.exp(logGammaDensity(a, x) + u - (g + logTarget)); // x f(x)/F(x)
    const d1 = s * h;
    const d2 = s * h * (a - x) - h * h;
    const newton = g / d1;
    const tol = 1e-15 * Math.max(1, Math.abs(u));
    if (!(Math.abs(newton) > tol)) break; // below the resolution of u (or h not finite)
    const c = (newton * d2) / (2 * d1);
    const step = Math.abs(c) < 0.5 ? newton / (1 - c) : newton; // Halley, or Newton if far off
    let next = u - step;
    const lo = BR[0] as number;
    const hi = BR[1] as number;
    if (!(next > lo && next < hi)) {
      // Left the bracket: bisect it; a half-open bracket is only left through rounding at the root.
      if (!(Number.isFinite(lo) && Number.isFinite(hi))) break;
      next = 0.5 * (lo + hi);
    }
    const moved = Math.abs(next - u);
    u = next;
    if (moved <= 1e-13 * Math.max(1, Math.abs(u)) && moved <= 1e-13) break; // cubic: error now ≪ 1e-13
    g = residual(a, Math.exp(u), upper, logTarget);
    if (!Number.isFinite(g)) break;
    note(u, g, s);
    if ((BR[1] as number) - (BR[0] as number) <= tol) break;
  }
  return Math.exp(u);
}

/** x ≥ 0 with P(a, x) = p (a > 0, 0 ≤ p ≤ 1); relative accuracy about 1e-13. */
export function gammaPInv(a: number, p: number): number {
  if (!(a > 0) || !(p >= 0 && p <= 1)) return Number.NaN;
  if (p === 0) return 0;
  if (p === 1) return Number.POSITIVE_INFINITY;
  return p <= 0.5 ? solve(a, Math.log(p), false) : solve(a, Math.log1p(-p), true);
}

/** x ≥ 0 with Q(a, x) = q (a > 0, 0 ≤ q ≤ 1), accurate for tiny q (no 1 − q is formed). */
export function gammaQInv(a: number, q: number): number {
  if (!(a > 0) || !(q >= 0 && q <= 1)) return Number.NaN;
  if (q === 0) return Number.POSITIVE_INFINITY;
  if (q === 1) return 0;
  return q <= 0.5 ? solve(a, Math.log(q), true) : solve(a, Math.log1p(-q), false);
}

/** x with ln P(a, x) = logP: the inverse from a log probability (logP ≤ 0). */
export function gammaPInvLog(a: number, logP: number): number {
  if (!(a > 0) || !(logP <= 0)) return Number.NaN;
  if (logP === Number.NEGATIVE_INFINITY) return 0;
  if (logP === 0) return Number.POSITIVE_INFINITY;
  return logP <= -Math.LN2 ? solve(a, logP, false) : solve(a, Math.log(-Math.expm1(logP)), true);
}

/** x with ln Q(a, x) = logQ: the upper-tail inverse from a log probability (logQ ≤ 0). */
export function gammaQInvLog(a: number, logQ: number): number {
  if (!(a > 0) || !(logQ <= 0)) return Number.NaN;
  if (logQ === Number.NEGATIVE_INFINITY) return Number.POSITIVE_INFINITY;
  if (logQ === 0) return 0;
  return logQ <= -Math.LN2 ? solve(a, logQ, true) : solve(a, Math.log(-Math.expm1(logQ)), false);
}
