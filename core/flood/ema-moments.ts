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
  const wa = (lower - mean) / sd;
  const wb = (upper - mean) / sd;
  if (Math.abs(skew) < NORMAL_SKEW) {
    const mass = normalMass(wa, wb);
    if (!(mass > 0)) return { probability: 0, m1: Number.NaN, m2: Number.NaN, m3: Number.NaN };
    const pa = Number.isFinite(wa) ? normalPdf(wa) : 0;
    const pb = Number.isFinite(wb) ? normalPdf(wb) : 0;
    const wpa = Number.isFinite(wa) ? wa * pa : 0;
    const wpb = Number.isFinite(wb) ? wb * pb : 0;
    const w2pa = Number.isFinite(wa) ? (wa * wa + 2) * pa : 0;
    const w2pb = Number.isFinite(wb) ? (wb * wb + 2) * pb : 0;
    return { probability: mass, m1: -(pb - pa) / mass, m2: 1 - (wpb - wpa) / mass, m3: -(w2pb - w2pa) / mass };
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
  if (!(x2 > x1)) return { probability: 0, m1: Number.NaN, m2: Number.NaN, m3: Number.NaN };
  const mass = gammaMass(alpha, x1, x2);
  if (!(mass > 0)) return { probability: 0, m1: Number.NaN, m2: Number.NaN, m3: Number.NaN };
  const h1 = xDensity(alpha, x1);
  const h2 = xDensity(alpha, x2);
  // Products with h vanish where h does (at 0 and at ∞), whatever D is there.
  const at = (h: number, f: number) => (h === 0 ? 0 : h * f);
  const bh = h2 - h1;
  const bdh = at(h2, d2 + 1) - at(h1, d1 + 1);
  const bd2h = at(h2, d2 * d2) - at(h1, d1 * d1);
  const i1 = -bh;
  const i2 = alpha * mass - bdh;
  const i3 = 2 * alpha * mass - bd2h - 2 * bdh - 2 * alpha * bh;
  const g = skew / 2;
  return { probability: mass, m1: (g * i1) / mass, m2: (g * g * i2) / mass, m3: (g * g * g * i3) / mass };
}
