/**
 * Within-subgroup sigma for the short-term indices Cp and Cpk.
 *
 * - 'pooled' (the default): the pooled standard deviation s_p = √(Σ_i Σ_j (x_ij - x̄_i)² / ν),
 *   ν = Σ_i (n_i - 1), divided by c4(ν + 1) to remove its bias under normality (the usual
 *   pooled-s estimator of control-chart practice, e.g. Montgomery, Introduction to Statistical
 *   Quality Control, ch. 6 [from memory]). ν is also the degrees of freedom used by the intervals:
 *   ν s_p² / σ² is exactly chi-square with ν degrees of freedom for normal subgroups.
 * - 'range': R̄/d2, the mean of R_i / d2(n_i) over the subgroups (for equal sizes this is exactly
 *   R̄ / d2(n); averaging R_i/d2(n_i) for unequal sizes is common practice, no source). Its
 *   intervals use the effective degrees of freedom ν ≈ 0.9·k·(n̄ - 1) (Duncan's approximation for
 *   the range of small subgroups, from memory), so they are approximate.
 *
 * Subgroups of one value carry no within-subgroup information and are skipped (counted in
 * `singletons`).
 */
import { CompensatedSum } from '../compensated.js';
import { InputError } from '../errors.js';
import { c4, d2 } from './constants.js';

export type WithinMethod = 'pooled' | 'range';

export interface WithinSigma {
  readonly sigma: number;
  readonly method: WithinMethod;
  /** The estimator in words. */
  readonly description: string;
  /** Degrees of freedom for the chi-square and Bissell intervals (approximate for 'range'). */
  readonly dof: number;
  /** Number of subgroups with at least 2 values. */
  readonly subgroups: number;
  /** Subgroups of a single value, skipped. */
  readonly singletons: number;
  readonly minSize: number;
  readonly maxSize: number;
}

/** Group the values by label, preserving first-seen order of the labels. */
export function groupByLabel(values: ArrayLike<number>, labels: ArrayLike<number | string>): number[][] {
  if (labels.length !== values.length) {
    throw new InputError(
      `The subgroup labels (${labels.length}) and the values (${values.length}) must have the same length.`,
      {},
      'bad-input',
    );
  }
  const map = new Map<number | string, number[]>();
  for (let i = 0; i < values.length; i++) {
    const key = labels[i] as number | string;
    let g = map.get(key);
    if (!g) map.set(key, (g = []));
    g.push(values[i] as number);
  }
  return [...map.values()];
}

export function withinSigma(groups: readonly (readonly number[])[], method: WithinMethod = 'pooled'): WithinSigma {
  const usable = groups.filter((g) => g.length >= 2);
  const singletons = groups.length - usable.length;
  if (usable.length === 0) {
    throw new InputError('No subgroup has two or more values, so the within-subgroup sigma cannot be estimated.', {}, 'not-computable');
  }
  let minSize = Number.POSITIVE_INFINITY;
  let maxSize = 0;
  for (const g of usable) {
    minSize = Math.min(minSize, g.length);
    maxSize = Math.max(maxSize, g.length);
  }
  if (method === 'pooled') {
    const ss = new CompensatedSum();
    let nu = 0;
    for (const g of usable) {
      const m = new CompensatedSum();
      for (const x of g) m.add(x);
      const mean = m.value / g.length;
      for (const x of g) ss.add((x - mean) * (x - mean));
      nu += g.length - 1;
    }
    const sp = Math.sqrt(ss.value / nu);
    return {
      sigma: sp / c4(nu + 1),
      method,
      description: `pooled within-subgroup standard deviation s_p = ${fmt(sp)} on ${nu} degrees of freedom, divided by c4(${nu + 1}) = ${fmt(c4(nu + 1))}`,
      dof: nu,
      subgroups: usable.length,
      singletons,
      minSize,
      maxSize,
    };
  }
  const acc = new CompensatedSum();
  let sizeSum = 0;
  for (const g of usable) {
    let lo = Number.POSITIVE_INFINITY;
    let hi = Number.NEGATIVE_INFINITY;
    for (const x of g) {
      if (x < lo) lo = x;
      if (x > hi) hi = x;
    }
    acc.add((hi - lo) / d2(g.length));
    sizeSum += g.length;
  }
  const k = usable.length;
  const nbar = sizeSum / k;
  return {
    sigma: acc.value / k,
    method,
    description:
      minSize === maxSize
        ? `mean range R̄ divided by d2(${minSize}) = ${fmt(d2(minSize))} over ${k} subgroups`
        : `mean of R_i/d2(n_i) over ${k} subgroups of sizes ${minSize} to ${maxSize}`,
    dof: 0.9 * k * (nbar - 1),
    subgroups: k,
    singletons,
    minSize,
    maxSize,
  };
}

function fmt(x: number): string {
  return String(Number(x.toPrecision(6)));
}
