/**
 * The decisions of the complete-sample analysis: which p-value decides each test (the A² table or
 * the parametric bootstrap; the chi-square's asymptotic bracket or its bootstrap), and the test
 * reports built from them once the bootstrap counts are in.
 */
import { PlumblineError } from './errors.js';
import type { Family, FamilyName, FitSuccess } from './families/index.js';
import {
  bootstrapPValue,
  chiSquareBootstrapPValue,
  EXTREME_VALUE_SIMULATED_MIN_N,
  formatNumber,
  GAMMA_AD_TABLE,
  type AdPValue,
  type BootstrapCounts,
} from './gof/index.js';
import type { ResolvedOptions } from './analyze-options.js';
import type { AndersonDarlingReport, ChiSquareReport } from './report.js';

export { EXTREME_VALUE_TABLE_MIN_N } from './gof/index.js';

/** A fitted family with its statistics and the reasons its tests go to the bootstrap (if they do). */
export interface FittedCandidate {
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

/**
 * Which p-value decides each test of one evaluated family: the A² table, or the bootstrap (asked
 * for, no table, a table whose size is off here, or a table bound that cannot decide at α); the
 * chi-square bracket or its bootstrap (chiSquareNeedsBootstrap).
 */
export function chooseDeciders(
  name: FamilyName,
  evaluated: { readonly outcome: FitSuccess; readonly chiSquare: ChiSquareReport; readonly table: AdPValue | null },
  n: number,
  opts: ResolvedOptions,
): { table: AdPValue | null; bootstrapReason: string | null; chiSquareBootstrapReason: string | null } {
  const { outcome, chiSquare } = evaluated;
  let table: AdPValue | null = evaluated.table;
  let bootstrapReason: string | null = null;
  if (opts.pMethod === 'bootstrap') bootstrapReason = 'requested';
  else {
    const switched = table === null ? null : tableSizeOff(name, outcome.parameters, n);
    if (table === null) bootstrapReason = 'no published table for this family';
    else if (switched !== null) {
      bootstrapReason = switched;
      table = null;
    } else if (!boundDecides(table, opts.alpha)) {
      bootstrapReason = `the table only gives a bound (p ${table.pValueIs === 'upper-bound' ? '<' : '>'} ${formatNumber(table.pValue)}), which cannot decide at α = ${formatNumber(opts.alpha)}`;
      table = null;
    }
  }
  return { table, bootstrapReason, chiSquareBootstrapReason: chiSquareNeedsBootstrap(chiSquare, n, opts.bootstrapReplicates) };
}

/**
 * Below this n the simulated gamma A² table (built at n = 200 and used without an n-correction) is
 * replaced by the bootstrap: at n = 10 it rejected 4.03 % (shape 2) and 4.55 % (shape 8) for a
 * nominal 5 % on 10,000 samples each; 4.75-5.09 % at n = 20 (docs/size-study.md).
 */
export const GAMMA_TABLE_MIN_N = 20;

/** Prefix of the reasons for an automatic switch from a table to the bootstrap (also said in the warnings). */
export const AUTO_SWITCH = 'the table p-value has the wrong size here, so the bootstrap is used automatically: ';

/**
 * Where a table's measured size at α = 0.05 is more than 0.5 points off the nominal (scripts/size-study.ts,
 * docs/size-study.md), the reason to switch to the bootstrap; else null.
 */
function tableSizeOff(family: FamilyName, parameters: Readonly<Record<string, number>>, n: number): string | null {
  if ((family === 'weibull' || family === 'gumbel') && n < EXTREME_VALUE_SIMULATED_MIN_N) {
    return `${AUTO_SWITCH}n = ${n} is below the smallest size (${EXTREME_VALUE_SIMULATED_MIN_N}) of the simulated extreme-value A² table, and the Stephens (1977) A*(1 + 0.2/√n) approximation is off there (about 5.6 % at n = 20 for a nominal 5 %)`;
  }
  if (family === 'gamma' && n < GAMMA_TABLE_MIN_N) {
    return `${AUTO_SWITCH}the simulated gamma table was built at n = ${GAMMA_AD_TABLE.n} and rejects about 4.0 % at n = 10 for a nominal 5 % (below n = ${GAMMA_TABLE_MIN_N} the bootstrap is used)`;
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
export function chiSquareWithBootstrap(c: ChiSquareReport, reason: string | null, counts: BootstrapCounts | undefined, opts: ResolvedOptions, n: number, label: string): ChiSquareReport {
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

export function andersonDarlingReport(c: FittedCandidate, opts: ResolvedOptions, n: number, counts: BootstrapCounts | undefined): AndersonDarlingReport {
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
