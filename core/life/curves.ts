/**
 * Curve data for the page: the fitted cdf, reliability and hazard rate h(t) = f(t)/S(t) (computed as
 * exp(ln f - ln S), so it stays finite far in the upper tail) on a log-spaced time grid covering
 * the data.
 */
import type { Distribution } from '../families/index.js';
import { normalQuantile } from '../special/index.js';

export interface LifeCurves {
  readonly time: readonly number[];
  readonly cdf: readonly number[];
  readonly reliability: readonly number[];
  readonly hazard: readonly number[];
  /** The fitted cdf on the probability-plot scales (x = ln time): ln(-ln(1 - F)) and Φ⁻¹(F). */
  readonly weibullY: readonly number[];
  readonly lognormalY: readonly number[];
}

/** Log-spaced grid from lo to hi (both > 0), `points` ≥ 2. */
export function logGrid(lo: number, hi: number, points: number): number[] {
  const a = Math.log(lo);
  const b = Math.log(hi);
  const out: number[] = [];
  for (let i = 0; i < points; i++) out.push(Math.exp(a + ((b - a) * i) / (points - 1)));
  return out;
}

export function lifeCurves(dist: Pick<Distribution, 'cdf' | 'sf' | 'logPdf' | 'logSf' | 'logCdf'>, grid: readonly number[]): LifeCurves {
  return {
    time: grid,
    cdf: grid.map((t) => dist.cdf(t)),
    reliability: grid.map((t) => dist.sf(t)),
    hazard: grid.map((t) => Math.exp(dist.logPdf(t) - dist.logSf(t))),
    // ln(-ln S) from logSf directly, so the upper tail does not round to ln(-ln 0).
    weibullY: grid.map((t) => Math.log(-dist.logSf(t))),
    lognormalY: grid.map((t) => {
      const lc = dist.logCdf(t);
      const ls = dist.logSf(t);
      return lc < ls ? normalQuantile(Math.exp(lc)) : -normalQuantile(Math.exp(ls));
    }),
  };
}
