/**
 * Parametric bootstrap p-value of the censored Anderson–Darling statistic, reproducing the
 * censoring pattern: each replicate draws n lifetimes from the fitted model and censors each unit
 * at a censoring time chosen as follows (the conditional scheme for censored data, Davison &
 * Hinkley 1997, "Bootstrap Methods and their Application", §3.5 [from memory]):
 *  - a unit that was a suspension is censored at its own observed run time;
 *  - a unit that failed had an unseen censoring time beyond its failure time: it is drawn from the
 *    Kaplan–Meier estimate of the censoring distribution (suspensions as events) conditional on
 *    exceeding the failure time, with the estimate's leftover mass at the end of observation
 *    (the largest time in the data).
 * Under Type I censoring (every suspension at the same end time, as in a test stopped at 500 h) this
 * censors every unit at that end time; with staggered withdrawals it keeps their spread.
 * Calibration measured here (one-off simulation, 500 Weibull samples of 40 units, 99 replicates
 * each): with Type I censoring at a fixed time 4.6 % of p-values fell at or below 0.05 (9.4 % at
 * or below 0.10); with staggered uniform withdrawal times 8.6 % (15 %), i.e. somewhat liberal,
 * because the censoring distribution itself is estimated.
 * Each replicate is refitted by the same censored maximum likelihood and its statistic computed
 * against its own fit, so the p-value accounts for estimated parameters (Stute, González Manteiga
 * & Presedo Quindimil 1993, Test 2:113-124 [memory]; for censored samples the same scheme as
 * Efron 1981, JASA 76:312-319, "censored data and the bootstrap" [from memory]).
 * p = (1 + #{A²_b ≥ A²_obs}) / (1 + B), with its binomial Monte Carlo standard error.
 */
import { getFamily } from '../families/index.js';
import { createRng } from '../random/index.js';
import { censoredAndersonDarling } from './anderson-darling.js';
import { buildLifeData, type LifeData } from './data.js';
import { fitCensored, type CensoredFitSuccess } from './fit.js';

export interface CensoredGofResult {
  readonly statistic: number;
  readonly pValue: number;
  /** Replicates that produced a statistic. */
  readonly replicates: number;
  /** Replicates whose refit failed (e.g. too few simulated failures); left out of the p-value. */
  readonly failedReplicates: number;
  readonly monteCarloError: number;
  readonly method: string;
}

export interface BootstrapOptions {
  readonly replicates?: number;
  readonly seed?: number;
}

export const CENSORED_AD_METHOD =
  'Anderson–Darling A² on the Kaplan–Meier estimate (Anderson–Darling weight on the product-limit process, cf. Koziol & Green 1976), p-value by parametric bootstrap that refits every replicate and reproduces the censoring: suspensions censored at their own run times, failures at a time drawn from the Kaplan–Meier censoring distribution beyond their failure time (Type I censoring is reproduced exactly; with staggered withdrawals the p-value is approximate and somewhat liberal: 8.6 % of true-model p-values fell at or below 0.05 in a check here)';

export function censoredGofBootstrap(fit: CensoredFitSuccess, data: LifeData, opts: BootstrapOptions = {}): CensoredGofResult {
  const B = opts.replicates ?? 999;
  const seed = opts.seed ?? 20261201;
  const fam = getFamily(fit.family);
  const observed = censoredAndersonDarling(fam.make(fit.parameters), data);
  const n = data.n;
  const G = censoringDistribution(data);
  let exceed = 0;
  let ok = 0;
  let failed = 0;
  const t = new Float64Array(n);
  const f = new Uint8Array(n);
  for (let b = 0; b < B; b++) {
    const rng = createRng(seed, b);
    const life = fam.random(fit.parameters, rng, n);
    for (let i = 0; i < n; i++) {
      const x = life[i] as number;
      const c = data.failed[i] ? G.drawBeyond(data.times[i] as number, rng.uniform()) : (data.times[i] as number);
      if (x <= c) {
        t[i] = x;
        f[i] = 1;
      } else {
        t[i] = c;
        f[i] = 0;
      }
    }
    const sim = buildLifeData(t, f);
    const rf = fitCensored(fit.family, sim, { warmStart: fit.parameters });
    if (!rf.ok || !Number.isFinite(rf.logLikelihood)) {
      failed++;
      continue;
    }
    const a = censoredAndersonDarling(fam.make(rf.parameters), sim);
    if (!Number.isFinite(a)) {
      failed++;
      continue;
    }
    ok++;
    if (a >= observed) exceed++;
  }
  const p = (1 + exceed) / (1 + ok);
  return {
    statistic: observed,
    pValue: p,
    replicates: ok,
    failedReplicates: failed,
    monteCarloError: ok > 0 ? Math.sqrt((p * (1 - p)) / ok) : Number.NaN,
    method: CENSORED_AD_METHOD,
  };
}

/**
 * The Kaplan–Meier estimate of the censoring-time distribution (suspensions are its events,
 * failures its censored values; at a tie the failure is taken first, as the lifetime sort order
 * has it), with any mass it leaves undistributed placed at the end of observation.
 */
export function censoringDistribution(data: LifeData): { atoms: Float64Array; mass: Float64Array; drawBeyond(t: number, u: number): number } {
  const n = data.n;
  const atoms: number[] = [];
  const mass: number[] = [];
  let S = 1;
  let i = 0;
  while (i < n) {
    const t = data.times[i] as number;
    let m = 0;
    let d = 0;
    let firstSusp = -1;
    while (i + m < n && data.times[i + m] === t) {
      if (!data.failed[i + m]) {
        d++;
        if (firstSusp < 0) firstSusp = i + m;
      }
      m++;
    }
    if (d > 0) {
      const atRisk = n - firstSusp; // failures tied at t are not at risk of censoring after failing
      const jump = S * (d / atRisk);
      atoms.push(t);
      mass.push(jump);
      S -= jump;
    }
    i += m;
  }
  if (S > 1e-15) {
    if (atoms.length > 0 && atoms[atoms.length - 1] === data.maxTime) mass[mass.length - 1] = (mass[mass.length - 1] as number) + S;
    else {
      atoms.push(data.maxTime);
      mass.push(S);
    }
  }
  const A = Float64Array.from(atoms);
  const M = Float64Array.from(mass);
  return {
    atoms: A,
    mass: M,
    drawBeyond(t: number, u: number): number {
      let total = 0;
      for (let j = 0; j < A.length; j++) if ((A[j] as number) > t) total += M[j] as number;
      if (!(total > 0)) return data.maxTime;
      let target = u * total;
      for (let j = 0; j < A.length; j++) {
        if (!((A[j] as number) > t)) continue;
        target -= M[j] as number;
        if (target <= 0) return A[j] as number;
      }
      return A[A.length - 1] as number;
    },
  };
}
