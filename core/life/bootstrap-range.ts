/**
 * The censored Anderson–Darling bootstrap of bootstrap.ts by replicate range, so that ranges can
 * run anywhere (worker threads) and be added up: replicate b always draws from `createRng(seed, b)`
 * and refits from the same warm start, so the counts over [start, end) are a pure function of the
 * job and the sum over any split equals the one-piece run (as core/gof/bootstrap.ts does for
 * complete samples). The method and its sources are described in bootstrap.ts.
 *
 * p = (1 + #{A²_b ≥ A²_obs} + #{unrefittable}) / (1 + B), unrefittable replicates counted as
 * exceeding (conservative), with its binomial Monte Carlo standard error.
 */
import { getFamily, type Parameters } from '../families/index.js';
import type { BootstrapCounts } from '../gof/index.js';
import { createRng } from '../random/index.js';
import { censoredAndersonDarling } from './anderson-darling.js';
import { CENSORED_AD_METHOD, censoringDistribution, type CensoredGofResult } from './bootstrap.js';
import { buildLifeData, prepareLifeData, type LifeData } from './data.js';
import { fitCensored } from './fit.js';
import type { LifeFamilyName } from './models.js';
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
  const G = censoringDistribution(data);
  const t = new Float64Array(n);
  const f = new Uint8Array(n);
  return countReplicates(start, end, observed, (b) => {
    const rng = createRng(seed, b);
    const life = fam.random(parameters, rng, n);
    for (let i = 0; i < n; i++) {
      const x = life[i] as number;
      // Random censorship: every unit's censoring time is drawn from the Kaplan–Meier censoring distribution.
      const c = G.drawBeyond(Number.NEGATIVE_INFINITY, rng.uniform());
      if (x <= c) {
        t[i] = x;
        f[i] = 1;
      } else {
        t[i] = c;
        f[i] = 0;
      }
    }
    const sim = buildLifeData(t, f);
    const rf = fitCensored(family, sim, { warmStart: parameters });
    return rf.ok && Number.isFinite(rf.logLikelihood) ? censoredAndersonDarling(fam.make(rf.parameters), sim) : Number.NaN;
  }, opts);
}

/** Run one job's range. Pure: same job, same counts. */
export function runCensoredGofRange(job: CensoredGofJob, opts: CensoredRangeOptions = {}): BootstrapCounts {
  const data = prepareLifeData({ times: job.times, failed: job.failed });
  return runCensoredReplicates(job.family, job.parameters, data, job.observed, job.seed, job.start, job.end, opts);
}

/** The p-value result from the observed statistic and the counts over the whole range. */
export function censoredGofFromCounts(observed: number, counts: BootstrapCounts): CensoredGofResult {
  // Unrefittable replicates count as exceeding (conservative), so B is every replicate run.
  const b = counts.completed;
  const p = (1 + counts.exceed + counts.failed) / (1 + b);
  return {
    statistic: observed,
    pValue: p,
    replicates: b,
    failedReplicates: counts.failed,
    monteCarloError: b > 0 ? Math.sqrt((p * (1 - p)) / b) : Number.NaN,
    method: CENSORED_AD_METHOD,
  };
}
