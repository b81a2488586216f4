/**
 * Two-subpopulation Weibull mixture for right-censored life data, for a probability plot that
 * bends (e.g. a weak subpopulation failing early among sound units):
 *   F(t) = π F₁(t) + (1 - π) F₂(t),   F_k Weibull(shape β_k, scale η_k),
 * fitted by EM (Dempster, Laird & Rubin 1977, JRSS B 39:1-38; for censored mixtures McLachlan &
 * Peel 2000, "Finite Mixture Models", §2.8 and ch. 10 [from memory]):
 *   E-step: each unit's chance of belonging to subpopulation 1, from the densities for failures
 *           and from the survival functions for suspensions (in log space);
 *   M-step: π = mean membership; each component's weighted censored Weibull ML by the profile
 *           equation (weibull-censored.ts with fractional counts).
 * EM is started from three splits of the failure times (at their 30 %, 50 % and 70 % points) and
 * the best end kept, then polished by Newton on the full likelihood (core/optimize). Component 1 is
 * the one with the smaller scale.
 * Not identified (flagged, with reasons) when: a component holds under 2 % of the population or
 * under 5 expected failures (common practice, no source), the two components nearly coincide,
 * the observed information is singular, or a parameter's standard error exceeds half its value.
 * With 5 parameters it is ranked by AICc beside the one-population families.
 */
import { getFamily, type Distribution } from '../families/index.js';
import { between, LOG, maximize, observedInformation } from '../optimize/index.js';
import { findRoot, lnGamma, log1mexp, logAddExp } from '../special/index.js';
import type { LifeData } from './data.js';
import { fitWeibullCensored } from './weibull-censored.js';

export interface WeibullMixtureParameters {
  /** Fraction π of the population in subpopulation 1 (the earlier-failing one). */
  readonly fraction: number;
  readonly shape1: number;
  readonly scale1: number;
  readonly shape2: number;
  readonly scale2: number;
}

export interface WeibullMixtureFit {
  readonly ok: true;
  readonly family: 'weibull-mixture';
  readonly parameters: WeibullMixtureParameters;
  readonly logLikelihood: number;
  readonly estimatedParameters: 5;
  readonly iterations: number;
  readonly converged: boolean;
  /** false: the components are not identified by these data (see `flags`); the numbers are not to be used. */
  readonly identified: boolean;
  readonly flags: readonly string[];
  /** Standard errors from the observed information (null when it is singular). */
  readonly standardErrors: WeibullMixtureParameters | null;
  readonly method: string;
  readonly source: string;
}

export type WeibullMixtureOutcome = WeibullMixtureFit | { readonly ok: false; readonly family: 'weibull-mixture'; readonly reason: string };

const NAMES = ['fraction', 'shape1', 'scale1', 'shape2', 'scale2'] as const;
const TRANSFORMS = [between(0, 1), LOG, LOG, LOG, LOG];

function logComponent(shape: number, scale: number, t: number, failed: boolean): number {
  const z = t / scale;
  const zb = Math.pow(z, shape);
  return failed ? Math.log(shape / scale) + (shape - 1) * Math.log(z) - zb : -zb;
}

/** Mixture log-likelihood over the grouped (time, status, count) rows. */
export function mixtureLogLikelihood(data: Pick<LifeData, 'groups'>, p: WeibullMixtureParameters): number {
  const { times, failed, counts } = data.groups;
  const a = Math.log(p.fraction);
  const b = Math.log1p(-p.fraction);
  let s = 0;
  for (let i = 0; i < times.length; i++) {
    const t = times[i] as number;
    const f = failed[i] === 1;
    s += (counts[i] as number) * logAddExp(a + logComponent(p.shape1, p.scale1, t, f), b + logComponent(p.shape2, p.scale2, t, f));
  }
  return s;
}

/** The mixture log-likelihood as a function of [fraction, shape1, scale1, shape2, scale2] (-∞ outside the space). */
export function mixtureLogLikelihoodOf(data: Pick<LifeData, 'groups'>): (v: Float64Array) => number {
  return (v: Float64Array) => {
    for (let i = 0; i < 5; i++) if (!Number.isFinite(v[i] as number)) return Number.NEGATIVE_INFINITY;
    const p = fromVector(v);
    if (!(p.fraction > 0 && p.fraction < 1 && p.shape1 > 0 && p.shape2 > 0 && p.scale1 > 0 && p.scale2 > 0)) return Number.NEGATIVE_INFINITY;
    return mixtureLogLikelihood(data, p);
  };
}

export function fromVector(v: ArrayLike<number>): WeibullMixtureParameters {
  return { fraction: v[0] as number, shape1: v[1] as number, scale1: v[2] as number, shape2: v[3] as number, scale2: v[4] as number };
}

export function toVector(p: WeibullMixtureParameters): Float64Array {
  return Float64Array.from(NAMES.map((k) => p[k]));
}

function runEm(data: LifeData, w0: Float64Array, maxIt: number): { p: WeibullMixtureParameters; ll: number; iterations: number; converged: boolean } | null {
  const { times, failed, counts } = data.groups;
  const g = times.length;
  let w = w0;
  let prev = Number.NEGATIVE_INFINITY;
  let p: WeibullMixtureParameters | null = null;
  for (let it = 1; it <= maxIt; it++) {
    const c1 = new Float64Array(g);
    const c2 = new Float64Array(g);
    let r1 = 0;
    let r2 = 0;
    let n1 = 0;
    for (let i = 0; i < g; i++) {
      c1[i] = (counts[i] as number) * (w[i] as number);
      c2[i] = (counts[i] as number) - (c1[i] as number);
      n1 += c1[i] as number;
      if (failed[i]) {
        r1 += c1[i] as number;
        r2 += c2[i] as number;
      }
    }
    if (r1 < 1e-6 || r2 < 1e-6) return null;
    const f1 = fitWeibullCensored({ groups: { times, failed, counts: c1 }, failures: r1, maxTime: data.maxTime });
    const f2 = fitWeibullCensored({ groups: { times, failed, counts: c2 }, failures: r2, maxTime: data.maxTime });
    if (!(f1.shape > 0 && f2.shape > 0 && f1.scale > 0 && f2.scale > 0)) return null;
    p = { fraction: n1 / data.n, shape1: f1.shape, scale1: f1.scale, shape2: f2.shape, scale2: f2.scale };
    if (!(p.fraction > 0 && p.fraction < 1)) return null;
    // E-step.
    const a = Math.log(p.fraction);
    const b = Math.log1p(-p.fraction);
    const next = new Float64Array(g);
    let ll = 0;
    for (let i = 0; i < g; i++) {
      const t = times[i] as number;
      const f = failed[i] === 1;
      const l1 = a + logComponent(p.shape1, p.scale1, t, f);
      const l2 = b + logComponent(p.shape2, p.scale2, t, f);
      const tot = logAddExp(l1, l2);
      next[i] = Math.exp(l1 - tot);
      ll += (counts[i] as number) * tot;
    }
    w = next;
    if (Math.abs(ll - prev) <= 1e-12 * Math.abs(ll)) return { p, ll, iterations: it, converged: true };
    prev = ll;
  }
  return p ? { p, ll: mixtureLogLikelihood(data, p), iterations: maxIt, converged: false } : null;
}

export function fitWeibullMixture(data: LifeData, opts: { readonly maxIterations?: number } = {}): WeibullMixtureOutcome {
  const family = 'weibull-mixture' as const;
  if (data.failures < 10) return { ok: false, family, reason: `a two-subpopulation mixture needs at least 10 failures to be worth trying; the data have ${data.failures}` };
  const maxIt = opts.maxIterations ?? 5000;
  const ft = data.failureTimes;
  let best: ReturnType<typeof runEm> = null;
  for (const q of [0.3, 0.5, 0.7]) {
    const split = ft[Math.min(ft.length - 1, Math.floor(q * ft.length))] as number;
    const w0 = Float64Array.from(data.groups.times, (t, i) => (data.groups.failed[i] ? (t <= split ? 0.9 : 0.1) : 0.1));
    const r = runEm(data, w0, maxIt);
    if (r && (!best || r.ll > best.ll)) best = r;
  }
  if (!best) return { ok: false, family, reason: 'EM could not keep two subpopulations apart from any start (one emptied)' };
  const ll = mixtureLogLikelihoodOf(data);
  const polished = maximize(ll, toVector(best.p), { transforms: TRANSFORMS, skipSimplex: true });
  let p = best.p;
  let value = best.ll;
  let converged = best.converged;
  if (Number.isFinite(polished.value) && polished.value >= best.ll - 1e-9 * Math.abs(best.ll)) {
    p = fromVector(polished.x);
    value = polished.value;
    converged = polished.converged || best.converged;
  }
  if (p.scale1 > p.scale2) p = { fraction: 1 - p.fraction, shape1: p.shape2, scale1: p.scale2, shape2: p.shape1, scale2: p.scale1 };
  const flags: string[] = [];
  const r1 = p.fraction * data.failures;
  const r2 = (1 - p.fraction) * data.failures;
  if (p.fraction < 0.02 || p.fraction > 0.98) flags.push(`one subpopulation holds ${(100 * Math.min(p.fraction, 1 - p.fraction)).toPrecision(2)} % of the units: the data do not show two populations`);
  if (Math.min(r1, r2) < 5) flags.push(`one subpopulation accounts for about ${Math.min(r1, r2).toPrecision(2)} failures (fewer than 5; common practice, no source)`);
  if (Math.abs(Math.log(p.scale1 / p.scale2)) < 0.1 && Math.abs(Math.log(p.shape1 / p.shape2)) < 0.1) flags.push('the two components nearly coincide (scales and shapes within 10 %)');
  const info = observedInformation(ll, toVector(p));
  let se: WeibullMixtureParameters | null = null;
  if (!info.covariance) {
    flags.push('the observed information is singular: the parameters are not separately determined');
  } else {
    const v = NAMES.map((_, i) => info.covariance![i * 5 + i] as number);
    if (v.some((x) => !(x >= 0))) flags.push('the observed information is not positive definite: not a clear maximum');
    else {
      se = fromVector(v.map(Math.sqrt));
      const loose = NAMES.filter((k) => se![k] > 0.5 * p[k]);
      if (loose.length > 0) flags.push(`standard errors above half the value for ${loose.join(', ')}: the components are poorly determined`);
    }
  }
  if (!converged) flags.push('EM reached its iteration limit before the likelihood settled');
  return {
    ok: true,
    family,
    parameters: p,
    logLikelihood: value,
    estimatedParameters: 5,
    iterations: best.iterations,
    converged,
    identified: flags.length === 0,
    flags,
    standardErrors: se,
    method: 'two-subpopulation Weibull mixture by EM (weighted censored Weibull ML in the M-step; three starting splits), polished by Newton on the full likelihood',
    source: 'Dempster, Laird & Rubin 1977, JRSS B 39:1-38; McLachlan & Peel 2000, Finite Mixture Models [from memory]',
  };
}

/** ln S(t) of the mixture. */
export function mixtureLogSf(p: WeibullMixtureParameters, t: number): number {
  return logAddExp(Math.log(p.fraction) - Math.pow(t / p.scale1, p.shape1), Math.log1p(-p.fraction) - Math.pow(t / p.scale2, p.shape2));
}

/** The mixture's p-quantile (B-life), by Brent on ln t between the components' quantiles. */
export function mixtureQuantile(p: WeibullMixtureParameters, prob: number): number {
  const w = getFamily('weibull');
  const q1 = w.make({ shape: p.shape1, scale: p.scale1 }).quantile(prob);
  const q2 = w.make({ shape: p.shape2, scale: p.scale2 }).quantile(prob);
  const target = Math.log1p(-prob);
  const g = (u: number) => mixtureLogSf(p, Math.exp(u)) - target;
  return Math.exp(findRoot(g, Math.log(Math.min(q1, q2)) - 1e-9, Math.log(Math.max(q1, q2)) + 1e-9, { relTol: 1e-13 }).root);
}

/** The mixture's distribution functions (for curves), each in log space where it matters. */
export function mixtureDistribution(p: WeibullMixtureParameters): Pick<Distribution, 'cdf' | 'sf' | 'logPdf' | 'logSf' | 'logCdf'> & { mean(): number } {
  const a = Math.log(p.fraction);
  const b = Math.log1p(-p.fraction);
  const logSf = (t: number) => (t <= 0 ? 0 : mixtureLogSf(p, t));
  return {
    logSf,
    sf: (t) => Math.exp(logSf(t)),
    logCdf: (t) => (t <= 0 ? Number.NEGATIVE_INFINITY : log1mexp(logSf(t))),
    cdf: (t) => (t <= 0 ? 0 : -Math.expm1(logSf(t))),
    logPdf: (t) => (t <= 0 ? Number.NEGATIVE_INFINITY : logAddExp(a + logComponent(p.shape1, p.scale1, t, true), b + logComponent(p.shape2, p.scale2, t, true))),
    mean: () => p.fraction * p.scale1 * Math.exp(lnGamma(1 + 1 / p.shape1)) + (1 - p.fraction) * p.scale2 * Math.exp(lnGamma(1 + 1 / p.shape2)),
  };
}
