/**
 * ln Γ(x) for x > 0, ln Γ(1 + x) for x > −1, and the Stirling correction
 * ln Γ*(x) = ln Γ(x) − [(x − ½) ln x − x + ½ ln 2π].
 *
 * - Near 1 and 2, where ln Γ vanishes, the Taylor series about 1 (Abramowitz & Stegun 1964, 6.1.33)
 *     ln Γ(1+z) = −ln(1+z) + z(1 − γ) + Σ_{n≥2} (−1)^n (ζ(n) − 1) z^n / n,
 *   with the 2^-n part of ζ(n) − 1 summed in closed form, −ln(1 + z/2) + z/2, so that the remaining
 *   coefficients (ζ(n) − 1 − 2^-n)/n fall like 3^-n; |z| ≤ ½ then needs 22 terms for full relative
 *   precision (ln Γ(1+z) ≈ −γz near z = 0; ln Γ(2+z) = ln Γ(1+z) + ln(1+z) ≈ (1 − γ)z).
 *   The coefficients are ζ values computed with mpmath at 50 digits
 *   (`python3 scripts/fixtures/special.py --coefficients`).
 * - Below ½: ln Γ(x) = ln Γ(1+x) − ln x. Between 2.5 and 10: the recurrence Γ(x+1) = xΓ(x) down to
 *   [1.5, 2.5]. From 10: Stirling's series with Bernoulli numbers (A&S 6.1.40), eight terms.
 */

const EULER = 0.5772156649015329;
const HALF_LN_2PI = 0.9189385332046728;

// (−1)^n (ζ(n) − 1 − 2^-n)/n for n = 2 … 23.
const S2 = 0.19746703342411323, S3 = -0.025685634386531427, S4 = 0.004955808427784548;
const S5 = -0.0011355510286739853, S6 = 0.0002863436640748566, S7 = -7.66824831318324e-5;
const S8 = 2.1388274743042423e-5, S9 = -6.140869564690491e-6, S10 = 1.8012627818085338e-6;
const S11 = -5.370321926785962e-7, S12 = 1.6216069233735823e-7, S13 = -4.946423680685744e-8;
const S14 = 1.5212772050344947e-8, S15 = -4.710545468032904e-9, S16 = 1.4668966344919833e-9;
const S17 = -4.5900627351542783e-10, S18 = 1.4422218749110315e-10, S19 = -4.54780916546803e-11;
const S20 = 1.4385873327305658e-11, S21 = -4.563265937212529e-12, S22 = 1.4510739168404548e-12;
const S23 = -4.624528056444812e-13;

/** Σ_{n≥2} (−1)^n (ζ(n) − 1 − 2^-n) z^n / n for |z| ≤ ½. */
function zetaTail(z: number): number {
  const p =
    S2 + z * (S3 + z * (S4 + z * (S5 + z * (S6 + z * (S7 + z * (S8 + z * (S9 + z * (S10 + z * (S11 + z * (S12 +
    z * (S13 + z * (S14 + z * (S15 + z * (S16 + z * (S17 + z * (S18 + z * (S19 + z * (S20 + z * (S21 + z * (S22 +
    z * S23))))))))))))))))))));
  return z * z * p;
}

/** ln Γ(1 + z) for |z| ≤ ½. */
function lnGamma1pSmall(z: number): number {
  return -Math.log1p(z) - Math.log1p(0.5 * z) + z * (1.5 - EULER) + zetaTail(z);
}

/** ln Γ(2 + z) for |z| ≤ ½. */
function lnGamma2pSmall(z: number): number {
  return -Math.log1p(0.5 * z) + z * (1.5 - EULER) + zetaTail(z);
}

// Stirling series B_{2k} / (2k(2k − 1)), k = 1 … 8.
const G1 = 1 / 12, G2 = -1 / 360, G3 = 1 / 1260, G4 = -1 / 1680, G5 = 1 / 1188, G6 = -691 / 360360;
const G7 = 1 / 156, G8 = -3617 / 122400;

/**
 * ln Γ*(x) = ln Γ(x) − (x − ½) ln x + x − ½ ln 2π (the error of Stirling's formula), for x > 0.
 * From x = 10 by its asymptotic series (absolute error below 1e-17); below by the definition.
 */
export function lnGammaStirlingCorrection(x: number): number {
  if (x >= 10) {
    const r = 1 / x;
    const r2 = r * r;
    return r * (G1 + r2 * (G2 + r2 * (G3 + r2 * (G4 + r2 * (G5 + r2 * (G6 + r2 * (G7 + r2 * G8)))))));
  }
  return lnGamma(x) - (x - 0.5) * Math.log(x) + x - HALF_LN_2PI;
}

/** ln Γ(x) for x > 0 (NaN for x ≤ 0 or NaN; +∞ at +∞). */
export function lnGamma(x: number): number {
  if (!(x > 0)) return x === 0 ? Number.POSITIVE_INFINITY : Number.NaN;
  if (x < 0.5) return lnGamma1pSmall(x) - Math.log(x);
  if (x <= 1.5) return lnGamma1pSmall(x - 1);
  if (x <= 2.5) return lnGamma2pSmall(x - 2);
  if (x < 10) {
    // Γ(x) = (x−1)(x−2)…(x−n) Γ(x−n) with x − n in (1.5, 2.5].
    let prod = 1;
    let y = x;
    while (y > 2.5) {
      y -= 1;
      prod *= y;
    }
    return lnGamma2pSmall(y - 2) + Math.log(prod);
  }
  if (x === Number.POSITIVE_INFINITY) return x;
  return (x - 0.5) * Math.log(x) - x + HALF_LN_2PI + lnGammaStirlingCorrection(x);
}

/** ln Γ(1 + x) for x > −1, accurate also for tiny |x| (≈ −γx). */
export function lnGamma1p(x: number): number {
  if (Math.abs(x) <= 0.5) return lnGamma1pSmall(x);
  if (x > 0.5 && x <= 1.5) return lnGamma2pSmall(x - 1);
  return lnGamma(1 + x);
}
