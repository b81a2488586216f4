/**
 * Logarithm/exponential helpers that keep precision where the naive forms cancel or overflow.
 *
 * - log1mexp: Mächler, M. (2012), "Accurately computing log(1 − exp(−|a|))", R package Rmpfr
 *   vignette: switch between log(−expm1(x)) and log1p(−exp(x)) at x = −ln 2.
 * - log1pexp: same note, ln(1 + e^x) with the cut points 18 and 33.3 given there for doubles.
 * - log1pmx: ln(1 + x) − x, by its Taylor series for |x| < 0.5 written in t = x / (2 + x)
 *   (ln(1+x) = 2 atanh t, so ln(1+x) − x = 2t³/3 + 2t⁵/5 + … − x·t, Abramowitz & Stegun 4.1.28);
 *   this is the quantity the incomplete gamma prefactor needs (DiDonato & Morris 1986, §2).
 */

/** ln(1 − e^x) for x ≤ 0; NaN for x > 0, −∞ at x = 0. */
export function log1mexp(x: number): number {
  if (x > 0) return Number.NaN;
  return x > -Math.LN2 ? Math.log(-Math.expm1(x)) : Math.log1p(-Math.exp(x));
}

/** ln(1 + e^x) for any x, without overflow. */
export function log1pexp(x: number): number {
  if (x <= -37) return Math.exp(x);
  if (x <= 18) return Math.log1p(Math.exp(x));
  if (x <= 33.3) return x + Math.exp(-x);
  return x;
}

/** ln Σ e^{v_i}, scaled by the largest term; −∞ for an empty list or all −∞. */
export function logSumExp(values: ArrayLike<number>): number {
  const n = values.length;
  let m = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const v = values[i] as number;
    if (Number.isNaN(v)) return Number.NaN;
    if (v > m) m = v;
  }
  if (m === Number.NEGATIVE_INFINITY) return m;
  if (m === Number.POSITIVE_INFINITY) return m;
  let s = 0;
  for (let i = 0; i < n; i++) s += Math.exp((values[i] as number) - m);
  return m + Math.log(s);
}

/** ln(e^a + e^b) without overflow. */
export function logAddExp(a: number, b: number): number {
  if (a === Number.NEGATIVE_INFINITY) return b;
  if (b === Number.NEGATIVE_INFINITY) return a;
  return a > b ? a + log1pexp(b - a) : b + log1pexp(a - b);
}

/** ln(1 + x) − x for x > −1, accurate near 0 (relative error a few ulps). */
export function log1pmx(x: number): number {
  if (Math.abs(x) >= 0.5) return Math.log1p(x) - x;
  // ln(1+x) = 2 atanh(t) with t = x/(2+x), |t| ≤ 1/3: ln(1+x) − x = 2t(t²/3 + t⁴/5 + …) − x t
  // since 2t − x = −x t. 17 terms of t^{2k}/(2k+1) reach 2^-60 relative at |t| = 1/3.
  const t = x / (2 + x);
  const u = t * t;
  const s =
    u * (1 / 3 + u * (1 / 5 + u * (1 / 7 + u * (1 / 9 + u * (1 / 11 + u * (1 / 13 + u * (1 / 15 + u * (1 /
    17 + u * (1 / 19 + u * (1 / 21 + u * (1 / 23 + u * (1 / 25 + u * (1 / 27 + u * (1 / 29 + u * (1 / 31 + u
    * (1 / 33 + u * (1 / 35)))))))))))))))));
  return 2 * t * s - x * t;
}
