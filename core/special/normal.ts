/**
 * Standard normal distribution function Φ, survival function 1 − Φ and their logarithms, accurate
 * far into both tails.
 *
 * Φ(z) = ½ erfc(−z/√2), evaluated with Cody's (1969) rational approximations (see erf.ts). In the
 * tails, Φ(−|z|) = ½ erfcx(|z|/√2) · e^{−z²/2}; the logarithm is then ln(½ erfcx) − z²/2, which
 * stays finite and accurate to z = −10^150 and beyond (no exponential is ever formed), e.g.
 * ln Φ(−40) = −804.608. The factor e^{−z²/2} uses Cody's split z = h + (z − h), h a multiple of
 * 1/16, so that z² carries no rounding error in the exponent. The side nearer 1 is taken as
 * 1 − (small tail) or, for the logarithm, log1p(−small tail), never as a difference of two values
 * near 1.
 */
import { erfcxLarge, erfSmall } from './erf.js';

const SQRT1_2 = Math.SQRT1_2;
/** |z| below which Φ(z) is computed from erf directly (z/√2 ≤ 0.46875, Cody's first interval). */
const Z_SMALL = 0.46875 * Math.SQRT2;

/** Φ(z) − ½ = ½ erf(z/√2) for |z| ≤ Z_SMALL (Cody's first interval). */
function centralHalf(z: number): number {
  return 0.5 * erfSmall(z * SQRT1_2);
}

/** |t| above which Φ(−t) underflows: Φ(−38.5) < 2^-1074. */
const T_UNDERFLOW = 38.5;
/**
 * e^{−h²/2} at h = k/16, k = 0..616 (h up to T_UNDERFLOW): the exact part of Cody's split, looked up
 * instead of evaluated. h² = k²/256 is exact, so entry k is bit for bit Math.exp(−0.5·h·h).
 */
const EXP_HALF_H2 = new Float64Array(Math.ceil(T_UNDERFLOW * 16) + 1);
for (let k = 0; k < EXP_HALF_H2.length; k++) EXP_HALF_H2[k] = Math.exp(-(k * k) / 512);

/** e^{−z²/2} with full relative precision. */
function expMinusHalfSquare(z: number): number {
  const t = Math.abs(z);
  const k = Math.trunc(t * 16);
  const h = k / 16;
  const exact = k < EXP_HALF_H2.length ? (EXP_HALF_H2[k] as number) : Math.exp(-0.5 * h * h);
  return exact * Math.exp(-0.5 * (t - h) * (t + h));
}

/** Φ(−t) for t > Z_SMALL, given e = erfcx(t/√2). */
function lowerTailFrom(t: number, e: number): number {
  if (t > T_UNDERFLOW) return 0;
  return 0.5 * e * expMinusHalfSquare(t);
}

/** Φ(−t) for t > Z_SMALL. */
function lowerTail(t: number): number {
  if (t > T_UNDERFLOW) return 0;
  return lowerTailFrom(t, erfcxLarge(t * SQRT1_2));
}

/** ln Φ(−t) for t > Z_SMALL. */
function logLowerTail(t: number): number {
  return Math.log(0.5 * erfcxLarge(t * SQRT1_2)) - 0.5 * t * t;
}

/** Standard normal cdf Φ(z). */
export function normalCdf(z: number): number {
  if (z < -Z_SMALL) return lowerTail(-z);
  if (z <= Z_SMALL) return 0.5 + centralHalf(z);
  if (z > Z_SMALL) return 1 - lowerTail(z);
  return Number.NaN;
}

/** Standard normal survival function 1 − Φ(z) = Φ(−z), computed directly. */
export function normalSf(z: number): number {
  return normalCdf(-z);
}

/** ln Φ(z), finite and accurate for very negative z (ln Φ(−40) ≈ −804.608). */
export function normalLogCdf(z: number): number {
  if (z < -Z_SMALL) return logLowerTail(-z);
  if (z <= Z_SMALL) return Math.log(0.5 + centralHalf(z));
  if (z > Z_SMALL) return Math.log1p(-lowerTail(z));
  return Number.NaN;
}

/** ln(1 − Φ(z)) = ln Φ(−z), finite and accurate for very large z. */
export function normalLogSf(z: number): number {
  return normalLogCdf(-z);
}

/**
 * ln Φ(z) into outLogCdf[i] and ln(1 − Φ(z)) into outLogSf[i] from one erf/erfcx evaluation, the
 * same numbers as normalLogCdf(z) and normalLogSf(z) (bit for bit: the same operations, shared):
 * near the centre ln(½ ± ½ erf(|z|/√2)); in a tail, t = |z|, the smaller side
 * ln(½ erfcx(t/√2)) − t²/2 and the larger log1p(−½ erfcx(t/√2) e^{−t²/2}).
 */
export function normalLogCdfSfAt(z: number, outLogCdf: Float64Array, outLogSf: Float64Array, i: number): void {
  if (z < -Z_SMALL || z > Z_SMALL) {
    const t = Math.abs(z);
    const e = erfcxLarge(t * SQRT1_2);
    const small = Math.log(0.5 * e) - 0.5 * t * t;
    const large = Math.log1p(-lowerTailFrom(t, e));
    if (z < 0) {
      outLogCdf[i] = small;
      outLogSf[i] = large;
    } else {
      outLogCdf[i] = large;
      outLogSf[i] = small;
    }
  } else if (z === z) {
    const c = centralHalf(z);
    outLogCdf[i] = Math.log(0.5 + c);
    outLogSf[i] = Math.log(0.5 - c);
  } else {
    outLogCdf[i] = Number.NaN;
    outLogSf[i] = Number.NaN;
  }
}

/** Standard normal density φ(z), with e^{−z²/2} formed without rounding loss. */
export function normalPdf(z: number): number {
  return 0.3989422804014327 * expMinusHalfSquare(z);
}

/** ln φ(z). */
export function normalLogPdf(z: number): number {
  return -0.5 * z * z - 0.9189385332046728;
}

/**
 * φ(z)/Φ(z) (the inverse Mills ratio of the lower tail), without forming either factor where they
 * underflow: for z < −0.66 it is √(2/π) / erfcx(−z/√2).
 */
export function normalPdfOverCdf(z: number): number {
  if (z < -Z_SMALL) return 0.7978845608028654 / erfcxLarge(-z * SQRT1_2);
  return normalPdf(z) / normalCdf(z);
}
