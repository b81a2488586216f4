/**
 * Anderson–Darling statistic for right-censored data, Kaplan–Meier form:
 *   A² = n ∫₀^{u_max} (K(u) - u)² / (u(1 - u)) du,   u = F̂(t),
 * with K the Kaplan–Meier estimate of F carried to the u scale and u_max = F̂ at the largest observed
 * time (1 when the Kaplan–Meier estimate reaches 1). This is the Anderson–Darling weight applied to
 * the product-limit process, as Koziol & Green (1976, Biometrika 63:465-474) do for the
 * Cramér–von Mises statistic under random censoring [journal details from memory]. With no
 * suspensions it is exactly the usual A² = -n - (1/n) Σ (2i - 1)[ln uᵢ + ln(1 - u_{n+1-i})].
 * On each step of K (constant value k on [a, b]) the integral is closed-form:
 *   k² ln(b/a) + (1 - k)² ln((1 - a)/(1 - b)) - (b - a),
 * evaluated from the fitted distribution's logCdf and logSf so that the tails do not round off.
 * Its null distribution depends on the model, the estimates and the censoring, so its p-value is
 * obtained by parametric bootstrap (bootstrap.ts).
 */
import type { Distribution } from '../families/index.js';
import { forEachFailureTime, type LifeData } from './data.js';

export function censoredAndersonDarling(dist: Distribution, data: LifeData): number {
  const n = data.n;
  let total = 0;
  let S = 1; // Kaplan–Meier survival just after the previous jump
  let prevLogU = Number.NEGATIVE_INFINITY; // ln a
  let prevLogV = 0; // ln(1 - a)
  let prevU = 0;
  const segment = (k: number, logU: number, logV: number, u: number): number => {
    const l1 = k === 0 ? 0 : k * k * (logU - prevLogU);
    const l2 = k === 1 ? 0 : (1 - k) * (1 - k) * (prevLogV - logV);
    return l1 + l2 - (u - prevU);
  };
  forEachFailureTime(data, (t, atRisk, d) => {
    const logU = dist.logCdf(t);
    const logV = dist.logSf(t);
    const u = Math.exp(logU);
    total += segment(1 - S, logU, logV, u);
    prevLogU = logU;
    prevLogV = logV;
    prevU = u;
    S *= 1 - d / atRisk;
  });
  if (S <= 0) {
    // K reaches 1 at the last failure: integrate to u = 1 with k = 1.
    total += -prevLogU - (1 - prevU);
  } else {
    const t = data.maxTime;
    const logU = dist.logCdf(t);
    const logV = dist.logSf(t);
    const u = Math.exp(logU);
    if (u > prevU) total += segment(1 - S, logU, logV, u);
  }
  return n * total;
}
