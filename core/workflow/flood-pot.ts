/**
 * Peaks over a threshold as a report section, one computation for the CLI (`--threshold`,
 * cli/flood-pot.ts) and the pipeline (API and page: a dated series, DatasetInput.dates):
 * core/flood peaksOverThreshold (runs declustering, generalized Pareto excesses, the exceedance
 * rate, return levels per year, profile-likelihood intervals for maximum likelihood) by both
 * estimators — the one asked for first, the other beside it — and the threshold diagnostics
 * (mean excess and parameter stability across thresholds; e.g. Coles 2001, ch. 4 [from memory]).
 *
 * A dated series is not a sample of annual maxima: its report carries no ranked candidates (the
 * daily values are not what is modelled) and no annual-maximum flood section; the generalized
 * Pareto fits and their return levels sit in `report.pot`.
 */
import { PLUMBLINE_VERSION, resolveOptions } from '../analyze.js';
import { InputError } from '../errors.js';
import { EMA_CAUTIONS, peaksOverThreshold, thresholdDiagnostics, type GpdFit, type PotReturnLevel, type ThresholdDiagnostic } from '../flood/index.js';
import type { MethodNote } from '../report.js';
import { prepareSample } from '../sample.js';
import type { WorkflowSettings } from './options.js';
import type { DatasetOptions, DatasetReport } from './types.js';

/** Return periods when none are given (years). */
export const POT_DEFAULT_PERIODS: readonly number[] = Object.freeze([2, 5, 10, 25, 50, 100]);
/** Minimum separation (days) when none is given: the option table's default. */
export const POT_DEFAULT_SEPARATION = 3;
/**
 * Most values of a dated series a peaks-over-threshold run takes: 200 000, about 550 years of daily
 * values. The run declusters the series once per estimator and once per diagnostic threshold
 * (17 passes) and sorts it: 0.43 s of CPU at 200 000 values here, and a series of 10⁶ values took
 * 3.5–16 s end to end (dates read, under this machine's load), so a longer one (hourly or finer
 * records) is refused with a message asking for daily maxima first (common practice, no source
 * for the number).
 */
export const POT_MAX_VALUES = 200_000;

/** Thresholds of the diagnostics: this many, evenly spaced. */
export const POT_DIAGNOSTIC_COUNT = 15;

export const POT_DIAGNOSTICS_RULE = `${POT_DIAGNOSTIC_COUNT} thresholds evenly spaced from the 80th percentile of the values to the value with 15 values above it, each declustered with the same minimum separation; shape and modified scale by maximum likelihood where at least 10 event peaks lie above it`;

export const POT_CAUTIONS: readonly string[] = Object.freeze([
  'The threshold is a choice: the mean excess should be close to linear, and the shape and modified scale close to constant, above it (see the diagnostics); results change with it.',
  'Events are assumed independent after declustering; a minimum separation shorter than the time a flood takes to pass joins nothing and counts one flood several times.',
  ...EMA_CAUTIONS.slice(0, 1),
]);

export type PotEstimation = 'ml' | 'lmoments';

export interface PotCandidate {
  readonly family: 'genpareto';
  readonly label: string;
  readonly estimation: PotEstimation;
  /** The threshold u (fixed, not estimated), and the scale σ and shape ξ of the excesses. */
  readonly parameters: { readonly threshold: number; readonly scale: number; readonly shape: number };
  /** null for L-moments (not a likelihood estimate). */
  readonly logLikelihood: number | null;
  readonly converged: boolean;
  readonly method: string;
  readonly returnLevels: readonly PotReturnLevel[];
}

export interface PotSection {
  readonly threshold: number;
  readonly minSeparationDays: number;
  /** Event (cluster) peaks above the threshold after declustering. */
  readonly clusters: number;
  /** Record length in years: (last day − first day + 1)/365.25. */
  readonly years: number;
  /** Event peaks per year. */
  readonly ratePerYear: number;
  /** Two-sided level of the profile-likelihood intervals. */
  readonly confidence: number;
  /** The estimator asked for first, then the other (ml: with intervals; lmoments: point estimates). */
  readonly candidates: readonly PotCandidate[];
  /** Each event's peak: its day (days since 1970-01-01) and value. */
  readonly peaks: readonly { readonly day: number; readonly value: number }[];
  readonly diagnostics: readonly ThresholdDiagnostic[];
  readonly diagnosticsRule: string;
  readonly cautions: readonly string[];
}

export interface PotSectionOptions {
  readonly threshold: number;
  readonly minSeparation?: number;
  readonly estimation?: PotEstimation;
  readonly periods?: readonly number[];
  readonly confidence: number;
}

const LABEL: Readonly<Record<PotEstimation, string>> = { ml: 'generalized Pareto, maximum likelihood', lmoments: 'generalized Pareto, L-moments' };

function candidate(estimation: PotEstimation, threshold: number, fit: GpdFit, returnLevels: readonly PotReturnLevel[]): PotCandidate {
  return {
    family: 'genpareto',
    label: LABEL[estimation],
    estimation,
    parameters: { threshold, scale: fit.scale, shape: fit.shape },
    logLikelihood: fit.logLikelihood,
    converged: fit.converged,
    method: fit.method,
    returnLevels,
  };
}

/** The diagnostics' thresholds for these values (POT_DIAGNOSTICS_RULE); empty when the range is empty. */
export function diagnosticThresholds(values: ArrayLike<number>): number[] {
  const sorted = Float64Array.from(values).sort();
  const lo = sorted[Math.floor(0.8 * (sorted.length - 1))] as number;
  const hi = sorted[Math.max(0, sorted.length - 16)] as number;
  if (!(hi > lo)) return [];
  return Array.from({ length: POT_DIAGNOSTIC_COUNT }, (_, i) => lo + ((hi - lo) * i) / (POT_DIAGNOSTIC_COUNT - 1));
}

/** Peaks over a threshold of a dated series (days since 1970-01-01 beside each value). */
export function potSection(days: ArrayLike<number>, values: ArrayLike<number>, opts: PotSectionOptions): PotSection {
  if (days.length !== values.length) throw new InputError(`The dated series has ${days.length} dates but ${values.length} values.`, {}, 'bad-input');
  if (values.length > POT_MAX_VALUES) {
    throw new InputError(
      `Peaks over a threshold takes a dated series of at most ${String(POT_MAX_VALUES)} values (about 550 years of daily values); this one has ${String(values.length)}. Reduce it to one value a day (the daily maximum) first.`,
      { value: String(values.length) },
      'bad-input',
    );
  }
  const sep = opts.minSeparation ?? POT_DEFAULT_SEPARATION;
  const first = opts.estimation ?? 'ml';
  const periods = opts.periods ?? POT_DEFAULT_PERIODS;
  const run = (estimation: PotEstimation) => peaksOverThreshold(days, values, { threshold: opts.threshold, minSeparation: sep, estimation, periods, confidence: opts.confidence });
  const main = run(first);
  const other = run(first === 'ml' ? 'lmoments' : 'ml');
  const grid = diagnosticThresholds(values);
  return {
    threshold: opts.threshold,
    minSeparationDays: sep,
    clusters: main.exceedances,
    years: main.years,
    ratePerYear: main.rate,
    confidence: opts.confidence,
    candidates: [candidate(first, opts.threshold, main.fit, main.returnLevels), candidate(first === 'ml' ? 'lmoments' : 'ml', opts.threshold, other.fit, other.returnLevels)],
    peaks: main.clusters.map((c) => ({ day: c.time, value: c.peak })),
    diagnostics: grid.length > 0 ? thresholdDiagnostics(days, values, grid, sep) : [],
    diagnosticsRule: POT_DIAGNOSTICS_RULE,
    cautions: POT_CAUTIONS,
  };
}

const POT_METHODS: readonly MethodNote[] = [
  { topic: 'peaks over a threshold', description: 'runs declustering (values above the threshold closer than the minimum separation form one event; its peak is kept); the excesses of the event peaks fitted by a generalized Pareto model; return level z_T = u + (σ/ξ)((λT)^ξ − 1) with λ event peaks per year', source: 'Coles (2001), An Introduction to Statistical Modeling of Extreme Values, ch. 4 [from memory]' },
  { topic: 'generalized Pareto by L-moments', description: 'lower bound known (0 for the excesses): k = l1/l2 − 2, α = (1 + k) l1, ξ = −k; no interval', source: 'Hosking & Wallis (1997), Regional Frequency Analysis, App. A.5' },
  { topic: 'return-level intervals', description: 'profile likelihood of z_T (σ written through z_T and ξ), the exceedance rate taken as known', source: 'Coles (2001), ch. 4 [from memory]' },
];

/** The dataset report of a dated series: the frame of the daily values, no ranked candidates, the `pot` section. */
export function potReport(days: ArrayLike<number>, values: ArrayLike<number>, options: DatasetOptions, settings: WorkflowSettings): DatasetReport {
  const threshold = options.threshold;
  if (threshold === undefined || threshold === null) throw new InputError('A dated series is analysed as peaks over a threshold: give the threshold.', {}, 'bad-option');
  if (settings.capability) throw new InputError('Capability needs a sample of measurements, not a dated series of flows.', {}, 'bad-option');
  if (settings.bLifePercents !== null || settings.reliabilityTimes.length > 0) throw new InputError('B-lives and reliability need life data, not a dated series.', {}, 'bad-option');
  const est = options.estimation ?? 'ml';
  if (est !== 'ml' && est !== 'lmoments') throw new InputError(`estimation ${est} does not apply to peaks over a threshold; use ml or lmoments.`, { value: est }, 'bad-option');
  const section = potSection(days, values, {
    threshold,
    ...(options.minSeparation !== undefined && options.minSeparation !== null ? { minSeparation: options.minSeparation } : {}),
    estimation: est,
    ...(settings.returnPeriods !== null ? { periods: settings.returnPeriods } : {}),
    confidence: settings.confidence,
  });
  const opts = resolveOptions({ ...options, families: ['genpareto'] });
  const s = prepareSample(Float64Array.from(values));
  const warnings = section.candidates.filter((c) => !c.converged).map((c) => `${c.label}: the fit did not converge.`);
  return {
    software: { name: 'plumbline', version: PLUMBLINE_VERSION },
    n: s.n,
    summary: { min: s.min, max: s.max, mean: s.mean, sd: s.n > 1 ? Math.sqrt(s.sumSqDev / (s.n - 1)) : 0, distinct: s.distinct },
    options: { ...opts, families: [...opts.families] },
    rankingRule: 'none: a dated series is analysed as peaks over a threshold; the generalized Pareto fits of the event peaks’ excesses are in the pot section, not ranked against other models',
    candidates: [],
    notApplicable: [],
    warnings,
    methods: [...POT_METHODS, { topic: 'summary', description: 'n, min, max, mean, sd and distinct count are those of the dated series’ values (every day), not of the event peaks', source: 'common practice, no source' }],
    dataKind: 'complete',
    pot: section,
  };
}
