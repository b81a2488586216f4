/**
 * Bounds on the system B-life of independent failure modes in series (competing-modes.ts): the
 * t_p with Σ_m H_m(t_p; θ_m) = −ln(1 − p), H_m = −ln R_m the mode's cumulative hazard.
 *  - Likelihood ratio (default): the joint log-likelihood of independent modes is the sum of the
 *    modes' (Meeker & Escobar 1998, §15.3), so t_p is profiled over every mode's parameters at once:
 *    the lead mode (the largest H_m at the estimate) has its replaced parameter (models.ts
 *    fromQuantile) set so that its own cumulative hazard at t is what the others leave,
 *    H_lead(t) = −ln(1 − p) − Σ_{m≠lead} H_m(t); the profile likelihood of t is inverted at
 *    χ²₁(confidence) (core/optimize profileInterval; Meeker & Escobar 1998, §8.3, for the method).
 *  - Fisher matrix: each mode's observed information inverted (the modes' estimates are
 *    independent, so the covariance is block-diagonal), delta method on ln t_p with the gradient of
 *    t_p taken numerically through its defining equation (Meeker & Escobar 1998, §8.4 and §15.4
 *    [from memory]).
 * Two-sided at `confidence`, like the mode B-lives (bounds.ts).
 */
import { getFamily } from '../families/index.js';
import { LOG, numericalGradient, observedInformation, profileInterval, type Transform } from '../optimize/index.js';
import { normalQuantile } from '../special/index.js';
import { likelihoodOf, logLikelihoodAtQuantile, othersOf, type BLife, type BoundMethod, type LikelihoodSource } from './bounds.js';
import { systemQuantile } from './competing-modes.js';
import type { CensoredFitSuccess } from './fit.js';
import { lifeModel, toParameters, toVector } from './models.js';

export interface FittedMode {
  readonly fit: CensoredFitSuccess;
  readonly source: LikelihoodSource;
}

const LR_SYSTEM = 'likelihood ratio (profile likelihood over every mode’s parameters), two-sided';
const FM_SYSTEM = 'Fisher matrix (each mode’s observed information, delta method on ln t_p), two-sided';

const distOf = (m: FittedMode, v: Float64Array) => getFamily(m.fit.family).make(toParameters(lifeModel(m.fit.family), v));

function likelihoodRatio(modes: readonly FittedMode[], p: number, estimate: number, confidence: number): { lower: number; upper: number; found: boolean } {
  const c = -Math.log1p(-p);
  const hazards = modes.map((m) => -getFamily(m.fit.family).make(m.fit.parameters).logSf(estimate));
  const lead = hazards.indexOf(Math.max(...hazards));
  const rest = modes.map((_, i) => i).filter((i) => i !== lead);
  const leadMode = modes[lead]!;
  const o = othersOf(leadMode.fit);
  const lls = modes.map((m) => likelihoodOf(m.fit.family, m.source));
  const vectors = modes.map((m) => toVector(lifeModel(m.fit.family), m.fit.parameters));
  // Layout: [t, the lead mode's other parameters, every other mode's full vector].
  const x0: number[] = [estimate, ...o.values];
  const transforms: Transform[] = [LOG, ...o.transforms];
  const slices: [number, number][] = [];
  for (const i of rest) {
    slices.push([x0.length, x0.length + vectors[i]!.length]);
    x0.push(...vectors[i]!);
    transforms.push(...lifeModel(modes[i]!.fit.family).transforms);
  }
  const ll = (v: Float64Array): number => {
    const t = v[0] as number;
    if (!(t > 0) || !Number.isFinite(t)) return Number.NEGATIVE_INFINITY;
    let left = c;
    let total = 0;
    for (let j = 0; j < rest.length; j++) {
      const i = rest[j]!;
      const [a, b] = slices[j]!;
      const th = v.subarray(a, b);
      let d;
      try {
        d = distOf(modes[i]!, th);
      } catch {
        return Number.NEGATIVE_INFINITY;
      }
      left += d.logSf(t);
      total += lls[i]!(th);
    }
    // The lead mode's cumulative hazard at t must be what the others leave: > 0.
    if (!(left > 0)) return Number.NEGATIVE_INFINITY;
    const pLead = -Math.expm1(-left);
    if (!(pLead > 0 && pLead < 1)) return Number.NEGATIVE_INFINITY;
    return total + logLikelihoodAtQuantile(leadMode.fit.family, lls[lead]!, v.subarray(1, 1 + o.values.length), pLead, t);
  };
  const x = Float64Array.from(x0);
  const iv = profileInterval(ll, { x, value: ll(x) }, 0, confidence, { transforms });
  return { lower: iv.lower, upper: iv.upper, found: iv.lowerFound && iv.upperFound };
}

function fisher(modes: readonly FittedMode[], p: number, estimate: number, confidence: number): { lower: number; upper: number; found: boolean } {
  const vectors = modes.map((m) => toVector(lifeModel(m.fit.family), m.fit.parameters));
  let variance = 0;
  for (let i = 0; i < modes.length; i++) {
    const info = observedInformation(likelihoodOf(modes[i]!.fit.family, modes[i]!.source), vectors[i]!);
    if (!info.covariance) return { lower: Number.NaN, upper: Number.NaN, found: false };
    const g = numericalGradient((th) => {
      try {
        return Math.log(systemQuantile(modes.map((m, j) => (j === i ? distOf(m, th) : distOf(m, vectors[j]!))), p));
      } catch {
        return Number.NaN;
      }
    }, vectors[i]!);
    const k = vectors[i]!.length;
    for (let a = 0; a < k; a++) for (let b = 0; b < k; b++) variance += (g[a] as number) * (info.covariance[a * k + b] as number) * (g[b] as number);
  }
  if (!(variance >= 0) || !Number.isFinite(variance)) return { lower: Number.NaN, upper: Number.NaN, found: false };
  const z = normalQuantile(0.5 + confidence / 2);
  const sd = Math.sqrt(variance);
  return { lower: estimate * Math.exp(-z * sd), upper: estimate * Math.exp(z * sd), found: true };
}

/** The system B-life (percent failed) with its two-sided bounds at `confidence`. */
export function systemBLife(modes: readonly FittedMode[], percent: number, confidence: number, method: BoundMethod = 'likelihood-ratio'): BLife {
  const p = percent / 100;
  const estimate = systemQuantile(
    modes.map((m) => getFamily(m.fit.family).make(m.fit.parameters)),
    p,
  );
  let b: { lower: number; upper: number; found: boolean };
  try {
    b = method === 'fisher-matrix' ? fisher(modes, p, estimate, confidence) : likelihoodRatio(modes, p, estimate, confidence);
  } catch {
    b = { lower: Number.NaN, upper: Number.NaN, found: false }; // a profile that cannot be followed: no bound, said by boundsFound
  }
  return { percent, estimate, lower: b.lower, upper: b.upper, confidence, method: method === 'fisher-matrix' ? FM_SYSTEM : LR_SYSTEM, boundsFound: b.found };
}
