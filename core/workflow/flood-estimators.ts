/**
 * The flood section's estimators beside maximum likelihood, run when a flood run asks for them
 * (`estimation: 'ema'` or `'lmoments'` with return periods):
 *
 *  - log-Pearson type III by the expected moments algorithm (core/flood fitEma: Cohn, Lane & Baier
 *    1997; USGS Bulletin 17C, England et al. 2018) on the annual maxima as a systematic record,
 *    low outliers by the multiple Grubbs–Beck test treated as censored, the station skew weighted
 *    with a regional skew when one is given with its mean square error; return levels with the
 *    intervals of core/flood emaReturnLevels (the EMA's first-order variance after Cohn, Lane &
 *    Stedinger 2001 with noncentral-t limits; the parametric bootstrap beside them);
 *  - fits by L-moments (Hosking 1990; Hosking & Wallis 1997, App. A) of the Gumbel, GEV,
 *    generalized logistic, generalized Pareto and Pearson III with their return levels (point
 *    estimates: no interval is computed for them, and the report says so), the sample L-moment
 *    ratios and the L-moment ratio diagram.
 *
 * Every number carries the estimator that produced it (`estimation`), so the report never mixes
 * a maximum-likelihood level with an L-moment or EMA one without saying so. `lmoments` gives the
 * L-moment block; `ema` gives both (the ratio diagram shows whether the Pearson III shape suits
 * the sample). Runs that ask for neither skip both: the EMA's low-outlier test and interval
 * simulation cost a few tenths of a second, too much for every series of a batch.
 */
import { InputError } from '../errors.js';
import { getFamily, type FamilyName } from '../families/index.js';
import { EMA_INTERVAL_STREAM, emaCautions, emaCandidateFields, type EmaCandidateFields, type EmaFit, type EmaReturnLevel } from '../flood/index.js';
import { fitByLMoments, LMOMENT_FAMILIES, ratioDiagram, sampleLMoments, type LMomentFamily, type RatioDiagram } from '../lmoments/index.js';
import type { MethodNote } from '../report.js';
import { fitFloodRecord, regionalSkewOf, type FloodRecordFit } from './flood-record.js';

export { EMA_INTERVAL_STREAM };

export interface EstimatorReturnLevel {
  readonly period: number;
  readonly estimate: number;
  /** Interval ends, or null where the estimator gives none. */
  readonly lower: number | null;
  readonly upper: number | null;
}

export interface EmaLevelRow extends EstimatorReturnLevel {
  /** Years of a normal record with the same quantile variance (core/flood ema-intervals.ts; null where not computed). */
  readonly equivalentYears: number | null;
  /** The parametric-bootstrap percentile interval beside the reported one. */
  readonly bootstrapLower: number | null;
  readonly bootstrapUpper: number | null;
}

export interface FloodEmaBlock extends EmaCandidateFields {
  readonly applicable: true;
  readonly confidence: number;
  /** How the reported intervals (lower, upper) were found, in words. */
  readonly intervalMethod: string;
  /** How the intervals beside them (bootstrapLower, bootstrapUpper) were found. */
  readonly bootstrapMethod: string;
  readonly returnLevels: readonly EmaLevelRow[];
  readonly cautions: readonly string[];
}

export interface NotApplicableBlock {
  readonly applicable: false;
  readonly reason: string;
}

export interface LMomentFitRow {
  readonly family: LMomentFamily;
  readonly label: string;
  readonly estimation: 'lmoments';
  readonly parameters: Readonly<Record<string, number>>;
  readonly logLikelihood: null;
  readonly method: string;
  /** Point estimates only (lower and upper null). */
  readonly returnLevels: readonly EstimatorReturnLevel[];
}

export interface FloodLMomentBlock {
  readonly applicable: true;
  readonly estimation: 'lmoments';
  readonly sample: { readonly n: number; readonly l1: number; readonly l2: number; readonly t: number; readonly t3: number; readonly t4: number };
  readonly fits: readonly LMomentFitRow[];
  /** Families the L-moments could not fit, with the reason. */
  readonly notFitted: readonly { readonly family: LMomentFamily; readonly reason: string }[];
  readonly intervalMethod: string;
  readonly diagram: RatioDiagram;
}

export interface FloodEstimators {
  /** The estimator the run asked for: its numbers lead the section. */
  readonly requested: 'ema' | 'lmoments';
  /** Log-Pearson III by EMA: run when `ema` was asked (null otherwise). */
  readonly ema: FloodEmaBlock | NotApplicableBlock | null;
  readonly lmoments: FloodLMomentBlock | NotApplicableBlock;
  readonly warnings: readonly string[];
}

export interface FloodEstimatorSettings {
  readonly estimation: 'ema' | 'lmoments';
  readonly periods: readonly number[];
  readonly confidence: number;
  readonly seed: number;
  readonly regionalSkew?: { readonly skew: number; readonly mse: number } | null;
  readonly replicates?: number;
}

const reasonOf = (e: unknown): string => (e instanceof Error ? e.message.replace(/\.$/, '') : String(e));

function emaBlock(values: ArrayLike<number>, s: FloodEstimatorSettings, warnings: string[]): FloodEmaBlock | NotApplicableBlock {
  for (let i = 0; i < values.length; i++) {
    if (!((values[i] as number) >= 0)) return { applicable: false, reason: `log-Pearson III describes flows of 0 or more; value ${i + 1} is ${String(values[i])}` };
  }
  let run: FloodRecordFit;
  try {
    run = fitFloodRecord({ peaks: Array.from(values) }, { regionalSkew: s.regionalSkew ?? null, periods: s.periods, confidence: s.confidence, seed: s.seed, ...(s.replicates !== undefined ? { replicates: s.replicates } : {}) });
  } catch (e) {
    if (e instanceof InputError && e.code === 'bad-option') throw e;
    return { applicable: false, reason: reasonOf(e) };
  }
  if (run.notConverged) warnings.push(`Log-Pearson III (EMA): ${run.notConverged}.`);
  return emaBlockOf(run.fit, run.returnLevels, run.confidence);
}

/**
 * The EMA block of the report from a fit and its return levels (core/flood emaReturnLevels): the
 * one shape the flood section of annual maxima and the flood record of a peak file
 * (flood-record.ts) both report, so the page draws both with one renderer.
 */
export function emaBlockOf(fit: EmaFit, levels: readonly EmaReturnLevel[], confidence: number): FloodEmaBlock {
  return {
    applicable: true,
    ...emaCandidateFields(fit),
    confidence,
    intervalMethod: levels[0]?.method ?? 'none',
    bootstrapMethod: levels[0]?.bootstrap?.method ?? 'none',
    returnLevels: levels.map((l) => ({
      period: l.period,
      estimate: l.estimate,
      lower: l.lower,
      upper: l.upper,
      equivalentYears: l.equivalentYears,
      bootstrapLower: l.bootstrap?.lower ?? null,
      bootstrapUpper: l.bootstrap?.upper ?? null,
    })),
    cautions: emaCautions(fit),
  };
}

function lmomentBlock(values: ArrayLike<number>, periods: readonly number[]): FloodLMomentBlock | NotApplicableBlock {
  const sorted = Float64Array.from(values).sort();
  let lm;
  try {
    lm = sampleLMoments(sorted);
  } catch (e) {
    return { applicable: false, reason: reasonOf(e) };
  }
  if (!(lm.l2 > 0)) return { applicable: false, reason: 'the values are all equal (l2 = 0)' };
  const fits: LMomentFitRow[] = [];
  const notFitted: { family: LMomentFamily; reason: string }[] = [];
  for (const family of LMOMENT_FAMILIES) {
    try {
      const f = fitByLMoments(family, lm);
      const d = getFamily(family as FamilyName).make(f.parameters);
      fits.push({
        family,
        label: getFamily(family as FamilyName).label,
        estimation: 'lmoments',
        parameters: f.parameters,
        logLikelihood: null,
        method: f.method,
        returnLevels: periods.map((T) => ({ period: T, estimate: d.isf(1 / T), lower: null, upper: null })),
      });
    } catch (e) {
      notFitted.push({ family, reason: reasonOf(e) });
    }
  }
  return {
    applicable: true,
    estimation: 'lmoments',
    sample: { n: lm.n, l1: lm.l1, l2: lm.l2, t: lm.t, t3: lm.t3, t4: lm.t4 },
    fits,
    notFitted,
    intervalMethod: 'point estimates: no interval is computed for the L-moment levels',
    diagram: ratioDiagram(sorted),
  };
}

/** The L-moment block (and, when `ema` was asked, the EMA block) of a flood run's annual maxima. */
export function floodEstimators(values: ArrayLike<number>, s: FloodEstimatorSettings): FloodEstimators {
  const warnings: string[] = [];
  const ema = s.estimation === 'ema' ? emaBlock(values, s, warnings) : null;
  const lmoments = lmomentBlock(values, s.periods);
  if (ema && !ema.applicable) warnings.push(`Log-Pearson III (EMA) not fitted: ${ema.reason}.`);
  if (!lmoments.applicable) warnings.push(`L-moment fits not made: ${lmoments.reason}.`);
  return { requested: s.estimation, ema, lmoments, warnings };
}

/**
 * The estimators a dataset run asked for (`estimation` 'ema' or 'lmoments' on a flood run), with
 * the report's method notes; undefined when the run asked for neither.
 */
export function floodEstimatorsFor(
  values: ArrayLike<number>,
  options: { readonly estimation?: string; readonly regionalSkew?: number | null; readonly regionalSkewMse?: number | null },
  run: { readonly periods: readonly number[]; readonly confidence: number; readonly seed: number },
): { readonly section: FloodEstimators; readonly methods: readonly MethodNote[] } | undefined {
  checkFloodEstimation(options, run.periods);
  const estimation = options.estimation;
  if (estimation !== 'ema' && estimation !== 'lmoments') return undefined;
  const section = floodEstimators(values, { estimation, periods: run.periods, confidence: run.confidence, seed: run.seed, regionalSkew: regionalSkewOf(options.regionalSkew, options.regionalSkewMse) });
  const methods: MethodNote[] = [
    {
      topic: 'L-moment fits',
      description:
        'Sample L-moments from the unbiased probability-weighted moments; Gumbel, GEV, generalized logistic, generalized Pareto (lower bound estimated) and Pearson III parameters from (l1, l2, t3); return levels isf(1/T) of each fit, point estimates without intervals.',
      source: 'Hosking (1990), JRSS B 52:105-124; Hosking & Wallis (1997), Regional Frequency Analysis, §2.3 and App. A.',
    },
  ];
  if (section.ema?.applicable) {
    methods.push({
      topic: 'log-Pearson III by EMA',
      description: `${section.ema.method}; low outliers: ${section.ema.lowOutliers.method ?? 'none'}; station-skew MSE: ${section.ema.skew.mseMethod}; intervals: ${section.ema.intervalMethod}.`,
      source: 'Cohn, Lane & Baier (1997), WRR 33:2089-2096; Cohn et al. (2013), WRR 49:5047-5058; England et al. (2018), USGS Techniques and Methods 4-B5 (Bulletin 17C).',
    });
  }
  return { section, methods };
}

/**
 * The flood-estimator options of a complete sample, checked before any fitting: `ema` or
 * `lmoments` needs return periods (the estimators report levels by return period; without them
 * the request would change nothing), and a regional skew needs its mean square error and
 * `estimation: 'ema'` (it weights the EMA's log-Pearson III skew; otherwise it would be ignored).
 */
export function checkFloodEstimation(
  options: { readonly estimation?: string; readonly regionalSkew?: number | null; readonly regionalSkewMse?: number | null },
  returnPeriods: readonly number[] | null,
): void {
  const e = options.estimation;
  const g = options.regionalSkew ?? null;
  const mse = options.regionalSkewMse ?? null;
  regionalSkewOf(g, mse);
  if (g !== null && e !== 'ema') {
    throw new InputError(
      `A regional skew weights the log-Pearson III skew of the expected moments algorithm: ask for estimation ema${e === 'lmoments' ? ', not lmoments' : ' too'}.`,
      {},
      'bad-option',
    );
  }
  if ((e === 'ema' || e === 'lmoments') && returnPeriods === null) {
    throw new InputError(
      `Estimation ${e} applies to the flood section of annual maxima: give return periods too (or a threshold with dates for peaks over a threshold on the command line).`,
      {},
      'bad-option',
    );
  }
}
