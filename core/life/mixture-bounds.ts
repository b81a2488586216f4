/**
 * Bounds on a B-life of the two-subpopulation Weibull mixture (mixture.ts): Fisher matrix — the
 * observed information of the five parameters (fraction, shape1, scale1, shape2, scale2) inverted,
 * and the delta method on ln t_p with the gradient of t_p taken numerically through its defining
 * equation F(t_p) = p (Meeker & Escobar 1998, §8.4, for the method; Lawless 2003, §B.2). Two-sided
 * at `confidence`. A large-sample Wald bound on a five-parameter fit: given only when the
 * components are identified (mixture.ts flags), else no bound. A likelihood-ratio bound is not
 * offered for the mixture (its profile over five parameters with a fraction near 0 or 1 is not
 * reliable enough to claim).
 */
import { numericalGradient, observedInformation } from '../optimize/index.js';
import { normalQuantile } from '../special/index.js';
import type { BLife } from './bounds.js';
import type { LifeData } from './data.js';
import { fromVector, mixtureLogLikelihoodOf, mixtureQuantile, toVector, type WeibullMixtureFit } from './mixture.js';

export const MIXTURE_BOUND_METHOD = 'Fisher matrix (observed information of the five mixture parameters, delta method on ln t_p), two-sided';

/** The mixture's B-life (percent failed) with Fisher-matrix bounds (NaN, boundsFound false, when not identified or singular). */
export function mixtureBLife(fit: WeibullMixtureFit, data: Pick<LifeData, 'groups'>, percent: number, confidence: number): BLife {
  const prob = percent / 100;
  const estimate = mixtureQuantile(fit.parameters, prob);
  const none: BLife = { percent, estimate, lower: Number.NaN, upper: Number.NaN, confidence, method: 'no bound: the mixture’s components are not identified by these data', boundsFound: false };
  if (!fit.identified) return none;
  const v = toVector(fit.parameters);
  const info = observedInformation(mixtureLogLikelihoodOf(data), v);
  if (!info.covariance) return none;
  const g = numericalGradient((x) => {
    try {
      return Math.log(mixtureQuantile(fromVector(x), prob));
    } catch {
      return Number.NaN;
    }
  }, v);
  let variance = 0;
  for (let i = 0; i < 5; i++) for (let j = 0; j < 5; j++) variance += (g[i] as number) * (info.covariance[i * 5 + j] as number) * (g[j] as number);
  if (!(variance >= 0) || !Number.isFinite(variance)) return none;
  const z = normalQuantile(0.5 + confidence / 2);
  const sd = Math.sqrt(variance);
  return { percent, estimate, lower: estimate * Math.exp(-z * sd), upper: estimate * Math.exp(z * sd), confidence, method: MIXTURE_BOUND_METHOD, boundsFound: true };
}
