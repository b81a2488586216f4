/**
 * Weibayes: Weibull analysis with the shape β ASSUMED from experience, not estimated (Nelson 1985,
 * "Weibull analysis of reliability data with few or no failures", J. Quality Technology
 * 17:140-146). With β fixed, Tᵢ^β is exponential with mean η^β, so everything follows from the
 * total transformed exposure E = Σ tᵢ^β over every unit (failed or not) and the number of
 * failures r:
 *   scale (maximum likelihood given β, r ≥ 1):   η̂ = (E / r)^{1/β}
 *   one-sided lower confidence bound at C:      η_L = (2E / χ²_{C; 2r+2})^{1/β}   (zero failures included)
 * (for β = 1 this is the classical bound on an exponential mean, 2T/χ²_{2r+2}; Epstein & Sobel 1953
 * [from memory]). From η_L: the lower bound of a B-life, η_L (-ln(1 - p))^{1/β}, and of the
 * reliability at t, exp(-(t/η_L)^β). The bounds are exact for time-censored (Type I) tests only
 * under the assumed β; they carry no allowance for β being wrong.
 * With r = 0 there is no estimate; the trade's habit of "assuming one failure" gives (E)^{1/β},
 * which is η_L at C = 1 - e^{-1} ≈ 63.2 %, and is reported as that bound, not as an estimate.
 * Sums of tᵢ^β use ln tᵢ and the largest time as a pivot so that large β does not overflow.
 */
import { CompensatedSum } from '../compensated.js';
import { InputError } from '../errors.js';
import { chiSquareIsf } from '../special/index.js';
import type { LifeData } from './data.js';

export interface WeibayesOptions {
  /** The assumed Weibull shape β (> 0). */
  readonly shape: number;
  /** One-sided confidence of the lower bounds (default 0.9). */
  readonly confidence?: number;
  readonly bLifePercents?: readonly number[];
  readonly reliabilityTimes?: readonly number[];
}

export interface WeibayesResult {
  readonly shape: number;
  readonly shapeIs: 'assumed';
  readonly failures: number;
  readonly units: number;
  /** Σ tᵢ^β over all units (in time^β). */
  readonly exposure: number;
  /** Maximum-likelihood scale given β; null with zero failures. */
  readonly scale: number | null;
  /** One-sided lower bound of the scale at `confidence`. */
  readonly scaleLower: number;
  /** (Σ tᵢ^β)^{1/β}: the "one assumed failure" value, a lower bound at 63.2 %. */
  readonly scaleOneFailure: number;
  readonly confidence: number;
  readonly degreesOfFreedom: number;
  readonly bLives: readonly { readonly percent: number; readonly estimate: number | null; readonly lower: number }[];
  readonly reliability: readonly { readonly time: number; readonly estimate: number | null; readonly lower: number }[];
  readonly statement: string;
  readonly method: string;
  readonly source: string;
}

/** ln Σ tᵢ^β from times (ascending not required), pivoted on the largest ln t. */
export function logExposure(times: ArrayLike<number>, counts: ArrayLike<number> | null, shape: number): number {
  let lmax = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < times.length; i++) lmax = Math.max(lmax, Math.log(times[i] as number));
  const s = new CompensatedSum();
  for (let i = 0; i < times.length; i++) s.add((counts ? (counts[i] as number) : 1) * Math.exp(shape * (Math.log(times[i] as number) - lmax)));
  return shape * lmax + Math.log(s.value);
}

export function weibayes(data: Pick<LifeData, 'groups' | 'failures' | 'n'>, opts: WeibayesOptions): WeibayesResult {
  const beta = opts.shape;
  const C = opts.confidence ?? 0.9;
  if (!(beta > 0 && Number.isFinite(beta))) throw new InputError(`The assumed Weibull shape must be a number > 0, got ${String(beta)}.`, { value: String(beta) }, 'bad-option');
  if (!(C > 0 && C < 1)) throw new InputError(`The confidence must be in (0, 1), got ${String(C)}.`, { value: String(C) }, 'bad-option');
  const r = data.failures;
  const lE = logExposure(data.groups.times, data.groups.counts, beta);
  const dof = 2 * r + 2;
  const chi = chiSquareIsf(1 - C, dof);
  const scaleLower = Math.exp((Math.LN2 + lE - Math.log(chi)) / beta);
  const scale = r > 0 ? Math.exp((lE - Math.log(r)) / beta) : null;
  const bLives = (opts.bLifePercents ?? [10]).map((percent) => {
    const a = Math.pow(-Math.log1p(-percent / 100), 1 / beta);
    return { percent, estimate: scale === null ? null : scale * a, lower: scaleLower * a };
  });
  const reliability = (opts.reliabilityTimes ?? []).map((time) => ({
    time,
    estimate: scale === null ? null : Math.exp(-Math.pow(time / scale, beta)),
    lower: Math.exp(-Math.pow(time / scaleLower, beta)),
  }));
  const pct = Number((100 * C).toPrecision(4));
  return {
    shape: beta,
    shapeIs: 'assumed',
    failures: r,
    units: data.n,
    exposure: Math.exp(lE),
    scale,
    scaleLower,
    scaleOneFailure: Math.exp(lE / beta),
    confidence: C,
    degreesOfFreedom: dof,
    bLives,
    reliability,
    statement: `The Weibull shape β = ${beta} is ASSUMED (from experience or earlier data), not estimated from these data; every number below holds only if β is right. ${
      r === 0 ? 'With no failures there is no estimate of the scale, only its lower bound.' : `With ${r} failure${r === 1 ? '' : 's'} the scale is the maximum-likelihood value given β.`
    } The lower bounds are one-sided at ${pct} %.`,
    method: `Weibayes: scale from the total exposure Σ t^β of all ${data.n} units and r = ${r} failures; lower bound (2 Σ t^β / χ²(${pct} %; ${dof} degrees of freedom))^(1/β)`,
    source: 'Nelson 1985, J. Quality Technology 17:140-146',
  };
}
