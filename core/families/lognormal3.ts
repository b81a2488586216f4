/**
 * Three-parameter lognormal: ln(x - γ) ~ N(meanlog, sdlog²) for x > γ; parameters `meanlog`,
 * `sdlog`, `threshold` (γ). Distribution functions are the lognormal's at x - γ.
 * Fit: the threshold profile of weibull3.ts (`fitWithThreshold`): the likelihood always tends to
 * +∞ as γ → min(x) (Hill 1963, JRSS B 25:72-82), so the estimate is the highest interior local
 * maximum of the profile (the local maximum-likelihood estimate of Cohen & Whitten 1980, JASA
 * 75:399-404 [from memory]); when there is none, the fit says so with `converged: false`.
 * The Anderson–Darling p-value is by parametric bootstrap (no table).
 */
import { IDENTITY, LOG } from '../optimize/index.js';
import { lognormal } from './lognormal.js';
import { POSITIVE, REAL } from './parameters.js';
import type { Family, Parameters } from './types.js';
import { thresholdFamily, type ThresholdSpec } from './weibull3.js';

const SPEC: ThresholdSpec = {
  name: 'lognormal3',
  label: 'three-parameter lognormal',
  base: lognormal,
  baseNames: ['meanlog', 'sdlog'],
  baseBounds: { meanlog: REAL, sdlog: POSITIVE },
  baseTransforms: [IDENTITY, LOG],
  thresholdScore(p: Parameters, xs: Float64Array, g: number): number {
    // ∂/∂γ Σ [-ln(x - γ) - ln σ - (ln(x - γ) - μ)²/(2σ²)] = Σ [1 + (ln(x - γ) - μ)/σ²] / (x - γ).
    const mu = p.meanlog as number;
    const s2 = (p.sdlog as number) ** 2;
    let s = 0;
    for (let i = 0; i < xs.length; i++) {
      const y = (xs[i] as number) - g;
      s += (1 + (Math.log(y) - mu) / s2) / y;
    }
    return s;
  },
  regimeWarnings: () => [],
};

export const lognormal3: Family = thresholdFamily(SPEC);
