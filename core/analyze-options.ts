/**
 * The options of the complete-sample analysis: defaults, validation (resolveOptions) and the
 * resolved form a plan carries.
 */
import { InputError } from './errors.js';
import { DEFAULT_FAMILIES, getFamily, type FamilyName } from './families/index.js';
import { DEFAULT_BOOTSTRAP_REPLICATES, type CancelSignal } from './gof/index.js';
import type { EvaluatedFamily } from './analyze-evaluate.js';
import type { PMethod } from './report.js';
import type { Sample } from './sample.js';

/** Plumbline's version as written in reports. */
export const PLUMBLINE_VERSION = '0.1.0';
/** Default significance level. */
export const DEFAULT_ALPHA = 0.05;
/** Default bootstrap seed (any fixed number; this one is the year of Anderson & Darling's test paper). */
export const DEFAULT_SEED = 1954;

export interface BootstrapProgress {
  readonly family: FamilyName;
  /** Replicates done for this family. */
  readonly done: number;
  readonly total: number;
}

export interface AnalyzeOptions {
  /** Candidate families (default: all five). */
  readonly families?: readonly FamilyName[];
  /** Significance level, 0 < alpha < 1 (default 0.05). */
  readonly alpha?: number;
  /** User-chosen number of chi-square bins (default: Moore's rule with caps). */
  readonly bins?: number | null;
  /** Anderson–Darling p-values: 'table' (default; bootstrap only where no table exists) or 'bootstrap' for all. */
  readonly pMethod?: PMethod;
  /** Bootstrap replicates B (default 999). */
  readonly bootstrapReplicates?: number;
  /** Bootstrap seed (default DEFAULT_SEED). */
  readonly seed?: number;
  /** Bootstrap progress, per family. */
  readonly onProgress?: (p: BootstrapProgress) => void;
  /** Cancellation, checked between bootstrap replicates. */
  readonly signal?: CancelSignal;
  /**
   * Families evaluated elsewhere (e.g. the CLI's second thread, with evaluateFamilies on the same
   * sorted values); the report is the same as without it.
   */
  readonly delegated?: DelegatedFamilies;
}

/** Families whose evaluation planAnalysis hands off (see AnalyzeOptions.delegated). */
export interface DelegatedFamilies {
  readonly families: readonly FamilyName[];
  /** Called once with the prepared sample, before the other families are evaluated here. */
  start(sample: Sample): void;
  /** Called after them: the delegated families' results (any order), or null to evaluate them here. */
  collect(): readonly EvaluatedFamily[] | null;
}

export interface ResolvedOptions {
  readonly families: readonly FamilyName[];
  readonly alpha: number;
  readonly bins: number | null;
  readonly pMethod: PMethod;
  readonly bootstrapReplicates: number;
  readonly seed: number;
}

/** Validate options and fill in defaults. Throws InputError with a clear message. */
export function resolveOptions(options: AnalyzeOptions = {}): ResolvedOptions {
  const alpha = options.alpha ?? DEFAULT_ALPHA;
  if (typeof alpha !== 'number' || !(alpha > 0 && alpha < 1)) {
    throw new InputError(`The significance level alpha must be a number between 0 and 1 (exclusive); got ${String(alpha)}.`, { value: String(alpha) }, 'bad-option');
  }
  const families = options.families ?? DEFAULT_FAMILIES;
  if (families.length === 0) throw new InputError('No candidate families were given.', {}, 'bad-option');
  const seen = new Set<FamilyName>();
  for (const f of families) {
    getFamily(f); // throws InputError 'bad-option' for an unknown name
    if (seen.has(f)) throw new InputError(`Family "${f}" is listed twice.`, { value: f }, 'bad-option');
    seen.add(f);
  }
  const pMethod = options.pMethod ?? 'table';
  if (pMethod !== 'table' && pMethod !== 'bootstrap') {
    throw new InputError(`The p-value method must be "table" or "bootstrap"; got "${String(pMethod)}".`, { value: String(pMethod) }, 'bad-option');
  }
  const b = options.bootstrapReplicates ?? DEFAULT_BOOTSTRAP_REPLICATES;
  if (!Number.isInteger(b) || b < 1) {
    throw new InputError(`The number of bootstrap replicates must be a whole number of at least 1; got ${String(b)}.`, { value: String(b) }, 'bad-option');
  }
  const seed = options.seed ?? DEFAULT_SEED;
  if (!Number.isSafeInteger(seed) || seed < 0) {
    throw new InputError(`The seed must be a whole number ≥ 0; got ${String(seed)}.`, { value: String(seed) }, 'bad-option');
  }
  const bins = options.bins ?? null;
  return { families: [...families], alpha, bins, pMethod, bootstrapReplicates: b, seed };
}
