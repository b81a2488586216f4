/**
 * The common x grid on which every candidate's fitted density and CDF are evaluated, and the
 * curves themselves. Densities are exp(logPdf(x)), so a tail that underflows is 0 rather than
 * NaN, and a pole (e.g. a gamma or Weibull shape below 1 at x = 0) becomes null (a gap).
 */
import type { Distribution } from '../families/index.js';
import type { FittedCurve } from './types.js';
import { finiteOrNull } from './quantileMap.js';

/**
 * Ascending grid over [lo, hi]: `points` equally spaced values, merged with `points/2`
 * geometrically spaced ones over [dataMin, hi] when the data are positive and max/min > 20 (so a
 * density rising steeply near 0 is resolved). Duplicates removed.
 */
export function commonGrid(lo: number, hi: number, points: number, dataMin: number, dataMax: number): number[] {
  const out: number[] = [];
  const m = Math.max(2, points);
  // lo·(1 - t) + hi·t stays finite even when hi - lo would overflow (data near ±1.8e308).
  for (let j = 0; j < m; j++) {
    const t = j / (m - 1);
    out.push(j === m - 1 ? hi : lo * (1 - t) + hi * t);
  }
  if (dataMin > 0 && dataMax / dataMin > 20) {
    const g = Math.max(2, Math.floor(m / 2));
    const a = Math.log(Math.max(dataMin, lo > 0 ? lo : dataMin));
    const b = Math.log(hi);
    for (let j = 0; j < g; j++) out.push(Math.min(hi, Math.exp(a + ((b - a) * j) / (g - 1))));
  }
  out.sort((p, q) => p - q);
  const dedup: number[] = [];
  for (const v of out) if (dedup.length === 0 || v > (dedup[dedup.length - 1] as number)) dedup.push(v);
  return dedup;
}

export function densityCurve(dist: Distribution, label: string, grid: readonly number[]): FittedCurve {
  return { family: dist.family, label, y: grid.map((x) => finiteOrNull(Math.exp(dist.logPdf(x)))) };
}

export function cdfCurve(dist: Distribution, label: string, grid: readonly number[]): FittedCurve {
  return { family: dist.family, label, y: grid.map((x) => finiteOrNull(dist.cdf(x))) };
}
