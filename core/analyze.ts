/**
 * The whole analysis of one column: prepare the sample once, fit every candidate family by maximum
 * likelihood, test each fit (equiprobable chi-square; Anderson–Darling with a p-value valid for
 * estimated parameters), rank by AICc, and collect warnings and the methods used with their sources.
 *
 * Split in two so that the bootstrap (the only slow part) can run elsewhere, e.g. in worker threads:
 *   planAnalysis(values, options)  → AnalysisPlan with serialisable `bootstrapJobs` (possibly none)
 *   runBootstrapRange(job) on any thread, for any split of [0, B) (see core/gof/bootstrap.ts)
 *   finishAnalysis(plan, counts)   → AnalysisReport
 * `analyze` does all three in-process; `analyzeAsync` takes a runner for the middle step. The
 * report is the same whichever way it was computed.
 */
import { InputError, PlumblineError } from './errors.js';
import { DEFAULT_FAMILIES, getFamily, type Family, type FamilyName, type FitSuccess } from './families/index.js';
import {
  DEFAULT_BOOTSTRAP_REPLICATES,
  andersonDarlingStatistic,
  bootstrapPValue,
  chiSquareBootstrapPValue,
  chiSquareTest,
  chooseBinCount,
  formatNumber,
  GAMMA_AD_TABLE,
  runBootstrapRange,
  tablePValue,
  type AdPValue,
  type BootstrapCounts,
  type BootstrapJob,
  type CancelSignal,
} from './gof/index.js';
import { RANKING_RULE, informationCriteria, rankCandidates, rejectedBy, verdict } from './rank.js';
import type {
  AnalysisReport,
  AndersonDarlingReport,
  CandidateReport,
  ChiSquareReport,
  MethodNote,
  NotApplicableReport,
  PMethod,
} from './report.js';
import { prepareSample, type Sample } from './sample.js';

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

/** Fit, A² and chi-square of one family, as plain data (structured-clone safe). */
export type EvaluatedFamily =
  | { readonly family: FamilyName; readonly ok: true; readonly outcome: FitSuccess; readonly a2: number; readonly chiSquare: ChiSquareReport; readonly table: AdPValue | null }
  | { readonly family: FamilyName; readonly ok: false; readonly notApplicable: NotApplicableReport };

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

interface FittedCandidate {
  readonly family: Family;
  readonly fit: FitSuccess;
  readonly a2: number;
  readonly chiSquare: ChiSquareReport;
  /** Table p-value (null when the bootstrap is used). */
  readonly table: AdPValue | null;
  /** Why the bootstrap is used (when it is). */
  readonly bootstrapReason: string | null;
  /** Why the chi-square decision is by bootstrap (null: the asymptotic bracket decides). */
  readonly chiSquareBootstrapReason: string | null;
}

/** Everything computed before the bootstrap. */
export interface AnalysisPlan {
  readonly options: ResolvedOptions;
  readonly sample: Sample;
  readonly candidates: readonly FittedCandidate[];
  readonly notApplicable: readonly NotApplicableReport[];
  /** One full-range job [0, B) per family that needs the bootstrap; split them freely. */
  readonly bootstrapJobs: readonly BootstrapJob[];
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

function validateSample(sample: Sample, families: readonly FamilyName[]): void {
  const n = sample.n;
  // A NaN or infinity anywhere makes the compensated sum non-finite. prepareSample rejects such values,
  // but a Sample built with `alreadySorted` is only checked at its ends, so look again here: a
  // non-finite value must be an input error, never a fit (robustness invariant, issue 6).
  if (!Number.isFinite(sample.sum)) {
    for (let i = 0; i < n; i++) {
      const v = sample.sorted[i] as number;
      if (!Number.isFinite(v)) {
        throw new InputError(`Value #${i + 1} of the sorted sample is not a finite number (${String(v)}).`, { value: String(v) }, 'not-a-number');
      }
    }
  }
  if (n === 1) throw new InputError('Only one value: at least two different values are needed to fit a model.', {}, 'too-few-values');
  if (sample.distinct === 1) {
    throw new InputError(`All ${n} values are equal (${String(sample.min)}): no spread, so no continuous model can be fitted.`, { value: String(sample.min) }, 'bad-input');
  }
  const maxM = Math.max(...families.map((f) => getFamily(f).estimatedParameters));
  if (n < maxM + 2) {
    throw new InputError(
      `Too few values (${n}): a model with ${maxM} estimated parameters needs at least ${maxM + 2} values for AICc to be defined.`,
      {},
      'too-few-values',
    );
  }
}

function isSample(v: ArrayLike<number> | Sample): v is Sample {
  return typeof (v as Sample).logs === 'function' && (v as Sample).sorted instanceof Float64Array;
}

/**
 * Everything up to the bootstrap. Throws InputError on bad input or options. `values` may be an
 * already prepared Sample (e.g. from a streaming reader that sorted once), used as is.
 */
export function planAnalysis(values: ArrayLike<number> | Sample, options: AnalyzeOptions = {}): AnalysisPlan {
  const opts = resolveOptions(options);
  const sample = isSample(values) ? values : prepareSample(values);
  validateSample(sample, opts.families);
  if (opts.bins !== null) {
    // Validate a user k once, up front, against the most demanding family.
    const maxM = Math.max(...opts.families.map((f) => getFamily(f).estimatedParameters));
    chooseBinCount(sample.n, maxM, opts.bins);
  }
  const candidates: FittedCandidate[] = [];
  const notApplicable: NotApplicableReport[] = [];
  const jobs: BootstrapJob[] = [];
  const delegated = options.delegated;
  const away = new Set(delegated ? delegated.families.filter((f) => opts.families.includes(f)) : []);
  if (delegated && away.size > 0) delegated.start(sample);
  const results = new Map<FamilyName, Evaluated>();
  for (const name of opts.families) if (!away.has(name)) results.set(name, evaluateFamily(getFamily(name), sample, opts));
  if (delegated && away.size > 0) {
    for (const r of delegated.collect() ?? []) if (away.has(r.family)) results.set(r.family, r);
  }
  for (const name of opts.families) {
    const family = getFamily(name);
    const evaluated = results.get(name) ?? evaluateFamily(family, sample, opts);
    if (!evaluated.ok) {
      notApplicable.push(evaluated.notApplicable);
      continue;
    }
    const { outcome, a2, chiSquare } = evaluated;
    let table: AdPValue | null = evaluated.table;
    let bootstrapReason: string | null = null;
    if (opts.pMethod === 'bootstrap') bootstrapReason = 'requested';
    else {
      const switched = table === null ? null : tableSizeOff(name, outcome.parameters, sample.n);
      if (table === null) bootstrapReason = 'no published table for this family';
      else if (switched !== null) {
        bootstrapReason = switched;
        table = null;
      } else if (!boundDecides(table, opts.alpha)) {
        bootstrapReason = `the table only gives a bound (p ${table.pValueIs === 'upper-bound' ? '<' : '>'} ${formatNumber(table.pValue)}), which cannot decide at α = ${formatNumber(opts.alpha)}`;
        table = null;
      }
    }
    const chiSquareBootstrapReason = chiSquareNeedsBootstrap(chiSquare, sample.n, opts.bootstrapReplicates);
    if (bootstrapReason !== null || chiSquareBootstrapReason !== null) {
      jobs.push({
        family: name,
        parameters: outcome.parameters,
        n: sample.n,
        observed: a2,
        seed: opts.seed,
        start: 0,
        end: opts.bootstrapReplicates,
        ...(chiSquareBootstrapReason !== null && chiSquare.computable ? { chiSquare: { observed: chiSquare.statistic, k: chiSquare.k } } : {}),
      });
    }
    candidates.push({ family, fit: outcome, a2, chiSquare, table, bootstrapReason, chiSquareBootstrapReason });
  }
  return { options: opts, sample, candidates, notApplicable, bootstrapJobs: jobs };
}

type Evaluated =
  | { readonly ok: true; readonly outcome: FitSuccess; readonly a2: number; readonly chiSquare: ChiSquareReport; readonly table: AdPValue | null }
  | { readonly ok: false; readonly notApplicable: NotApplicableReport };

/**
 * The per-family part of planAnalysis (fit, A², chi-square, table p-value) for `families` only,
 * as plain data: what another thread computes for AnalyzeOptions.delegated. `values` must be the
 * same values (the Sample sorts them the same way, so every number is the same).
 */
export function evaluateFamilies(values: ArrayLike<number> | Sample, families: readonly FamilyName[], options: AnalyzeOptions = {}): EvaluatedFamily[] {
  const opts = resolveOptions({ ...options, families });
  const sample = isSample(values) ? values : prepareSample(values);
  return opts.families.map((name) => ({ family: name, ...evaluateFamily(getFamily(name), sample, opts) }));
}

/** Whether every number the report would carry for this fit is a real number (not NaN/±Infinity). */
function nonFiniteIn(outcome: FitSuccess, a2: number, chiSquare: ChiSquareReport, table: AdPValue | null): string | null {
  for (const [k, v] of Object.entries(outcome.parameters)) if (!Number.isFinite(v)) return `its estimate of ${k} is not a finite number`;
  if (!Number.isFinite(outcome.logLikelihood)) return 'its log-likelihood is not a finite number';
  if (!Number.isFinite(a2)) return 'its Anderson–Darling statistic is not a finite number';
  if (chiSquare.computable) {
    if (!Number.isFinite(chiSquare.statistic)) return 'its chi-square statistic is not a finite number';
    if (Number.isNaN(chiSquare.pValue) || Number.isNaN(chiSquare.pValueUpper)) return 'its chi-square p-value could not be computed';
  }
  if (table !== null && Number.isNaN(table.pValue)) return 'its Anderson–Darling p-value could not be computed';
  return null;
}

/** A typed error from inside a fit, in plain words (no NaN or internal names shown to the user). */
function plainFailure(e: PlumblineError): string {
  const m = /parameter (\w+) = (\S+) is invalid/.exec(e.message);
  if (m) {
    const v = Number(m[2]);
    return Number.isFinite(v) ? `its estimate of ${m[1]} came out as ${m[2]}, outside the allowed range` : `its estimate of ${m[1]} is not a finite number`;
  }
  if (e.name === 'BracketError') return 'its likelihood equation could not be solved (no bracketing interval)';
  return e.message.replace(/\.$/, '');
}

/**
 * Fit one family and compute its statistics. A fit that fails numerically (a family's own
 * parameter check throwing, or a NaN/infinite number in its results), which happens for data at
 * the edges of double precision (e.g. values near 1e-300 or 1e300 whose squared deviations
 * underflow or overflow), is reported as not applicable with the reason, never thrown as an
 * internal error and never reported as a fit (issue 6: nothing dropped without being reported).
 * Input errors (e.g. a user's bin count) still propagate.
 */
function evaluateFamily(family: Family, sample: Sample, opts: ResolvedOptions): Evaluated {
  const failed = (what: string): Evaluated => {
    const extreme = Math.max(Math.abs(sample.min), Math.abs(sample.max));
    const tiny = sample.sorted.reduce((m, x) => (x !== 0 && Math.abs(x) < m ? Math.abs(x) : m), Infinity);
    const hint =
      extreme > 1e150 || tiny < 1e-150
        ? ` The values (from ${String(sample.min)} to ${String(sample.max)}) are near the limits of double precision; rescale them (change units) to fit this model.`
        : '';
    return {
      ok: false,
      notApplicable: { family: family.name, reason: `The ${family.label} fit failed numerically (${what}), so it is not reported.${hint}`, offendingCount: 0 },
    };
  };
  try {
    const outcome = family.fit(sample);
    if (!outcome.ok) {
      // No interior maximum (a threshold model on the edge) is its own kind: not ranked, not tested.
      const kind = 'kind' in outcome ? { kind: outcome.kind } : {};
      return { ok: false, notApplicable: { family: family.name, reason: outcome.reason, offendingCount: outcome.offendingCount, ...kind } };
    }
    const dist = family.make(outcome.parameters);
    // Families that can work from ln x get the sample's cached logs (same numbers, one Math.log a point saved).
    const a2 = andersonDarlingStatistic(dist, sample.sorted, 'logCdfSfFromLogsInto' in dist && sample.nonPositive === 0 ? sample.logs() : null);
    const chiSquare = chiSquareTest(dist, sample.sorted, {
      alpha: opts.alpha,
      estimatedParameters: family.estimatedParameters,
      bins: opts.bins,
    });
    const table = opts.pMethod === 'bootstrap' ? null : tablePValue(family.name, outcome.parameters, sample, a2);
    const bad = nonFiniteIn(outcome, a2, chiSquare, table);
    if (bad !== null) return failed(bad);
    return { ok: true, outcome, a2, chiSquare, table };
  } catch (e) {
    // The sample and the options were validated before this point, so a typed error raised inside a
    // family's fit or its statistics (a parameter check, a root finder without a bracket, an input
    // check on an intermediate array) is a numerical failure of that family on these data, not the
    // user's fault: report it per family. A user's bin count error still propagates (it is checked
    // up front, but keep it the user's), and so do untyped errors (true bugs).
    if (e instanceof PlumblineError && e.code !== 'bins-too-many' && e.code !== 'bad-option' && e.code !== 'cancelled') {
      return failed(plainFailure(e));
    }
    throw e;
  }
}

/** Below this n the Weibull/Gumbel A² table (Stephens 1977) is replaced by the bootstrap. */
export const EXTREME_VALUE_TABLE_MIN_N = 100;

/** Prefix of the reasons for an automatic switch from a table to the bootstrap (also said in the warnings). */
const AUTO_SWITCH = 'the table p-value has the wrong size here, so the bootstrap is used automatically: ';

/**
 * Where a table's measured size at α = 0.05 is more than 0.5 points off the nominal (scripts/size-study.ts,
 * docs/size-study.md), the reason to switch to the bootstrap; else null.
 */
function tableSizeOff(family: FamilyName, parameters: Readonly<Record<string, number>>, n: number): string | null {
  if ((family === 'weibull' || family === 'gumbel') && n < EXTREME_VALUE_TABLE_MIN_N) {
    return `${AUTO_SWITCH}the Stephens (1977) A*(1 + 0.2/√n) approximation rejects about 5.6 % at n = 20 for a nominal 5 % (below n = ${EXTREME_VALUE_TABLE_MIN_N} the bootstrap is used)`;
  }
  const smallest = GAMMA_AD_TABLE.rows[0].shape;
  if (family === 'gamma' && (parameters['shape'] as number) < smallest) {
    return `${AUTO_SWITCH}the fitted gamma shape ${formatNumber(parameters['shape'] as number)} is below the simulated table's smallest shape ${smallest}, where the table rejected 9.6 % (shape 0.1) and 6.7 % (shape 0.25) for a nominal 5 %`;
  }
  return null;
}

/** Below this n the chi-square decision is always by bootstrap (measured sizes: scripts/size-study.ts, docs/size-study.md). */
export const CHI_SQUARE_BOOTSTRAP_BELOW_N = 50;

/**
 * Half-width of the band around α, in Monte Carlo standard errors √(α(1 - α)/B), inside which the
 * bootstrap decides the chi-square test even when the asymptotic bracket does not straddle α.
 */
export const CHI_SQUARE_MONTE_CARLO_BAND = 4;

/**
 * Above this many sampled values (B·n) the band is not used and the bootstrap decides only where the
 * bracket straddles α: 2·10^6 values cost about 3 s a family on one core (1.4 µs a value with its
 * refit, server/limits.ts). There the bracket is narrow and the straddle-only rule measured 4.8-4.9 %
 * at B = 999 and 4.5-4.6 % at B = 99 (n = 2000, docs/size-study.md).
 */
export const CHI_SQUARE_BAND_MAX_WORK = 2_000_000;

/**
 * Why the chi-square p-value must come from the parametric bootstrap, or null when the asymptotic
 * bracket decides. The true null distribution of X² with parameters estimated from the raw values
 * lies between χ²(k - 1 - m) and χ²(k - 1) (Chernoff & Lehmann 1954) only for large n, and at small
 * n the k - 1 - m reference rejects too often (measured 10 % at n = 20 for a nominal 5 %).
 *
 * At larger n the bracket [p(k - 1 - m), p(k - 1)] decides only where it lies wholly outside
 * α ± 4·√(α(1 - α)/B). A Monte Carlo test with B replicates has exact size only as a whole (Dufour
 * 2006, J. Econometrics 133:443-477 [from memory]): its decision is random for a true p near α (a
 * true p of 0.07 is still rejected with probability 0.17 at B = 99: binomial, SciPy), and letting the bracket decide
 * everywhere outside the straddle cut those random rejections off on one side only. That rule
 * rejected 4.0-4.3 % at B = 99 and 4.6-5.0 % at B = 999 for a nominal 5 % (n = 50 and 200; the
 * pure bootstrap decision 4.7-5.2 %); measured in docs/size-study.md. At the band's edge the
 * bootstrap would still reject with probability 0.004 (B = 19), 0.0014 (B = 99), 0.0002 (B = 999)
 * (binomial, SciPy), so the bracket decides only where the bootstrap would almost surely agree.
 */
export function chiSquareNeedsBootstrap(c: ChiSquareReport, n: number, replicates: number): string | null {
  if (!c.computable) return null;
  if (n < CHI_SQUARE_BOOTSTRAP_BELOW_N) return `n = ${n} is below ${CHI_SQUARE_BOOTSTRAP_BELOW_N}, where the χ²(k - 1 - m) reference rejects too often`;
  const band = replicates * n > CHI_SQUARE_BAND_MAX_WORK ? 0 : CHI_SQUARE_MONTE_CARLO_BAND * Math.sqrt((c.alpha * (1 - c.alpha)) / replicates);
  const low = c.alpha - band;
  const high = c.alpha + band;
  if (c.pValueUpper < low || c.pValue >= high) return null; // band 0: exactly the straddle of α
  const bracket = `the Chernoff–Lehmann bracket (p between ${formatNumber(c.pValue)} and ${formatNumber(c.pValueUpper)})`;
  if (c.pValue < c.alpha && c.pValueUpper >= c.alpha) return `${bracket} straddles α = ${formatNumber(c.alpha)}`;
  return (
    `${bracket} reaches within ${CHI_SQUARE_MONTE_CARLO_BAND} Monte Carlo standard errors of α = ${formatNumber(c.alpha)} ` +
    `(${formatNumber(Math.max(0, low))} to ${formatNumber(high)} at B = ${replicates}), where the bootstrap's own decision is still random; deciding there by the bracket would make the test conservative`
  );
}

/** The chi-square report with the bootstrap p-value deciding (the two asymptotic p-values kept beside it). */
function chiSquareWithBootstrap(c: ChiSquareReport, reason: string | null, counts: BootstrapCounts | undefined, opts: ResolvedOptions, n: number, label: string): ChiSquareReport {
  if (!c.computable) return c;
  if (reason === null || !counts || counts.chiSquareExceed === undefined) return { ...c, decidedBy: 'asymptotic' };
  const bp = chiSquareBootstrapPValue(counts);
  // A Monte Carlo p-value (1 + #)/(B + 1) rejects when p ≤ α: exact size when α(B + 1) is a whole
  // number (Davison & Hinkley 1997, §4.2.5 [from memory]); p < α would have size α - 1/(B + 1).
  const rejected = bp.pValue <= opts.alpha;
  const a = formatNumber(opts.alpha);
  const decision =
    `${rejected ? 'Rejected' : 'Not rejected'} at α = ${a}: X² = ${formatNumber(c.statistic)}, bootstrap p = ${formatNumber(bp.pValue)} ` +
    `(${bp.replicates} samples of n = ${n} from the fitted ${label}, each refitted on its raw values, X²* on ${c.k} equiprobable bins of its own fit; Monte Carlo s.e. ${formatNumber(bp.monteCarloStandardError)}` +
    `${bp.unrefitted > 0 ? `; ${bp.unrefitted} unrefittable replicate(s) counted as exceeding` : ''}). ` +
    `Used because ${reason}. The asymptotic p-values are ${formatNumber(c.pValue)} (dof ${c.dof}) and ${formatNumber(c.pValueUpper)} (dof ${c.dofUpper}).`;
  return {
    ...c,
    rejected,
    decision,
    decidedBy: 'bootstrap',
    bootstrap: { pValue: bp.pValue, monteCarloStandardError: bp.monteCarloStandardError, replicates: bp.replicates, unrefitted: bp.unrefitted, seed: opts.seed },
  };
}

/** Whether a table result decides the test at α (an estimate always does; a bound only on one side). */
function boundDecides(t: AdPValue, alpha: number): boolean {
  if (t.pValueIs === 'estimate') return true;
  if (t.pValueIs === 'upper-bound') return t.pValue <= alpha; // p < bound ≤ α: rejected
  return t.pValue >= alpha; // p > bound ≥ α: not rejected
}

function adRejected(pValue: number, pValueIs: AndersonDarlingReport['pValueIs'], alpha: number): boolean {
  if (pValueIs === 'upper-bound') return pValue <= alpha;
  if (pValueIs === 'lower-bound') return pValue < alpha; // not reached: undecidable bounds go to the bootstrap
  return pValue < alpha;
}

function adDecision(r: { statistic: number; pValue: number; pValueIs: AndersonDarlingReport['pValueIs']; rejected: boolean; alpha: number }): string {
  const p = r.pValueIs === 'upper-bound' ? `p < ${formatNumber(r.pValue)}` : r.pValueIs === 'lower-bound' ? `p > ${formatNumber(r.pValue)}` : `p = ${formatNumber(r.pValue)}`;
  return r.rejected
    ? `Rejected at α = ${formatNumber(r.alpha)}: A² = ${formatNumber(r.statistic)}, ${p}.`
    : `Not rejected at α = ${formatNumber(r.alpha)}: A² = ${formatNumber(r.statistic)}, ${p}.`;
}

function andersonDarlingReport(c: FittedCandidate, opts: ResolvedOptions, n: number, counts: BootstrapCounts | undefined): AndersonDarlingReport {
  const alpha = opts.alpha;
  if (c.table !== null) {
    const rejected = adRejected(c.table.pValue, c.table.pValueIs, alpha);
    const base = { statistic: c.a2, pValue: c.table.pValue, pValueIs: c.table.pValueIs, rejected, alpha };
    return {
      statistic: c.a2,
      ...(c.table.modifiedStatistic !== undefined ? { modifiedStatistic: c.table.modifiedStatistic } : {}),
      ...(c.table.tableStatistic !== undefined ? { tableStatistic: c.table.tableStatistic } : {}),
      pValue: c.table.pValue,
      pValueIs: c.table.pValueIs,
      method: 'table',
      methodDetail: c.table.methodDetail,
      alpha,
      rejected,
      decision: adDecision(base),
    };
  }
  if (!counts) throw new PlumblineError('not-computable', `Bootstrap counts for ${c.family.name} are missing.`);
  if (counts.start !== 0 || counts.end !== opts.bootstrapReplicates) {
    throw new PlumblineError('not-computable', `Bootstrap counts for ${c.family.name} cover [${counts.start}, ${counts.end}), expected [0, ${opts.bootstrapReplicates}).`);
  }
  const bp = bootstrapPValue(counts);
  const rejected = bp.pValue <= alpha; // Monte Carlo p-value: reject at p ≤ α (see chiSquareWithBootstrap)
  const methodDetail =
    `Parametric bootstrap (Stute, González Manteiga & Presedo Quindimil 1993 [from memory]): ${bp.replicates} samples of n = ${n} ` +
    `drawn from the fitted ${c.family.label}, each refitted by maximum likelihood and its A² recomputed; p = (1 + #{A²* ≥ A²} + #{unrefittable})/(B + 1) with Monte Carlo standard error √(p(1 - p)/B), a replicate that cannot be refitted counted as exceeding (conservative); seed ${opts.seed}, replicate i on random stream i. ` +
    `Used because ${c.bootstrapReason ?? 'requested'}.` +
    (bp.failed > 0 ? ` ${bp.failed} of the ${bp.replicates} replicates could not be refitted and were counted as exceeding the observed A².` : '');
  return {
    statistic: c.a2,
    pValue: bp.pValue,
    pValueIs: 'estimate',
    method: 'bootstrap',
    methodDetail,
    replicates: bp.replicates,
    monteCarloStandardError: bp.monteCarloStandardError,
    ...(bp.failed > 0 ? { failedReplicates: bp.failed } : {}),
    seed: opts.seed,
    alpha,
    rejected,
    decision: adDecision({ statistic: c.a2, pValue: bp.pValue, pValueIs: 'estimate', rejected, alpha }),
  };
}

/** Build the report from a plan and the bootstrap counts of its jobs (any split, per family). */
export function finishAnalysis(plan: AnalysisPlan, counts: readonly BootstrapCounts[] | ReadonlyMap<FamilyName, BootstrapCounts> = []): AnalysisReport {
  const opts = plan.options;
  const sample = plan.sample;
  const n = sample.n;
  const byFamily = counts instanceof Map ? counts : null;
  const list = counts instanceof Map ? [] : (counts as readonly BootstrapCounts[]);
  const notApplicable: NotApplicableReport[] = [...plan.notApplicable];
  const drafts = plan.candidates.flatMap((c) => {
    const m = c.family.estimatedParameters;
    const ic = informationCriteria(c.fit.logLikelihood, m, n);
    let famCounts: BootstrapCounts | undefined;
    if (c.table === null || c.chiSquareBootstrapReason !== null) {
      if (byFamily) famCounts = byFamily.get(c.family.name);
      else {
        const idx = plan.bootstrapJobs.findIndex((j) => j.family === c.family.name);
        famCounts = list[idx];
      }
    }
    let ad: AndersonDarlingReport;
    try {
      ad = andersonDarlingReport(c, opts, n, famCounts);
    } catch (e) {
      // Every bootstrap replicate failed to refit (data at the edge of double precision): the fit
      // has no valid p-value, so it is listed as not applicable with the reason, not ranked.
      if (e instanceof PlumblineError && e.code === 'not-computable' && famCounts !== undefined && famCounts.valid === 0) {
        notApplicable.push({
          family: c.family.name,
          reason: `The ${c.family.label} fit has no Anderson–Darling p-value: none of the ${famCounts.completed} bootstrap replicates could be refitted, so it is not reported.`,
          offendingCount: 0,
        });
        return [];
      }
      throw e;
    }
    const chiSquare = chiSquareWithBootstrap(c.chiSquare, c.chiSquareBootstrapReason, famCounts, opts, n, c.family.label);
    return [{ c, m, ...ic, ad, chiSquare, family: c.family.name, estimatedParameters: m }];
  });
  const ranked = rankCandidates(drafts);
  const candidates: CandidateReport[] = ranked.map((d) => {
    const chiRejected = d.chiSquare.computable ? d.chiSquare.rejected : null;
    const by = rejectedBy(chiRejected, d.ad.rejected);
    return {
      rank: d.rank,
      family: d.family,
      label: d.c.family.label,
      parameters: d.c.fit.parameters,
      estimatedParameters: d.m,
      logLikelihood: d.c.fit.logLikelihood,
      aic: d.aic,
      aicc: d.aicc,
      bic: d.bic,
      deltaAicc: d.deltaAicc,
      fit: { method: d.c.fit.method, iterations: d.c.fit.iterations, converged: d.c.fit.converged },
      chiSquare: d.chiSquare,
      andersonDarling: d.ad,
      rejectedBy: by,
      verdict: verdict(d.rank, d.deltaAicc, by, opts.alpha, d.c.chiSquare.computable),
    };
  });
  return {
    software: { name: 'plumbline', version: PLUMBLINE_VERSION },
    n,
    summary: { min: sample.min, max: sample.max, ...meanAndSd(sample), distinct: sample.distinct },
    options: { ...opts, families: [...opts.families] },
    rankingRule: RANKING_RULE,
    candidates,
    notApplicable,
    warnings: warningsFor(plan, candidates, notApplicable),
    methods: methodsFor(plan, candidates),
  };
}

/**
 * Mean and n - 1 standard deviation for the summary. The sample's own sums overflow near 1e308 and
 * the squared deviations underflow near 1e-300; then both are recomputed on the values divided by
 * the largest |x| (a power of two, so the division is exact), which keeps every intermediate
 * in range (common practice, no source).
 */
function meanAndSd(sample: Sample): { mean: number; sd: number } {
  const n = sample.n;
  const mean = sample.mean;
  const sd = Math.sqrt(sample.sumSqDev / (n - 1));
  if (Number.isFinite(mean) && Number.isFinite(sd) && (sd > 0 || sample.distinct === 1)) return { mean, sd };
  const big = Math.max(Math.abs(sample.min), Math.abs(sample.max));
  const s = Math.pow(2, Math.min(1023, Math.floor(Math.log2(big)))); // log2 of the largest double rounds to 1024
  const xs = sample.sorted;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += (xs[i] as number) / s;
  const m = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const d = (xs[i] as number) / s - m;
    ss += d * d;
  }
  return { mean: m * s, sd: Math.sqrt(ss / (n - 1)) * s };
}

function warningsFor(plan: AnalysisPlan, candidates: readonly CandidateReport[], notApplicable: readonly NotApplicableReport[]): string[] {
  const w: string[] = [];
  const { n, distinct } = plan.sample;
  if (distinct < n / 2) {
    w.push(
      `Many tied values: only ${distinct} distinct among ${n}. The data look rounded or discrete; the tests assume continuous data, so their p-values are too small. Record more digits if you can.`,
    );
  }
  if (n < 20) {
    w.push(`Small sample (n = ${n}): the goodness-of-fit tests have little power, so "not rejected" says little, and the ranking is uncertain.`);
  }
  for (const c of candidates) {
    if (!c.chiSquare.computable) w.push(`${c.label}: chi-square test not computed. ${c.chiSquare.reason}`);
    if (c.andersonDarling.pValueIs !== 'estimate') {
      w.push(`${c.label}: the Anderson–Darling table gives only a bound (p ${c.andersonDarling.pValueIs === 'upper-bound' ? '<' : '>'} ${formatNumber(c.andersonDarling.pValue)}); use the bootstrap method for an estimate.`);
    }
    if (!c.fit.converged) w.push(`${c.label}: the maximum-likelihood solver did not converge; treat its numbers with caution.`);
    const failedB = c.andersonDarling.failedReplicates ?? 0;
    if (failedB > 0) {
      w.push(
        `${c.label}: ${failedB} of ${c.andersonDarling.replicates ?? 0} bootstrap replicates could not be refitted; they were counted as exceeding the observed A², so the Anderson–Darling p-value is conservative (it can only be too large).`,
      );
    }
  }
  for (const c of plan.candidates) for (const fw of c.fit.warnings ?? []) w.push(`${c.family.label}: ${fw}`);
  for (const c of plan.candidates) {
    if (c.bootstrapReason?.startsWith(AUTO_SWITCH)) w.push(`${c.family.label}: Anderson–Darling p-value by bootstrap, not the table: ${c.bootstrapReason.slice(AUTO_SWITCH.length)}.`);
  }
  if (candidates.length > 0 && candidates.every((c) => c.rejectedBy.length > 0)) {
    w.push(`Every candidate is rejected at α = ${formatNumber(plan.options.alpha)}: none of these models describes the data well; the ranking only says which is least bad.`);
  }
  for (const na of notApplicable) w.push(`${na.family}: ${na.kind === 'no-interior-maximum' ? 'not ranked or tested' : 'not applicable'}. ${na.reason}`);
  return w;
}

function methodsFor(plan: AnalysisPlan, candidates: readonly CandidateReport[]): MethodNote[] {
  const notes: MethodNote[] = [
    {
      topic: 'fitting',
      description: 'Maximum likelihood for each family (closed forms where they exist, else Newton on the likelihood equation inside a bracket), solved to relative 1e-10.',
      source: 'Standard maximum-likelihood estimation (common practice).',
    },
    {
      topic: 'chi-square bins',
      description:
        'Equiprobable bins under each fitted model (edges at the fitted quantiles j/k, outer edges at the support bounds, counting [lower, upper)); k = round(2·n^(2/5)), capped so each bin expects at least 5, raised to m + 2 so the degrees of freedom are at least 1; or the user\'s k if it keeps 5 per bin.',
      source: "Moore (1986), ch. 3 of D'Agostino & Stephens (eds.), Goodness-of-Fit Techniques; Cochran (1952) Ann. Math. Stat. 23:315-345 and (1954) Biometrics 10:417-451.",
    },
    {
      topic: 'chi-square p-value',
      description: `X² = Σ(O - E)²/E with k - 1 - m degrees of freedom (pValue) and k - 1 (pValueUpper); the true null distribution lies between them for large n because the parameters were estimated from the raw data. Where that bracket comes within ${CHI_SQUARE_MONTE_CARLO_BAND} Monte Carlo standard errors √(α(1 - α)/B) of α (so that the bootstrap's own decision would still be random; past B·n = ${CHI_SQUARE_BAND_MAX_WORK.toExponential(0).replace('e+', '·10^')} sampled values only where it straddles α), or n < ${CHI_SQUARE_BOOTSTRAP_BELOW_N} (where k - 1 - m rejects too often), the decision uses a parametric-bootstrap p-value instead: samples drawn from the fitted model, each refitted on its raw values and X²* computed on equiprobable bins of its own fit, p = (1 + #{X²* > X²} + ½·#{X²* = X²})/(B + 1) (mid-p: X² is discrete), unrefittable replicates counted as exceeding.`,
      source: 'Chernoff & Lehmann (1954), Ann. Math. Stat. 25:579-586; NIST/SEMATECH e-Handbook §1.3.5.15; parametric bootstrap: Davison & Hinkley (1997), Bootstrap Methods, §4.2 [from memory].',
    },
    {
      topic: 'Anderson–Darling statistic',
      description: 'A² = -n - (1/n) Σ (2i - 1)[ln F(x_(i)) + ln S(x_(n+1-i))] at the maximum-likelihood fit, from log-cdf and log-survival values.',
      source: "Anderson & Darling (1954), JASA 49:765-769; D'Agostino & Stephens (1986), ch. 4.",
    },
  ];
  const seen = new Set<string>();
  for (const c of candidates) {
    const ad = c.andersonDarling;
    const key = `${ad.method}:${c.family}`;
    if (seen.has(key)) continue;
    seen.add(key);
    notes.push({
      topic: `Anderson–Darling p-value, ${c.label}`,
      description: ad.methodDetail,
      source: adSource(c.family, ad.method),
    });
  }
  notes.push({ topic: 'ranking', description: RANKING_RULE, source: 'Akaike (1974); Hurvich & Tsai (1989), Biometrika 76:297-307; Schwarz (1978), Ann. Stat. 6:461-464.' });
  return notes;
}

function adSource(family: FamilyName, method: PMethod): string {
  if (method === 'bootstrap') return 'Stute, González Manteiga & Presedo Quindimil (1993), Test 2:113-124 [from memory].';
  switch (family) {
    case 'normal':
    case 'lognormal':
      return "D'Agostino & Stephens (1986), Goodness-of-Fit Techniques, Table 4.9.";
    case 'exponential':
      return "D'Agostino & Stephens (1986), Goodness-of-Fit Techniques, ch. 4 (exponential case).";
    case 'weibull':
    case 'gumbel':
      return 'Stephens (1977), Biometrika 64:583-588 (extreme-value case).';
    case 'gamma':
      return "Plumbline's simulated grid (scripts/simulate-ad-tables.ts), checked at shape 1 against D'Agostino & Stephens (1986) Table 4.21 [from memory].";
    default:
      return '';
  }
}

/** Run a plan's bootstrap jobs in-process (synchronously), with progress and cancellation. */
export function runPlanBootstrap(plan: AnalysisPlan, options: Pick<AnalyzeOptions, 'onProgress' | 'signal'> = {}): BootstrapCounts[] {
  return plan.bootstrapJobs.map((job) => {
    const counts = runBootstrapRange(job, {
      ...(options.signal ? { signal: options.signal } : {}),
      onProgress: options.onProgress ? (done, total) => options.onProgress?.({ family: job.family, done, total }) : undefined,
    });
    if (counts.cancelled) throw new PlumblineError('cancelled', 'The analysis was cancelled.');
    return counts;
  });
}

/** The whole analysis, in-process. */
export function analyze(values: ArrayLike<number> | Sample, options: AnalyzeOptions = {}): AnalysisReport {
  const plan = planAnalysis(values, options);
  return finishAnalysis(plan, runPlanBootstrap(plan, options));
}

/**
 * Runs bootstrap jobs somewhere (e.g. split over worker threads with `splitBootstrapJob` and added
 * up with `combineBootstrapCounts`); must return one count per job, in the jobs' order, each
 * covering the job's whole range.
 */
export type BootstrapRunner = (
  jobs: readonly BootstrapJob[],
  options: Pick<AnalyzeOptions, 'onProgress' | 'signal'>,
) => Promise<readonly BootstrapCounts[]>;

/** The whole analysis with the bootstrap handed to `runner` (default: in-process). */
export async function analyzeAsync(values: ArrayLike<number> | Sample, options: AnalyzeOptions & { runner?: BootstrapRunner } = {}): Promise<AnalysisReport> {
  const plan = planAnalysis(values, options);
  const counts = options.runner
    ? await options.runner(plan.bootstrapJobs, options)
    : runPlanBootstrap(plan, options);
  for (const c of counts) if (c.cancelled) throw new PlumblineError('cancelled', 'The analysis was cancelled.');
  return finishAnalysis(plan, counts);
}

