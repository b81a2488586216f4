/**
 * A flood record for log-Pearson type III by the expected moments algorithm (core/flood fitEma;
 * Cohn, Lane & Baier 1997; USGS Bulletin 17C, England et al. 2018), built once for every surface:
 * the CLI's `--estimation ema` run (cli/flood-ema.ts), the server's peak-file upload and the page's
 * flood-record section (flood-record-report.ts), and the flood section's EMA block of annual maxima
 * (flood-estimators.ts). What is decided here, and only here:
 *
 *  - whether a text is a peak file (tab-separated, '#' comment lines, a header naming peak_va);
 *  - how it is read (core/gauge readPeakFile with the perception threshold and the start of the
 *    historical period when given);
 *  - the regional skew's pairing rule (a regional skew and its mean square error go together);
 *  - the fit and the return levels with their intervals, the one default set of return periods
 *    and the one seeded random stream of the bootstrap beside the intervals (EMA_INTERVAL_STREAM of
 *    the option table's seed), so the CLI's JSON and the API's report give the same numbers.
 */
import { InputError } from '../errors.js';
import { DEFAULT_EMA_REPLICATES, EMA_INTERVAL_STREAM, emaCautions, emaReturnLevels, fitEma, type EmaFit, type EmaRecord, type EmaReturnLevel } from '../flood/index.js';
import { readPeakFile, type CodeSummary, type PeakFile } from '../gauge/peak-file.js';
import { createRng } from '../random/index.js';

/** Return periods of a flood record when none are given (years). */
export const FLOOD_RECORD_PERIODS: readonly number[] = Object.freeze([2, 5, 10, 25, 50, 100, 200, 500]);

/** The peak column a peak file must name in its header. */
export const PEAK_COLUMN = 'peak_va';

/**
 * A peak file: the first line that is neither blank nor a '#' comment is a tab-separated header
 * naming the peak column (peak_va). Only the first 200 lines are looked at, so a large CSV costs
 * nothing here. A CSV whose header does not name peak_va is not a peak file, '#' lines or not.
 */
export function looksLikePeakFile(text: string): boolean {
  let at = 0;
  for (let i = 0; i < 200 && at <= text.length; i++) {
    const next = text.indexOf('\n', at);
    const line = (next < 0 ? text.slice(at) : text.slice(at, next)).replace(/^\uFEFF/, '').replace(/\r$/, '');
    if (!line.startsWith('#') && line.trim() !== '') return line.split('\t').some((c) => c.trim() === PEAK_COLUMN);
    if (next < 0) return false;
    at = next + 1;
  }
  return false;
}

/** What a peak file holds, for the page's data card and the report ("peak file: 78 peaks 1888-2024; ..."). */
export interface PeakFileMakeUp {
  /** Rows with a peak discharge. */
  readonly peaks: number;
  readonly firstYear: number;
  readonly lastYear: number;
  /** Systematic record: the years of the rows that are not historic peaks. */
  readonly systematic: { readonly peaks: number; readonly firstYear: number; readonly lastYear: number } | null;
  readonly historicPeaks: number;
  /** Peaks known only to lie below (code 4) or above (code 8) the value given. */
  readonly knownBelow: number;
  readonly knownAbove: number;
  readonly codes: readonly CodeSummary[];
  /** The whole make-up in one line. */
  readonly text: string;
}

export function peakFileMakeUp(f: PeakFile): PeakFileMakeUp {
  const years = f.rows.map((r) => r.year);
  const sys = f.rows.filter((r) => !r.codes.includes('7')).map((r) => r.year);
  const historicPeaks = f.rows.length - sys.length;
  const knownBelow = f.rows.filter((r) => r.codes.includes('4')).length;
  const knownAbove = f.rows.filter((r) => !r.codes.includes('4') && r.codes.includes('8')).length;
  const firstYear = Math.min(...years);
  const lastYear = Math.max(...years);
  const parts = [`peak file: ${f.rows.length} peaks ${firstYear}-${lastYear}`];
  if (sys.length > 0) parts.push(`systematic record ${Math.min(...sys)}-${Math.max(...sys)} (${sys.length} peaks)`);
  parts.push(`${historicPeaks} historic peak${historicPeaks === 1 ? '' : 's'}`);
  if (knownBelow + knownAbove > 0) parts.push(`${knownBelow} known only below and ${knownAbove} only above a value`);
  parts.push(f.codes.length > 0 ? `codes ${f.codes.map((c) => `${c.code} ×${c.count}`).join(', ')}` : 'no qualification codes');
  return {
    peaks: f.rows.length,
    firstYear,
    lastYear,
    systematic: sys.length > 0 ? { peaks: sys.length, firstYear: Math.min(...sys), lastYear: Math.max(...sys) } : null,
    historicPeaks,
    knownBelow,
    knownAbove,
    codes: f.codes,
    text: parts.join('; '),
  };
}

export interface FloodRecordReadOptions {
  readonly perceptionThreshold?: number | null;
  readonly historicalStart?: number | null;
}

/** A peak file read for the EMA: the file (rows, codes, historical period, warnings) and its make-up. */
export interface FloodRecordRead {
  readonly file: PeakFile;
  readonly makeUp: PeakFileMakeUp;
}

/** Read a peak file (core/gauge readPeakFile) with the historical-period options when given. */
export function readFloodRecord(text: string, o: FloodRecordReadOptions = {}): FloodRecordRead {
  const pt = o.perceptionThreshold ?? undefined;
  const hs = o.historicalStart ?? undefined;
  const file = readPeakFile(text, { ...(pt !== undefined ? { perceptionThreshold: pt } : {}), ...(hs !== undefined ? { historicalStart: hs } : {}) });
  return { file, makeUp: peakFileMakeUp(file) };
}

/**
 * The regional skew of the weighting from its two options: both or neither (the weighting needs
 * the regional skew and its mean square error); null when neither is given.
 */
export function regionalSkewOf(skew: number | null | undefined, mse: number | null | undefined): { readonly skew: number; readonly mse: number } | null {
  const g = skew ?? null;
  const m = mse ?? null;
  if ((g === null) !== (m === null)) {
    throw new InputError('A regional skew and its mean square error go together: the weighting needs both.', {}, 'bad-option');
  }
  return g !== null && m !== null ? { skew: g, mse: m } : null;
}

export interface FloodRecordRun {
  readonly regionalSkew?: { readonly skew: number; readonly mse: number } | null;
  /** Default FLOOD_RECORD_PERIODS. */
  readonly periods?: readonly number[];
  /** Two-sided level of the intervals (default 0.9). */
  readonly confidence?: number;
  /** Bootstrap replicates of the interval beside the reported one (default DEFAULT_EMA_REPLICATES). */
  readonly replicates?: number;
  /** The run's seed (the option table's default when the user gives none). */
  readonly seed: number;
}

export interface FloodRecordFit {
  /** The record fitted (with the regional skew when given). */
  readonly record: EmaRecord;
  readonly fit: EmaFit;
  readonly returnLevels: readonly EmaReturnLevel[];
  readonly confidence: number;
  /** Set when the iteration did not settle (in words, without a trailing period). */
  readonly notConverged: string | null;
  readonly cautions: readonly string[];
}

/** Fit log-Pearson III by EMA to a record and compute its return levels with intervals. */
export function fitFloodRecord(record: EmaRecord, run: FloodRecordRun): FloodRecordFit {
  const withSkew: EmaRecord = run.regionalSkew ? { ...record, regionalSkew: run.regionalSkew } : record;
  const fit = fitEma(withSkew);
  const confidence = run.confidence ?? 0.9;
  const returnLevels = emaReturnLevels(withSkew, fit, run.periods ?? FLOOD_RECORD_PERIODS, {
    confidence,
    replicates: run.replicates ?? DEFAULT_EMA_REPLICATES,
    rng: createRng(run.seed, EMA_INTERVAL_STREAM),
  });
  return {
    record: withSkew,
    fit,
    returnLevels,
    confidence,
    notConverged: fit.converged ? null : `the EMA iteration did not settle in ${fit.iterations} steps; the moments are the last step's`,
    cautions: emaCautions(fit),
  };
}
