/**
 * Fit every requested family to grouped counts and test each on the given classes.
 */
import { DEFAULT_FAMILIES, type FamilyName } from '../families/index.js';
import { groupedChiSquare, GROUPED_AD_NOTE, type GroupedChiSquare } from './chi-square.js';
import type { GroupedData } from './classes.js';
import { fitGrouped, type GroupedFitOutcome } from './fit.js';

export interface GroupedCandidate {
  readonly fit: GroupedFitOutcome;
  readonly chiSquare: GroupedChiSquare | null;
  /** AIC = 2m - 2ℓ on the grouped likelihood (comparable across families on the same classes). */
  readonly aic: number | null;
}

export interface GroupedAnalysis {
  readonly total: number;
  readonly classes: number;
  readonly candidates: readonly GroupedCandidate[];
  readonly notes: readonly string[];
}

export function analyzeGrouped(
  data: GroupedData,
  opts: { families?: readonly FamilyName[]; alpha?: number } = {},
): GroupedAnalysis {
  const alpha = opts.alpha ?? 0.05;
  const candidates: GroupedCandidate[] = [];
  for (const name of opts.families ?? DEFAULT_FAMILIES) {
    const fit = fitGrouped(name, data);
    if (!fit.ok) {
      candidates.push({ fit, chiSquare: null, aic: null });
      continue;
    }
    const m = Object.keys(fit.parameters).length;
    candidates.push({ fit, chiSquare: groupedChiSquare(name, fit.parameters, data, { alpha }), aic: 2 * m - 2 * fit.logLikelihood });
  }
  return { total: data.total, classes: data.classes, candidates, notes: [GROUPED_AD_NOTE] };
}
