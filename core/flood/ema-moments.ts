/**
 * Conditional moments of a Pearson type III variable inside an interval, the "expected moments"
 * of the expected moments algorithm (Cohn, Lane & Baier 1997, WRR 33(9):2089-2096; USGS Bulletin
 * 17C, England et al. 2018, §7): for W = (Y − μ)/σ and an interval lower < Y ≤ upper,
 *   E[W^j | lower < Y ≤ upper],  j = 1, 2, 3.
 *
 * With Y = μ + σ(γ/2)D, D = G − α, G ~ Gamma(α, 1), α = 4/γ², integration by parts with
 * d/dx[x g(x)] = (α − x) g(x) (g the gamma density; h(x) = x g(x)) gives, over x₁ < G < x₂ and
 * [f] = f(x₂) − f(x₁), ΔP = P(α, x₂) − P(α, x₁):
 *   ∫ D g = −[h],
 *   ∫ D² g = α ΔP − [(D + 1) h],
 *   ∫ D³ g = 2α ΔP − [D² h] − 2[(D + 1) h] − 2α[h]
 * (the untruncated values 0, α, 2α are the gamma central moments). No term cancels α² or α³
 * against each other, unlike the expansion of raw gamma moments, so small skews keep their digits.
 * For γ < 0 the y-interval maps to x₂ = x(lower), x₁ = x(upper) (the sign trap of pearson3.ts).
 * The normal case (|γ| below the families' NORMAL_SKEW) uses the truncated normal moments
 *   E[W] = −[φ]/ΔΦ, E[W²] = 1 − [wφ]/ΔΦ, E[W³] = −[(w² + 2)φ]/ΔΦ
 * (e.g. Johnson, Kotz & Balakrishnan 1994, Continuous Univariate Distributions vol. 1, §13.10.1
 * [from memory]; they follow from φ′ = −wφ).
 */
import { gammaP, gammaQ, logGammaDensity, normalCdf, normalPdf, normalSf } from '../special/index.js';
import { NORMAL_SKEW } from '../families/index.js';

export interface IntervalMoments {
  /** P(lower < Y ≤ upper) under the distribution. */
  readonly probability: number;
  /** E[W | interval], E[W² | interval], E[W³ | interval], W = (Y − μ)/σ. */
  readonly m1: number;
  readonly m2: number;
  readonly m3: number;
}

/** Probability mass of (a, b] for the standard normal, from the side that keeps its digits. */
function normalMass(a: number, b: number): number {
  if (a >= 0) return normalSf(a) - normalSf(b);
  if (b <= 0) return normalCdf(b) - normalCdf(a);
  return 1 - normalCdf(a) - normalSf(b);
}

/** Mass of (x1, x2] for Gamma(α, 1), from the side that keeps its digits. */
function gammaMass(alpha: number, x1: number, x2: number): number {
  if (x1 >= alpha) return gammaQ(alpha, x1) - (x2 === Number.POSITIVE_INFINITY ? 0 : gammaQ(alpha, x2));
  if (x2 <= alpha) return gammaP(alpha, x2) - (x1 <= 0 ? 0 : gammaP(alpha, x1));
  return 1 - (x1 <= 0 ? 0 : gammaP(alpha, x1)) - (x2 === Number.POSITIVE_INFINITY ? 0 : gammaQ(alpha, x2));
}

/** h(x) = x g(x) (0 at 0 and at ∞). */
function xDensity(alpha: number, x: number): number {
  if (!(x > 0) || x === Number.POSITIVE_INFINITY) return 0;
  return Math.exp(logGammaDensity(alpha, x) + Math.log(x));
}

/**
 * Moments of W over lower < Y ≤ upper for Y ~ Pearson III(mean, sd, skew); ±Infinity allowed.
 * Returns probability 0 and NaN moments for an interval of no mass.
 */
export function intervalMoments(mean: number, sd: number, skew: number, lower: number, upper: number): IntervalMoments {
  const r = intervalRawMoments(mean, sd, skew, lower, upper, 3);
  return { probability: r.probability, m1: r.moments[1] as number, m2: r.moments[2] as number, m3: r.moments[3] as number };
}

export interface IntervalRawMoments {
  /** P(lower < Y ≤ upper). */
  readonly probability: number;
  /** E[W^k | interval] for k = 0 … order (moments[0] = 1); NaN for an interval of no mass. */
  readonly moments: readonly number[];
}

/**
 * E[W^k | lower < Y ≤ upper], k = 0 … order, by the recursions that extend the ones above to any
 * order (the same integration by parts, one power at a time):
 *   gamma:  I₀ = ΔP, I₁ = −[h], I_{k+1} = −[D^k h] + k I_k + kα I_{k−1}   (I_k = ∫ D^k g over the interval),
 *   normal: J₀ = ΔΦ, J₁ = −[φ], J_{k+1} = −[w^k φ] + k J_{k−1}            (J_k = ∫ w^k φ).
 * For k ≤ 3 they give the closed forms of the header. The untruncated values are the gamma's and
 * the normal's central moments (I₄ = 3α² + 6α, J₄ = 3), which the tests check.
 */
export function intervalRawMoments(mean: number, sd: number, skew: number, lower: number, upper: number, order: number): IntervalRawMoments {
  const none = { probability: 0, moments: Array.from({ length: order + 1 }, (_, k) => (k === 0 ? 1 : Number.NaN)) };
  const wa = (lower - mean) / sd;
  const wb = (upper - mean) / sd;
  if (Math.abs(skew) < NORMAL_SKEW) {
    const mass = normalMass(wa, wb);
    if (!(mass > 0)) return none;
    const pa = Number.isFinite(wa) ? normalPdf(wa) : 0;
    const pb = Number.isFinite(wb) ? normalPdf(wb) : 0;
    // [w^k φ] with the products vanishing where φ does.
    const bracket = (k: number): number => (pb === 0 ? 0 : Math.pow(wb, k) * pb) - (pa === 0 ? 0 : Math.pow(wa, k) * pa);
    const J: number[] = [mass, -bracket(0)];
    for (let k = 1; k < order; k++) J.push(-bracket(k) + k * (J[k - 1] as number));
    return { probability: mass, moments: J.slice(0, order + 1).map((j, k) => (k === 0 ? 1 : j / mass)) };
  }
  const alpha = 4 / (skew * skew);
  // D = 2w/γ; x = α + D clamped to the support.
  let d1 = (2 * wa) / skew;
  let d2 = (2 * wb) / skew;
  if (skew < 0) [d1, d2] = [d2, d1];
  d1 = Math.max(d1, -alpha);
  d2 = Math.max(d2, -alpha);
  const x1 = d1 === -alpha ? 0 : alpha + d1;
  const x2 = d2 === Number.POSITIVE_INFINITY ? Number.POSITIVE_INFINITY : d2 === -alpha ? 0 : alpha + d2;
  if (!(x2 > x1)) return none;
  const mass = gammaMass(alpha, x1, x2);
  if (!(mass > 0)) return none;
  const h1 = xDensity(alpha, x1);
  const h2 = xDensity(alpha, x2);
  // [D^k h]: products with h vanish where h does (at 0 and at ∞), whatever D is there.
  const bracket = (k: number): number => (h2 === 0 ? 0 : Math.pow(d2, k) * h2) - (h1 === 0 ? 0 : Math.pow(d1, k) * h1);
  const I: number[] = [mass, -bracket(0)];
  for (let k = 1; k < order; k++) I.push(-bracket(k) + k * (I[k] as number) + k * alpha * (I[k - 1] as number));
  const g = skew / 2;
  return { probability: mass, moments: I.slice(0, order + 1).map((v, k) => (k === 0 ? 1 : (Math.pow(g, k) * v) / mass)) };
}
