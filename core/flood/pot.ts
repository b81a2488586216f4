/**
 * Peaks over a threshold (e.g. Coles 2001, An Introduction to Statistical Modeling of Extreme
 * Values, ch. 4 [from memory]; its §4.4.1 rainfall example is reproduced in
 * test/flood/pot-coles-rain.test.ts on the book's open data):
 * - declustering by runs: exceedances of the threshold u closer in time than the minimum
 *   separation belong to one cluster, and only each cluster's peak is kept;
 * - the excesses y = x − u of the cluster peaks follow a generalized Pareto distribution,
 *   S(y) = (1 + ξy/σ)^(−1/ξ) (ξ = 0: e^(−y/σ)), fitted by maximum likelihood (general maximiser
 *   over ln σ, ξ from the L-moment start) or by L-moments with the lower bound known
 *   (Hosking & Wallis 1997 A.5: k = l1/l2 − 2, α = (1 + k) l1, ξ = −k);
 * - λ, the mean number of cluster peaks per year, turns a period of T years into the return level
 *   z_T = u + (σ/ξ)[(λT)^ξ − 1] (ξ = 0: u + σ ln(λT)), for λT > 1;
 * - intervals for ML by profile likelihood of z_T (σ written through z_T and ξ; λ taken as known),
 *   none for L-moments (the report says so);
 * - threshold diagnostics: the mean excess above each candidate threshold (linear in u above a
 *   threshold where the GPD holds) and the ML shape and modified scale σ* = σ − ξu across
 *   thresholds (constant where it holds).
 */
import { CompensatedSum } from '../compensated.js';
import { InputError } from '../errors.js';
import { formatNumber } from '../format/index.js';
import { LOG, IDENTITY, maximize, profileInterval } from '../optimize/index.js';
import { sampleLMoments } from '../lmoments/sample-lmoments.js';

export interface Cluster {
  readonly start: number;
  readonly end: number;
  /** Time of the cluster's peak (days). */
  readonly time: number;
  readonly peak: number;
  readonly size: number;
}

/** Runs declustering of a dated series (times in days, any order). */
export function declusterRuns(times: ArrayLike<number>, values: ArrayLike<number>, threshold: number, minSeparation: number): Cluster[] {
  if (times.length !== values.length) throw new InputError('times and values must have the same length', {}, 'bad-input');
  if (!(minSeparation >= 0)) throw new InputError('the minimum separation must be ≥ 0 days', {}, 'bad-option');
  const idx = Array.from({ length: times.length }, (_, i) => i).filter((i) => (values[i] as number) > threshold).sort((a, b) => (times[a] as number) - (times[b] as number));
  const out: Cluster[] = [];
  let cur: { start: number; end: number; time: number; peak: number; size: number } | null = null;
  for (const i of idx) {
    const t = times[i] as number;
    const v = values[i] as number;
    if (cur && t - cur.end < minSeparation) {
      cur.end = t;
      cur.size++;
      if (v > cur.peak) {
        cur.peak = v;
        cur.time = t;
      }
    } else {
      if (cur) out.push(cur);
      cur = { start: t, end: t, time: t, peak: v, size: 1 };
    }
  }
  if (cur) out.push(cur);
  return out;
}

/** GPD log-likelihood of excesses y (all ≥ 0) at (σ, ξ). */
export function gpdLogLikelihood(y: ArrayLike<number>, sigma: number, xi: number): number {
  if (!(sigma > 0)) return Number.NEGATIVE_INFINITY;
  const acc = new CompensatedSum();
  const small = Math.abs(xi) < 1e-12;
  for (let i = 0; i < y.length; i++) {
    const t = (y[i] as number) / sigma;
    if (small) acc.add(-t);
    else {
      const a = xi * t;
      if (!(a > -1)) return Number.NEGATIVE_INFINITY;
      acc.add(-(1 + 1 / xi) * Math.log1p(a));
    }
  }
  return acc.value - y.length * Math.log(sigma);
}

export interface GpdFit {
  readonly scale: number;
  readonly shape: number;
  readonly logLikelihood: number | null;
  readonly converged: boolean;
  readonly method: string;
}

/** L-moments with the lower bound 0 known. */
export function fitGpdLMoments(y: ArrayLike<number>): GpdFit {
  const lm = sampleLMoments(Float64Array.from(y).sort());
  const k = lm.l1 / lm.l2 - 2;
  return { scale: (1 + k) * lm.l1, shape: -k, logLikelihood: null, converged: true, method: 'L-moments, lower bound known (Hosking & Wallis 1997 A.5)' };
}

/** Maximum likelihood over (σ, ξ), started from the L-moment fit. */
export function fitGpdMl(y: ArrayLike<number>): GpdFit {
  const start = fitGpdLMoments(y);
  // A loop, not Math.max(...y): a spread of 10^5+ excesses overflows the call stack.
  let ymax = 0;
  for (let i = 0; i < y.length; i++) ymax = Math.max(ymax, y[i] as number);
  // A start inside the support: for ξ < 0 the upper end σ/|ξ| must exceed the largest excess.
  let s0 = start.scale;
  const x0 = Math.max(-0.45, Math.min(0.9, start.shape));
  if (x0 < 0 && s0 / -x0 <= ymax) s0 = -x0 * ymax * 1.05;
  const r = maximize((t) => gpdLogLikelihood(y, t[0] as number, t[1] as number), [s0, x0], { transforms: [LOG, IDENTITY] });
  return { scale: r.x[0] as number, shape: r.x[1] as number, logLikelihood: r.value, converged: r.converged, method: 'maximum likelihood (general maximiser from the L-moment start)' };
}

/** z_T above u for m = λT cluster peaks. */
export function gpdReturnLevel(u: number, sigma: number, xi: number, m: number): number {
  const lm = Math.log(m);
  return Math.abs(xi) < 1e-12 ? u + sigma * lm : u + (sigma / xi) * Math.expm1(xi * lm);
}

export interface PotReturnLevel {
  readonly period: number;
  readonly estimate: number;
  readonly lower: number | null;
  readonly upper: number | null;
  readonly method: string;
}

export interface PotResult {
  readonly threshold: number;
  readonly minSeparation: number;
  readonly clusters: readonly Cluster[];
  readonly exceedances: number;
  readonly years: number;
  /** Cluster peaks per year. */
  readonly rate: number;
  readonly fit: GpdFit;
  readonly returnLevels: readonly PotReturnLevel[];
}

export interface PotOptions {
  readonly threshold: number;
  readonly minSeparation: number;
  readonly estimation?: 'ml' | 'lmoments';
  readonly periods?: readonly number[];
  readonly confidence?: number;
  /** Record length in years; default (last − first time + 1 day)/365.25. */
  readonly years?: number;
}

export function peaksOverThreshold(times: ArrayLike<number>, values: ArrayLike<number>, opts: PotOptions): PotResult {
  const clusters = declusterRuns(times, values, opts.threshold, opts.minSeparation);
  if (clusters.length < 5) throw new InputError(`only ${clusters.length} cluster peaks above the threshold ${formatNumber(opts.threshold)}; a GPD fit needs at least 5 (lower the threshold)`, { value: String(opts.threshold) }, 'too-few-values');
  let tmin = Infinity;
  let tmax = -Infinity;
  for (let i = 0; i < times.length; i++) {
    tmin = Math.min(tmin, times[i] as number);
    tmax = Math.max(tmax, times[i] as number);
  }
  const years = opts.years ?? (tmax - tmin + 1) / 365.25;
  const rate = clusters.length / years;
  const y = clusters.map((c) => c.peak - opts.threshold);
  const ml = (opts.estimation ?? 'ml') === 'ml';
  const fit = ml ? fitGpdMl(y) : fitGpdLMoments(y);
  const level = opts.confidence ?? 0.95;
  const u = opts.threshold;
  const returnLevels = (opts.periods ?? [10, 50, 100]).map((T): PotReturnLevel => {
    const m = rate * T;
    if (!(m > 1)) return { period: T, estimate: Number.NaN, lower: null, upper: null, method: 'not defined: fewer than one cluster peak expected in T years' };
    const z = gpdReturnLevel(u, fit.scale, fit.shape, m);
    if (!ml) return { period: T, estimate: z, lower: null, upper: null, method: 'none (L-moment estimate)' };
    // σ through (z, ξ): σ = ξ(z − u)/((m)^ξ − 1), ξ = 0: (z − u)/ln m.
    const lmm = Math.log(m);
    const loglik = (t: Float64Array): number => {
      const zz = t[0] as number;
      const xi = t[1] as number;
      if (!(zz > u)) return Number.NEGATIVE_INFINITY;
      const sigma = Math.abs(xi) < 1e-12 ? (zz - u) / lmm : (xi * (zz - u)) / Math.expm1(xi * lmm);
      return gpdLogLikelihood(y, sigma, xi);
    };
    const pi = profileInterval(loglik, { x: [z, fit.shape], value: fit.logLikelihood as number }, 0, level);
    return {
      period: T,
      estimate: z,
      lower: pi.lowerFound ? pi.lower : null,
      upper: pi.upperFound ? pi.upper : null,
      method: `profile likelihood (${Math.round(level * 100)} %), exceedance rate taken as known`,
    };
  });
  return { threshold: u, minSeparation: opts.minSeparation, clusters, exceedances: clusters.length, years, rate, fit, returnLevels };
}

export interface ThresholdDiagnostic {
  readonly threshold: number;
  readonly clusters: number;
  readonly meanExcess: number;
  /** ML shape and modified scale σ − ξu; null with fewer than 10 cluster peaks. */
  readonly shape: number | null;
  readonly modifiedScale: number | null;
}

/** Mean excess and parameter stability across thresholds (declustered at each). */
export function thresholdDiagnostics(times: ArrayLike<number>, values: ArrayLike<number>, thresholds: readonly number[], minSeparation: number): ThresholdDiagnostic[] {
  return thresholds.map((u) => {
    const c = declusterRuns(times, values, u, minSeparation);
    const y = c.map((k) => k.peak - u);
    const me = y.length > 0 ? y.reduce((a, b) => a + b, 0) / y.length : Number.NaN;
    if (y.length < 10) return { threshold: u, clusters: y.length, meanExcess: me, shape: null, modifiedScale: null };
    const f = fitGpdMl(y);
    return { threshold: u, clusters: y.length, meanExcess: me, shape: f.shape, modifiedScale: f.scale - f.shape * u };
  });
}
