/**
 * Parametric bootstrap p-value of the interval-data Anderson–Darling statistic
 * (interval-anderson-darling.ts), reproducing the inspection scheme unit by unit: each unit keeps
 * the inspection times its own row records, gets a lifetime drawn from the fitted model, and is
 * observed through those times —
 *   interval row (L, R]: inspected at L and at R, so T ≤ L reads (0, L], L < T ≤ R reads (L, R],
 *                        T > R reads "running at R" (R, ∞);
 *   left row (0, R]:     inspected at R: (0, R] or (R, ∞);
 *   right row (L, ∞):    last seen at L: found failed there, (0, L], or still running, (L, ∞);
 *   exact row t:         watched continuously up to the last time in the data, τ: T exact when T ≤ τ,
 *                        else (τ, ∞).
 * This treats each unit's recorded times as its inspection times, drawn independently of its life
 * (case-2 interval censoring; the resampling that keeps each unit's inspection times and redraws its
 * life is Ren's (2003, Scand. J. Statist. 30:211-226 [from memory]) for the NPMLE; Sun 2006, The
 * Statistical Analysis of Interval-censored Failure Time Data, ch. 2 [from memory], for the
 * scheme). When a fleet was inspected on a denser common schedule than its rows show, the
 * replicates carry less information than such a fleet had; the method text says so. Measured size
 * (test/fixtures/life-interval-size.json, scripts/life-interval-size.ts): conservative in both designs,
 * far below α: with case-2 data too, since a row records only the inspections around the failure (a
 * suspension at V loses its earlier inspection at U), so replicates are coarser than the data. The
 * p-value therefore errs toward not rejecting; its power is low.
 * Each replicate is refitted by the same interval maximum likelihood (warm start at the fitted
 * parameters) and its statistic computed on its own Turnbull estimate against its own fit, so the
 * p-value accounts for estimated parameters (as bootstrap.ts does for right-censored data).
 * By replicate range: replicate b always draws from `createRng(seed, b)`, so counts over any split
 * add up to the one-piece run. A replicate that cannot be refitted counts as exceeding
 * (conservative): p = (1 + #{A²_b ≥ A²_obs} + #{unrefittable}) / (1 + B), reject at p ≤ α.
 */
import { getFamily, type Parameters } from '../families/index.js';
import type { BootstrapCounts } from '../gof/index.js';
import { createRng } from '../random/index.js';
import type { CensoredGofResult } from './bootstrap.js';
import { censoredGofFromCounts } from './bootstrap-range.js';
import { countReplicates, type ReplicateRangeOptions } from './replicate-counts.js';
import { intervalAndersonDarling } from './interval-anderson-darling.js';
import { prepareIntervalLifeData, type IntervalLifeData } from './interval-likelihood-data.js';
import { fitInterval } from './interval-likelihood-fit.js';
import type { LifeFamilyName } from './models.js';
import { turnbull, type TurnbullOptions } from './turnbull.js';

/** The Turnbull settings of the statistic, the same for the data and every replicate. */
export const INTERVAL_AD_TURNBULL: TurnbullOptions = { tolerance: 1e-9, maxIterations: 20000 };

export const INTERVAL_AD_METHOD =
  'Anderson–Darling A² on the Turnbull estimate (inside each innermost interval the estimate taken nearest the model; cf. Ren 2003), p-value by parametric bootstrap that refits every replicate and reproduces the inspection scheme unit by unit: each unit keeps the inspection times its row records (interval (L, R]: inspected at L and R; left (0, R]: at R; right (L, ∞): last seen at L; exact: watched to the last time in the data) and gets a lifetime from the fitted model; replicates that cannot be refitted count as exceeding (conservative). Assumes inspection times independent of the lives; a fleet inspected more often than its rows show is given less information in the replicates than it had. Measured size: conservative (far below α), so a model that is not rejected is not thereby supported';

/** The observed statistic of a fitted model. */
export function intervalStatistic(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData): number {
  return intervalAndersonDarling(getFamily(family).make(parameters), turnbull(data, INTERVAL_AD_TURNBULL), data.n);
}

export type IntervalRangeOptions = ReplicateRangeOptions;

/** Run replicates [start, end) of the inspection-scheme bootstrap. Pure: same arguments, same counts. */
export function runIntervalReplicates(
  family: LifeFamilyName,
  parameters: Parameters,
  data: IntervalLifeData,
  observed: number,
  seed: number,
  start: number,
  end: number,
  opts: IntervalRangeOptions = {},
): BootstrapCounts {
  const fam = getFamily(family);
  const dist = fam.make(parameters);
  const tau = data.maxTime;
  const rows = data.lower.length;
  const n = data.n;
  const lo = new Float64Array(n);
  const hi = new Float64Array(n);
  return countReplicates(start, end, observed, (b) => {
    const rng = createRng(seed, b);
    let k = 0;
    for (let r = 0; r < rows; r++) {
      const L = data.lower[r] as number;
      const R = data.upper[r] as number;
      const kind = data.kinds[r];
      for (let c = 0; c < (data.counts[r] as number); c++) {
        // Inversion of the model's own quantile (tails by isf): one uniform per unit, in row order.
        const u = rng.uniform();
        const T = u < 0.5 ? dist.quantile(u) : dist.isf(1 - u);
        let a: number;
        let z: number;
        if (kind === 'exact') [a, z] = T <= tau ? [T, T] : [tau, Number.POSITIVE_INFINITY];
        else if (kind === 'interval') [a, z] = T <= L ? [0, L] : T <= R ? [L, R] : [R, Number.POSITIVE_INFINITY];
        else if (kind === 'left') [a, z] = T <= R ? [0, R] : [R, Number.POSITIVE_INFINITY];
        else [a, z] = T <= L ? [0, L] : [L, Number.POSITIVE_INFINITY];
        lo[k] = a;
        hi[k++] = z;
      }
    }
    try {
      const sim = prepareIntervalLifeData({ start: lo, end: hi }, { trusted: true });
      const rf = fitInterval(family, sim, { warmStart: parameters });
      return rf.ok && Number.isFinite(rf.logLikelihood) ? intervalStatistic(family, rf.parameters, sim) : Number.NaN;
    } catch {
      return Number.NaN; // a replicate whose fit throws is unrefittable
    }
  }, opts);
}

/** The p-value from the observed statistic and the counts over the whole range (the rule of bootstrap-range.ts). */
export function intervalGofFromCounts(observed: number, counts: BootstrapCounts): CensoredGofResult {
  return { ...censoredGofFromCounts(observed, counts), method: INTERVAL_AD_METHOD };
}

export interface IntervalGofOptions {
  readonly replicates?: number;
  readonly seed?: number;
}

/** The whole bootstrap in one piece. */
export function intervalGofBootstrap(family: LifeFamilyName, parameters: Parameters, data: IntervalLifeData, opts: IntervalGofOptions = {}): CensoredGofResult {
  const B = opts.replicates ?? 999;
  const seed = opts.seed ?? 20261201;
  const observed = intervalStatistic(family, parameters, data);
  return intervalGofFromCounts(observed, runIntervalReplicates(family, parameters, data, observed, seed, 0, B));
}
