/**
 * Asymptotic (first-order) covariance of the expected moments algorithm's estimates and the
 * variance of its log10 quantile, for a record with censored years: the quantity Cohn, Lane &
 * Stedinger (2001, WRR 37(6):1695-1706) give "analytical expressions" for and that Bulletin 17C
 * (England et al. 2018, TM 4-B5) builds its confidence intervals on. The paper's text was not
 * available here: the derivation below is ours (a standard sandwich of estimating equations,
 * e.g. Huber 1967 / Stefanski & Boos 2002, The American Statistician 56(1):29-38 [from memory]);
 * that it is the paper's own construction is from memory and not checked.
 *
 * The record as a design. Each year has a perception threshold τ (−∞ for a year with no
 * censoring): the peak is known when Y > τ, else only Y ≤ τ is known (systematic years below the
 * low-outlier threshold; historical years below the perception threshold). A year the record gives
 * only as an interval ("less than", "greater than", between two flows) has no threshold of its own
 * to be drawn again from: it is counted as a systematic year (an approximation that credits it with
 * a known peak above the low-outlier threshold). Holding such years fixed instead (their conditional
 * moments in A, no variance in B) was tried and is wrong: on the invented gauge file one year
 * "greater than 6000" in the upper tail of a negatively skewed fit made the skew's variance 11
 * times that of the 73 systematic years alone.
 * The EMA's fixed point θ = (M, S, G) (G the station skew; the conditional moments use the skew
 * G_w = wG + (1 − w)G_R) solves Σ_t ψ_t(θ) = 0 with, for a known peak y,
 *   ψ(y) = (y − M, (y − M)² − S², (y − M)³ − G S³)
 * and for a censored year the same functions' conditional expectation under the current fit
 * (ema.ts; the small-sample factors n/(n − 1) … do not enter at first order). Then
 *   Var(θ̂) ≈ A⁻¹ B A⁻ᵀ,  A = ∂E[Σψ]/∂θ,  B = Σ_t Var(ψ_t),
 * where for a year with threshold τ, with g(Y) = (Y − M, (Y − M)², (Y − M)³) and c the censored part,
 *   Var(ψ) = Var(g(Y)) − P(c) Cov(g(Y) | c)
 * (law of total variance: a censored year keeps only E[g | c]); the conditional moments up to
 * order 6 come from ema-moments.ts intervalRawMoments. A is taken by central differences. The
 * regional skew's error (mean square error MSE_R, independent of the record) adds
 * (dŷ/dG_R)² MSE_R with dθ̂/dG_R = −A⁻¹ ∂E[Σψ]/∂G_R. Everything is evaluated at the fitted
 * model, standardized (M = 0, S = 1, skew G_w; then G_R = G_w there, which makes the derivative of
 * the weight w itself drop out). For a record with no censored years A⁻¹BA⁻ᵀ is the classical
 * moment covariance, and the quantile variance equals ema-variance.ts's and the published moment
 * quantile variance of Kite (2004, eq. 9-54) (both tested: test/flood/ema-kite.test.ts).
 *
 * Effective record length of the skew: the years of a censor-free record whose station skew would
 * have the same asymptotic variance, n_e = v₁/Var(Ĝ), v₁ the variance of the skew from one
 * uncensored year (so n_e = n for a systematic record, exactly). Bulletin 17C uses such a length
 * for the station skew's mean square error with censored data [from memory; the Bulletin's own
 * formula was not available here]; ema.ts fitEma feeds it to the skew weighting (regional-skew.ts).
 */
import { InputError } from '../errors.js';
import { Pearson3Distribution } from '../families/index.js';
import { intervalRawMoments } from './ema-moments.js';
import { standardizedRawMoments } from './ema-variance.js';
import type { EmaFit, EmaRecord } from './ema.js';

/** Years sharing a perception threshold (log10; −Infinity: no censoring). */
export interface ThresholdYears {
  readonly years: number;
  readonly threshold: number;
}

/** The record's design: which years could have been censored where. */
export interface EmaDesign {
  readonly thresholds: readonly ThresholdYears[];
}

type Vec3 = [number, number, number];
/** A 3×3 matrix, row-major. */
type Mat3 = number[];
const at = (m: readonly number[], i: number, j: number): number => m[3 * i + j] as number;
const el = (v: readonly number[], i: number): number => v[i] as number;
const zeros = (): Mat3 => [0, 0, 0, 0, 0, 0, 0, 0, 0];

/**
 * The design of an EMA record: the systematic years with the low-outlier threshold (or, with zero
 * flows and no low outliers, the smallest positive peak, below which the zeros were censored),
 * the historical period's years with its perception threshold (its known peaks are the years that
 * rose above it), historical peaks with no stated period as uncensored years, user intervals as
 * systematic years.
 */
export function emaDesign(record: EmaRecord, fit: Pick<EmaFit, 'lowOutlierThreshold' | 'counts'>): EmaDesign {
  const thresholds: ThresholdYears[] = [];
  const systematic = record.peaks.length + (record.intervals?.length ?? 0);
  let low = fit.lowOutlierThreshold;
  if (low === null && fit.counts.zeros > 0) {
    const positive = [...record.peaks, ...(record.historicalPeaks ?? [])].filter((q) => q > 0);
    low = Math.min(...positive);
  }
  thresholds.push({ years: systematic, threshold: low === null ? Number.NEGATIVE_INFINITY : Math.log10(low) });
  const hb = record.historicalYearsBelow;
  const hp = record.historicalPeaks?.length ?? 0;
  if (hb && hb.years > 0) thresholds.push({ years: hb.years + hp, threshold: Math.log10(hb.threshold) });
  else if (hp > 0) thresholds.push({ years: hp, threshold: Number.NEGATIVE_INFINITY });
  return { thresholds: thresholds.filter((t) => t.years > 0) };
}

/** E[(W − m)^j], j = 1, 2, 3, from raw moments r[k] = E[W^k] (same conditioning). */
function centeredAt(r: readonly number[], m: number): Vec3 {
  const r1 = r[1] as number;
  const r2 = r[2] as number;
  const r3 = r[3] as number;
  return [r1 - m, r2 - 2 * m * r1 + m * m, r3 - 3 * m * r2 + 3 * m * m * r1 - m * m * m];
}

interface Standardized {
  /** Population skew (the fitted weighted skew). */
  readonly gamma: number;
  /** Weight of the station skew. */
  readonly w: number;
}

/**
 * Expected estimating function Σ E_pop[ψ_θ] at a trial θ = (m, s, g) and regional skew gR, the
 * population being the standardized Pearson III of skew γ.
 */
function expectedPsi(design: EmaDesign, pop: Standardized, m: number, s: number, g: number, gR: number): Vec3 {
  const gw = pop.w * g + (1 - pop.w) * gR;
  const out: Vec3 = [0, 0, 0];
  const target: Vec3 = [0, s * s, g * s * s * s];
  const add = (k: number, v: Vec3): void => {
    for (let j = 0; j < 3; j++) out[j] = el(out, j) + k * (el(v, j) - el(target, j));
  };
  // E_θ[(Y − m)^j | Y in (lo, hi]] for Y ~ P3(m, s, gw): s^j E[V^j | ...].
  const censored = (lo: number, hi: number): Vec3 => {
    const r = intervalRawMoments(m, s, gw, lo, hi, 3);
    if (!(r.probability > 0)) {
      const d = new Pearson3Distribution(m, s, gw);
      const edge = hi <= d.support.lower ? d.support.lower : d.support.upper;
      const v = (edge - m) / s;
      return [s * v, s * s * v * v, s * s * s * v * v * v];
    }
    return [s * (r.moments[1] as number), s * s * (r.moments[2] as number), s * s * s * (r.moments[3] as number)];
  };
  for (const t of design.thresholds) {
    if (t.threshold === Number.NEGATIVE_INFINITY) {
      add(t.years, centeredAt(standardizedRawMoments(pop.gamma), m));
      continue;
    }
    const above = intervalRawMoments(0, 1, pop.gamma, t.threshold, Number.POSITIVE_INFINITY, 3);
    const pAbove = above.probability;
    const obs: Vec3 = pAbove > 0 ? centeredAt(above.moments, m) : [0, 0, 0];
    const cen = censored(Number.NEGATIVE_INFINITY, t.threshold);
    const v: Vec3 = [0, 0, 0];
    for (let j = 0; j < 3; j++) v[j] = pAbove * el(obs, j) + (1 - pAbove) * el(cen, j);
    add(t.years, v);
  }
  return out;
}

/** Var(ψ) of one year with threshold τ at the population (M = 0, S = 1): Var(g) − P(c) Cov(g | c). */
function yearVariance(gamma: number, threshold: number): Mat3 {
  const a = standardizedRawMoments(gamma);
  const cov = (r: readonly number[], i: number, j: number): number => (r[i + j] as number) - (r[i] as number) * (r[j] as number);
  const out = zeros();
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) out[3 * i + j] = cov(a, i + 1, j + 1);
  if (threshold === Number.NEGATIVE_INFINITY) return out;
  const c = intervalRawMoments(0, 1, gamma, Number.NEGATIVE_INFINITY, threshold, 6);
  if (!(c.probability > 0)) return out;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) out[3 * i + j] = at(out, i, j) - c.probability * cov(c.moments, i + 1, j + 1);
  return out;
}

function invert3(m: Mat3): Mat3 {
  const [a, b, c, d, e, f, g, h, k] = [0, 1, 2, 3, 4, 5, 6, 7, 8].map((i) => el(m, i)) as [number, number, number, number, number, number, number, number, number];
  const A = e * k - f * h;
  const B = -(d * k - f * g);
  const C = d * h - e * g;
  const det = a * A + b * B + c * C;
  if (!(Math.abs(det) > 0) || !Number.isFinite(det)) throw new InputError('the EMA covariance is singular for this record', {}, 'not-computable');
  return [
    A / det, -(b * k - c * h) / det, (b * f - c * e) / det,
    B / det, (a * k - c * g) / det, -(a * f - c * d) / det,
    C / det, -(a * h - b * g) / det, (a * e - b * d) / det,
  ];
}

function mul(x: Mat3, y: Mat3): Mat3 {
  const out = zeros();
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) out[3 * i + j] = at(x, i, 0) * at(y, 0, j) + at(x, i, 1) * at(y, 1, j) + at(x, i, 2) * at(y, 2, j);
  return out;
}
function transpose(x: Mat3): Mat3 {
  const out = zeros();
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) out[3 * i + j] = at(x, j, i);
  return out;
}

export interface EmaCovariance {
  /** Covariance of (M̂, Ŝ, Ĝ station), row-major 3×3, in units of S² for M and S (the record's sampling part only). */
  readonly parameters: readonly number[];
  /** dθ̂/dG_R (standardized), zero without censoring. */
  readonly regionalSlope: Vec3;
  /** Station-skew weight used. */
  readonly stationWeight: number;
  readonly regionalSkewMse: number;
}

/** Step of the central differences for A (standardized units; truncation ~1e-10, rounding ~1e-11 relative). */
const STEP = 1e-5;

/** The design in standard units of the fitted model, (y − M)/S. */
function standardize(design: EmaDesign, mean: number, sd: number): EmaDesign {
  const z = (y: number): number => (Number.isFinite(y) ? (y - mean) / sd : y);
  return {
    thresholds: design.thresholds.map((t) => ({ years: t.years, threshold: z(t.threshold) })),
  };
}

/** Asymptotic covariance of the EMA estimates for a design (log10 units) at the fitted model. */
export function emaCovariance(
  design: EmaDesign,
  fitted: { readonly mean: number; readonly sd: number; readonly skew: number },
  regional: { stationWeight: number; regionalSkewMse: number } | null,
): EmaCovariance {
  design = standardize(design, fitted.mean, fitted.sd);
  const skew = fitted.skew;
  const w = regional ? regional.stationWeight : 1;
  const pop: Standardized = { gamma: skew, w };
  const theta0: Vec3 = [0, 1, skew];
  const A = zeros();
  for (let k = 0; k < 3; k++) {
    const up = [...theta0] as Vec3;
    const dn = [...theta0] as Vec3;
    up[k] = el(up, k) + STEP;
    dn[k] = el(dn, k) - STEP;
    const fu = expectedPsi(design, pop, up[0], up[1], up[2], skew);
    const fd = expectedPsi(design, pop, dn[0], dn[1], dn[2], skew);
    for (let j = 0; j < 3; j++) A[3 * j + k] = (el(fu, j) - el(fd, j)) / (2 * STEP);
  }
  const B = zeros();
  for (const t of design.thresholds) {
    const v = yearVariance(skew, t.threshold);
    for (let i = 0; i < 9; i++) B[i] = el(B, i) + t.years * el(v, i);
  }
  const Ai = invert3(A);
  const parameters = mul(mul(Ai, B), transpose(Ai));
  let regionalSlope: Vec3 = [0, 0, 0];
  if (regional && w < 1) {
    const fu = expectedPsi(design, pop, 0, 1, skew, skew + STEP);
    const fd = expectedPsi(design, pop, 0, 1, skew, skew - STEP);
    const b = [0, 1, 2].map((j) => (el(fu, j) - el(fd, j)) / (2 * STEP));
    const row = (i: number): number => -(at(Ai, i, 0) * el(b, 0) + at(Ai, i, 1) * el(b, 1) + at(Ai, i, 2) * el(b, 2));
    regionalSlope = [row(0), row(1), row(2)];
  }
  return { parameters, regionalSlope, stationWeight: w, regionalSkewMse: regional ? regional.regionalSkewMse : 0 };
}

/** K(γ, q) and ∂K/∂γ (central difference, step 1e-4, as ema-variance.ts). */
function frequencyFactorAndSlope(skew: number, exceedance: number): { K: number; Kg: number } {
  const K = (g: number): number => new Pearson3Distribution(0, 1, g).isf(exceedance);
  const h = 1e-4;
  return { K: K(skew), Kg: (K(skew + h) - K(skew - h)) / (2 * h) };
}

/** Variance of ŷ_p = M̂ + Ŝ K(Ĝ_w) in units of S², and K. */
export function emaQuantileVariance(cov: EmaCovariance, skew: number, exceedance: number): { readonly variance: number; readonly frequencyFactor: number } {
  const { K, Kg } = frequencyFactorAndSlope(skew, exceedance);
  const w = cov.stationWeight;
  const grad: Vec3 = [1, K, Kg * w];
  const P = cov.parameters;
  let v = 0;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) v += el(grad, i) * at(P, i, j) * el(grad, j);
  if (cov.regionalSkewMse > 0 && w < 1) {
    const slope = grad[0] * cov.regionalSlope[0] + grad[1] * cov.regionalSlope[1] + grad[2] * cov.regionalSlope[2] + Kg * (1 - w);
    v += slope * slope * cov.regionalSkewMse;
  }
  return { variance: v, frequencyFactor: K };
}

/**
 * The asymptotic ratio v₁/Var(Ĝ), v₁ the skew variance from one uncensored year at the same skew
 * (no regional skew in either). It can exceed the record's years: at a strongly negative skew the
 * moment skew of complete years is so variable that replacing the lowest years by their model
 * expectations lowers its first-order variance (invented-gauge design at skew −1.6: 168 of 135).
 */
export function asymptoticSkewRecordLength(design: EmaDesign, fitted: { readonly mean: number; readonly sd: number; readonly skew: number }): number {
  const one = emaCovariance({ thresholds: [{ years: 1, threshold: Number.NEGATIVE_INFINITY }] }, fitted, null);
  const rec = emaCovariance(design, fitted, null);
  return at(one.parameters, 2, 2) / at(rec.parameters, 2, 2);
}

/** Years of the design (every threshold group). */
export function designYears(design: EmaDesign): number {
  return design.thresholds.reduce((a, t) => a + t.years, 0);
}

/**
 * Effective record length of the station skew: n_e = min(v₁/Var(Ĝ), n), the asymptotic ratio
 * capped at the record's n years. The cap is a guard of ours (no source): a seeded simulation of
 * the EMA skew (scripts/flood-ema-skew-mse.ts) shows the asymptotic ratio's promise above n false in
 * finite records — at skew −1.6, 60 systematic years censored below the 0.05 quantile, the ratio is
 * 121 but the simulated MSE of the skew is 0.49, above the 0.30 of 60 complete years — so a censored
 * year is never counted as more than a year.
 */
export function effectiveRecordLength(design: EmaDesign, fitted: { readonly mean: number; readonly sd: number; readonly skew: number }): number {
  return Math.min(asymptoticSkewRecordLength(design, fitted), designYears(design));
}
