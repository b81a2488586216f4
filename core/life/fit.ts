/**
 * Maximum-likelihood fit of one family to right-censored life data.
 *   exponential: closed form, rate = r / Σ tᵢ (all units' times; Lawless 2003, §3.1);
 *   Weibull: the censored profile equation in the shape (weibull-censored.ts);
 *   normal, lognormal, gamma: the general maximiser (core/optimize) on the censored
 *   log-likelihood, started from the family's complete-data fit of the failures alone.
 * With no suspensions every route reduces to the complete-sample likelihood.
 */
import { getFamily, type Parameters } from '../families/index.js';
import { maximize, type MaximizeResult } from '../optimize/index.js';
import { prepareSample } from '../sample.js';
import type { LifeData } from './data.js';
import { censoredLogLikelihood } from './likelihood.js';
import { lifeModel, toParameters, toVector, type LifeFamilyName } from './models.js';
import { fitWeibullCensored } from './weibull-censored.js';

export interface CensoredFitSuccess {
  readonly ok: true;
  readonly family: LifeFamilyName;
  readonly parameters: Parameters;
  readonly logLikelihood: number;
  readonly iterations: number;
  readonly converged: boolean;
  readonly method: string;
}

export interface CensoredFitFailure {
  readonly ok: false;
  readonly family: LifeFamilyName;
  readonly reason: string;
}

export type CensoredFitOutcome = CensoredFitSuccess | CensoredFitFailure;

/** The censored log-likelihood as a function of the family's parameter vector (-∞ when invalid). */
export function logLikelihoodOf(family: LifeFamilyName, data: LifeData): (v: Float64Array) => number {
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
    return censoredLogLikelihood(d, data);
  };
}

function startFromFailures(family: LifeFamilyName, data: LifeData): Parameters | null {
  const fam = getFamily(family);
  const distinct = new Set(data.failureTimes).size;
  if (data.failures >= 2 && distinct >= 2) {
    const f = fam.fit(prepareSample(data.failureTimes, { alreadySorted: false }));
    if (f.ok) return f.parameters;
  }
  // Fall back to all times as if complete (a rough start only).
  const g = fam.fit(prepareSample(data.times));
  return g.ok ? g.parameters : null;
}

export interface CensoredFitOptions {
  /**
   * Starting values close to the answer (e.g. the original fit, for a bootstrap replicate): the
   * optimiser then starts with Newton steps and runs the simplex only if they fail.
   */
  readonly warmStart?: Parameters;
}

export function fitCensored(family: LifeFamilyName, data: LifeData, options: CensoredFitOptions = {}): CensoredFitOutcome {
  const model = lifeModel(family);
  const k = model.names.length;
  if (data.failures < k) {
    return {
      ok: false,
      family,
      reason: `the ${family} model has ${k} parameter${k > 1 ? 's' : ''} and needs at least ${k} failure${k > 1 ? 's' : ''}; the data have ${data.failures}`,
    };
  }
  const ll = logLikelihoodOf(family, data);
  if (family === 'exponential') {
    let total = 0;
    for (let i = 0; i < data.n; i++) total += data.times[i] as number;
    const rate = data.failures / total;
    return {
      ok: true,
      family,
      parameters: { rate },
      logLikelihood: ll(Float64Array.of(rate)),
      iterations: 0,
      converged: true,
      method: 'closed form: rate = failures / total time on test (maximum likelihood with censoring)',
    };
  }
  if (family === 'weibull') {
    if (new Set(data.failureTimes).size < 2 && data.suspensions === 0) {
      return { ok: false, family, reason: 'all failure times are equal; there is no spread to fit a Weibull model' };
    }
    const w = fitWeibullCensored(data);
    if (Number.isFinite(w.shape) && Number.isFinite(w.scale)) {
      const v = Float64Array.of(w.shape, w.scale);
      return {
        ok: true,
        family,
        parameters: toParameters(model, v),
        logLikelihood: ll(v),
        iterations: w.iterations,
        converged: w.converged,
        method: 'Newton with a bracket on the censored profile equation in the shape (maximum likelihood)',
      };
    }
    return { ok: false, family, reason: 'the censored Weibull likelihood has no finite maximum for these data' };
  }
  let r: MaximizeResult | null = null;
  if (options.warmStart) {
    const w = maximize(ll, toVector(model, options.warmStart), { transforms: model.transforms, skipSimplex: true });
    if (w.converged && Number.isFinite(w.value)) r = w;
  }
  if (!r) {
    const start = startFromFailures(family, data);
    if (!start) return { ok: false, family, reason: `no starting values for the ${family} model could be found` };
    r = maximize(ll, toVector(model, start), { transforms: model.transforms });
  }
  if (!r.converged) {
    const r2 = maximize(ll, r.x, { transforms: model.transforms, initialStep: 0.3 });
    if (r2.value >= r.value) r = r2;
  }
  if (!Number.isFinite(r.value)) return { ok: false, family, reason: `the censored ${family} likelihood could not be maximised` };
  return {
    ok: true,
    family,
    parameters: toParameters(model, r.x),
    logLikelihood: r.value,
    iterations: r.iterations,
    converged: r.converged,
    method: `maximum likelihood with censoring: Nelder–Mead then Newton polishing (core/optimize), started from ${options.warmStart ? 'the given warm start (Newton only when it converges)' : 'the complete-data fit of the failures'}; stop: ${r.reason}`,
  };
}
