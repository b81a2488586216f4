/**
 * The censored Anderson–Darling bootstrap of bootstrap.ts by replicate range, so that ranges can
 * run anywhere (worker threads) and be added up: replicate b always draws from `createRng(seed, b)`
 * and refits from the same warm start, so the counts over [start, end) are a pure function of the
 * job and the sum over any split equals the one-piece run (as core/gof/bootstrap.ts does for
 * complete samples). The method and its sources are described in bootstrap.ts.
 *
 * p = (1 + #{A²_b ≥ A²_obs} + #{unrefittable}) / (1 + B), unrefittable replicates counted as
 * exceeding (conservative), with its binomial Monte Carlo standard error. Under staggered
 * withdrawals each replicate also carries one second-level replicate and the range returns both
 * levels' statistics (BootstrapCounts.firstLevel/secondLevel, concatenated when ranges are
 * combined); the p-value is then the fast double bootstrap's (fast-double-bootstrap.ts), and the
 * standard error beside it is the binomial one of that p-value (an approximation: p** depends on
 * both levels' draws).
 */
import { getFamily, type Parameters } from '../families/index.js';
import type { BootstrapCounts } from '../gof/index.js';
import { createRng, type Rng } from '../random/index.js';
import { CENSORED_AD_METHOD, censoredGofStatistic, censoringDesign, censoringDistribution, type CensoredGofResult, type CensoringDesign } from './bootstrap.js';
import { buildLifeData, prepareLifeData, type LifeData } from './data.js';
import { fitCensored } from './fit.js';
import type { LifeFamilyName } from './models.js';
import { fastDoubleBootstrapPValue } from './fast-double-bootstrap.js';
import { countReplicates, type ReplicateRangeOptions } from './replicate-counts.js';

/** A serialisable range of censored bootstrap replicates (structured-clone safe). */
export interface CensoredGofJob {
  readonly kind: 'censored';
  readonly family: LifeFamilyName;
  /** The fitted parameters (the model the replicates are drawn from, and the refits' warm start). */
  readonly parameters: Parameters;
  /** The life data as given (any order): times and 1 = failed / 0 = suspended. */
  readonly times: readonly number[];
  readonly failed: readonly number[];
  /** Observed censored A² at the fitted parameters. */
  readonly observed: number;
  readonly seed: number;
  readonly start: number;
  readonly end: number;
}

export type CensoredRangeOptions = ReplicateRangeOptions;

/** Run replicates [job.start, job.end) on prepared data (bootstrap.ts runs the whole range this way). */
export function runCensoredReplicates(
  family: LifeFamilyName,
  parameters: Parameters,
  data: LifeData,
  observed: number,
  seed: number,
  start: number,
  end: number,
  opts: CensoredRangeOptions = {},
): BootstrapCounts {
  const fam = getFamily(family);
  const n = data.n;
  const design = censoringDesign(data);
  const draw = censoredReplicateDrawer(family, parameters, data);
  // The observed design fixes the statistic for every replicate (bootstrap.ts censoredGofStatistic).
  const statistic = censoredGofStatistic(design);
  const t = new Float64Array(n);
  const f = new Uint8Array(n);
  /** The statistic of a replicate drawn into t, f, against its own refit (NaN when it cannot be refitted); the refit's parameters with it. */
  const refit = (warmStart: Parameters): { stat: number; sim: LifeData; parameters: Parameters | null } => {
    const sim = buildLifeData(t, f);
    const rf = fitCensored(family, sim, { warmStart });
    return rf.ok && Number.isFinite(rf.logLikelihood) ? { stat: statistic(fam.make(rf.parameters), sim), sim, parameters: rf.parameters } : { stat: Number.NaN, sim, parameters: null };
  };
  if (design !== 'staggered') {
    return countReplicates(start, end, observed, (b) => {
      // A replicate that could not be drawn with the observed number of failures counts as unrefittable (exceeding).
      if (!draw(createRng(seed, b), t, f)) return Number.NaN;
      return refit(parameters).stat;
    }, opts);
  }
  // Staggered withdrawals: the fast double bootstrap (fast-double-bootstrap.ts). After replicate b
  // (statistic τ*_b), the same random stream draws one second-level replicate from the replicate's
  // own refit and its own Kaplan–Meier censoring estimate, by the same staggered scheme with the same
  // number of failures, and refits it (τ**_b). NaN where either level cannot be drawn or refitted.
  const firstLevel: number[] = [];
  const secondLevel: number[] = [];
  const counts = countReplicates(start, end, observed, (b) => {
    const rng = createRng(seed, b);
    if (!draw(rng, t, f)) {
      firstLevel.push(Number.NaN);
      secondLevel.push(Number.NaN);
      return Number.NaN;
    }
    const one = refit(parameters);
    firstLevel.push(one.stat);
    let two = Number.NaN;
    if (one.parameters !== null && Number.isFinite(one.stat)) {
      const drawTwo = censoredReplicateDrawer(family, one.parameters, one.sim, 'staggered');
      if (drawTwo(rng, t, f)) two = refit(one.parameters).stat;
    }
    secondLevel.push(two);
    return one.stat;
  }, opts);
  return { ...counts, firstLevel, secondLevel };
}

/**
 * Under staggered withdrawals a replicate has the observed number of failures r: its units are
 * independent and alike, so given r failures the failed units are independent draws of (life,
 * censoring time) given life ≤ censoring and the others given life > censoring; each unit is drawn
 * by rejection (about r/π + (n − r)/(1 − π) ≈ 2n draws a replicate, π the chance that a unit
 * fails). At most MAX_REPLICATE_ATTEMPTS·n unit draws a replicate; beyond that the replicate
 * counts as unrefittable, i.e. as exceeding (conservative). Redrawing whole replicates until one
 * had r failures (the first form, same distribution) cost √(2π·n·π(1 − π)) whole replicates, 3× the
 * CPU of the plain bootstrap at n = 2000.
 */
export const MAX_REPLICATE_ATTEMPTS = 1000;

/**
 * How one replicate's n units are drawn (times into `t`, 1 = failed into `f`) from the fitted model:
 * - Type I (every suspension at the end of observation τ, at or after every failure — the censoring
 *   distribution is one atom at τ): the replicate keeps the observed number of failures r: r lifetimes
 *   from the fitted model truncated to (0, τ] (inverse distribution function at U·F(τ)), the other
 *   n − r units suspended at τ. Given r, the failure times of a Type I test are an independent sample
 *   from the model truncated at τ (Lawless 2003, Statistical Models and Methods for Lifetime Data,
 *   §2.2.2 [from memory]), so this is the parametric bootstrap conditional on r. Unconditional draws
 *   (r* binomial) made the test conservative under heavy censoring — 3.87 % at α = 5 % with 70 %
 *   censored (docs/size-study.md) — because the A² distribution changes with the number of failures
 *   and replicates with a different r are a different experiment; they also produced replicates with
 *   too few failures to refit.
 * - A complete sample (no suspensions): complete replicates.
 * - Otherwise (staggered withdrawals): random censorship (Efron 1981): each unit's censoring time is
 *   drawn from the Kaplan–Meier censoring distribution (its leftover mass at the last observed time)
 *   and the unit fails when its lifetime comes first, conditional on the observed number of failures
 *   r (as in the Type I case): r units drawn given failure, the others given suspension (see
 *   MAX_REPLICATE_ATTEMPTS; false when the draw budget runs out). Measured on the study's samples
 *   (R = 2000, B = 99, with the studentized statistic): 5.40 → 5.15 % at 30 % censored and
 *   4.20 → 4.50 % at 70 % (scripts/size-study-censored-variants.ts cur+stud, cur+stud+r); at
 *   R = 10,000 5.52 % and 3.95 % for this single bootstrap, 5.40 % and 4.90 % for the fast double
 *   bootstrap built on it (runCensoredReplicates; docs/size-study.md).
 * Returns whether the replicate was drawn.
 */
export function censoredReplicateDrawer(
  family: LifeFamilyName,
  parameters: Parameters,
  data: LifeData,
  /** The scheme to draw by (the second level of the fast double bootstrap keeps the observed data's); by default the data's own design. */
  scheme: CensoringDesign = censoringDesign(data),
): (rng: Rng, t: Float64Array, f: Uint8Array) => boolean {
  const fam = getFamily(family);
  const n = data.n;
  const design: CensoringDesign = scheme;
  if (design === 'complete') {
    // A complete sample: complete replicates (no observation end to reproduce).
    return (rng, t, f) => {
      t.set(fam.random(parameters, rng, n));
      f.fill(1);
      return true;
    };
  }
  const G = censoringDistribution(data);
  if (design === 'type-1') {
    const tau = G.atoms[0] as number;
    const r = data.failures;
    const dist = fam.make(parameters);
    const pTau = Math.exp(dist.logCdf(tau));
    return (rng, t, f) => {
      for (let i = 0; i < r; i++) {
        t[i] = Math.min(dist.quantile(rng.uniform() * pTau), tau);
        f[i] = 1;
      }
      for (let i = r; i < n; i++) {
        t[i] = tau;
        f[i] = 0;
      }
      return true;
    };
  }
  const r = data.failures;
  const dist = fam.make(parameters);
  return (rng, t, f) => {
    let budget = MAX_REPLICATE_ATTEMPTS * n;
    for (let i = 0; i < n; i++) {
      const fails = i < r;
      for (;;) {
        if (budget-- <= 0) return false;
        const x = dist.quantile(rng.uniform());
        // Random censorship: the censoring time is drawn from the Kaplan–Meier censoring distribution.
        const c = G.draw(rng.uniform());
        if ((x <= c) === fails) {
          t[i] = fails ? x : c;
          f[i] = fails ? 1 : 0;
          break;
        }
      }
    }
    return true;
  };
}

/** How the report names the staggered-withdrawal statistic (anderson-darling.ts studentizedCensoredAndersonDarling) and its p-value. */
export const STUDENTIZED_LABEL = 'studentized censored A² (A² over its Greenwood-estimated mean; p-value by fast double bootstrap)';

/** Run one job's range. Pure: same job, same counts. */
export function runCensoredGofRange(job: CensoredGofJob, opts: CensoredRangeOptions = {}): BootstrapCounts {
  const data = prepareLifeData({ times: job.times, failed: job.failed });
  return runCensoredReplicates(job.family, job.parameters, data, job.observed, job.seed, job.start, job.end, opts);
}

/** The p-value result from the observed statistic and the counts over the whole range. */
export function censoredGofFromCounts(observed: number, counts: BootstrapCounts, design?: CensoringDesign): CensoredGofResult {
  // Unrefittable replicates count as exceeding (conservative), so B is every replicate run.
  const b = counts.completed;
  // Staggered withdrawals: the fast double bootstrap p-value from both levels' statistics.
  const fdb = design === 'staggered' && counts.firstLevel !== undefined && counts.secondLevel !== undefined ? fastDoubleBootstrapPValue(observed, counts.firstLevel, counts.secondLevel) : null;
  const p = fdb ? fdb.pValue : (1 + counts.exceed + counts.failed) / (1 + b);
  return {
    ...(design === 'staggered' ? { testLabel: STUDENTIZED_LABEL } : {}),
    ...(fdb ? { firstLevelPValue: fdb.firstLevelPValue } : {}),
    statistic: observed,
    pValue: p,
    replicates: b,
    failedReplicates: counts.failed,
    monteCarloError: b > 0 ? Math.sqrt((p * (1 - p)) / b) : Number.NaN,
    method: CENSORED_AD_METHOD,
  };
}
