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
import { getFamily, type FamilyName } from './families/index.js';
import { chooseBinCount, runBootstrapRange, type BootstrapCounts, type BootstrapJob } from './gof/index.js';
import { informationCriteria, rankCandidates, rejectedBy, verdict, RANKING_RULE } from './rank.js';
import type { AnalysisReport, AndersonDarlingReport, CandidateReport, NotApplicableReport } from './report.js';
import { prepareSample, type Sample } from './sample.js';
import { resolveOptions, PLUMBLINE_VERSION, type AnalyzeOptions, type ResolvedOptions } from './analyze-options.js';
import { evaluateFamily, isSample, type Evaluated } from './analyze-evaluate.js';
import { andersonDarlingReport, chiSquareWithBootstrap, chooseDeciders, type FittedCandidate } from './analyze-decisions.js';
import { meanAndSd, methodsFor, warningsFor } from './analyze-notes.js';

export { DEFAULT_ALPHA, DEFAULT_SEED, PLUMBLINE_VERSION, resolveOptions } from './analyze-options.js';
export type { AnalyzeOptions, BootstrapProgress, DelegatedFamilies, ResolvedOptions } from './analyze-options.js';
export { evaluateFamilies } from './analyze-evaluate.js';
export type { EvaluatedFamily } from './analyze-evaluate.js';
export {
  CHI_SQUARE_BAND_MAX_WORK,
  CHI_SQUARE_BOOTSTRAP_BELOW_N,
  CHI_SQUARE_MONTE_CARLO_BAND,
  EXTREME_VALUE_TABLE_MIN_N,
  GAMMA_TABLE_MIN_N,
  chiSquareNeedsBootstrap,
} from './analyze-decisions.js';

/** Everything computed before the bootstrap. */
export interface AnalysisPlan {
  readonly options: ResolvedOptions;
  readonly sample: Sample;
  readonly candidates: readonly FittedCandidate[];
  readonly notApplicable: readonly NotApplicableReport[];
  /** One full-range job [0, B) per family that needs the bootstrap; split them freely. */
  readonly bootstrapJobs: readonly BootstrapJob[];
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
    const { table, bootstrapReason, chiSquareBootstrapReason } = chooseDeciders(name, evaluated, sample.n, opts);
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
        // A² decided by its table: the replicates need X²* only (an A² per replicate costs about a fifth of a gamma replicate).
        ...(bootstrapReason === null && chiSquare.computable ? { chiSquareOnly: true as const } : {}),
      });
    }
    candidates.push({ family, fit: outcome, a2, chiSquare, table, bootstrapReason, chiSquareBootstrapReason });
  }
  return { options: opts, sample, candidates, notApplicable, bootstrapJobs: jobs };
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


