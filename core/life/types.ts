/** The life-data report: what `analyzeLife` returns, for the CLI, the server and the page. */
import type { CandidateScores } from '../report.js';
import type { BLife, BoundedEstimate, BoundMethod, ReliabilityAt } from './bounds.js';
import type { CensoredGofResult } from './bootstrap.js';
import type { LifeData } from './data.js';
import type { CensoredFitSuccess } from './fit.js';
import type { LifeCurves } from './curves.js';
import type { LifeFamilyName } from './models.js';
import type { PlotPositionMethod, PlotPositions } from './positions.js';

export interface LifeOptions {
  /** Candidate families (default: all five). */
  readonly families?: readonly LifeFamilyName[];
  /** B-life percents, e.g. [1, 10, 50] for `--b-life 1,10,50` (default [10]). */
  readonly bLifePercents?: readonly number[];
  /** Two-sided confidence level of every bound (default 0.90). */
  readonly confidence?: number;
  /** Bound method (default 'likelihood-ratio'). */
  readonly boundMethod?: BoundMethod;
  /** Times at which to report reliability with bounds (default none). */
  readonly reliabilityTimes?: readonly number[];
  /** Bootstrap replicates for the censored Anderson–Darling p-value (default 999, as for complete samples; 0 turns it off). */
  readonly bootstrapReplicates?: number;
  readonly seed?: number;
  /** Probability-plot positions (default 'johnson-benard'). */
  readonly plotPositions?: PlotPositionMethod;
  /** Points on the curve grid (default 60). */
  readonly curvePoints?: number;
  /**
   * The goodness of fit of one fitted family, given its replicates B and seed; default: the
   * in-process censoredGofBootstrap. A caller may run the replicates elsewhere by range
   * (bootstrap-range.ts; core/workflow/pipeline.ts) and hand the result back here.
   */
  readonly goodnessOfFit?: CensoredGofHook;
}

/** See LifeOptions.goodnessOfFit. */
export type CensoredGofHook = (fit: CensoredFitSuccess, data: LifeData, replicates: number, seed: number) => CensoredGofResult | null;

export interface LifeMethodNote {
  readonly topic: string;
  readonly text: string;
  readonly source: string;
}

export interface LifeCandidate extends CandidateScores {
  readonly family: LifeFamilyName;
  readonly converged: boolean;
  readonly iterations: number;
  readonly method: string;
  readonly bLives: readonly BLife[];
  readonly reliability: readonly ReliabilityAt[];
  /** Mean life of the fitted model (no bounds). */
  readonly meanLife: number;
  /** Weibull shape with its profile-likelihood interval (Weibull only). */
  readonly shapeInterval: BoundedEstimate | null;
  readonly curves: LifeCurves;
  /** Censored Anderson–Darling with bootstrap p-value; null when the bootstrap is turned off. */
  readonly goodnessOfFit: CensoredGofResult | null;
  readonly warnings: readonly string[];
}

export interface LifeNotFitted {
  readonly family: LifeFamilyName;
  readonly reason: string;
}

/** What a life-data report says about the sample as a whole: shared by `LifeReport` and the workflow's life section. */
export interface LifeSampleSummary {
  readonly failures: number;
  readonly suspensions: number;
  readonly confidence: number;
  readonly boundMethod: BoundMethod;
  /** Probability-plot positions (method, description, points with bands, Weibull and lognormal coordinates). */
  readonly plot: PlotPositions;
  /** Why the equiprobable chi-square test is not reported for censored samples. */
  readonly chiSquare: { readonly applies: false; readonly reason: string };
  readonly warnings: readonly string[];
  readonly cautions: readonly string[];
}

export interface LifeReport extends LifeSampleSummary {
  /** All units. */
  readonly n: number;
  /** Ranked by AICc (n = all units), best first. */
  readonly candidates: readonly LifeCandidate[];
  readonly notFitted: readonly LifeNotFitted[];
  readonly methods: readonly LifeMethodNote[];
}
