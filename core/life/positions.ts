/**
 * Probability-plot positions for data with suspensions, with pointwise bands, and their
 * coordinates on Weibull and lognormal probability scales.
 *
 * - 'johnson-benard' (default): Johnson's adjusted ranks (Johnson 1964, "The Statistical Treatment
 *   of Fatigue Experiments", Elsevier), increment = (n + 1 - previous rank)/(1 + units at or after
 *   this one), then Benard's approximation to the median rank, F = (j - 0.3)/(n + 0.4) (Benard &
 *   Bos-Levenbach 1953). Band: the Beta(j, n + 1 - j) rank distribution at the band's two
 *   probabilities (the 5 %/95 % ranks for a 90 % band), with the adjusted rank j in place of i
 *   (common practice, no source).
 * - 'kaplan-meier': the product-limit estimate (Kaplan & Meier 1958, JASA 53:457-481), plotted
 *   halfway up each jump so that the last point is not at F = 1 (Meeker & Escobar 1998, §6.4
 *   [from memory]); band from Greenwood's variance on the ln(-ln S) scale (Kalbfleisch & Prentice
 *   2002, "The Statistical Analysis of Failure Time Data", §1.4 [from memory]).
 * Only failures get plotting positions; suspensions only change the ranks.
 */
import { betaQuantile } from '../evidence/index.js';
import { normalQuantile } from '../special/index.js';
import { forEachFailureTime, type LifeData } from './data.js';

export type PlotPositionMethod = 'johnson-benard' | 'kaplan-meier';

export interface PlotPoint {
  readonly time: number;
  /** Plotting position (estimated fraction failed by `time`). */
  readonly F: number;
  /** Pointwise band for F. */
  readonly lower: number;
  readonly upper: number;
  /** Johnson's adjusted rank (johnson-benard) or the number at risk (kaplan-meier). */
  readonly rank: number;
}

export interface PlotCoordinates {
  /** ln t. */
  readonly x: number;
  readonly y: number;
  readonly yLower: number;
  readonly yUpper: number;
}

export interface PlotPositions {
  readonly method: PlotPositionMethod;
  readonly description: string;
  readonly bandLevel: number;
  readonly points: readonly PlotPoint[];
  /** x = ln t, y = ln(-ln(1 - F)). */
  readonly weibull: readonly PlotCoordinates[];
  /** x = ln t, y = Φ⁻¹(F). */
  readonly lognormal: readonly PlotCoordinates[];
}

/** y on the Weibull probability scale: ln(-ln(1 - F)). */
export function weibullScaleY(F: number): number {
  return Math.log(-Math.log1p(-F));
}

/** y on the lognormal (normal probability) scale: Φ⁻¹(F). */
export function lognormalScaleY(F: number): number {
  return normalQuantile(F);
}

export function johnsonBenardPositions(data: LifeData, bandLevel: number): PlotPoint[] {
  const n = data.n;
  const out: PlotPoint[] = [];
  let prev = 0;
  const a = (1 - bandLevel) / 2;
  for (let i = 0; i < n; i++) {
    if (!data.failed[i]) continue;
    const reverse = n - i; // units at or after this one
    const j = prev + (n + 1 - prev) / (1 + reverse);
    prev = j;
    const F = (j - 0.3) / (n + 0.4);
    const b = n + 1 - j;
    out.push({ time: data.times[i] as number, F, lower: betaQuantile(a, j, b).x, upper: betaQuantile(1 - a, j, b).x, rank: j });
  }
  return out;
}

export function kaplanMeierPositions(data: LifeData, bandLevel: number): PlotPoint[] {
  const z = normalQuantile(0.5 + bandLevel / 2);
  const out: PlotPoint[] = [];
  let S = 1;
  let logS = 0;
  let greenwood = 0;
  forEachFailureTime(data, (t, atRisk, d) => {
    const sPrev = S;
    S = S * (1 - d / atRisk);
    logS += Math.log1p(-d / atRisk);
    if (atRisk > d) greenwood += d / (atRisk * (atRisk - d));
    const F = 1 - 0.5 * (sPrev + S);
    let lower: number;
    let upper: number;
    if (S > 0 && logS < 0) {
      // S^{exp(±z·σ/ln S)} with σ² = Greenwood's sum: the ln(-ln S) interval.
      const w = (z * Math.sqrt(greenwood)) / logS;
      const sLo = Math.exp(logS * Math.exp(-w));
      const sHi = Math.exp(logS * Math.exp(w));
      lower = 1 - Math.max(sLo, sHi);
      upper = 1 - Math.min(sLo, sHi);
    } else {
      lower = S > 0 ? 0 : 1 - sPrev;
      upper = 1;
    }
    out.push({ time: t, F, lower: Math.min(lower, F), upper: Math.max(upper, F), rank: atRisk });
  });
  return out;
}

function coordinates(points: readonly PlotPoint[], y: (F: number) => number): PlotCoordinates[] {
  return points.map((p) => ({ x: Math.log(p.time), y: y(p.F), yLower: y(p.lower), yUpper: y(p.upper) }));
}

export function plotPositions(data: LifeData, method: PlotPositionMethod = 'johnson-benard', bandLevel = 0.9): PlotPositions {
  const points = method === 'kaplan-meier' ? kaplanMeierPositions(data, bandLevel) : johnsonBenardPositions(data, bandLevel);
  const description =
    method === 'kaplan-meier'
      ? 'Kaplan–Meier product-limit estimate, plotted halfway up each step; pointwise band from Greenwood’s variance on the ln(-ln S) scale'
      : 'Johnson’s adjusted ranks for suspensions with Benard’s median-rank approximation (j - 0.3)/(n + 0.4); pointwise band from the Beta(j, n + 1 - j) rank distribution';
  return {
    method,
    description,
    bandLevel,
    points,
    weibull: coordinates(points, weibullScaleY),
    lognormal: coordinates(points, lognormalScaleY),
  };
}
