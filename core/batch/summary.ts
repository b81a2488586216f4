/**
 * One line per series for the batch summary: n, the best model, each test's verdict on it, and the
 * decision number with its interval. Built only from the series' report (or its error), so the same
 * summary comes from a single run, a batch run and the merged output of shards.
 */
import type { AnyDatasetReport } from '../workflow/index.js';

export interface SeriesSummary {
  readonly series: string;
  /** 'ok' or 'error'. */
  readonly status: 'ok' | 'error';
  readonly n: number | null;
  readonly dataKind: string | null;
  /** Best model by the ranking rule (its label), or null when no candidate was ranked. */
  readonly best: string | null;
  readonly bestFamily: string | null;
  /** The best model's verdicts: 'not rejected', 'rejected' or 'not computed'. */
  readonly chiSquare: string | null;
  readonly andersonDarling: string | null;
  /** The first decision number asked for (B-life, return level, ppm, ...) under the best model. */
  readonly quantity: string | null;
  readonly estimate: number | null;
  readonly lower: number | null;
  readonly upper: number | null;
  /** Warnings in the report (all sections). */
  readonly warnings: number;
  readonly message: string | null;
}

/** One record of a batch's JSON Lines output. */
export type SeriesLine =
  | { readonly series: string; readonly report: AnyDatasetReport }
  | { readonly series: string; readonly error: { readonly message: string; readonly row?: number; readonly column?: string; readonly value?: string } };

function verdict(rejected: boolean | undefined, computed: boolean): string {
  if (!computed) return 'not computed';
  return rejected ? 'rejected' : 'not rejected';
}

/** The summary line of one series. */
export function summarizeSeries(line: SeriesLine): SeriesSummary {
  if ('error' in line) {
    return {
      series: line.series,
      status: 'error',
      n: null,
      dataKind: null,
      best: null,
      bestFamily: null,
      chiSquare: null,
      andersonDarling: null,
      quantity: null,
      estimate: null,
      lower: null,
      upper: null,
      warnings: 0,
      message: line.error.message,
    };
  }
  const r = line.report;
  const best = r.candidates[0];
  let chi: string | null = null;
  let ad: string | null = null;
  if (best) {
    const c = best.chiSquare as { computable?: boolean; rejected?: boolean };
    chi = verdict(c.rejected, c.computable !== false && typeof c.rejected === 'boolean');
    const a = best.andersonDarling as { offered?: boolean; rejected?: boolean };
    ad = verdict(a.rejected, a.offered !== false && typeof a.rejected === 'boolean');
  }
  const row = r.sensitivity?.[0];
  const value = best && row ? row.values.find((v) => v.family === best.family) : undefined;
  let warnings = r.warnings.length;
  for (const section of ['life', 'flood', 'capability', 'trend'] as const) {
    const s = (r as unknown as Record<string, { warnings?: readonly string[] } | undefined>)[section];
    if (s?.warnings) warnings += s.warnings.length;
  }
  return {
    series: line.series,
    status: 'ok',
    n: r.n,
    dataKind: r.dataKind,
    best: best ? best.label : null,
    bestFamily: best ? best.family : null,
    chiSquare: chi,
    andersonDarling: ad,
    quantity: row && value ? row.quantity : null,
    estimate: value ? value.estimate : null,
    lower: value?.lower ?? null,
    upper: value?.upper ?? null,
    warnings,
    message: null,
  };
}

export const SUMMARY_COLUMNS = [
  'series',
  'status',
  'n',
  'dataKind',
  'best',
  'chiSquare',
  'andersonDarling',
  'quantity',
  'estimate',
  'lower',
  'upper',
  'warnings',
  'message',
] as const;

function csvCell(v: unknown): string {
  if (v === null || v === undefined) return '';
  const s = typeof v === 'number' ? String(v) : String(v);
  return /[",\r\n]/.test(s) || /^\s|\s$/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The summary as CSV (RFC 4180 quoting), one header line then one line per series, in the order given. */
export function summaryCsv(rows: readonly SeriesSummary[]): string {
  const lines = [SUMMARY_COLUMNS.join(',')];
  for (const r of rows) lines.push(SUMMARY_COLUMNS.map((c) => csvCell(r[c])).join(','));
  return `${lines.join('\r\n')}\r\n`;
}
