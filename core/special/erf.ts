/**
 * Error function, complementary error function and the scaled erfcx(x) = e^{x²} erfc(x).
 *
 * Cody, W. J. (1969), "Rational Chebyshev approximations for the error function", Mathematics of
 * Computation 23:631-637; coefficients as published in Cody's CALERF (SPECFUN, Cody 1993, ACM TOMS
 * 19:22-32, Algorithm 715). Three intervals: |x| ≤ 0.46875 (erf = x R(x²)), 0.46875 < |x| ≤ 4
 * (erfc = e^{-x²} R(x)), |x| > 4 (erfc = e^{-x²}/x (1/√π + R(1/x²)/x²)). The factor e^{-x²} is
 * formed as e^{-h²} e^{-(x-h)(x+h)} with h = x rounded down to 1/16, so that it keeps full relative
 * precision in the far tail (x² would otherwise carry an absolute rounding error of x²·2^-53).
 */

const SQRPI = 5.6418958354775628695e-1; // 1/√π
const THRESH = 0.46875;

const A0 = 3.1611237438705656, A1 = 1.13864154151050156e2, A2 = 3.77485237685302021e2;
const A3 = 3.20937758913846947e3, A4 = 1.85777706184603153e-1;
const B0 = 2.36012909523441209e1, B1 = 2.44024637934444173e2, B2 = 1.28261652607737228e3;
const B3 = 2.84423683343917062e3;

const C0 = 5.64188496988670089e-1, C1 = 8.88314979438837594, C2 = 6.61191906371416295e1;
const C3 = 2.98635138197400131e2, C4 = 8.8195222124176909e2, C5 = 1.71204761263407058e3;
const C6 = 2.05107837782607147e3, C7 = 1.23033935479799725e3, C8 = 2.15311535474403846e-8;
const D0 = 1.57449261107098347e1, D1 = 1.17693950891312499e2, D2 = 5.37181101862009858e2;
const D3 = 1.62138957456669019e3, D4 = 3.29079923573345963e3, D5 = 4.36261909014324716e3;
const D6 = 3.43936767414372164e3, D7 = 1.23033935480374942e3;

const P0 = 3.05326634961232344e-1, P1 = 3.60344899949804439e-1, P2 = 1.25781726111229246e-1;
const P3 = 1.60837851487422766e-2, P4 = 6.58749161529837803e-4, P5 = 1.63153871373020978e-2;
const Q0 = 2.56852019228982242, Q1 = 1.87295284992346047, Q2 = 5.27905102951428412e-1;
const Q3 = 6.05183413124413191e-2, Q4 = 2.33520497626869185e-3;

/** erf(x) for |x| ≤ 0.46875 (Cody's first interval). Internal. */
export function erfSmall(x: number): number {
  const z = x * x;
  const num = (((A4 * z + A0) * z + A1) * z + A2) * z + A3;
  const den = (((z + B0) * z + B1) * z + B2) * z + B3;
  return (x * num) / den;
}

/**
 * e^{y²} erfc(y) for y > 0.46875 (Cody's second and third intervals). Internal: the normal
 * distribution functions call it directly.
 */
export function erfcxLarge(y: number): number {
  if (y <= 4) {
    const num = (((((((C8 * y + C0) * y + C1) * y + C2) * y + C3) * y + C4) * y + C5) * y + C6) * y + C7;
    const den = (((((((y + D0) * y + D1) * y + D2) * y + D3) * y + D4) * y + D5) * y + D6) * y + D7;
    return num / den;
  }
  if (y >= 6.71e7) return SQRPI / y; // 1/x² below 2^-53 relative
  const z = 1 / (y * y);
  const num = ((((P5 * z + P0) * z + P1) * z + P2) * z + P3) * z + P4;
  const den = ((((z + Q0) * z + Q1) * z + Q2) * z + Q3) * z + Q4;
  return (SQRPI - (z * num) / den) / y;
}

/** e^{-x²} with full relative precision (Cody's splitting of x² into an exact and a small part). */
export function expMinusSquare(x: number): number {
  const h = Math.trunc(x * 16) / 16;
  return Math.exp(-h * h) * Math.exp(-(x - h) * (x + h));
}

/** Error function erf(x) = 2/√π ∫₀ˣ e^{-t²} dt. */
export function erf(x: number): number {
  const y = Math.abs(x);
  if (y <= THRESH) return erfSmall(x);
  if (y >= 6) return x > 0 ? 1 : x < 0 ? -1 : Number.NaN; // erfc(6) < 2^-53 / 2
  const r = 0.5 - erfcxLarge(y) * expMinusSquare(y) + 0.5;
  return x < 0 ? -r : r;
}

/** Complementary error function erfc(x) = 1 − erf(x), computed directly (no cancellation). */
export function erfc(x: number): number {
  const y = Math.abs(x);
  if (y <= THRESH) return 1 - erfSmall(x);
  if (Number.isNaN(x)) return x;
  const r = y < 27.3 ? erfcxLarge(y) * expMinusSquare(y) : 0; // erfc(27.3) < 2^-1074
  return x < 0 ? 2 - r : r;
}

/** Scaled complementary error function erfcx(x) = e^{x²} erfc(x); +∞ where it overflows (x < −26.6). */
export function erfcx(x: number): number {
  const y = Math.abs(x);
  if (y <= THRESH) return Math.exp(x * x) * (1 - erfSmall(x));
  if (Number.isNaN(x)) return x;
  const r = erfcxLarge(y);
  if (x > 0) return r;
  if (x < -26.628) return Number.POSITIVE_INFINITY;
  const h = Math.trunc(y * 16) / 16;
  const e = Math.exp(h * h) * Math.exp((y - h) * (y + h)); // e^{x²}, split as in expMinusSquare
  return e + e - r;
}
