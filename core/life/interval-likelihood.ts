/**
 * One log-likelihood for exact, left-, interval- and right-censored units with counts
 * (Meeker & Escobar 1998, §2.4.3, eq. 2.3; Lawless 2003, §2.2):
 *   exact t:        ln f(t)
 *   left (0, R]:    ln F(R)
 *   interval (L, R]: ln(F(R) - F(L)), in log space without cancellation (core/grouped logClassProbability)
 *   right (L, ∞):   ln S(L)
 * each term times its row's count, summed with compensation (Neumaier 1974).
 */
import { CompensatedSum } from '../compensated.js';
import { getFamily, type Distribution } from '../families/index.js';
import { logClassProbability } from '../grouped/index.js';
import type { IntervalLifeData } from './interval-likelihood-data.js';
import { lifeModel, toParameters, type LifeFamilyName } from './models.js';

export function intervalLogLikelihood(dist: Distribution, data: IntervalLifeData): number {
  const s = new CompensatedSum();
  const { lower, upper, counts, kinds } = data;
  for (let i = 0; i < lower.length; i++) {
    const lo = lower[i] as number;
    const hi = upper[i] as number;
    let v: number;
    switch (kinds[i]) {
      case 'exact':
        v = dist.logPdf(lo);
        break;
      case 'right':
        v = dist.logSf(lo);
        break;
      case 'left':
        v = dist.logCdf(hi);
        break;
      default:
        v = logClassProbability(dist, lo, hi);
    }
    if (!(v > Number.NEGATIVE_INFINITY) || Number.isNaN(v)) return Number.NEGATIVE_INFINITY;
    s.add((counts[i] as number) * v);
  }
  return s.value;
}

/** The interval-data log-likelihood as a function of the family's parameter vector (-∞ when invalid). */
export function intervalLogLikelihoodOf(family: LifeFamilyName, data: IntervalLifeData): (v: Float64Array) => number {
  const fam = getFamily(family);
  const model = lifeModel(family);
  return (v: Float64Array) => {
    for (let i = 0; i < v.length; i++) if (!Number.isFinite(v[i] as number)) return Number.NEGATIVE_INFINITY;
    let d;
    try {
      d = fam.make(toParameters(model, v));
    } catch {
      return Number.NEGATIVE_INFINITY;
    }
    return intervalLogLikelihood(d, data);
  };
}
