/**
 * Pearson's chi-square test on the given classes of grouped data.
 *
 * Expected counts E_j = N·P_j under the fitted model, with the first class extended down to the
 * lower end of the support and the last up to the upper end, so that the cells partition the line
 * and Σ E_j = N. Adjacent classes are merged, left to right, until every cell expects at least 5
 * (Cochran 1952, Ann. Math. Stat. 23:315-345; NIST e-Handbook §1.3.5.15); a short remainder at the
 * top is merged into the cell before it. When merging was needed the model is refitted by
 * grouped maximum likelihood on the merged cells (and merged again until stable), so that the
 * statistic is computed at the MLE from exactly the counts it tests.
 *
 * Degrees of freedom k - 1 - m. Here, unlike the equiprobable test on raw data, this is the exact
 * large-sample rule: the m parameters are estimated by maximum likelihood from the same grouped
 * counts, and X² is then asymptotically chi-square with k - 1 - m degrees of freedom (Cramér 1946,
 * Mathematical Methods of Statistics, §30.3; Cochran 1952). The Chernoff–Lehmann bracket applies
 * only when the parameters come from the ungrouped values.
 *
 * No Anderson–Darling test is offered for grouped data: it needs each individual value's position
 * on the fitted cdf, and grouped counts say only how many values fall in each class; putting them
 * at class midpoints would create ties that inflate the statistic.
 */
import type { FamilyName, Parameters } from '../families/index.js';
import { getFamily } from '../families/index.js';
import { formatNumber, MIN_EXPECTED_PER_BIN, pearsonStatistic } from '../gof/index.js';
import type { BinRow } from '../report.js';
import { chiSquareIsf, chiSquareSf } from '../special/index.js';
import { logClassProbability } from './class-probability.js';
import type { GroupedData } from './classes.js';
import { fitGrouped } from './fit.js';

export const GROUPED_AD_NOTE =
  'The Anderson–Darling test is not offered for grouped data: it needs the individual values, and the counts say only how many values fall in each class (placing them at class midpoints would create ties that inflate the statistic).';

export type GroupedChiSquare =
  | {
      readonly computable: true;
      readonly statistic: number;
      readonly dof: number;
      readonly pValue: number;
      readonly criticalValue: number;
      readonly alpha: number;
      readonly rejected: boolean;
      readonly decision: string;
      /** Cells after merging. */
      readonly k: number;
      /** Classes as given. */
      readonly classesGiven: number;
      /** Parameters at which the test was computed (refitted on the merged cells when merging was needed). */
      readonly parameters: Parameters;
      readonly refitted: boolean;
      readonly bins: readonly BinRow[];
      readonly dofRule: string;
    }
  | { readonly computable: false; readonly reason: string };

/** Merge adjacent cells left to right until each expects ≥ minExpected; returns the cell edges as class indices. */
export function mergeCells(expected: ArrayLike<number>, minExpected = MIN_EXPECTED_PER_BIN): number[][] {
  const groups: number[][] = [];
  let cur: number[] = [];
  let e = 0;
  for (let j = 0; j < expected.length; j++) {
    cur.push(j);
    e += expected[j] as number;
    if (e >= minExpected) {
      groups.push(cur);
      cur = [];
      e = 0;
    }
  }
  if (cur.length > 0) {
    if (groups.length > 0) groups[groups.length - 1]!.push(...cur);
    else groups.push(cur);
  }
  return groups;
}

/** Merge `data` by groups of class indices. */
function mergeData(data: GroupedData, groups: readonly number[][]): GroupedData {
  const k = groups.length;
  const lower = new Float64Array(k);
  const upper = new Float64Array(k);
  const count = new Float64Array(k);
  for (let g = 0; g < k; g++) {
    const idx = groups[g] as number[];
    lower[g] = data.lower[idx[0] as number] as number;
    upper[g] = data.upper[idx[idx.length - 1] as number] as number;
    let c = 0;
    for (const j of idx) c += data.count[j] as number;
    count[g] = c;
  }
  return { lower, upper, count, total: data.total, classes: k };
}

function expectedCounts(family: FamilyName, parameters: Parameters, data: GroupedData): Float64Array {
  const d = getFamily(family).make(parameters);
  const k = data.classes;
  const e = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    const a = j === 0 ? d.support.lower : (data.lower[j] as number);
    const b = j === k - 1 ? d.support.upper : (data.upper[j] as number);
    e[j] = data.total * Math.exp(logClassProbability(d, a, b));
  }
  return e;
}

export function groupedChiSquare(
  family: FamilyName,
  parameters: Parameters,
  data: GroupedData,
  opts: { alpha: number },
): GroupedChiSquare {
  const m = getFamily(family).estimatedParameters;
  let params = parameters;
  let cells = data;
  let refitted = false;
  for (let round = 0; round < 10; round++) {
    const e = expectedCounts(family, params, cells);
    const groups = mergeCells(e);
    if (groups.length === cells.classes) break;
    cells = mergeData(cells, groups);
    if (cells.classes - 1 - m < 1) break;
    const r = fitGrouped(family, cells);
    if (!r.ok) return { computable: false, reason: `refitting on the merged classes failed: ${r.reason}` };
    params = r.parameters;
    refitted = true;
  }
  const k = cells.classes;
  const dof = k - 1 - m;
  if (dof < 1) {
    return {
      computable: false,
      reason: `after merging classes to at least ${MIN_EXPECTED_PER_BIN} expected each, ${k} cell${k === 1 ? '' : 's'} remain, too few for ${m} estimated parameters (k - 1 - m = ${dof})`,
    };
  }
  const e = expectedCounts(family, params, cells);
  const bins: BinRow[] = [];
  for (let j = 0; j < k; j++) {
    const lo = cells.lower[j] as number;
    const hi = cells.upper[j] as number;
    bins.push({ lower: Number.isFinite(lo) ? lo : null, upper: Number.isFinite(hi) ? hi : null, observed: cells.count[j] as number, expected: e[j] as number });
  }
  const statistic = pearsonStatistic(bins);
  const pValue = chiSquareSf(statistic, dof);
  const alpha = opts.alpha;
  const criticalValue = chiSquareIsf(alpha, dof);
  const rejected = pValue < alpha;
  const words = `X² = ${formatNumber(statistic)} on ${dof} degree${dof === 1 ? '' : 's'} of freedom (${k} cells), p = ${formatNumber(pValue)}`;
  return {
    computable: true,
    statistic,
    dof,
    pValue,
    criticalValue,
    alpha,
    rejected,
    decision: rejected ? `Rejected at α = ${formatNumber(alpha)}: ${words}.` : `Not rejected at α = ${formatNumber(alpha)}: ${words}.`,
    k,
    classesGiven: data.classes,
    parameters: params,
    refitted,
    bins,
    dofRule:
      'k - 1 - m, exact in large samples because the parameters are maximum-likelihood estimates from these grouped counts (Cramér 1946 §30.3; Cochran 1952)',
  };
}
