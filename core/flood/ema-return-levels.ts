/**
 * Return levels of an EMA log-Pearson III fit and their confidence intervals.
 *
 * Estimate: Q_T = 10^(M + K_T S), K_T the Pearson III frequency factor at the weighted skew,
 * i.e. the inverse survival function of the fitted Pearson III of log10 Q at 1/T.
 *
 * Intervals (the reported lower/upper): ema-intervals.ts — the EMA's first-order variance after
 * Cohn, Lane & Stedinger (2001), with censored and historical years, the skew's and the regional
 * skew's uncertainty, and noncentral-t limits at the equivalent record length (exact for a normal
 * population with the skew held and no censoring). Measured coverage of the nominal 90 % interval
 * (scripts/flood-ema-ci-coverage.ts, seeded, test/fixtures/flood-ema-ci-coverage.json): 86.4–96.2 %
 * over eleven cases, 82.7 % in a twelfth (skew −1.6 censored at the low end), 89.3 % in the exact
 * case; the figures are in ema-intervals.ts.
 *
 * Beside it, when an rng is given, a parametric bootstrap of the whole estimator (common practice,
 * no source for this particular scheme): each replicate draws a record of the same shape from the
 * fitted distribution (the systematic years censored below the same low-outlier threshold; the
 * historical period's years above its perception threshold kept as peaks, the others as "below the
 * threshold"; user intervals kept as given), refits by EMA with the same regional skew, and the
 * interval is the percentile range of the replicates' log10 Q_T. Its coverage on systematic records
 * (scripts/flood-ema-coverage.py, seeded, 1000 records per case, Monte Carlo s.e. 0.9 points) was
 * 87.4 % (skew +0.3, n = 60), 90.4 % (skew −0.3, n = 60), 85.0 % (skew +0.3, n = 30).
 */
import type { Rng } from '../random/index.js';
import { Pearson3Distribution } from '../families/index.js';
import { emaIterate, type EmaFit, type EmaRecord, type LogObservation } from './ema.js';
import { emaDesign } from './ema-covariance.js';
import { EMA_INTERVAL_METHOD, emaIntervals, type EmaIntervals } from './ema-intervals.js';
import { isPlumblineError } from '../errors.js';

export interface EmaBootstrapInterval {
  readonly lower: number | null;
  readonly upper: number | null;
  readonly method: string;
}

export interface EmaReturnLevel {
  readonly period: number;
  readonly estimate: number;
  /** Interval of ema-intervals.ts (null when the equivalent record length is under 2 years). */
  readonly lower: number | null;
  readonly upper: number | null;
  readonly method: string;
  /** Years of a normal record with the same quantile variance (ema-intervals.ts; null where not computed). */
  readonly equivalentYears: number | null;
  /** The parametric-bootstrap percentile interval beside it (null without an rng). */
  readonly bootstrap: EmaBootstrapInterval | null;
}

export interface EmaIntervalOptions {
  readonly confidence?: number;
  readonly replicates?: number;
  readonly rng?: Rng;
}

export const DEFAULT_EMA_REPLICATES = 300;

/** Stream of createRng(seed, stream) for the EMA bootstrap: the CLI, the API and the page draw the same numbers from one seed. */
export const EMA_INTERVAL_STREAM = 12;

/** Draw one synthetic record shaped like the fitted one. */
function syntheticRecord(record: EmaRecord, fit: EmaFit, d: Pearson3Distribution, rng: Rng): LogObservation[] {
  const draw = (): number => d.quantile(rng.uniform());
  const out: LogObservation[] = [];
  const low = fit.lowOutlierThreshold !== null ? Math.log10(fit.lowOutlierThreshold) : null;
  for (let i = 0; i < record.peaks.length; i++) {
    const y = draw();
    if (low !== null && y < low) out.push({ kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: low });
    else out.push({ kind: 'peak', y });
  }
  const hb = record.historicalYearsBelow;
  const hp = record.historicalPeaks ?? [];
  if (hb && hb.years > 0) {
    const t = Math.log10(hb.threshold);
    for (let i = 0; i < hb.years + hp.length; i++) {
      const y = draw();
      out.push(y > t ? { kind: 'peak', y } : { kind: 'interval', lower: Number.NEGATIVE_INFINITY, upper: t });
    }
  } else {
    for (let i = 0; i < hp.length; i++) out.push({ kind: 'peak', y: draw() });
  }
  for (const iv of record.intervals ?? []) {
    out.push({ kind: 'interval', lower: iv.lower > 0 ? Math.log10(iv.lower) : Number.NEGATIVE_INFINITY, upper: Math.log10(iv.upper) });
  }
  return out;
}

function percentile(sorted: Float64Array, p: number): number {
  const h = (sorted.length - 1) * p;
  const i = Math.floor(h);
  const f = h - i;
  const a = sorted[i] as number;
  return f === 0 ? a : a + f * ((sorted[Math.min(i + 1, sorted.length - 1)] as number) - a);
}

/** Return levels for the periods (years > 1) with their intervals; the bootstrap beside them when an rng is given. */
export function emaReturnLevels(record: EmaRecord, fit: EmaFit, periods: readonly number[], opts: EmaIntervalOptions = {}): EmaReturnLevel[] {
  const confidence = opts.confidence ?? 0.9;
  const main = intervalsOrNone(record, fit, periods, confidence);
  const boot = opts.rng ? bootstrapIntervals(record, fit, periods, confidence, opts.replicates ?? DEFAULT_EMA_REPLICATES, opts.rng) : null;
  return main.levels.map((l, i) => ({
    period: l.period,
    estimate: l.estimate,
    lower: l.lower,
    upper: l.upper,
    method: main.method,
    equivalentYears: l.equivalentYears,
    bootstrap: boot ? (boot[i] as EmaBootstrapInterval) : null,
  }));
}

/** The EMA-variance intervals; where the covariance cannot be computed (a singular design), none, saying why. */
function intervalsOrNone(record: EmaRecord, fit: EmaFit, periods: readonly number[], confidence: number): EmaIntervals {
  try {
    return emaIntervals(fit, emaDesign(record, fit), periods, confidence);
  } catch (e) {
    if (!isPlumblineError(e)) throw e;
    const d = new Pearson3Distribution(fit.parameters.mean, fit.parameters.sd, fit.parameters.skew);
    return {
      levels: periods.map((period) => ({ period, estimate: Math.pow(10, d.isf(1 / period)), lower: null, upper: null, varianceLog10: Number.NaN, equivalentYears: null })),
      effectiveRecordLength: Number.NaN,
      method: `${EMA_INTERVAL_METHOD}: not computed for this record (${e.message.replace(/\.$/, '')})`,
    };
  }
}

/** Parametric-bootstrap percentile intervals of log10 Q_T (B replicates). */
function bootstrapIntervals(record: EmaRecord, fit: EmaFit, periods: readonly number[], confidence: number, B: number, rng: Rng): EmaBootstrapInterval[] {
  const { mean, sd, skew } = fit.parameters;
  const d = new Pearson3Distribution(mean, sd, skew);
  const samples = periods.map(() => new Float64Array(B));
  let kept = 0;
  for (let b = 0; b < B; b++) {
    const obs = syntheticRecord(record, fit, d, rng);
    if (obs.filter((o) => o.kind === 'peak').length < 3) continue;
    // The station skew's MSE from the fitted record's years (its effective length when censored), not recomputed per replicate.
    const r = emaIterate(obs, record.regionalSkew, { years: fit.skew.mseYears, kind: fit.skew.mseYearsKind });
    if (!r.converged) continue;
    const rd = new Pearson3Distribution(r.mean, r.sd, r.skew.weightedSkew);
    periods.forEach((t, i) => {
      (samples[i] as Float64Array)[kept] = rd.isf(1 / t);
    });
    kept++;
  }
  const method = `parametric bootstrap of the EMA, percentile interval (${kept} replicates)`;
  return periods.map((_, i) => {
    const s = (samples[i] as Float64Array).slice(0, kept).sort();
    const ok = kept >= 20;
    return {
      lower: ok ? Math.pow(10, percentile(s, (1 - confidence) / 2)) : null,
      upper: ok ? Math.pow(10, percentile(s, (1 + confidence) / 2)) : null,
      method,
    };
  });
}
