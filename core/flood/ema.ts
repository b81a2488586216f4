/**
 * The expected moments algorithm (EMA) for the log-Pearson type III distribution of annual peak
 * flows (Cohn, Lane & Baier 1997, WRR 33(9):2089-2096; USGS Bulletin 17C, England et al. 2018,
 * Techniques and Methods 4-B5, §7 and App. 7 [from memory]).
 *
 * Every year of the record is one observation of Y = log10 Q: either a known peak y, or an
 * interval lower < Y ≤ upper (a historical year whose peak stayed below the perception threshold,
 * a low outlier known only to lie below the smallest retained peak, a zero flow, a peak reported
 * only as "below" or "above" a value). Starting from the moments of the known peaks, each step
 * replaces every interval by its conditional moments under the current Pearson III fit
 * (ema-moments.ts) and re-estimates
 *   M  = [Σ y + Σ E(Y | interval)] / n,
 *   S² = c₂ [Σ (y − M)² + Σ E((Y − M)² | interval)] / n,
 *   G  = c₃ [Σ (y − M)³ + Σ E((Y − M)³ | interval)] / (n S³),
 *   c₂ = n/(n − 1),  c₃ = n²/((n − 1)(n − 2)),
 * until the moments stop changing (relative 1e-12 of S). With known peaks only, one step gives the
 * sample mean, the sample standard deviation and the Bulletin's bias-corrected station skew
 * G = n Σ(y − ȳ)³/((n − 1)(n − 2) S³) exactly (Bulletin 17B eq. 6; the same in 17C): the reduction
 * test in test/flood/ema.test.ts. With a regional skew, each step uses the MSE-weighted skew
 * (regional-skew.ts) for the next conditional moments, and the station skew reported is the
 * unweighted G of the last step.
 */
import { CompensatedSum } from '../compensated.js';
import { InputError, isPlumblineError } from '../errors.js';
import { Pearson3Distribution } from '../families/index.js';
import { intervalMoments } from './ema-moments.js';
import { multipleGrubbsBeck, type MgbResult } from './grubbs-beck.js';
import { weightSkew, type SkewWeighting, type SkewYears } from './regional-skew.js';
import { effectiveRecordLength, emaDesign, type EmaDesign } from './ema-covariance.js';

/** One year of the record in log10 flow: a known peak, or an interval lower < Y ≤ upper. */
export type LogObservation = { readonly kind: 'peak'; readonly y: number } | { readonly kind: 'interval'; readonly lower: number; readonly upper: number };

/** The record in flow units, as the gauge file or the CLI gives it. */
export interface EmaRecord {
  /** Known peaks (systematic record and known historical peaks), flow units. */
  readonly peaks: readonly number[];
  /** Known historical peaks above the perception threshold (flow units). */
  readonly historicalPeaks?: readonly number[];
  /** Historical years with no recorded peak: each peak stayed at or below `threshold`. */
  readonly historicalYearsBelow?: { readonly years: number; readonly threshold: number };
  /** Peaks known only to lie in (lower, upper]; lower 0 or upper Infinity for one-sided. */
  readonly intervals?: readonly { readonly lower: number; readonly upper: number }[];
  /** Regional skew with its mean square error. */
  readonly regionalSkew?: { readonly skew: number; readonly mse: number };
  /** 'mgb' (default): multiple Grubbs–Beck on the known peaks; 'none'; or a fixed threshold (flow). */
  readonly lowOutliers?: 'mgb' | 'none' | { readonly threshold: number };
}

export interface EmaCounts {
  readonly years: number;
  readonly peaks: number;
  readonly historicalPeaks: number;
  readonly historicalYearsBelow: number;
  readonly intervals: number;
  readonly lowOutliers: number;
  readonly zeros: number;
}

export interface EmaFit {
  /** Moments of log10 flows; skew is the weighted skew when a regional skew was given. */
  readonly parameters: { readonly mean: number; readonly sd: number; readonly skew: number };
  readonly skew: SkewWeighting;
  readonly iterations: number;
  readonly converged: boolean;
  readonly counts: EmaCounts;
  readonly lowOutlierTest: MgbResult | null;
  /** Flow below which peaks were treated as low outliers (censored), or null. */
  readonly lowOutlierThreshold: number | null;
  /** The observations as the EMA used them (log10). */
  readonly observations: readonly LogObservation[];
  /**
   * Effective record length of the station skew (ema-covariance.ts): the years of a record with no
   * censoring whose skew has the same asymptotic variance; equals the years when none is censored.
   * With censored or historical years it is the n of the station skew's MSE (skew.mseYears), found
   * together with the fit (fitEma). null when the covariance cannot be computed (the MSE then uses
   * the years).
   */
  readonly effectiveRecordLength: number | null;
  readonly method: string;
}

const MAX_ITERATIONS = 500;
const TOLERANCE = 1e-12;
/**
 * Most known peaks one EMA fit takes. Annual-peak records run to a few hundred years; the multiple
 * Grubbs–Beck p-values are simulated at the record's length (about 7 ms per peak at load 17 here,
 * 1000 peaks ≈ 7 s), so a column of daily values sent by mistake (the server accepts 2·10⁶) is
 * refused with a message instead of running for hours (common practice, no source).
 */
export const EMA_MAX_PEAKS = 1000;

/** Build the log10 observations from a record, running the low-outlier test. */
export function recordObservations(record: EmaRecord): {
  observations: LogObservation[];
  counts: EmaCounts;
  mgb: MgbResult | null;
  lowThreshold: number | null;
} {
  const known = [...record.peaks, ...(record.historicalPeaks ?? [])];
  if (known.length > EMA_MAX_PEAKS) {
    throw new InputError(
      `EMA takes an annual-peak record of at most ${EMA_MAX_PEAKS} known peaks (got ${known.length}); a longer column is not a series of annual maxima — reduce it to one peak a year first.`,
      {},
      'bad-input',
    );
  }
  for (const q of known) {
    if (!Number.isFinite(q) || q < 0) throw new InputError(`a peak flow must be a finite number ≥ 0 (got ${String(q)})`);
  }
  const positive = known.filter((q) => q > 0);
  const zeros = known.length - positive.length;
  if (positive.length < 3) throw new InputError(`EMA needs at least 3 positive known peaks (got ${positive.length})`, {}, 'too-few-values');
  let mgb: MgbResult | null = null;
  let lowThreshold: number | null = null;
  const mode = record.lowOutliers ?? 'mgb';
  if (mode === 'mgb') {
    mgb = multipleGrubbsBeck(positive.map((q) => Math.log10(q)));
    // The smallest retained peak itself (not 10^log10 of it, which may differ in the last bit).
    if (mgb.lowOutliers > 0) lowThreshold = [...positive].sort((a, b) => a - b)[mgb.lowOutliers] as number;
  } else if (mode !== 'none') {
    if (!(mode.threshold > 0)) throw new InputError('the low-outlier threshold must be a positive flow');
    lowThreshold = mode.threshold;
  }
  // Zero flows lie below every positive peak: censored at the low-outlier threshold, else at the smallest positive peak.
  const zeroCeiling = lowThreshold ?? Math.min(...positive);
  const obs: LogObservation[] = [];
  let low = 0;
  for (const q of known) {
    if (q === 0) obs.push({ kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: Math.log10(zeroCeiling) });
    else if (lowThreshold !== null && q < lowThreshold) {
      obs.push({ kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: Math.log10(lowThreshold) });
      low++;
    } else obs.push({ kind: 'peak', y: Math.log10(q) });
  }
  const hb = record.historicalYearsBelow;
  if (hb && hb.years > 0) {
    if (!(hb.threshold > 0) || !Number.isInteger(hb.years)) throw new InputError('historical years need a whole number of years and a positive perception threshold');
    for (let i = 0; i < hb.years; i++) obs.push({ kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: Math.log10(hb.threshold) });
  }
  for (const iv of record.intervals ?? []) {
    if (!(iv.lower >= 0) || !(iv.upper > iv.lower)) throw new InputError(`an interval peak needs 0 ≤ lower < upper (got ${String(iv.lower)}, ${String(iv.upper)})`);
    obs.push({ kind: 'interval', lower: iv.lower > 0 ? Math.log10(iv.lower) : Number.NEGATIVE_INFINITY, upper: Math.log10(iv.upper) });
  }
  const counts: EmaCounts = {
    years: obs.length,
    peaks: record.peaks.length,
    historicalPeaks: record.historicalPeaks?.length ?? 0,
    historicalYearsBelow: hb?.years ?? 0,
    intervals: record.intervals?.length ?? 0,
    lowOutliers: low,
    zeros,
  };
  return { observations: obs, counts, mgb, lowThreshold };
}

/** Conditional moments of W over an interval; an interval of no mass sits at the support edge. */
function momentsOf(d: Pearson3Distribution, lower: number, upper: number): { m1: number; m2: number; m3: number } {
  const r = intervalMoments(d.mu, d.sigma, d.gamma, lower, upper);
  if (r.probability > 0) return r;
  const edge = upper <= d.support.lower ? d.support.lower : d.support.upper;
  const w = (edge - d.mu) / d.sigma;
  return { m1: w, m2: w * w, m3: w * w * w };
}

/** One EMA moment step; returns M, S and the unweighted G. */
function emaStep(obs: readonly LogObservation[], d: Pearson3Distribution | null): { mean: number; sd: number; skew: number } {
  const n = obs.length;
  const sum = new CompensatedSum();
  const cm: { m1: number; m2: number; m3: number }[] = [];
  // Many years share one interval (a perception threshold): their moments are computed once a step.
  const cache = new Map<string, { m1: number; m2: number; m3: number }>();
  for (const o of obs) {
    if (o.kind === 'peak') sum.add(o.y);
    else {
      if (!d) throw new Error('interval observations need a current fit');
      const key = `${o.lower}|${o.upper}`;
      let m = cache.get(key);
      if (!m) {
        m = momentsOf(d, o.lower, o.upper);
        cache.set(key, m);
      }
      cm.push(m);
      sum.add(d.mu + d.sigma * m.m1);
    }
  }
  const M = sum.value / n;
  const s2 = new CompensatedSum();
  const s3 = new CompensatedSum();
  let j = 0;
  for (const o of obs) {
    if (o.kind === 'peak') {
      const e = o.y - M;
      s2.add(e * e);
      s3.add(e * e * e);
    } else {
      const m = cm[j++] as { m1: number; m2: number; m3: number };
      const dd = d as Pearson3Distribution;
      const c = (dd.mu - M) / dd.sigma;
      const sg = dd.sigma;
      s2.add(sg * sg * (m.m2 + 2 * c * m.m1 + c * c));
      s3.add(sg * sg * sg * (m.m3 + 3 * c * m.m2 + 3 * c * c * m.m1 + c * c * c));
    }
  }
  const c2 = n / (n - 1);
  const c3 = (n * n) / ((n - 1) * (n - 2));
  const sd = Math.sqrt((c2 * s2.value) / n);
  return { mean: M, sd, skew: (c3 * s3.value) / (n * sd * sd * sd) };
}

/** Moments of the known peaks only: the starting point. */
function knownMoments(obs: readonly LogObservation[]): { mean: number; sd: number; skew: number } {
  const peaks = obs.filter((o): o is { kind: 'peak'; y: number } => o.kind === 'peak');
  return emaStep(peaks, null);
}

/** Run the EMA iteration on prepared observations. */
export function emaIterate(
  obs: readonly LogObservation[],
  regional?: { skew: number; mse: number },
  skewYears?: SkewYears,
): { mean: number; sd: number; skew: SkewWeighting; iterations: number; converged: boolean } {
  const n = obs.length;
  if (n < 3) throw new InputError('EMA needs at least 3 years', {}, 'too-few-values');
  const years = skewYears ?? { years: n, kind: 'record' as const };
  let cur = knownMoments(obs);
  let weighting = weightSkew(cur.skew, years.years, regional, years.kind);
  const hasIntervals = obs.some((o) => o.kind === 'interval');
  if (!hasIntervals) return { mean: cur.mean, sd: cur.sd, skew: weighting, iterations: 1, converged: true };
  for (let it = 1; it <= MAX_ITERATIONS; it++) {
    const d = new Pearson3Distribution(cur.mean, cur.sd, weighting.weightedSkew);
    const next = emaStep(obs, d);
    const nextWeighting = weightSkew(next.skew, years.years, regional, years.kind);
    const change = Math.max(
      Math.abs(next.mean - cur.mean) / next.sd,
      Math.abs(next.sd - cur.sd) / next.sd,
      Math.abs(nextWeighting.weightedSkew - weighting.weightedSkew),
    );
    cur = next;
    weighting = nextWeighting;
    if (change <= TOLERANCE) return { mean: cur.mean, sd: cur.sd, skew: weighting, iterations: it, converged: true };
  }
  return { mean: cur.mean, sd: cur.sd, skew: weighting, iterations: MAX_ITERATIONS, converged: false };
}

/** Effective record length of the station skew at a fit, or null where the covariance cannot be computed. */
function erlAt(design: EmaDesign, r: { mean: number; sd: number; skew: SkewWeighting }): number | null {
  try {
    const e = effectiveRecordLength(design, { mean: r.mean, sd: r.sd, skew: r.skew.weightedSkew });
    return Number.isFinite(e) && e > 0 ? e : null;
  } catch (e) {
    if (isPlumblineError(e)) return null;
    throw e;
  }
}

/** Most rounds of the search for the effective record length that the fit and its skew weighting share. */
const MAX_ERL_ROUNDS = 50;
/** Relative agreement of the effective record length used and the one at the resulting fit. */
const ERL_TOLERANCE = 1e-9;

/**
 * The EMA fit of a record: low-outlier test, iteration, skew weighting.
 *
 * With censored or historical years the station skew's MSE (regional-skew.ts) is computed from the
 * effective record length n_e of the station skew, not the record's years (Bulletin 17C [from
 * memory]). n_e depends on the fit (its skew) and, with a regional skew, the fit on n_e (through the
 * weights): the two are found together by fixed-point rounds, refitting with the last n_e until
 * the n_e at the fit agrees with the one used to relative 1e-9 (two or three rounds on the test
 * records). A record with no censored years keeps n = its years exactly (n_e = n there, up to the
 * rounding of the covariance). Where n_e cannot be computed (a singular design) the years are used
 * and effectiveRecordLength is null.
 */
export function fitEma(record: EmaRecord): EmaFit {
  const { observations, counts, mgb, lowThreshold } = recordObservations(record);
  const design = emaDesign(record, { lowOutlierThreshold: lowThreshold, counts });
  let r = emaIterate(observations, record.regionalSkew);
  let erl = erlAt(design, r);
  const censored = design.thresholds.some((t) => t.threshold !== Number.NEGATIVE_INFINITY);
  let erlConverged = true;
  if (censored && erl !== null) {
    erlConverged = false;
    for (let round = 0; round < MAX_ERL_ROUNDS && erl !== null; round++) {
      const used: number = erl;
      r = emaIterate(observations, record.regionalSkew, { years: used, kind: 'effective' });
      const next = erlAt(design, r);
      if (next === null) {
        erl = null;
        break;
      }
      erl = used;
      if (Math.abs(next - used) <= ERL_TOLERANCE * used) {
        erlConverged = true;
        break;
      }
      erl = next;
    }
    if (erl === null || !erlConverged) {
      // No consistent effective length: fall back to the record's years, and say so (effectiveRecordLength null).
      r = emaIterate(observations, record.regionalSkew);
      erl = null;
    }
  }
  return {
    effectiveRecordLength: erl,
    parameters: Object.freeze({ mean: r.mean, sd: r.sd, skew: r.skew.weightedSkew }),
    skew: r.skew,
    iterations: r.iterations,
    converged: r.converged,
    counts,
    lowOutlierTest: mgb,
    lowOutlierThreshold: lowThreshold,
    observations,
    method:
      'expected moments algorithm (Cohn, Lane & Baier 1997; Bulletin 17C) on log10 flows' +
      (record.regionalSkew ? ', skew weighted with the regional skew by mean square errors' : ', station skew'),
  };
}

/** The fields of an EMA fit that every report of it carries (the CLI's JSON, the flood section), under the contract's names. */
export interface EmaCandidateFields {
  readonly family: 'logpearson3';
  readonly estimation: 'ema';
  readonly parameters: EmaFit['parameters'];
  /** null: the EMA is a moments estimator, not maximum likelihood. */
  readonly logLikelihood: null;
  readonly skew: SkewWeighting;
  readonly counts: EmaCounts;
  readonly lowOutliers: { readonly count: number; readonly threshold: number | null; readonly method: string | null };
  readonly iterations: number;
  readonly converged: boolean;
  readonly effectiveRecordLength: number | null;
  readonly method: string;
}

export function emaCandidateFields(fit: EmaFit): EmaCandidateFields {
  return {
    family: 'logpearson3',
    estimation: 'ema',
    parameters: fit.parameters,
    logLikelihood: null,
    skew: fit.skew,
    counts: fit.counts,
    lowOutliers: { count: fit.counts.lowOutliers, threshold: fit.lowOutlierThreshold, method: fit.lowOutlierTest?.method ?? null },
    iterations: fit.iterations,
    converged: fit.converged,
    effectiveRecordLength: fit.effectiveRecordLength,
    method: fit.method,
  };
}
