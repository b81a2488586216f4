/**
 * Weibull maximum likelihood with right censoring by the profile equation in the shape c
 * (Lawless 2003, §5.2; Cohen 1965, Technometrics 7:579-588):
 *   g(c) = Σ_all t^c ln t / Σ_all t^c - 1/c - (1/r) Σ_failures ln t = 0,   scale = (Σ_all t^c / r)^(1/c),
 * with r failures. Times enter as y = ln t - ln max t ≤ 0 (g is unchanged by the shift), so the
 * weights e^{c·y} lie in (0, 1]. g is increasing (g' = weighted variance of y + 1/c²); solved by
 * Newton kept inside a bracket found by doubling/halving (core/special newtonBracketed).
 * Counts may be fractional (weights, e.g. the E-step of a mixture's EM; r is then the summed failure weight).
 */
import { newtonBracketed } from '../special/index.js';
import type { LifeData } from './data.js';

export interface WeibullCensoredFit {
  readonly shape: number;
  readonly scale: number;
  readonly iterations: number;
  readonly converged: boolean;
}

export function fitWeibullCensored(data: Pick<LifeData, 'groups' | 'failures' | 'maxTime'>, relTol = 1e-13): WeibullCensoredFit {
  // Sums run over the distinct (time, status) pairs, weighted by their counts.
  const { times, failed, counts } = data.groups;
  const n = times.length;
  const r = data.failures;
  const lmax = Math.log(data.maxTime);
  const y = new Float64Array(n);
  let meanFailY = 0;
  for (let i = 0; i < n; i++) {
    y[i] = Math.log(times[i] as number) - lmax;
    if (failed[i]) meanFailY += (counts[i] as number) * (y[i] as number);
  }
  meanFailY /= r;
  const gd = (c: number): [number, number] => {
    let s0 = 0;
    let s1 = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const yi = y[i] as number;
      const w = (counts[i] as number) * Math.exp(c * yi);
      s0 += w;
      s1 += w * yi;
      s2 += w * yi * yi;
    }
    const m = s1 / s0;
    return [m - 1 / c - meanFailY, s2 / s0 - m * m + 1 / (c * c)];
  };
  // Bracket: g → -∞ as c → 0+, and g → max(y) - mean_fail(y) ≥ 0 as c → ∞ (> 0 unless all failures sit at the max).
  let lo = 1;
  let hi = 1;
  let it = 0;
  while (gd(lo)[0] > 0 && it < 200) {
    lo /= 2;
    it++;
  }
  while (gd(hi)[0] < 0 && it < 400) {
    hi *= 2;
    it++;
  }
  if (!(gd(lo)[0] <= 0 && gd(hi)[0] >= 0)) {
    return { shape: Number.NaN, scale: Number.NaN, iterations: it, converged: false };
  }
  let c = lo;
  let converged = true;
  if (lo < hi) {
    // core/special newtonBracketed (rtsafe): Newton steps, bisection whenever a step leaves the bracket.
    const out = { f: 0, df: 0 };
    const root = newtonBracketed(
      (x) => {
        [out.f, out.df] = gd(x);
        return out;
      },
      lo,
      hi,
      Math.sqrt(lo * hi),
      { relTol },
    );
    c = root.root;
    converged = root.converged;
    it += root.iterations;
  }
  let s0 = 0;
  for (let i = 0; i < n; i++) s0 += (counts[i] as number) * Math.exp(c * (y[i] as number));
  const scale = Math.exp(lmax + Math.log(s0 / r) / c);
  return { shape: c, scale, iterations: it, converged };
}
