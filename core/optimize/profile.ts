/**
 * Profile-likelihood (likelihood-ratio) confidence interval for one parameter: the set of values
 * t with 2[ℓ(θ̂) - max_{θ: θ_i = t} ℓ(θ)] ≤ χ²₁(level) (Cox & Hinkley 1974, "Theoretical
 * Statistics", §9.3; Lawless 2003, §B.4). Each end is bracketed by stepping out from the estimate
 * in the parameter's free coordinate and then solved by Brent's method on the profile deviance.
 */
import { normalQuantile } from '../special/index.js';
import { numericalHessian } from './derivatives.js';
import { maximize } from './maximize.js';
import { brentRoot } from './root.js';
import { IDENTITY, type Transform } from './transforms.js';

export interface ProfileOptions {
  /** One transform per parameter, as for `maximize` (the interval is searched in free coordinates). */
  readonly transforms?: readonly Transform[];
  /** Relative tolerance on each end, in the parameter's free coordinate (default 1e-8). */
  readonly tolerance?: number;
  /** Maximum doublings of the outward step when bracketing (default 60). */
  readonly maxExpansions?: number;
}

export interface ProfileInterval {
  /** Lower end in the natural parameter; the parameter's range end when the profile never reaches the critical value. */
  readonly lower: number;
  readonly upper: number;
  readonly level: number;
  /** χ²₁ quantile at `level`: the deviance that defines each end. */
  readonly critical: number;
  /** false when that side could not be closed (the likelihood stays within the critical value). */
  readonly lowerFound: boolean;
  readonly upperFound: boolean;
  readonly method: string;
}

/** χ²₁ quantile at probability `level`: z²_{(1+level)/2}. */
export function chiSquare1Quantile(level: number): number {
  const z = normalQuantile(0.5 + level / 2);
  return z * z;
}

/**
 * The profile log-likelihood of parameter `index` as a function of its value `t` (natural scale),
 * maximised over the other parameters, warm-started from the last point it visited.
 */
export function profileLogLikelihood(
  logLik: (theta: Float64Array) => number,
  mle: ArrayLike<number>,
  index: number,
  transforms?: readonly Transform[],
): (t: number) => number {
  const n = mle.length;
  if (n === 1) return (t: number) => logLik(Float64Array.of(t));
  let warm: Float64Array = Float64Array.from(mle as ArrayLike<number>).filter((_, i) => i !== index);
  const otherTr = transforms ? transforms.filter((_, i) => i !== index) : undefined;
  return (t: number) => {
    const full = new Float64Array(n);
    const inner = (others: Float64Array): number => {
      for (let i = 0, k = 0; i < n; i++) full[i] = i === index ? t : (others[k++] as number);
      return logLik(full);
    };
    let r = maximize(inner, warm, { transforms: otherTr, skipSimplex: true, xtol: 1e-11 });
    if (!r.converged || !Number.isFinite(r.value)) {
      const r2 = maximize(inner, warm, { transforms: otherTr, xtol: 1e-11 });
      if (r2.value >= r.value || !Number.isFinite(r.value)) r = r2;
    }
    if (Number.isFinite(r.value)) warm = Float64Array.from(r.x);
    return r.value;
  };
}

export function profileInterval(
  logLik: (theta: Float64Array) => number,
  mle: { readonly x: ArrayLike<number>; readonly value: number },
  index: number,
  level: number,
  opts: ProfileOptions = {},
): ProfileInterval {
  if (!(level > 0 && level < 1)) throw new RangeError(`profileInterval: level must be in (0, 1), got ${level}`);
  const tr = opts.transforms?.[index] ?? IDENTITY;
  const crit = chiSquare1Quantile(level);
  const tol = opts.tolerance ?? 1e-8;
  const maxExp = opts.maxExpansions ?? 60;
  const u0 = tr.toFree(mle.x[index] as number);
  // Scale of the first step: the Wald standard error in the free coordinate, when available.
  const n = mle.x.length;
  const freeLogLik = (z: Float64Array): number => {
    const th = Float64Array.from(mle.x as ArrayLike<number>);
    for (let i = 0; i < n; i++) {
      const t = opts.transforms?.[i] ?? IDENTITY;
      th[i] = t.fromFree(z[i] as number);
    }
    return logLik(th);
  };
  const z0 = new Float64Array(n);
  for (let i = 0; i < n; i++) z0[i] = (opts.transforms?.[i] ?? IDENTITY).toFree(mle.x[i] as number);
  let h0 = 0.1 * Math.max(Math.abs(u0), 1);
  const H = numericalHessian(freeLogLik, z0);
  const hii = -(H[index * n + index] as number);
  if (hii > 0 && Number.isFinite(hii)) h0 = Math.min(h0 * 10, Math.sqrt(crit / hii) / 2);
  const side = (dir: 1 | -1): { end: number; found: boolean } => {
    const prof = profileLogLikelihood(logLik, mle.x, index, opts.transforms);
    const dev = (u: number): number => {
      const v = prof(tr.fromFree(u));
      return Number.isFinite(v) ? 2 * (mle.value - v) - crit : Number.POSITIVE_INFINITY;
    };
    let inner = u0;
    let fin = -crit;
    let h = h0;
    for (let k = 0; k < maxExp; k++) {
      const u = u0 + dir * h;
      const t = tr.fromFree(u);
      if (!Number.isFinite(t) || !Number.isFinite(u)) break;
      const d = dev(u);
      if (d > 0) {
        if (d === Number.POSITIVE_INFINITY) {
          // Outside the feasible set: shrink towards the inner point until finite.
          let hi = u;
          for (let j = 0; j < 60; j++) {
            const mid = 0.5 * (inner + hi);
            const dm = dev(mid);
            if (dm === Number.POSITIVE_INFINITY) hi = mid;
            else if (dm > 0) {
              hi = mid;
              const r = brentRoot(dev, inner, hi, { fa: fin, fb: dm, rtol: tol, xtol: tol });
              return { end: tr.fromFree(r.x), found: true };
            } else {
              inner = mid;
              fin = dm;
            }
          }
          return { end: tr.fromFree(inner), found: false };
        }
        const r = brentRoot(dev, inner, u, { fa: fin, fb: d, rtol: tol, xtol: tol * Math.max(Math.abs(u0), 1) });
        return { end: tr.fromFree(r.x), found: true };
      }
      inner = u;
      fin = d;
      h *= 2;
    }
    return { end: tr.fromFree(dir > 0 ? Number.POSITIVE_INFINITY : Number.NEGATIVE_INFINITY), found: false };
  };
  const lo = side(-1);
  const hi = side(1);
  const a = Math.min(lo.end, hi.end);
  const b = Math.max(lo.end, hi.end);
  // A decreasing transform swaps the ends.
  const swapped = lo.end > hi.end;
  return {
    lower: a,
    upper: b,
    level,
    critical: crit,
    lowerFound: swapped ? hi.found : lo.found,
    upperFound: swapped ? lo.found : hi.found,
    method: 'profile likelihood ratio (deviance = χ²₁ quantile), Brent root on each side',
  };
}
