/**
 * computeEvidence: everything the page's charts need, from the prepared sample and the report's
 * candidates. Pure; the full sample is used for every number, thinning is for drawing only.
 */
import { InputError } from '../errors.js';
import { getFamily, type Distribution } from '../families/index.js';
import type { AnalysisReport, CandidateReport } from '../report.js';
import type { Sample } from '../sample.js';
import { empiricalCdf } from './ecdf.js';
import { cdfCurve, commonGrid, densityCurve } from './grid.js';
import { binCounts, candidateBins, histogramEvidence } from './histogram.js';
import { orderStatisticInterval } from './orderStatistic.js';
import { probabilityPlot } from './probabilityPlot.js';
import { MIN_THIN_CAP } from './thin.js';
import type { CandidateEvidence, Evidence, EvidenceOptions } from './types.js';

export const DEFAULT_MAX_POINTS = 2000;
export const DEFAULT_GRID_POINTS = 400;
export const DEFAULT_BAND_ALPHA = 0.05;

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
  const candidates: CandidateEvidence[] = fitted.map(({ c, dist }) => {
    const bins = candidateBins(dist, sorted, c.chiSquare);
    return {
      family: c.family,
      label: c.label,
      histogram: histogramEvidence(bins.source, bins.rows, n, min, max),
      probabilityPlot: probabilityPlot(dist, sorted, logs, maxPoints, bandAlpha, bandCache),
      bins: binCounts(bins.source, bins.rows),
    };
  });
  let lo = min;
  let hi = max;
  for (const ce of candidates) {
    for (const b of ce.histogram.bars) {
      if (b.lower < lo) lo = b.lower;
      if (b.upper > hi) hi = b.upper;
    }
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
      empirical: empiricalCdf(sorted, maxPoints),
      fitted: { x: grid, curves: fitted.map(({ c, dist }) => cdfCurve(dist, c.label, grid)) },
    },
    candidates,
  };
}
