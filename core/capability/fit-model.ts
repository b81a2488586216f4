/**
 * Fit a capability model of a given kind to a sample: the same procedure for the data and for every
 * bootstrap replicate (so the interval carries the uncertainty of choosing λ, the Johnson curve or
 * the family's parameters).
 * - 'boxcox': λ̂ by maximum likelihood (boxcox.ts), then mean and standard deviation (divisor n - 1,
 *   as for Pp) of y(λ̂).
 * - 'johnson': Slifker & Shapiro percentile fit (johnson.ts), type chosen afresh.
 * - 'family': the family's maximum-likelihood fit.
 */
import { CompensatedSum } from '../compensated.js';
import { PlumblineError } from '../errors.js';
import { getFamily, type FamilyName } from '../families/index.js';
import { prepareSample } from '../sample.js';
import { boxCoxTransform, fitBoxCoxLambda } from './boxcox.js';
import { fitJohnson } from './johnson.js';
import type { ModelSpec } from './model.js';

export type ModelKind = { readonly kind: 'boxcox' } | { readonly kind: 'johnson' } | { readonly kind: 'family'; readonly family: FamilyName };

/** Mean and standard deviation (n - 1) of y(λ). */
export function transformedMoments(values: ArrayLike<number>, lambda: number): { mean: number; sd: number } {
  const n = values.length;
  const s = new CompensatedSum();
  for (let i = 0; i < n; i++) s.add(boxCoxTransform(values[i] as number, lambda));
  const mean = s.value / n;
  const ss = new CompensatedSum();
  for (let i = 0; i < n; i++) {
    const d = boxCoxTransform(values[i] as number, lambda) - mean;
    ss.add(d * d);
  }
  return { mean, sd: Math.sqrt(ss.value / (n - 1)) };
}

/** Fit `kind` to ascending-sorted values. Throws a PlumblineError when it cannot. */
export function fitModelSpec(kind: ModelKind, sorted: Float64Array): ModelSpec {
  if (kind.kind === 'boxcox') {
    const lambda = fitBoxCoxLambda(sorted);
    return { kind: 'boxcox', lambda, ...transformedMoments(sorted, lambda) };
  }
  if (kind.kind === 'johnson') {
    const f = fitJohnson(sorted);
    return { kind: 'johnson', type: f.type, gamma: f.gamma, delta: f.delta, xi: f.xi, lambda: f.lambda };
  }
  const fam = getFamily(kind.family);
  const fit = fam.fit(prepareSample(sorted, { alreadySorted: true }));
  if (!fit.ok) throw new PlumblineError('not-computable', `The ${kind.family} model could not be fitted.`);
  return { kind: 'family', family: kind.family, parameters: fit.parameters };
}

export function kindOf(spec: ModelSpec): ModelKind {
  return spec.kind === 'family' ? { kind: 'family', family: spec.family } : { kind: spec.kind };
}
