/**
 * Life data as recorded at inspections, one row per unit or per group of units: the start and end
 * of the interval in which the unit failed (start empty or 0: failed before the first inspection;
 * end empty: still running at the last one; start = end: an exact time), and optionally how many
 * units the row stands for. The page reads only the header and the first rows to guess the columns;
 * the server reads the intervals (core/life readIntervalRows) and says what is wrong with a row.
 * Pure: no DOM.
 */
import { readColumns } from '../../core/index.js';
import type { ColumnChoice } from './columns.js';

export interface IntervalColumns {
  readonly start: number;
  readonly end: number;
  /** The count column, or 0 when each row is one unit. */
  readonly count: number;
}

const START = /^(start|from|begin|last[ _-]?(ok|good|seen|inspection)|t[ _-]?(start|from)|start[ _-]?[a-z0-9]*)$/i;
const END = /^(end|stop|found|t[ _-]?(end|to)|end[ _-]?[a-z0-9]*|failed[ _-]?(by|at))$/i;
const COUNT = /^(count|counts|n|units|number|qty|quantity|freq|frequency)$/i;

/** Are the first rows of column `index` whole numbers of at least 1 (a count of units)? */
function wholeCounts(csv: string, index: number, header: boolean, decimal: '.' | ','): boolean {
  try {
    const t = readColumns(csv.slice(0, 20_000), [{ select: index, kind: 'number' }], { header, decimal, skipInvalid: true });
    const col = t.columns[0];
    const v = col?.kind === 'number' ? col.values : new Float64Array(0);
    return v.length > 0 && v.length >= t.rowsRead - 1 && v.every((x) => Number.isInteger(x) && x >= 1);
  } catch {
    return false;
  }
}

/** The start and end columns when the header names both (common practice, no source), else null. */
export function namesIntervalColumns(columns: readonly ColumnChoice[]): { start: number; end: number } | null {
  const find = (re: RegExp): number => columns.find((c) => re.test(c.label.trim()))?.index ?? 0;
  const start = find(START);
  const end = find(END);
  return start === 0 || end === 0 || start === end ? null : { start, end };
}

/**
 * The start, end and count columns when the header names a start and an end column (common
 * practice, no source), else null. The count is a column named like one, or else the one other
 * column when the file has exactly three and it holds whole numbers of at least 1.
 */
export function guessIntervalColumns(columns: readonly ColumnChoice[], csv: string, options: { readonly header: boolean; readonly decimal: '.' | ',' }): IntervalColumns | null {
  if (!options.header) return null;
  const named = namesIntervalColumns(columns);
  if (!named) return null;
  const { start, end } = named;
  let count = columns.find((c) => c.index !== start && c.index !== end && COUNT.test(c.label.trim()))?.index ?? 0;
  if (count === 0 && columns.length === 3) {
    const other = columns.find((c) => c.index !== start && c.index !== end);
    if (other && wholeCounts(csv, other.index, options.header, options.decimal)) count = other.index;
  }
  return { start, end, count };
}

/** A fallback choice for the selects: the guess, or the first two columns and no count. */
export function defaultIntervalColumns(columns: readonly ColumnChoice[], csv: string, options: { readonly header: boolean; readonly decimal: '.' | ',' }): IntervalColumns {
  const g = guessIntervalColumns(columns, csv, options);
  if (g) return g;
  const at = (i: number): number => columns[Math.min(i, columns.length - 1)]?.index ?? 1;
  return { start: at(0), end: at(1), count: 0 };
}
