/**
 * The regional growth curve by the index-flood method (Hosking & Wallis 1997, §§1.2, 6.2): a
 * distribution with mean 1 is fitted to the regional average L-moment ratios, q(F) is its quantile,
 * and a site's quantile is its index flood (the site mean, l1) times q(F). Candidates are the GEV
 * (the kappa with h = 0) and the generalized logistic (h = −1), each fitted by L-moments: the GLO's
 * shape is k = −τ3; the GEV's solves τ3(k) = 2(1 − 3^−k)/(1 − 2^−k) − 3 by a bracketed root finder
 * (started from the Hosking, Wallis & Wood 1985 approximation). Their fit to the region is judged by
 * Z = (τ4_DIST − t4^R + B4)/σ4 with B4, σ4 from the heterogeneity simulation (H&W §5.2.3);
 * |Z| ≤ 1.64 is an acceptable fit.
 */
import { findRoot } from '../special/index.js';
import { kappaFromShapes, kappaQuantile, kappaRatios, type KappaParameters } from '../lmoments/kappa.js';
import type { RegionalAverages } from './heterogeneity.js';

export type GrowthFamily = 'gev' | 'genlogistic';

export interface GrowthFit {
  readonly family: GrowthFamily;
  readonly label: string;
  /** Kappa-form parameters (location ξ, scale α, shape k with Hosking's sign, h fixed by the family). */
  readonly parameters: KappaParameters;
  readonly t4: number;
  readonly z: number;
  readonly acceptable: boolean;
}

/** GEV shape k (Hosking's sign: k > 0 bounded above) with τ3(k) = t3, by Brent on a bracket. */
export function gevShapeFromT3(t3: number): number {
  const f = (k: number): number => kappaRatios(k, 0).t3 - t3;
  // τ3 falls from 1 (k → −1) to −1 (k → ∞): bracket inside (−1, 30).
  return findRoot(f, -0.999, 30, { relTol: 1e-13, absTol: 1e-14 }).root;
}

/** A growth-curve distribution (mean 1) fitted to the regional L-moment ratios, judged by Z. */
export function fitGrowth(family: GrowthFamily, r: RegionalAverages, t4Bias: number, t4Sd: number): GrowthFit {
  const k = family === 'gev' ? gevShapeFromT3(r.t3) : -r.t3;
  const h = family === 'gev' ? 0 : -1;
  const parameters = kappaFromShapes(1, r.t, k, h);
  const t4 = kappaRatios(k, h).t4;
  const z = (t4 - r.t4 + t4Bias) / t4Sd;
  return { family, label: family === 'gev' ? 'GEV' : 'generalized logistic', parameters, t4, z, acceptable: Math.abs(z) <= 1.64 };
}

/** q(F) of a growth curve at return period T (F = 1 − 1/T). */
export function growthAt(fit: GrowthFit, period: number): number {
  return kappaQuantile(fit.parameters, 1 - 1 / period);
}
