/**
 * Many series in one table: split the cells of a long table (a key column naming the series, one
 * row per value) or of a wide table (one column per series) into series, each parsed on its own so
 * that one series' bad cell gives that series an error record (row, column, value) and every other
 * series is still analysed.
 *
 * Works on cell texts already read by core/csv (reading the file is the caller's job): the key and
 * value columns of a long table come with the file row of each cell.
 */
import { parseNumberRange, type NumberFailure } from '../csv/number.js';
import { classifyCell, REASON_WORDS } from '../csv/classify.js';
import type { SkipReason } from '../csv/types.js';

/** One series ready for analysis. */
export interface SeriesValues {
  readonly kind: 'values';
  readonly key: string;
  /** The value column's label (wide tables: the series' own column). */
  readonly column: string;
  readonly values: Float64Array;
  /** Status of each value (1 failed, 0 suspended) when a status column was read. */
  readonly status: Uint8Array | null;
  /** 1-based file line of each value. */
  readonly rows: Int32Array;
  /** Cells dropped (only blank cells of a wide table, or any invalid cell with skipInvalid), by reason. */
  readonly dropped: readonly { readonly reason: SkipReason; readonly count: number; readonly firstRow: number }[];
}

/** A series that cannot be analysed, with the first offending cell. */
export interface SeriesFault {
  readonly kind: 'error';
  readonly key: string;
  readonly message: string;
  readonly row?: number;
  readonly column?: string;
  readonly value?: string;
}

export type SeriesRecord = SeriesValues | SeriesFault;

export interface SplitOptions {
  readonly decimal?: '.' | ',';
  /** Drop invalid cells (counted per series) instead of giving the series an error record. */
  readonly skipInvalid?: boolean;
}

/** Cells of one column with the file row of each (rows ascending). */
export interface CellColumn {
  readonly column: string;
  readonly texts: readonly string[];
  readonly rows: Int32Array | readonly number[];
}

class SeriesBuilder {
  values: number[] = [];
  status: number[] = [];
  rows: number[] = [];
  dropped = new Map<SkipReason, { count: number; firstRow: number }>();
  fault: SeriesFault | null = null;
  constructor(readonly key: string, readonly column: string) {}

  drop(reason: SkipReason, row: number): void {
    const d = this.dropped.get(reason);
    if (d) d.count++;
    else this.dropped.set(reason, { count: 1, firstRow: row });
  }

  finish(withStatus: boolean): SeriesRecord {
    if (this.fault) return this.fault;
    return {
      kind: 'values',
      key: this.key,
      column: this.column,
      values: Float64Array.from(this.values),
      status: withStatus ? Uint8Array.from(this.status) : null,
      rows: Int32Array.from(this.rows),
      dropped: [...this.dropped].map(([reason, d]) => ({ reason, count: d.count, firstRow: d.firstRow })),
    };
  }
}

function cellFault(key: string, row: number, column: string, text: string, what: string): SeriesFault {
  return {
    kind: 'error',
    key,
    message: `series ${JSON.stringify(key)}: row ${row}, column ${JSON.stringify(column)}: ${JSON.stringify(text)} is ${what}`,
    row,
    column,
    value: text,
  };
}

/** Parse one cell into `b`; returns false when the series failed on it. */
function addCell(b: SeriesBuilder, text: string, row: number, column: string, decimal: '.' | ',', skip: boolean, failure: NumberFailure): boolean {
  const t = text.trim();
  failure.kind = 'syntax';
  const v = t === '' ? Number.NaN : parseNumberRange(t, 0, t.length, decimal === ',' ? 44 : 46, failure);
  if (Number.isFinite(v)) {
    b.values.push(v);
    b.rows.push(row);
    return true;
  }
  const reason = classifyCell(t, failure);
  if (skip) {
    b.drop(reason, row);
    return false;
  }
  b.fault = cellFault(b.key, row, column, t, `not usable: ${REASON_WORDS[reason]}`);
  return false;
}

function addStatus(b: SeriesBuilder, text: string, row: number, column: string, skip: boolean): boolean {
  const t = text.trim();
  if (t === '1' || t === '0') {
    b.status.push(t === '1' ? 1 : 0);
    return true;
  }
  if (skip) {
    b.drop(t === '' ? 'blank' : 'non-numeric', row);
    return false;
  }
  b.fault = cellFault(b.key, row, column, t, 'not a status: 1 (failed) or 0 (still running or removed unfailed)');
  return false;
}

/**
 * Long table: `keys` names the series of each row; `values` (and `status`, when given) hold that
 * row's cells. The three columns must come from the same rows (the same `rows`); a row missing from
 * the value column (a blank cell) is a fault of its series. Series come out in order of first
 * appearance.
 */
export function splitLong(keys: CellColumn, values: CellColumn, status: CellColumn | null, options: SplitOptions = {}): SeriesRecord[] {
  const decimal = options.decimal ?? '.';
  const skip = options.skipInvalid === true;
  const failure: NumberFailure = { kind: 'syntax' };
  const builders = new Map<string, SeriesBuilder>();
  // Value and status cells by file row (a blank cell was left out by the reader).
  const valueAt = new Map<number, string>();
  for (let i = 0; i < values.texts.length; i++) valueAt.set(values.rows[i] as number, values.texts[i] as string);
  const statusAt = new Map<number, string>();
  if (status) for (let i = 0; i < status.texts.length; i++) statusAt.set(status.rows[i] as number, status.texts[i] as string);

  for (let i = 0; i < keys.texts.length; i++) {
    const key = (keys.texts[i] as string).trim();
    const row = keys.rows[i] as number;
    let b = builders.get(key);
    if (!b) {
      b = new SeriesBuilder(key, values.column);
      builders.set(key, b);
    }
    if (b.fault) continue;
    const text = valueAt.get(row) ?? '';
    const statusText = status ? (statusAt.get(row) ?? '') : '';
    if (status && !addStatus(b, statusText, row, status.column, skip)) continue;
    if (!addCell(b, text, row, values.column, decimal, skip, failure) && status) {
      b.status.pop(); // keep status aligned with the values kept
    }
  }
  return [...builders.values()].map((b) => b.finish(status !== null));
}

/**
 * Wide table: each column is a series named by its header. A blank cell is no value in that row
 * (columns of different lengths are usual), counted; any other invalid cell is the series' fault.
 */
export function splitWide(columns: readonly CellColumn[], options: SplitOptions = {}): SeriesRecord[] {
  const decimal = options.decimal ?? '.';
  const skip = options.skipInvalid === true;
  const failure: NumberFailure = { kind: 'syntax' };
  const out: SeriesRecord[] = [];
  const seen = new Set<string>();
  for (const col of columns) {
    const key = col.column;
    if (seen.has(key)) {
      out.push({ kind: 'error', key, message: `series ${JSON.stringify(key)}: two columns have this name; rename one`, column: key });
      continue;
    }
    seen.add(key);
    const b = new SeriesBuilder(key, col.column);
    for (let i = 0; i < col.texts.length && !b.fault; i++) {
      const text = col.texts[i] as string;
      const row = col.rows[i] as number;
      if (text.trim() === '') {
        b.drop('blank', row);
        continue;
      }
      addCell(b, text, row, col.column, decimal, skip, failure);
    }
    out.push(b.finish(false));
  }
  return out;
}
