/**
 * computeEvidence: everything the page's charts need, from the prepared sample and the report's
 * candidates. Pure; the full sample is used for every number, thinning is for drawing only.
 * With `censoring` (the same values with a status, 1 failed / 0 suspended) the evidence follows
 * the censoring (censored.ts): failures at suspension-aware positions, suspensions marked where
 * they are, the Kaplan–Meier step for the distribution function, and no bins.
 */
import { InputError } from '../errors.js';
import { getFamily, type Distribution } from '../families/index.js';
import type { AnalysisReport, CandidateReport } from '../report.js';
import type { Sample } from '../sample.js';
import { empiricalCdf } from './ecdf.js';
import { cdfCurve, commonGrid, densityCurve } from './grid.js';
import { CENSORED_BINS, censoredPositions, censoredProbabilityPlot, censoringEvidence, kaplanMeierCdf, prepareCensored, type CensoredEvidenceInput } from './censored.js';
import { binCounts, candidateBins, histogramEvidence, notApplicableBins, notApplicableHistogram } from './histogram.js';
import { orderStatisticInterval } from './orderStatistic.js';
import { probabilityPlot } from './probabilityPlot.js';
import { MIN_THIN_CAP } from './thin.js';
import type { CandidateEvidence, Evidence, EvidenceOptions } from './types.js';

export const DEFAULT_MAX_POINTS = 2000;
export const DEFAULT_GRID_POINTS = 400;
export const DEFAULT_BAND_ALPHA = 0.05;
/** Probabilities whose fitted quantiles widen the curve grid beyond the data (common practice, no source). */
export const MARGIN_QUANTILES = [0.001, 0.999] as const;

/** The candidate fields evidence uses (a CandidateReport has them all). */
export type EvidenceCandidate = Pick<CandidateReport, 'family' | 'label' | 'parameters'> & { readonly chiSquare?: CandidateReport['chiSquare'] };

function checkOption(name: string, v: number | undefined, lo: number, hi: number, integer: boolean, dflt: number): number {
  if (v === undefined) return dflt;
  if (typeof v !== 'number' || !Number.isFinite(v) || v < lo || v > hi || (integer && !Number.isInteger(v))) {
    throw new InputError(`${name} must be ${integer ? 'a whole number' : 'a number'} from ${lo} to ${hi} (got ${String(v)}).`, { value: String(v) }, 'bad-option');
  }
  return v;
}

export function computeEvidence(
  sample: Sample,
  report: Pick<AnalysisReport, 'candidates'> | { readonly candidates: readonly EvidenceCandidate[] },
  options: EvidenceOptions = {},
  censoring?: CensoredEvidenceInput,
): Evidence {
  const maxPoints = checkOption('maxPoints', options.maxPoints, MIN_THIN_CAP, 1_000_000, true, DEFAULT_MAX_POINTS);
  const gridPoints = checkOption('gridPoints', options.gridPoints, 16, 2000, true, DEFAULT_GRID_POINTS);
  const bandAlpha = checkOption('bandAlpha', options.bandAlpha, 1e-6, 0.5, false, DEFAULT_BAND_ALPHA);
  const { n, sorted, min, max } = sample;
  const logs = sample.logs();
  const fitted: { c: EvidenceCandidate; dist: Distribution }[] = report.candidates.map((c) => ({
    c,
    dist: getFamily(c.family).make(c.parameters),
  }));
  const bandCache = new Map<number, ReturnType<typeof orderStatisticInterval>>();
  const life = censoring ? prepareCensored(sorted, censoring) : null;
  const method = censoring?.positions ?? lifePositionsOf(report) ?? 'johnson-benard';
  const positions = life ? censoredPositions(life, method, 1 - bandAlpha) : null;
  const candidates: CandidateEvidence[] = fitted.map(({ c, dist }) => {
    if (life && positions) {
      return {
        family: c.family,
        label: c.label,
        histogram: notApplicableHistogram(CENSORED_BINS),
        probabilityPlot: censoredProbabilityPlot(dist, life, positions, method, maxPoints, 1 - bandAlpha),
        bins: notApplicableBins(CENSORED_BINS),
      };
    }
    const bins = candidateBins(dist, sorted, c.chiSquare);
    return {
      family: c.family,
      label: c.label,
      histogram: histogramEvidence(bins.source, bins.rows, n, min, max),
      probabilityPlot: probabilityPlot(dist, sorted, logs, maxPoints, bandAlpha, bandCache),
      bins: binCounts(bins.source, bins.rows),
    };
  });
  // The curve grid and the suggested domain cover the data's range, widened by each candidate's
  // 0.1 % and 99.9 % quantiles and the outer bars' drawn edges, but never by more than the data's
  // own range on either side: a candidate whose bins reach far away (a support edge at 0 under a
  // sample at 25 ± 0.003) must not spread the grid so thinly that no curve point falls on the data.
  const spread = max - min;
  const reachLo = Number.isFinite(spread) && spread > 0 ? Math.max(-Number.MAX_VALUE, min - spread) : min;
  const reachHi = Number.isFinite(spread) && spread > 0 ? Math.min(Number.MAX_VALUE, max + spread) : max;
  let lo = min;
  let hi = max;
  const widen = (v: number): void => {
    if (!Number.isFinite(v)) return;
    if (v < lo) lo = Math.max(v, reachLo);
    if (v > hi) hi = Math.min(v, reachHi);
  };
  for (const { dist } of fitted) {
    widen(dist.quantile(MARGIN_QUANTILES[0]));
    widen(dist.quantile(MARGIN_QUANTILES[1]));
  }
  for (const ce of candidates) {
    const bars = ce.histogram.bars;
    if (bars.length === 0) continue;
    widen((bars[0] as (typeof bars)[number]).lower);
    widen((bars[bars.length - 1] as (typeof bars)[number]).upper);
  }
  if (!(hi > lo)) {
    const d = Math.abs(lo) > 0 ? Math.abs(lo) * 0.05 : 1;
    lo = Math.max(-Number.MAX_VALUE, lo - d);
    hi = Math.min(Number.MAX_VALUE, hi + d);
  }
  const grid = commonGrid(lo, hi, gridPoints, min, max);
  return {
    n,
    min,
    max,
    xDomain: [lo, hi],
    maxPoints,
    densities: { x: grid, curves: fitted.map(({ c, dist }) => densityCurve(dist, c.label, grid)) },
    cdf: {
      empirical: life ? kaplanMeierCdf(life, maxPoints) : empiricalCdf(sorted, maxPoints),
      fitted: { x: grid, curves: fitted.map(({ c, dist }) => cdfCurve(dist, c.label, grid)) },
    },
    candidates,
    censoring: life ? censoringEvidence(life, method, maxPoints) : null,
  };
}

/** The plotting positions a life report used (its `life.plot.method`), if the report has them. */
function lifePositionsOf(report: object): 'johnson-benard' | 'kaplan-meier' | undefined {
  const life = (report as { readonly life?: { readonly plot?: { readonly method?: unknown } } }).life;
  const m = life?.plot?.method;
  return m === 'kaplan-meier' || m === 'johnson-benard' ? m : undefined;
}
