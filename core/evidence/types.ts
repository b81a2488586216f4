import type { FamilyName } from '../families/types.js';

/**
 * Plot data computed by the core for the page ("evidence"): everything a chart needs, so the
 * client only draws. Every array here is a plain `number[]` (JSON-ready). A `null` inside a
 * y-array is a gap (the value is undefined or unbounded there, e.g. a density pole at 0); draw it
 * with `d3.line().defined(v => v !== null)`.
 *
 * Thinning: series drawn from the data (probability-plot points, the ECDF) are thinned for drawing
 * only, to at most `maxPoints` points, always keeping the first and last (the extremes). Every
 * statistic in the report is computed from the full data; `thinned` says whether a series was
 * reduced and `total` how many points it had before.
 */

/** Options for `computeEvidence`. */
export interface EvidenceOptions {
  /** Cap on the points of any data-derived series (default 2000, minimum 16). */
  readonly maxPoints?: number;
  /** Points of the common x grid for fitted curves (default 400, 16..2000). */
  readonly gridPoints?: number;
  /** Two-sided level of the pointwise probability-plot band: coverage 1 - bandAlpha (default 0.05). */
  readonly bandAlpha?: number;
}

/** The top-level evidence object (`response.evidence` in `POST /api/analyze`). */
export interface Evidence {
  readonly n: number;
  /** Data extremes. */
  readonly min: number;
  readonly max: number;
  /** Suggested x-axis domain for the histogram, density and CDF charts: the data range widened by the
   *  candidates' 0.1 %/99.9 % quantiles and outer bar edges, at most one data range on each side. */
  readonly xDomain: readonly [number, number];
  /** The cap used for thinning. */
  readonly maxPoints: number;
  /** Fitted density of every candidate on one common grid (same order as `report.candidates`). */
  readonly densities: FittedCurves;
  /** The empirical CDF with every candidate's fitted CDF. */
  readonly cdf: CdfEvidence;
  /** Per-candidate charts (same order as `report.candidates`; look up by `family`). */
  readonly candidates: readonly CandidateEvidence[];
  /** Right-censored samples (a status column): the failure and suspension times and how the
   *  failures are placed; null for a complete sample. */
  readonly censoring: CensoringEvidence | null;
}

/** Why a binned chart or table is not given: bins need every unit in a known class, and a
 *  suspension is known only to lie beyond its run time. */
export interface NotApplicableEvidence {
  readonly cause: 'censored';
  readonly reason: string;
}

/** Times marked on the charts of a censored sample (thinned for drawing, extremes kept). */
export interface TimeMarks {
  readonly x: readonly number[];
  readonly thinned: boolean;
  /** Count before thinning. */
  readonly total: number;
}

export interface CensoringEvidence {
  readonly failures: number;
  readonly suspensions: number;
  /** How the failures are placed on the probability plot and the distribution-function chart. */
  readonly method: 'johnson-benard' | 'kaplan-meier';
  readonly plottingPosition: PlottingPosition;
  /** Failure times and suspension times, each ascending (for marks along the axis). */
  readonly failureTimes: TimeMarks;
  readonly suspensionTimes: TimeMarks;
  /** Why the sample gets no chi-square bins, histogram bars or observed-vs-expected bins. */
  readonly binsNotApplicable: NotApplicableEvidence;
}

/** Curves for several candidates on a common, ascending x grid. */
export interface FittedCurves {
  /** Ascending grid (linear over the display domain, merged with a geometric grid when the data
   *  are positive and span more than a factor of 20, so that curves near 0 are resolved). */
  readonly x: readonly number[];
  readonly curves: readonly FittedCurve[];
}

export interface FittedCurve {
  readonly family: FamilyName;
  readonly label: string;
  /** Same length as the grid; null where undefined or infinite. Densities are exp(logPdf). */
  readonly y: readonly (number | null)[];
}

export interface CdfEvidence {
  /** Empirical CDF as a right-continuous step function: at each x[j] (ascending distinct data
   *  values, thinned) the cumulative count of observations ≤ x[j]. The last count is n.
   *  Censored sample (`estimator` 'kaplan-meier'): the steps are at the distinct failure times,
   *  p is the Kaplan–Meier estimate 1 − Ŝ(x) (it stays below 1 when the largest time is a
   *  suspension) and cumulativeCount the number of failures ≤ x. */
  readonly empirical: {
    readonly estimator: 'empirical' | 'kaplan-meier';
    readonly x: readonly number[];
    readonly cumulativeCount: readonly number[];
    /** cumulativeCount / n. */
    readonly p: readonly number[];
    readonly thinned: boolean;
    /** Number of distinct values (steps) before thinning. */
    readonly total: number;
    /** Suspensions marked where they are: time and the step's height there (empty when complete). */
    readonly suspensions: { readonly x: readonly number[]; readonly p: readonly number[]; readonly thinned: boolean; readonly total: number };
  };
  /** Fitted CDFs on the same grid as `densities.x`. */
  readonly fitted: FittedCurves;
}

/** Charts that depend on the selected candidate. */
export interface CandidateEvidence {
  readonly family: FamilyName;
  readonly label: string;
  readonly histogram: HistogramEvidence;
  readonly probabilityPlot: ProbabilityPlotEvidence;
  readonly bins: BinCountsEvidence;
}

export interface HistogramBar {
  /** Edges used for drawing (always finite). */
  readonly lower: number;
  readonly upper: number;
  /** The true bin edges (null = ∓Infinity), as in the report's bins table. */
  readonly lowerEdge: number | null;
  readonly upperEdge: number | null;
  /** True when a display edge replaces an infinite or support edge. */
  readonly openLower: boolean;
  readonly openUpper: boolean;
  readonly observed: number;
  readonly expected: number;
  /** observed / (n · (upper - lower)): bar height on the density scale. */
  readonly density: number;
  /** expected / (n · (upper - lower)). */
  readonly expectedDensity: number;
}

export interface HistogramEvidence {
  /** "report" when the bins are the candidate's chi-square bins; "display" when the chi-square
   *  test was not computable and the bins were made here (equiprobable under the fit, k stated);
   *  "not-applicable" for a censored sample (no bars; `notApplicable` says why). */
  readonly source: 'report' | 'display' | 'not-applicable';
  readonly notApplicable: NotApplicableEvidence | null;
  readonly k: number;
  readonly bars: readonly HistogramBar[];
  /** How the finite display edges of the outer bins were chosen, in words. */
  readonly displayEdgeRule: string;
}

export interface BinCountsRow {
  readonly index: number;
  readonly lower: number | null;
  readonly upper: number | null;
  readonly observed: number;
  readonly expected: number;
  /** (observed - expected) / √expected. */
  readonly pearsonResidual: number;
  /** (observed - expected)² / expected (sums to the chi-square statistic). */
  readonly contribution: number;
}

export interface BinCountsEvidence {
  readonly source: 'report' | 'display' | 'not-applicable';
  /** Set for a censored sample, whose rows are empty. */
  readonly notApplicable: NotApplicableEvidence | null;
  readonly rows: readonly BinCountsRow[];
}

export type ProbabilityScale = 'normal' | 'lognormal' | 'weibull' | 'exponential' | 'quantile-quantile';

export interface PlottingPosition {
  /** e.g. "Blom" or "Benard (median ranks)". */
  readonly name: string;
  /** e.g. "(i - 3/8)/(n + 1/4)". */
  readonly formula: string;
  readonly source: string;
}

/** A tick on the probability axis: probability p drawn at vertical coordinate y. */
export interface ProbabilityTick {
  readonly p: number;
  readonly y: number;
}

/**
 * Probability plot on the candidate's linearising scale. Horizontal coordinate: the data on
 * `xTransform` (x, or ln x). Vertical coordinate: the plotting position mapped by the scale
 * (normal and lognormal: z = Φ⁻¹(p); Weibull: ln(-ln(1-p)); exponential: -ln(1-p); gamma and any
 * family without a linearising scale: the fitted quantile Q(p), i.e. a Q–Q plot with y = x line).
 */
export interface ProbabilityPlotEvidence {
  readonly scale: ProbabilityScale;
  readonly xTransform: 'identity' | 'ln';
  /** Axis titles without units (the page adds units), e.g. "ln x" and "z = Φ⁻¹(p)". */
  readonly xLabel: string;
  readonly yLabel: string;
  readonly plottingPosition: PlottingPosition;
  /** Data points (thinned for drawing): x = transformed order statistic, y = transformed position.
   *  Censored sample: failures only, rank = Johnson's adjusted rank (or, for Kaplan–Meier, the
   *  number at risk). */
  readonly points: { readonly x: readonly number[]; readonly y: readonly number[]; readonly rank: readonly number[] };
  /** The fitted model as a line: horizontal coordinate of the fitted quantile at each plotted y
   *  (its own y array: a rank where the fitted quantile is not finite on the scale is left out). */
  readonly fittedLine: { readonly x: readonly number[]; readonly y: readonly number[] };
  /**
   * Pointwise band at each plotted y: the i-th uniform order statistic is Beta(i, n+1-i); its
   * bandAlpha/2 and 1-bandAlpha/2 quantiles mapped through the fitted quantile and `xTransform`.
   * A point outside [lower, upper] is unusual at that rank on its own (not a simultaneous test).
   */
  readonly band: {
    readonly level: number;
    readonly y: readonly number[];
    readonly lower: readonly (number | null)[];
    readonly upper: readonly (number | null)[];
    readonly description: string;
  };
  /** Probability ticks for the vertical axis (absent for the Q–Q scale). */
  readonly probabilityTicks: readonly ProbabilityTick[];
  /** Censored sample: suspension times on the horizontal coordinate (xTransform applied; thinned),
   *  to be marked along the axis: they have no plotting position. Empty for a complete sample. */
  readonly suspensions: readonly number[];
  readonly thinned: boolean;
  /** Points before thinning (n, or the number of failures of a censored sample). */
  readonly total: number;
  /** Points left out because a coordinate was undefined (e.g. ln of a value ≤ 0). */
  readonly omitted: number;
}
