/**
 * Maximum likelihood for every life family on exact, left-, interval- and right-censored units
 * (interval-likelihood.ts): the general maximiser (core/optimize: Nelder–Mead then Newton polishing)
 * started from the right-censored fit (fit.ts) of a stand-in sample in which each interval is
 * replaced by its geometric midpoint, each left-censored unit by half its end and each suspension
 * kept (a start only; Meeker & Escobar 1998, §8.2 use the same idea of starting values from
 * simple stand-ins).
 * A fit whose maximiser does not converge is reported as not fitted (no maximum, not ranked).
 */
import type { Parameters } from '../families/index.js';
import { maximize, type MaximizeResult } from '../optimize/index.js';
import { buildLifeData } from './data.js';
import { fitCensored, type CensoredFitOutcome, type CensoredFitSuccess } from './fit.js';
import type { IntervalLifeData } from './interval-likelihood-data.js';
import { intervalLogLikelihoodOf } from './interval-likelihood.js';
import { lifeModel, toParameters, toVector, type LifeFamilyName } from './models.js';

/** Units in the stand-in sample used only for starting values (counts are scaled down past this). */
const START_UNITS = 20000;

function standIn(data: IntervalLifeData): { times: Float64Array; failed: Uint8Array } {
  const scale = data.n > START_UNITS ? START_UNITS / data.n : 1;
  const times: number[] = [];
  const failed: number[] = [];
  for (let i = 0; i < data.lower.length; i++) {
    const lo = data.lower[i] as number;
    const hi = data.upper[i] as number;
    const reps = Math.max(1, Math.round((data.counts[i] as number) * scale));
    let t: number;
    let f: number;
    switch (data.kinds[i]) {
      case 'exact':
        [t, f] = [lo, 1];
        break;
      case 'right':
        [t, f] = [lo, 0];
        break;
      case 'left':
        [t, f] = [hi / 2, 1];
        break;
      default:
        [t, f] = [Math.sqrt(lo * hi), 1];
    }
    for (let k = 0; k < reps; k++) {
      times.push(t);
      failed.push(f);
    }
  }
  return { times: Float64Array.from(times), failed: Uint8Array.from(failed) };
}

export interface IntervalFitOptions {
  /**
   * Start Newton from these parameters (the bootstrap's refits start from the fitted model); kept
   * only when Newton converges from there, else the stand-in start is used as without it.
   */
  readonly warmStart?: Parameters;
}

export function fitInterval(family: LifeFamilyName, data: IntervalLifeData, options: IntervalFitOptions = {}): CensoredFitOutcome {
  const model = lifeModel(family);
  const k = model.names.length;
  if (data.failures < k) {
    return {
      ok: false,
      family,
      reason: `the ${family} model has ${k} parameter${k > 1 ? 's' : ''} and needs at least ${k} failed unit${k > 1 ? 's' : ''} (exact, left- or interval-censored); the data have ${data.failures}`,
    };
  }
  const ll = intervalLogLikelihoodOf(family, data);
  let r: MaximizeResult | null = null;
  if (options.warmStart) {
    const w = maximize(ll, toVector(model, options.warmStart), { transforms: model.transforms, skipSimplex: true });
    if (w.converged && Number.isFinite(w.value)) r = w;
  }
  if (!r) {
    const s = standIn(data);
    const start = fitCensored(family, buildLifeData(s.times, s.failed));
    if (!start.ok) return { ok: false, family, reason: `no starting values: ${start.reason}` };
    r = maximize(ll, toVector(model, start.parameters), { transforms: model.transforms });
  }
  if (!r.converged) {
    const r2 = maximize(ll, r.x, { transforms: model.transforms, initialStep: 0.3 });
    if (r2.value >= r.value) r = r2;
  }
  if (!Number.isFinite(r.value)) return { ok: false, family, reason: `the ${family} likelihood could not be evaluated near the starting values` };
  if (!r.converged) {
    return {
      ok: false,
      family,
      reason: `the ${family} likelihood has no maximum that the optimiser could reach (stopped: ${r.reason}); a fit with no maximum is not ranked`,
    };
  }
  const fit: CensoredFitSuccess = {
    ok: true,
    family,
    parameters: toParameters(model, r.x),
    logLikelihood: r.value,
    iterations: r.iterations,
    converged: true,
    method: `maximum likelihood with exact, left-, interval- and right-censored terms: Nelder–Mead then Newton polishing (core/optimize), started from ${options.warmStart ? 'the given warm start (Newton only when it converges)' : 'a right-censored fit of interval midpoints'}; stop: ${r.reason}`,
  };
  return fit;
}
