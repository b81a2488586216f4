/**
 * The dataset report: `AnalysisReport` (issue 2; every field unchanged) extended, additively, with
 * the trade workflows of issue 4. Each workflow section is present only when its input or option
 * was given; documented field by field in docs/report-fields.md.
 *
 *   dataKind 'complete'  a column of values                    → AnalysisReport + sections
 *   dataKind 'censored'  values + status (1 failed, 0 running) → candidates from censored MLE, `life`
 *   dataKind 'grouped'   classes lower, upper, count           → GroupedDatasetReport (own candidates)
 */
import type { CapabilityAnswer, CapabilityExtensions, CapabilityReport, PpmOutOfSpec } from '../capability/index.js';
import type { FamilyName } from '../families/index.js';
import type { GumbelVersusGev, PlottingFormula, PlottingPoint, ReturnLevelMethod } from '../flood/index.js';
import type { GroupedChiSquare, GroupedClass } from '../grouped/index.js';
import type { BoundMethod, CompetingModesReport, IntervalLifeInput, LifeCurves, LifeSampleSummary, PlotPositionMethod, RecordedLifeExtras } from '../life/index.js';
import type { AnalyzeOptions } from '../analyze.js';
import type { AnalysisReport, CandidateReport, CandidateScores, FitRun, MethodNote, NotApplicableReport } from '../report.js';
import type { TrendResult } from '../trend/index.js';
import type { FloodEstimators } from './flood-estimators.js';
import type { PotSection } from './flood-pot.js';
import type { FloodRecordSection } from './flood-record-report.js';
import type { FloodRecordRead } from './flood-record.js';

/** What the data are: decides which candidates and sections the report carries. */
export type DataKind = 'complete' | 'censored' | 'grouped';

export interface DatasetInput {
  /** The value column (times for life data), in file order. Not used for grouped input. */
  readonly values?: ArrayLike<number>;
  /** Status of each value: 1 = failed, 0 = suspended (still running or removed unfailed). */
  readonly status?: ArrayLike<number> | null;
  /** Subgroup label of each value (capability: within-subgroup sigma). */
  readonly subgroups?: readonly (string | number)[] | null;
  /** Time or year of each value (trend check), all distinct. */
  readonly order?: ArrayLike<number> | null;
  /** Grouped counts: contiguous ascending classes (first lower may be -Infinity, last upper +Infinity). */
  readonly grouped?: readonly GroupedClass[] | null;
  /**
   * The failure mode of each unit (with values + status only; read by core/workflow/life-modes.ts
   * readFailureModes): every failed unit names its mode, the others' cells are ignored.
   */
  readonly modes?: readonly (string | null)[] | null;
  /** Life data as recorded at inspections: interval rows (start, end, optional counts); they come alone (core/workflow/life-interval.ts). */
  readonly interval?: IntervalLifeInput | null;
  /** A dated series (peaks over a threshold): the day of each value, days since 1970-01-01 (core/workflow/flood-pot.ts); values and dates come alone. */
  readonly dates?: ArrayLike<number> | null;
  /** A peak file read for log-Pearson III by EMA (core/workflow/flood-record.ts); it comes alone. */
  readonly floodRecord?: FloodRecordRead | null;
  /**
   * The caller gives up `values` (a Float64Array whose order it does not need back): a complete
   * sample without order or subgroups is then sorted where it is instead of copied (8 bytes per
   * value less; the CLI's large single series). Ignored otherwise.
   */
  readonly sortInPlace?: boolean;
}

export interface DatasetOptions extends Omit<AnalyzeOptions, 'onProgress' | 'signal'> {
  /** Two-sided confidence level of every interval in the workflow sections (default 0.90). */
  readonly confidence?: number;
  /** B-life percents (life data; default [10] when a status column is given). */
  readonly bLifePercents?: readonly number[];
  /** Bound method for B-lives and reliability (default 'likelihood-ratio'). */
  readonly boundMethod?: BoundMethod;
  /** How parameters are estimated (one option for life and flood): ml (default), rank-regression (life), lmoments or ema (flood). */
  readonly estimation?: 'ml' | 'rank-regression' | 'lmoments' | 'ema';
  /** Life data: a Weibull shape taken from experience (Weibayes; also the test plan's shape). */
  readonly assumedShape?: number;
  /** Life data: a test plan (reliability to show at planTime with planConfidence, planFailures allowed). */
  readonly planReliability?: number;
  readonly planTime?: number;
  readonly planConfidence?: number;
  readonly planFailures?: number;
  /** Times at which reliability is reported with bounds (life data). */
  readonly reliabilityTimes?: readonly number[];
  /** Probability-plot positions for life data (default 'johnson-benard'). */
  readonly lifePlotPositions?: PlotPositionMethod;
  /** Return periods in years; turns on the flood section (and adds gumbel, gev to the default families). */
  readonly returnPeriods?: readonly number[];
  /** Design life in years: chance of at least one exceedance of each return level. */
  readonly designLife?: number | null;
  /** Plotting positions of the return-period plot (default 'weibull'). */
  readonly plottingPosition?: PlottingFormula;
  /** Log-Pearson III by EMA (`estimation: 'ema'`): a regional skew of log10 peaks and its mean square error, weighted with the station skew. */
  readonly regionalSkew?: number | null;
  readonly regionalSkewMse?: number | null;
  /** A peak file's historical period: the flow above which every peak would have been noticed, and its first year (defaults in core/gauge readPeakFile). */
  readonly perceptionThreshold?: number | null;
  readonly historicalStart?: number | null;
  /** Peaks over a threshold (a dated series): the threshold, and the minimum separation in days of independent events (default 3). */
  readonly threshold?: number | null;
  readonly minSeparation?: number | null;
  /** Specification limits (either may be absent); any one turns on capability. */
  readonly lsl?: number | null;
  readonly usl?: number | null;
  readonly target?: number | null;
  /** Within-subgroup sigma: 'pooled' (default, s_p/c4) or 'range' (R̄/d2). */
  readonly withinMethod?: 'pooled' | 'range';
  /** Capability on a transformation to normality (core/capability transformed.ts; default 'none'). */
  readonly transform?: 'none' | 'boxcox' | 'johnson';
  /** Physical lower bound of the characteristic (e.g. 0): no lower tail below it. */
  readonly naturalLowerBound?: number | null;
  /** Replicates of the capability bootstrap (default 999). */
  readonly capabilityReplicates?: number;
  /** Run the trend check on the values in their given order when no order column is given. */
  readonly trend?: boolean;
}

/** A B-life with its two-sided bounds. */
export interface BLifeRow {
  /** Percent failed, e.g. 10 for B10. */
  readonly percent: number;
  readonly estimate: number;
  readonly lower: number;
  readonly upper: number;
  readonly confidence: number;
  /** false when an end could not be closed (the end shown is then the search limit). */
  readonly boundsFound: boolean;
}

/** Reliability R(t) = S(t) at a chosen time, with its bounds. */
export interface ReliabilityRow {
  readonly time: number;
  readonly estimate: number;
  /** Lower end of the two-sided interval (a one-sided (1 + confidence)/2 lower bound). */
  readonly lower: number;
  readonly upper: number;
  readonly confidence: number;
  readonly boundsFound: boolean;
}

export interface ReturnLevelRow {
  /** Return period T in years. */
  readonly period: number;
  /** 1/T. */
  readonly exceedanceProbability: number;
  readonly estimate: number;
  /** Interval ends; null when that end of a profile interval could not be closed (unbounded). */
  readonly lower: number | null;
  readonly upper: number | null;
  readonly confidence: number;
  /** T exceeds twice the record length. */
  readonly beyondRecord: boolean;
}

/** A candidate of a complete or censored sample: CandidateReport plus the workflow numbers. */
export interface DatasetCandidate extends CandidateReport {
  /** Life data: B-lives (`bLifeMethod` says how the bounds were found). */
  readonly bLives?: readonly BLifeRow[];
  readonly bLifeMethod?: string;
  /** Life data: reliability at the chosen times. */
  readonly reliability?: readonly ReliabilityRow[];
  /** Life data: mean life of the fitted model (no bounds). */
  readonly meanLife?: number;
  /** Flood: return levels (`returnLevelMethod` says how the intervals were found). */
  readonly returnLevels?: readonly ReturnLevelRow[];
  readonly returnLevelMethod?: string;
  /** Capability: parts per million outside the limits under this fitted model. */
  readonly ppmOutOfSpec?: PpmOutOfSpec;
  /** Plain-words warnings about this candidate (threshold on its bound, extrapolated B-life, ...). */
  readonly warnings?: readonly string[];
}

export interface LifeSection extends LifeSampleSummary {
  /** All units (= report n). */
  readonly units: number;
  readonly bLifePercents: readonly number[];
  readonly reliabilityTimes: readonly number[];
  /** Fitted curves per candidate on one log-spaced time grid (cdf, reliability, hazard, plot scales). */
  readonly curves: readonly ({ readonly family: FamilyName } & LifeCurves)[];
  /**
   * Several failure modes (a failure-mode column): each mode fitted with the other modes' failures
   * as suspensions, the system reliability the product of the modes' (core/life analyzeModes, as
   * the CLI's --mode-column gives it in `life.modes`).
   */
  readonly modes?: CompetingModesReport;
  /** The recorded-life methods (mixture, Turnbull, Weibayes, rank regression, test plan; core/life recordedLifeExtras), when run. */
  readonly recorded?: RecordedLifeExtras;
}

export interface FloodSection {
  /** Record length in years (blocks). */
  readonly recordLength: number;
  readonly periods: readonly number[];
  readonly confidence: number;
  /** Interval method for Gumbel/GEV ('profile') and for the other families ('delta'). */
  readonly intervalMethods: readonly { readonly family: FamilyName; readonly method: ReturnLevelMethod; readonly detail: string }[];
  /** Return-period plot positions. */
  readonly plottingPositions: {
    readonly formula: PlottingFormula;
    readonly description: string;
    readonly a: number;
    readonly points: readonly PlottingPoint[];
  };
  /** Chance of at least one exceedance of each return level within the design life (independent years). */
  readonly designLife: {
    readonly years: number;
    readonly exceedance: readonly { readonly period: number; readonly probability: number }[];
  } | null;
  /** Periods beyond twice the record. */
  readonly beyondRecord: readonly number[];
  /** Likelihood-ratio test of the Gumbel inside the GEV (ξ = 0, χ²₁); null unless both are candidates. */
  readonly gumbelVersusGev: GumbelVersusGev | null;
  /** The GEV shape sign convention (present when the GEV is a candidate). */
  readonly gevSignNote: string | null;
  /** Estimators beside maximum likelihood (`estimation: 'ema'` or `'lmoments'`): L-moment fits, log-Pearson III by EMA. */
  readonly estimators?: FloodEstimators;
  readonly warnings: readonly string[];
  readonly cautions: readonly string[];
}

/** capability: core/capability's report plus how the normality gate and the percentile model were chosen. */
export interface CapabilitySection extends CapabilityReport, Omit<CapabilityExtensions, 'warnings'> {
  /** The fitted candidate used for the percentile method, or null. */
  readonly percentileFamily: FamilyName | null;
  /** How the gate and the percentile model were chosen, in words. */
  readonly gateRule: string;
  /**
   * The model that answers for the best-ranked candidate (core/capability/answer.ts): the
   * transformation asked for when it passes its normality test, else that candidate's row; the page
   * recomputes it for the model the user selects. `selected` is the candidate it was computed for.
   */
  readonly answer: CapabilityAnswer & { readonly selected: FamilyName | null };
}

/** trend: core/trend's Mann–Kendall result plus where the order came from. */
export interface TrendSection extends TrendResult {
  /** 'column' (an order/year column) or 'row order' (the values as given). */
  readonly orderFrom: 'column' | 'row order';
}

/** One decision number under each candidate. */
export interface SensitivityRow {
  /** E.g. 'B10 life', 'reliability at t=1000', 'mean life', 'return level T=100', 'ppm out of spec'. */
  readonly quantity: string;
  /** 'passing': only candidates that no test rejects; 'all (none passes)': every candidate, flagged. */
  readonly basis: 'passing' | 'all (none passes)';
  readonly values: readonly {
    readonly family: FamilyName;
    readonly label: string;
    readonly estimate: number;
    readonly lower?: number | null;
    readonly upper?: number | null;
    /** false when a goodness-of-fit test rejects this candidate. */
    readonly passes: boolean;
  }[];
  /** Smallest and largest estimate across the listed candidates. */
  readonly min: number;
  readonly max: number;
}

/** The report for a complete or censored sample. */
export interface DatasetReport extends AnalysisReport {
  readonly dataKind: 'complete' | 'censored';
  readonly candidates: readonly DatasetCandidate[];
  readonly life?: LifeSection;
  readonly flood?: FloodSection;
  readonly capability?: CapabilitySection;
  readonly trend?: TrendSection;
  /** Peaks over a threshold of a dated series (core/workflow/flood-pot.ts); such a report has no ranked candidates. */
  readonly pot?: PotSection;
  /** A peak file's record by log-Pearson III and EMA (core/workflow/flood-record-report.ts); such a report has no ranked candidates. */
  readonly floodRecord?: FloodRecordSection;
  /** Present when any decision number was asked for (B-life, reliability, return level, ppm). */
  readonly sensitivity?: readonly SensitivityRow[];
}

/** Chi-square on the given classes of grouped counts (k - 1 - m is exact here); defined in core/grouped. */
export type GroupedChiSquareReport = GroupedChiSquare;

export interface GroupedCandidateReport extends CandidateScores {
  /** Grouped (multinomial) log-likelihood. */
  readonly logLikelihood: number;
  readonly fit: FitRun;
  readonly chiSquare: GroupedChiSquareReport;
  readonly andersonDarling: { readonly offered: false; readonly reason: string };
  readonly rejectedBy: readonly 'chi-square'[];
  readonly verdict: string;
  readonly ppmOutOfSpec?: PpmOutOfSpec;
}

export interface GroupedSection {
  /** Σ counts (= report n). */
  readonly total: number;
  readonly classes: readonly GroupedClass[];
  /** The degrees-of-freedom rule in words (k - 1 - m, exact for grouped maximum likelihood). */
  readonly chiSquareRule: string;
  /** Why no Anderson–Darling test. */
  readonly andersonDarling: { readonly offered: false; readonly reason: string };
  readonly notes: readonly string[];
}

/** The report for grouped counts: the issue-2 frame with grouped candidates. */
export interface GroupedDatasetReport extends Omit<AnalysisReport, 'candidates'> {
  readonly dataKind: 'grouped';
  readonly candidates: readonly GroupedCandidateReport[];
  readonly grouped: GroupedSection;
  readonly sensitivity?: readonly SensitivityRow[];
}

export type AnyDatasetReport = DatasetReport | GroupedDatasetReport;

export type { GroupedClass, MethodNote, NotApplicableReport };
