/**
 * Anderson–Darling statistic for exact, left-, interval- and right-censored units, on the Turnbull
 * (1976) nonparametric estimate:
 *   A² = n ∫ (K(u) − u)² / (u(1 − u)) du,   u = F̂(t) (the fitted model),
 * with K the Turnbull estimate carried to the u scale. Where the estimate is known (between its
 * innermost intervals) K is its flat step. Inside an innermost interval [q, p] the estimate says only
 * that F rises from F(q⁻) to F(p) somewhere in it, so K is taken as the value in that range nearest
 * the model, clamp(u, F(q⁻), F(p)): the statistic measures only the departure the data show, never
 * one the estimate leaves open. A box open to the right (mass beyond the last inspection) adds
 * nothing, as the Kaplan–Meier form stops at the last time (anderson-darling.ts). With only exact
 * failures and suspensions every innermost interval is a point, and this is the Kaplan–Meier A² of
 * anderson-darling.ts (Anderson–Darling weight on the product-limit process, cf. Koziol & Green 1976
 * [from memory]); the comparison of a Cramér–von Mises-type distance between the NPMLE and the fitted
 * model under interval censoring follows Ren (2003, Scand. J. Statist. 30:211-226 [from memory]).
 * On each piece where K is a constant k over [a, b] on the u scale the integral is closed-form:
 *   k² ln(b/a) + (1 − k)² ln((1 − a)/(1 − b)) − (b − a),
 * evaluated from the model's logCdf and logSf so that neither tail rounds off.
 * Its null distribution depends on the model, the estimates and the inspection scheme, so its
 * p-value comes from the parametric bootstrap of interval-bootstrap.ts.
 */
import type { Distribution } from '../families/index.js';
import type { TurnbullEstimate } from './turnbull.js';

/** A point on the u scale with its logs (ln u, ln(1 − u)), so that tails keep their digits. */
interface U {
  readonly u: number;
  readonly lu: number;
  readonly lv: number;
}

/** u at a time; a start of 0 is "before the first inspection", u = 0, as in the likelihood's left term. */
const atTime = (dist: Distribution, t: number): U => {
  if (t === 0) return { u: 0, lu: Number.NEGATIVE_INFINITY, lv: 0 };
  const lu = dist.logCdf(t);
  return { u: Math.exp(lu), lu, lv: dist.logSf(t) };
};

const atLevel = (k: number): U => ({ u: k, lu: Math.log(k), lv: Math.log1p(-k) });

/** ∫_a^b (k − u)²/(u(1 − u)) du for a constant k (0 when b ≤ a). */
function piece(k: number, a: U, b: U): number {
  if (!(b.u > a.u)) return 0;
  const l1 = k === 0 ? 0 : k * k * (b.lu - a.lu);
  const l2 = k === 1 ? 0 : (1 - k) * (1 - k) * (a.lv - b.lv);
  return l1 + l2 - (b.u - a.u);
}

const minU = (a: U, b: U): U => (a.u <= b.u ? a : b);
const maxU = (a: U, b: U): U => (a.u >= b.u ? a : b);

/** The interval-data A² of `dist` against the Turnbull estimate `np` of n units. */
export function intervalAndersonDarling(dist: Distribution, np: TurnbullEstimate, n: number): number {
  let total = 0;
  let prev: U = { u: 0, lu: Number.NEGATIVE_INFINITY, lv: 0 };
  let k = 0;
  let open = false;
  for (const iv of np.intervals) {
    const q = atTime(dist, iv.lower);
    // The known flat step from the end of the previous box to the start of this one.
    total += piece(k, prev, q);
    if (!Number.isFinite(iv.upper)) {
      open = true;
      break;
    }
    const p = iv.upper === iv.lower ? q : atTime(dist, iv.upper);
    const lo = iv.cdfBefore;
    const hi = iv.cdfAfter;
    // Inside the box K = clamp(u, lo, hi): below lo it is lo, above hi it is hi, zero distance between.
    if (q.u < lo) total += piece(lo, q, minU(p, atLevel(lo)));
    if (p.u > hi) total += piece(hi, maxU(q, atLevel(hi)), p);
    prev = p;
    k = hi;
  }
  // After the last closed box the estimate is 1 up to u = 1.
  if (!open && k >= 1) total += piece(1, prev, { u: 1, lu: 0, lv: Number.NEGATIVE_INFINITY });
  return n * total;
}
