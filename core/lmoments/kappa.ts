/**
 * The four-parameter kappa distribution (Hosking 1994, IBM J. Res. Develop. 38:251-258), used by the
 * regional heterogeneity measure (Hosking & Wallis 1997, §4.3.3) to simulate homogeneous regions:
 *
 *   x(F) = ξ + (α/k)·[1 − ((1 − F^h)/h)^k]          (k ≠ 0, h ≠ 0; limits at k = 0 or h = 0)
 *
 * h = −1 is the generalized logistic, h = 0 the GEV, h = 1 the generalized Pareto. L-moments
 * (Hosking 1994): with g_r = r Γ(1+k) Γ(r/h) / (h^{1+k} Γ(1+k+r/h)) for h > 0,
 * g_r = r Γ(1+k) Γ(−k−r/h) / ((−h)^{1+k} Γ(1−r/h)) for h < 0, and g_r = Γ(1+k) r^{−k} at h = 0:
 *
 *   λ1 = ξ + α(1 − g1)/k,  λ2 = α(g1 − g2)/k,
 *   τ3 = (−g1 + 3g2 − 2g3)/(g1 − g2),  τ4 = (g1 − 6g2 + 10g3 − 5g4)/(g1 − g2).
 *
 * The Gamma ratios are taken in log space through Stirling's series where their arguments are
 * large (small |h|), so the formulas join the GEV limit smoothly.
 */
import { lnGamma, lnGammaStirlingCorrection, log1pmx } from '../special/index.js';

export interface KappaParameters {
  readonly location: number;
  readonly scale: number;
  /** k: the GEV-like shape (k > 0 bounded above). */
  readonly shape: number;
  /** h: the second shape (−1 generalized logistic, 0 GEV, 1 generalized Pareto). */
  readonly shape2: number;
}

/** ln Γ(a) − ln Γ(a + b), for a > 0 and a + b > 0; accurate for large a (Stirling's series). */
function lnGammaRatio(a: number, b: number): number {
  if (a < 10 || a + b < 10) return lnGamma(a) - lnGamma(a + b);
  return -b * Math.log(a) - a * log1pmx(b / a) - (b - 0.5) * Math.log1p(b / a) + lnGammaStirlingCorrection(a) - lnGammaStirlingCorrection(a + b);
}

/** Shapes closer to 0 than this are evaluated at ±this (the formulas divide by k). */
const K_NUDGE = 1e-7;

function nudged(k: number): number {
  return Math.abs(k) < K_NUDGE ? (k < 0 ? -K_NUDGE : K_NUDGE) : k;
}

/** g_1 … g_4 of Hosking (1994); NaN where the L-moments do not exist (k ≤ −1, or h < 0 with k ≥ −1/h). */
export function kappaG(k: number, h: number): [number, number, number, number] {
  const out: [number, number, number, number] = [Number.NaN, Number.NaN, Number.NaN, Number.NaN];
  if (!(k > -1)) return out;
  const lg = lnGamma(1 + k);
  for (let r = 1; r <= 4; r++) {
    let ln: number;
    if (h === 0) ln = lg - k * Math.log(r);
    else if (h > 0) {
      const a = r / h;
      ln = Math.log(r) + lg + lnGammaRatio(a, 1 + k) - (1 + k) * Math.log(h);
    } else {
      const a = -r / h;
      if (!(a - k > 0)) return out;
      ln = Math.log(r) + lg + lnGammaRatio(a - k, 1 + k) - (1 + k) * Math.log(-h);
    }
    out[r - 1] = Math.exp(ln);
  }
  return out;
}

/** τ3 and τ4 of the kappa with shapes k, h (NaN where they do not exist). */
export function kappaRatios(k: number, h: number): { readonly t3: number; readonly t4: number } {
  const [g1, g2, g3, g4] = kappaG(nudged(k), h);
  const d = g1 - g2;
  return { t3: (-g1 + 3 * g2 - 2 * g3) / d, t4: (g1 - 6 * g2 + 10 * g3 - 5 * g4) / d };
}

/** λ1 and λ2 of a kappa distribution. */
export function kappaLMoments(p: KappaParameters): { readonly l1: number; readonly l2: number; readonly t3: number; readonly t4: number } {
  const k = nudged(p.shape);
  const [g1, g2] = kappaG(k, p.shape2);
  const { t3, t4 } = kappaRatios(k, p.shape2);
  return { l1: p.location + (p.scale * (1 - g1)) / k, l2: (p.scale * (g1 - g2)) / k, t3, t4 };
}

/** The quantile x(F), 0 < F < 1. */
export function kappaQuantile(p: KappaParameters, f: number): number {
  const { location: xi, scale: a, shape: k, shape2: h } = p;
  // y = −ln((1 − F^h)/h), with its h = 0 limit −ln(−ln F).
  const y = h === 0 ? -Math.log(-Math.log(f)) : -Math.log(-Math.expm1(h * Math.log(f)) / h);
  return k === 0 ? xi + a * y : xi + (a / k) * -Math.expm1(-k * y);
}

/** Parameters with location and scale matching λ1 and λ2 for shapes k, h. */
export function kappaFromShapes(l1: number, l2: number, k: number, h: number): KappaParameters {
  const kk = nudged(k);
  const [g1, g2] = kappaG(kk, h);
  const scale = (l2 * kk) / (g1 - g2);
  return { location: l1 - (scale * (1 - g1)) / kk, scale, shape: k, shape2: h };
}

export type KappaFit =
  | { readonly ok: true; readonly parameters: KappaParameters; readonly iterations: number }
  | { readonly ok: false; readonly reason: string };

/** τ4 on the generalized logistic curve, (1 + 5τ3²)/6: no kappa has τ4 at or above it (Hosking 1994). */
export function logisticT4(t3: number): number {
  return (1 + 5 * t3 * t3) / 6;
}

/**
 * Fit the kappa to λ1, λ2, τ3, τ4 by Newton's method on (k, h) with a finite-difference Jacobian and
 * step halving, from several starts; converged when both ratios match to 1e-10 (they are
 * dimensionless, so the test is scale-free).
 */
export function fitKappa(l1: number, l2: number, t3: number, t4: number): KappaFit {
  if (!(l2 > 0) || !(Math.abs(t3) < 1)) return { ok: false, reason: 'the L-moments are not those of a distribution (λ2 ≤ 0 or |τ3| ≥ 1)' };
  if (!(t4 < logisticT4(t3))) return { ok: false, reason: `τ4 = ${t4.toPrecision(4)} is on or above the generalized logistic curve (${logisticT4(t3).toPrecision(4)}): no kappa distribution has these L-moments` };
  if (!(t4 >= (5 * t3 * t3 - 1) / 4)) return { ok: false, reason: 'τ4 is below the bound (5τ3² − 1)/4 that every distribution meets (Hosking 1990)' };
  const residual = (k: number, h: number): [number, number] => {
    const r = kappaRatios(k, h);
    return [r.t3 - t3, r.t4 - t4];
  };
  // GEV shape for τ3 (Hosking, Wallis & Wood 1985 approximation) as the k of every start.
  const c = 2 / (3 + t3) - Math.LN2 / Math.log(3);
  const kGev = 7.859 * c + 2.9554 * c * c;
  const starts: [number, number][] = [
    [kGev, 0],
    [kGev, 0.5],
    [kGev, -0.5],
    [-t3, -0.9],
    [kGev, 1],
  ];
  for (const [k0, h0] of starts) {
    let k = k0;
    let h = h0;
    let r = residual(k, h);
    let norm = Math.hypot(r[0], r[1]);
    if (!Number.isFinite(norm)) continue;
    for (let it = 1; it <= 100; it++) {
      if (norm < 1e-10) return { ok: true, parameters: kappaFromShapes(l1, l2, k, h), iterations: it };
      const dk = 1e-6 * Math.max(1, Math.abs(k));
      const dh = 1e-6 * Math.max(1, Math.abs(h));
      const rk1 = residual(k + dk, h);
      const rk0 = residual(k - dk, h);
      const rh1 = residual(k, h + dh);
      const rh0 = residual(k, h - dh);
      const j11 = (rk1[0] - rk0[0]) / (2 * dk);
      const j21 = (rk1[1] - rk0[1]) / (2 * dk);
      const j12 = (rh1[0] - rh0[0]) / (2 * dh);
      const j22 = (rh1[1] - rh0[1]) / (2 * dh);
      const det = j11 * j22 - j12 * j21;
      if (!Number.isFinite(det) || det === 0) break;
      const sk = -(j22 * r[0] - j12 * r[1]) / det;
      const sh = -(-j21 * r[0] + j11 * r[1]) / det;
      let step = 1;
      let moved = false;
      for (let half = 0; half < 30; half++) {
        const kn = k + step * sk;
        const hn = h + step * sh;
        const rn = residual(kn, hn);
        const nn = Math.hypot(rn[0], rn[1]);
        if (Number.isFinite(nn) && nn < norm) {
          k = kn;
          h = hn;
          r = rn;
          norm = nn;
          moved = true;
          break;
        }
        step /= 2;
      }
      if (!moved) break;
    }
    if (norm < 1e-10) return { ok: true, parameters: kappaFromShapes(l1, l2, k, h), iterations: 100 };
  }
  return { ok: false, reason: 'Newton iteration on (k, h) did not converge from any start' };
}
