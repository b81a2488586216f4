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

/**
 * The failures' positions for drawing: time, F and rank of every failure at once (one pass, cheap),
 * and the pointwise band of any one failure on demand, computed when first asked and then kept.
 * Johnson's band needs two Beta quantiles per failure (a root search each), so a plot that draws a
 * thinned set of a large sample's failures pays only for the points it draws; the numbers are the
 * ones `plotPositions` states for the same failure.
 */
export interface DrawingPositions {
  readonly method: PlotPositionMethod;
  readonly count: number;
  readonly time: Float64Array;
  readonly F: Float64Array;
  readonly rank: Float64Array;
  /** The pointwise band for F of failure `i` (0-based among the failures, in time order). */
  band(i: number): { readonly lower: number; readonly upper: number };
}

function johnsonBenardDrawing(data: LifeData, bandLevel: number): DrawingPositions {
  const n = data.n;
  const count = data.failures;
  const time = new Float64Array(count);
  const F = new Float64Array(count);
  const rank = new Float64Array(count);
  let prev = 0;
  for (let i = 0, k = 0; i < n; i++) {
    if (!data.failed[i]) continue;
    const reverse = n - i; // units at or after this one
    const j = prev + (n + 1 - prev) / (1 + reverse);
    prev = j;
    time[k] = data.times[i] as number;
    F[k] = (j - 0.3) / (n + 0.4);
    rank[k++] = j;
  }
  const a = (1 - bandLevel) / 2;
  const lower = new Float64Array(count).fill(Number.NaN);
  const upper = new Float64Array(count).fill(Number.NaN);
  return {
    method: 'johnson-benard',
    count,
    time,
    F,
    rank,
    band(i) {
      if (Number.isNaN(lower[i] as number)) {
        const j = rank[i] as number;
        const b = n + 1 - j;
        lower[i] = betaQuantile(a, j, b).x;
        upper[i] = betaQuantile(1 - a, j, b).x;
      }
      return { lower: lower[i] as number, upper: upper[i] as number };
    },
  };
}

function kaplanMeierDrawing(data: LifeData, bandLevel: number): DrawingPositions {
  // Greenwood's band is a running sum: computed for every step in the same pass (no search).
  const z = normalQuantile(0.5 + bandLevel / 2);
  const time: number[] = [];
  const Fs: number[] = [];
  const ranks: number[] = [];
  const lowers: number[] = [];
  const uppers: number[] = [];
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
    time.push(t);
    Fs.push(F);
    ranks.push(atRisk);
    lowers.push(Math.min(lower, F));
    uppers.push(Math.max(upper, F));
  });
  return {
    method: 'kaplan-meier',
    count: time.length,
    time: Float64Array.from(time),
    F: Float64Array.from(Fs),
    rank: Float64Array.from(ranks),
    band: (i) => ({ lower: lowers[i] as number, upper: uppers[i] as number }),
  };
}

/** The failures' positions for drawing, bands on demand (see DrawingPositions). */
export function drawingPositions(data: LifeData, method: PlotPositionMethod = 'johnson-benard', bandLevel = 0.9): DrawingPositions {
  return method === 'kaplan-meier' ? kaplanMeierDrawing(data, bandLevel) : johnsonBenardDrawing(data, bandLevel);
}

/** Every failure's position with its band, as the report states them. */
function allPoints(d: DrawingPositions): PlotPoint[] {
  const out: PlotPoint[] = [];
  for (let i = 0; i < d.count; i++) {
    const b = d.band(i);
    out.push({ time: d.time[i] as number, F: d.F[i] as number, lower: b.lower, upper: b.upper, rank: d.rank[i] as number });
  }
  return out;
}

export function johnsonBenardPositions(data: LifeData, bandLevel: number): PlotPoint[] {
  return allPoints(johnsonBenardDrawing(data, bandLevel));
}

export function kaplanMeierPositions(data: LifeData, bandLevel: number): PlotPoint[] {
  return allPoints(kaplanMeierDrawing(data, bandLevel));
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
