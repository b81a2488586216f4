/**
 * Interval rows from a CSV file's text, one reading for the CLI and the server: the START and END
 * columns of the interval in which each unit (or `count` units) failed, read with the one CSV reader
 * (core/csv readColumns, rows kept aligned). An empty START means "failed before the first
 * inspection" (0), an empty END "still running" (∞); any other cell must be a strict number, and
 * the error names the file row, the column and the cell. The rows' own checks (end before start, a
 * count that is not a whole number, ...) are prepareIntervalLifeData's, with the file's row numbers.
 */
import { readColumns } from '../csv/index.js';
import { parseStrictNumber } from '../csv/index.js';
import type { ColumnRequest, ColumnSelector, CsvOptions, NumberColumn, ReadSummary, TextColumn } from '../csv/index.js';
import { InputError } from '../errors.js';
import type { IntervalLifeInput } from './interval-likelihood-data.js';

export interface IntervalColumns {
  readonly start: ColumnSelector;
  readonly end: ColumnSelector;
  readonly count?: ColumnSelector;
  /** The failure-mode column (blank for a suspension): competing-modes.ts analyzeIntervalModes. */
  readonly mode?: ColumnSelector;
  /** Each row's inspection times separated by ';' (IntervalLifeInput.inspections). */
  readonly inspections?: ColumnSelector;
}

export interface IntervalRowsRead {
  readonly interval: IntervalLifeInput;
  /** Each row's failure mode (null where blank), when a mode column was given. */
  readonly modes?: readonly (string | null)[];
  /** The columns read, by role, with their labels and 1-based indexes. */
  readonly columns: readonly { readonly role: 'interval start' | 'interval end' | 'count' | 'failure mode' | 'inspection times'; readonly column: string; readonly index: number }[];
  readonly summary: ReadSummary;
}

/** A column given as text that is a whole number ≥ 1 names the column by number, as everywhere else. */
export function columnSelector(s: string | number): ColumnSelector {
  return typeof s === 'number' ? s : /^[1-9][0-9]*$/.test(s.trim()) ? Number(s.trim()) : s;
}

export function readIntervalRows(text: string, cols: IntervalColumns, options: CsvOptions = {}, file = 'the file'): IntervalRowsRead {
  const requests: ColumnRequest[] = [
    // keepBlank: an empty start or end cell is meaningful here.
    { select: cols.start, kind: 'text', keepBlank: true },
    { select: cols.end, kind: 'text', keepBlank: true },
  ];
  if (cols.count !== undefined) requests.push({ select: cols.count, kind: 'number' });
  if (cols.mode !== undefined) requests.push({ select: cols.mode, kind: 'text', keepBlank: true });
  if (cols.inspections !== undefined) requests.push({ select: cols.inspections, kind: 'text', keepBlank: true });
  const t = readColumns(text, requests, options);
  const decimal = options.decimal ?? '.';
  const [s, e] = t.columns as [TextColumn, TextColumn];
  if (s.index === e.index) throw new InputError(`The interval start and end are the same column ${JSON.stringify(s.column)}: give two columns.`, { column: s.column }, 'bad-option');
  const cell = (c: TextColumn, empty: number) =>
    c.texts.map((x, i) => {
      if (x.trim() === '') return empty;
      const v = parseStrictNumber(x.trim(), decimal);
      if (Number.isNaN(v)) {
        const row = t.rowNumbers[i] as number;
        throw new InputError(`${file}: row ${row}, column ${JSON.stringify(c.column)}: ${JSON.stringify(x)} is not a number (leave the cell empty for "before the first inspection" or "still running")`, { row, column: c.column, value: x }, 'not-a-number');
      }
      return v;
    });
  const counts = cols.count !== undefined ? (t.columns[2] as NumberColumn) : undefined;
  const mode = cols.mode !== undefined ? (t.columns[cols.count !== undefined ? 3 : 2] as TextColumn) : undefined;
  const insp = cols.inspections !== undefined ? (t.columns[t.columns.length - 1] as TextColumn) : undefined;
  const times = insp
    ? insp.texts.map((x, i) =>
        x.trim() === ''
          ? []
          : x.split(';').map((part) => {
              const v = parseStrictNumber(part.trim(), decimal);
              if (Number.isNaN(v)) {
                const row = t.rowNumbers[i] as number;
                throw new InputError(`${file}: row ${row}, column ${JSON.stringify(insp.column)}: ${JSON.stringify(part.trim())} in ${JSON.stringify(x)} is not a number (inspection times are numbers separated by ;)`, { row, column: insp.column, value: x }, 'not-a-number');
              }
              return v;
            }),
      )
    : undefined;
  const { columns: _c, rowNumbers, ...summary } = t;
  return {
    interval: { start: cell(s, 0), end: cell(e, Number.POSITIVE_INFINITY), ...(counts ? { counts: counts.values } : {}), lines: Array.from(rowNumbers), ...(times ? { inspections: times } : {}) },
    ...(mode ? { modes: mode.texts.map((x) => (x.trim() === '' ? null : x.trim())) } : {}),
    columns: [
      { role: 'interval start', column: s.column, index: s.index },
      { role: 'interval end', column: e.column, index: e.index },
      ...(counts ? [{ role: 'count' as const, column: counts.column, index: counts.index }] : []),
      ...(mode ? [{ role: 'failure mode' as const, column: mode.column, index: mode.index }] : []),
      ...(insp ? [{ role: 'inspection times' as const, column: insp.column, index: insp.index }] : []),
    ],
    summary,
  };
}
