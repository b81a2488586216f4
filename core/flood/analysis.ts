/**
 * A flood-frequency analysis of an annual-maximum series in one call: Gumbel and GEV fits,
 * return levels with intervals, the likelihood-ratio test of the Gumbel inside the GEV (ξ = 0;
 * deviance against χ²₁, Coles 2001 §2.6.6/§3.4 [sections from memory]), return-period plot
 * coordinates, the chance of exceedance over a design life, a Mann–Kendall trend check in year
 * order, and the cautions.
 */
import { InputError } from '../errors.js';
import { fitGev, gumbel, type FitSuccess, type GevFit, type NotApplicable } from '../families/index.js';
import { prepareSample } from '../sample.js';
import { chiSquareSf } from '../special/index.js';
import { mannKendall, type TrendResult } from '../trend/index.js';
import { plottingPositions, type PlottingFormula, type PlottingPositions } from './plotting-positions.js';
import { returnLevels, FLOOD_CAUTION, GEV_SIGN_NOTE, type ReturnLevelMethod, type ReturnLevelReport } from './return-levels.js';
import { exceedanceRisk } from './risk.js';

export interface FloodOptions {
  /** Return periods in years (default 2, 10, 50, 100). */
  readonly periods?: readonly number[];
  /** Two-sided confidence level of the return-level intervals (default 0.95). */
  readonly level?: number;
  readonly method?: ReturnLevelMethod;
  readonly plotting?: PlottingFormula;
  /** Design life in years for the exceedance chance (optional). */
  readonly designLife?: number | null;
  /** The year of each value, for the trend check (default: the given order). */
  readonly years?: ArrayLike<number> | null;
  /** Significance level of the trend and Gumbel-vs-GEV tests (default 0.05). */
  readonly alpha?: number;
  /** Advisory GEV shape size (default 0.5): beyond it the estimate carries a warning. */
  readonly shapeGuard?: number;
  /** A constraint |ξ| ≤ c on the GEV fit (none by default); said on the intervals and in the test. */
  readonly shapeConstraint?: number | null;
}

export interface FloodCandidate {
  readonly fit: FitSuccess | GevFit | NotApplicable;
  readonly returnLevels: ReturnLevelReport | null;
}

export interface GumbelVersusGev {
  /** 2(ℓ_GEV - ℓ_Gumbel), ≥ 0. */
  readonly deviance: number;
  readonly pValue: number;
  readonly alpha: number;
  /** True when the data give no evidence against ξ = 0 at α. */
  readonly gumbelRetained: boolean;
  readonly decision: string;
}

export interface FloodAnalysis {
  readonly recordLength: number;
  readonly candidates: readonly FloodCandidate[];
  readonly gumbelVersusGev: GumbelVersusGev | null;
  readonly plotting: PlottingPositions;
  readonly designLifeRisk: readonly { readonly period: number; readonly designLife: number; readonly risk: number }[];
  readonly trend: TrendResult | null;
  readonly warnings: readonly string[];
  readonly cautions: readonly string[];
}

export function floodFrequency(values: ArrayLike<number>, opts: FloodOptions = {}): FloodAnalysis {
  const periods = opts.periods ?? [2, 10, 50, 100];
  const alpha = opts.alpha ?? 0.05;
  const sample = prepareSample(values);
  if (sample.n < 3) throw new InputError(`A flood-frequency analysis needs at least 3 annual maxima (got ${sample.n}).`, {}, 'too-few-values');
  const warnings: string[] = [];
  const g = gumbel.fit(sample);
  const v = fitGev(sample, { shapeGuard: opts.shapeGuard, shapeConstraint: opts.shapeConstraint ?? null });
  const rlOpts = { level: opts.level ?? 0.95, method: opts.method, shapeGuard: opts.shapeGuard, shapeConstraint: opts.shapeConstraint ?? null };
  const candidates: FloodCandidate[] = [g, v].map((fit) => ({
    fit,
    returnLevels: fit.ok ? returnLevels(sample, fit, periods, rlOpts) : null,
  }));
  if (v.ok) for (const w of v.warnings) warnings.push(w);
  let lr: GumbelVersusGev | null = null;
  if (g.ok && v.ok) {
    const deviance = Math.max(0, 2 * (v.logLikelihood - g.logLikelihood));
    const pValue = chiSquareSf(deviance, 1);
    const gumbelRetained = pValue >= alpha;
    const held = v.shapeConstraint !== null && v.shapeOnGuard;
    const shapeWords = held
      ? `the GEV shape is held at the constraint ξ = ${(v.parameters.shape as number).toPrecision(3)} (not an estimate; the unconstrained estimate is ${(v.unconstrainedShape ?? Number.NaN).toPrecision(3)}), so this deviance compares the constrained GEV with the Gumbel and understates the unconstrained one`
      : `the shape estimate is ξ = ${(v.parameters.shape as number).toPrecision(3)}`;
    lr = {
      deviance,
      pValue,
      alpha,
      gumbelRetained,
      decision: gumbelRetained
        ? `The GEV does not fit significantly better than the Gumbel (deviance ${deviance.toPrecision(3)}, p = ${pValue.toPrecision(3)} against χ²₁): the data do not contradict ξ = 0, though longer records often reveal a nonzero shape; ${shapeWords}.`
        : `The GEV fits significantly better than the Gumbel (deviance ${deviance.toPrecision(3)}, p = ${pValue.toPrecision(3)} against χ²₁): the shape differs from 0; ${shapeWords}.`,
    };
  }
  const designLifeRisk =
    opts.designLife !== null && opts.designLife !== undefined
      ? periods.map((T) => ({ period: T, designLife: opts.designLife as number, risk: exceedanceRisk(T, opts.designLife as number) }))
      : [];
  let trend: TrendResult | null = null;
  try {
    trend = mannKendall(values, { times: opts.years ?? null, alpha });
    if (trend.warning) warnings.push(trend.warning);
  } catch {
    trend = null;
  }
  for (const c of candidates) if (c.returnLevels) for (const w of c.returnLevels.warnings) if (!warnings.includes(w)) warnings.push(w);
  return {
    recordLength: sample.n,
    candidates,
    gumbelVersusGev: lr,
    plotting: plottingPositions(sample.sorted, opts.plotting ?? 'weibull'),
    designLifeRisk,
    trend,
    warnings,
    cautions: [FLOOD_CAUTION, GEV_SIGN_NOTE],
  };
}
