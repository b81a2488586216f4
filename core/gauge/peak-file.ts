/**
 * Reader for annual peak-flow files in the tab-separated layout that national water agencies
 * publish (as described for the USGS "RDB" peak-flow files [from memory]): lines starting with
 * '#' are comments; the first other line names the columns; the next line gives each column's
 * format (e.g. "10d", "15s") and is skipped; then one row per peak. The columns used are the date
 * of the peak (YYYY-MM-DD, month or day "00" when unknown), the peak discharge and a qualification
 * field that may hold several codes separated by commas.
 *
 * Codes that change the likelihood are mapped to the EMA's inputs (USGS peak qualification codes
 * [from memory]); every code found is listed with its count and what was done with it:
 *   7 historic peak → a known historical peak;
 *   4 discharge less than the indicated value → the peak lies in (0, value];
 *   8 discharge greater than the indicated value → the peak lies in (value, ∞);
 *   5, 6 regulation or diversion, C urbanization/land-use change → kept, with a warning that the
 *   record may not come from one distribution;
 *   other codes are listed and do not change the analysis.
 * Historical period: the historic peaks' perception threshold is taken as the smallest historic
 * peak and the years from the first historic peak to the start of the systematic record without
 * a peak as years below it, unless the caller gives both (a common default, stated as an
 * assumption in the result; the governing agency's guidance decides).
 */
import { InputError } from '../errors.js';
import type { EmaRecord } from '../flood/index.js';

export interface PeakRow {
  readonly line: number;
  readonly date: string;
  readonly year: number;
  readonly peak: number;
  readonly codes: readonly string[];
}

export interface CodeSummary {
  readonly code: string;
  readonly meaning: string;
  readonly count: number;
  readonly effect: string;
}

export interface PeakFile {
  readonly columns: readonly string[];
  readonly rows: readonly PeakRow[];
  readonly codes: readonly CodeSummary[];
  readonly record: EmaRecord;
  readonly historicalPeriod: { readonly firstYear: number; readonly threshold: number; readonly yearsBelow: number; readonly assumed: boolean } | null;
  readonly warnings: readonly string[];
  readonly comments: readonly string[];
}

export interface PeakFileOptions {
  readonly dateColumn?: string;
  readonly peakColumn?: string;
  readonly codeColumn?: string;
  /** Perception threshold of the historical period (flow); default the smallest historic peak. */
  readonly perceptionThreshold?: number;
  /** First year of the historical period; default the year of the first historic peak. */
  readonly historicalStart?: number;
}

const MEANINGS: Readonly<Record<string, [string, string]>> = {
  '1': ['maximum daily average, not an instantaneous peak', 'kept as a peak'],
  '2': ['discharge is an estimate', 'kept as a peak'],
  '3': ['affected by a dam failure', 'kept as a peak; check whether it belongs to the population'],
  '4': ['discharge less than the indicated value', 'censored: the peak lies in (0, value]'],
  '5': ['affected to an unknown degree by regulation or diversion', 'kept; the record may not be homogeneous'],
  '6': ['affected by regulation or diversion', 'kept; the record may not be homogeneous'],
  '7': ['historic peak', 'a known historical peak above the perception threshold'],
  '8': ['discharge greater than the indicated value', 'censored: the peak lies in (value, ∞)'],
  '9': ['snowmelt, hurricane, ice-jam or debris-dam breakup', 'kept as a peak'],
  A: ['year of occurrence unknown or not exact', 'kept as a peak'],
  B: ['month or day of occurrence unknown or not exact', 'kept as a peak'],
  Bd: ['day of occurrence unknown or not exact', 'kept as a peak'],
  Bm: ['month of occurrence unknown or not exact', 'kept as a peak'],
  C: ['affected by urbanization, mining, agricultural change, channelization or similar', 'kept; the record may not be homogeneous'],
  D: ['base discharge changed during this year', 'kept as a peak'],
  E: ['only the annual maximum peak is available for this year', 'kept as a peak'],
};

const NON_HOMOGENEOUS = new Set(['5', '6', 'C']);

export function readPeakFile(text: string, opts: PeakFileOptions = {}): PeakFile {
  const dateName = opts.dateColumn ?? 'peak_dt';
  const peakName = opts.peakColumn ?? 'peak_va';
  const codeName = opts.codeColumn ?? 'peak_cd';
  const lines = text.split(/\r?\n/);
  const comments: string[] = [];
  let header: string[] | null = null;
  let formatSeen = false;
  const rows: PeakRow[] = [];
  let di = -1;
  let pi = -1;
  let ci = -1;
  lines.forEach((raw, i) => {
    const lineNo = i + 1;
    if (raw.startsWith('#')) {
      comments.push(raw.slice(1).trim());
      return;
    }
    if (raw.trim() === '') return;
    const cells = raw.split('\t');
    if (!header) {
      header = cells.map((c) => c.trim());
      di = header.indexOf(dateName);
      pi = header.indexOf(peakName);
      ci = header.indexOf(codeName);
      if (di < 0 || pi < 0) {
        throw new InputError(`the peak file needs the columns "${dateName}" and "${peakName}"; its header has: ${header.join(', ')}`, { row: lineNo }, 'no-column');
      }
      return;
    }
    if (!formatSeen) {
      formatSeen = true;
      if (cells.every((c) => /^\d+[sdn]$/.test(c.trim()))) return; // the column-format line
    }
    const date = (cells[di] ?? '').trim();
    const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
    if (!m) throw new InputError(`line ${lineNo}, column ${dateName}: the date "${date}" is not YYYY-MM-DD`, { row: lineNo, column: dateName, value: date }, 'bad-input');
    const peakText = (cells[pi] ?? '').trim();
    if (peakText === '') return; // a year with a stage but no discharge: not a peak-flow observation
    const peak = Number(peakText);
    if (!Number.isFinite(peak) || peak < 0) throw new InputError(`line ${lineNo}, column ${peakName}: the peak "${peakText}" is not a flow ≥ 0`, { row: lineNo, column: peakName, value: peakText }, 'not-a-number');
    const codeText = ci >= 0 ? (cells[ci] ?? '').trim() : '';
    const codes = codeText === '' ? [] : codeText.split(',').map((c) => c.trim()).filter((c) => c !== '');
    rows.push({ line: lineNo, date, year: Number(m[1]), peak, codes });
  });
  if (!header) throw new InputError('the peak file has no header line', {}, 'bad-input');
  if (rows.length === 0) throw new InputError('the peak file has no peaks', {}, 'too-few-values');

  const counts = new Map<string, number>();
  for (const r of rows) for (const c of r.codes) counts.set(c, (counts.get(c) ?? 0) + 1);
  const codes: CodeSummary[] = [...counts.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([code, count]) => {
      const known = MEANINGS[code];
      return { code, count, meaning: known ? known[0] : 'not a code this reader knows', effect: known ? known[1] : 'ignored (listed only)' };
    });

  const peaks: number[] = [];
  const historicalPeaks: number[] = [];
  const intervals: { lower: number; upper: number }[] = [];
  const historicYears: number[] = [];
  const systematicYears: number[] = [];
  for (const r of rows) {
    if (r.codes.includes('4')) intervals.push({ lower: 0, upper: r.peak });
    else if (r.codes.includes('8')) intervals.push({ lower: r.peak, upper: Number.POSITIVE_INFINITY });
    else if (r.codes.includes('7')) {
      historicalPeaks.push(r.peak);
      historicYears.push(r.year);
      continue;
    } else peaks.push(r.peak);
    systematicYears.push(r.year);
  }
  const warnings: string[] = [];
  const nonHomog = codes.filter((c) => NON_HOMOGENEOUS.has(c.code));
  if (nonHomog.length > 0) {
    warnings.push(
      `${nonHomog.map((c) => `code ${c.code} (${c.meaning}) on ${c.count} peak${c.count === 1 ? '' : 's'}`).join('; ')}: the record may not come from one distribution; the governing agency's guidance says whether and how to adjust it.`,
    );
  }
  let historicalPeriod: PeakFile['historicalPeriod'] = null;
  let historicalYearsBelow: EmaRecord['historicalYearsBelow'];
  if (historicalPeaks.length > 0) {
    const firstSystematic = systematicYears.length > 0 ? Math.min(...systematicYears) : Math.max(...historicYears) + 1;
    const start = opts.historicalStart ?? Math.min(...historicYears);
    const threshold = opts.perceptionThreshold ?? Math.min(...historicalPeaks);
    const inPeriod = historicYears.filter((y) => y >= start && y < firstSystematic).length;
    const yearsBelow = Math.max(0, firstSystematic - start - inPeriod);
    const assumed = opts.perceptionThreshold === undefined || opts.historicalStart === undefined;
    historicalPeriod = { firstYear: start, threshold, yearsBelow, assumed };
    historicalYearsBelow = { years: yearsBelow, threshold };
    if (assumed) {
      warnings.push(
        `historical period assumed from ${start} to ${firstSystematic - 1} with a perception threshold of ${threshold} (the smallest historic peak): ${yearsBelow} years without a recorded peak are taken as below it. State the period and threshold the historical information supports.`,
      );
    }
  }
  return {
    columns: header,
    rows,
    codes,
    record: {
      peaks,
      ...(historicalPeaks.length > 0 ? { historicalPeaks } : {}),
      ...(historicalYearsBelow ? { historicalYearsBelow } : {}),
      ...(intervals.length > 0 ? { intervals } : {}),
    },
    historicalPeriod,
    warnings,
    comments,
  };
}
