import type { FamilyName, Parameters } from './families/types.js';

/**
 * The analysis report: what `plumbline analyze --json` prints and `POST /api/analyze` returns.
 * Every number in it can be recomputed from the report itself (bins carry observed and expected
 * counts; statistics carry their dof and method). Infinite bin edges are `null` in JSON.
 */

/** p-value methods for Anderson–Darling. */
export type PMethod = 'table' | 'bootstrap';

export interface BinRow {
  /** Lower edge (inclusive); null means -Infinity. */
  readonly lower: number | null;
  /** Upper edge (exclusive); null means +Infinity. */
  readonly upper: number | null;
  readonly observed: number;
  readonly expected: number;
}

export interface ChiSquareComputed {
  readonly computable: true;
  readonly statistic: number;
  /** k - 1 - m. */
  readonly dof: number;
  /** p-value with k - 1 - m dof (liberal). */
  readonly pValue: number;
  /** k - 1 (the Chernoff–Lehmann upper end). */
  readonly dofUpper: number;
  /** p-value with k - 1 dof; the true p lies between pValue and pValueUpper. */
  readonly pValueUpper: number;
  readonly criticalValue: number;
  readonly alpha: number;
  readonly rejected: boolean;
  /** The decision in words. */
  readonly decision: string;
  /**
   * What decided the test: 'asymptotic' (pValue, k - 1 - m dof, when the Chernoff–Lehmann bracket
   * is narrow) or 'bootstrap' (the parametric-bootstrap p-value below). Absent in older reports.
   */
  readonly decidedBy?: 'asymptotic' | 'bootstrap';
  /** The parametric-bootstrap p-value (each replicate refitted on its raw values), when it decides. */
  readonly bootstrap?: {
    readonly pValue: number;
    readonly monteCarloStandardError: number;
    /** Replicates run; unrefittable ones are counted as exceeding. */
    readonly replicates: number;
    readonly unrefitted: number;
    readonly seed: number;
  };
  /** Number of equiprobable bins. */
  readonly k: number;
  /** How k was chosen, in words (rule and caps). */
  readonly kRule: string;
  readonly bins: readonly BinRow[];
}

export interface ChiSquareNotComputable {
  readonly computable: false;
  readonly reason: string;
}

export type ChiSquareReport = ChiSquareComputed | ChiSquareNotComputable;

export interface AndersonDarlingReport {
  /** A² at the fitted parameters. */
  readonly statistic: number;
  /** The case-modified statistic used with the table (e.g. A* = A²(1 + 0.75/n + 2.25/n²)), if any. */
  readonly modifiedStatistic?: number;
  /**
   * The A² the table is entered with, when it differs from `statistic` (normal and lognormal:
   * Table 4.9 uses the n - 1 standard deviation, `statistic` is A² at the maximum-likelihood fit).
   */
  readonly tableStatistic?: number;
  /** p-value; when `pValueIs` is a bound, this number is that bound. */
  readonly pValue: number;
  readonly pValueIs: 'estimate' | 'upper-bound' | 'lower-bound';
  /** "table" (published case formula/table) or "bootstrap" (parametric, refitting each replicate). */
  readonly method: PMethod;
  /** The method in words with its published source. */
  readonly methodDetail: string;
  /** Bootstrap only. */
  readonly replicates?: number;
  readonly monteCarloStandardError?: number;
  /** Bootstrap only: replicates whose refit failed (included in `replicates`, counted as exceeding the observed A²). */
  readonly failedReplicates?: number;
  readonly seed?: number;
  readonly alpha: number;
  readonly rejected: boolean;
  readonly decision: string;
}

/** A fitted candidate's parameters and information criteria: shared by the complete, grouped and life reports. */
export interface CandidateScores {
  /** 1 = best by the ranking rule. */
  readonly rank: number;
  readonly family: FamilyName;
  readonly label: string;
  readonly parameters: Parameters;
  readonly estimatedParameters: number;
  readonly logLikelihood: number;
  readonly aic: number;
  readonly aicc: number;
  readonly bic: number;
  /** AICc minus the best AICc. */
  readonly deltaAicc: number;
}

/** How the maximum-likelihood fit ran. */
export interface FitRun {
  readonly method: string;
  readonly iterations: number;
  readonly converged: boolean;
}

export interface CandidateReport extends CandidateScores {
  readonly fit: FitRun;
  readonly chiSquare: ChiSquareReport;
  readonly andersonDarling: AndersonDarlingReport;
  /** Tests that reject this candidate at α. */
  readonly rejectedBy: readonly ('chi-square' | 'anderson-darling')[];
  /** Plain-words verdict at α. */
  readonly verdict: string;
}

export interface NotApplicableReport {
  readonly family: FamilyName;
  readonly reason: string;
  readonly offendingCount: number;
  /**
   * 'no-interior-maximum': the likelihood has no maximum on these data (a threshold model whose
   * likelihood is unbounded at the smallest value), so there is no fit to rank or test. Absent for
   * an ordinary not-applicable family.
   */
  readonly kind?: 'no-interior-maximum';
}

export interface MethodNote {
  readonly topic: string;
  readonly description: string;
  readonly source: string;
}

/** The analysis options as resolved (defaults filled in) and echoed in the report. */
export interface ReportOptions {
  readonly families: readonly FamilyName[];
  readonly alpha: number;
  readonly bins: number | null;
  readonly pMethod: PMethod;
  readonly bootstrapReplicates: number;
  readonly seed: number;
}

export interface AnalysisReport {
  readonly software: { readonly name: 'plumbline'; readonly version: string };
  readonly n: number;
  readonly summary: {
    readonly min: number;
    readonly max: number;
    readonly mean: number;
    readonly sd: number;
    readonly distinct: number;
  };
  readonly options: ReportOptions;
  readonly rankingRule: string;
  readonly candidates: readonly CandidateReport[];
  readonly notApplicable: readonly NotApplicableReport[];
  readonly warnings: readonly string[];
  readonly methods: readonly MethodNote[];
}
