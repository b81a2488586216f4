/**
 * Censored log-likelihood: Σ ln f(tᵢ) over failures + Σ ln S(tⱼ) over suspensions (Lawless 2003,
 * "Statistical Models and Methods for Lifetime Data", 2nd ed., §2.2), summed with compensation over
 * the distinct (time, status) pairs, each term times its count.
 */
import { CompensatedSum } from '../compensated.js';
import type { Distribution } from '../families/index.js';
import type { LifeData } from './data.js';

export function censoredLogLikelihood(dist: Distribution, data: LifeData): number {
  const s = new CompensatedSum();
  const { times, failed, counts } = data.groups;
  for (let i = 0; i < times.length; i++) {
    const t = times[i] as number;
    const v = failed[i] ? dist.logPdf(t) : dist.logSf(t);
    if (!(v > Number.NEGATIVE_INFINITY) || Number.isNaN(v)) return Number.NEGATIVE_INFINITY;
    s.add((counts[i] as number) * v);
  }
  return s.value;
}
