/**
 * Reading a batch's series from a CSV text (pure: the CLI and the page share it): a long table (`--by KEY`: one row per value) or a wide
 * table (`--columns a,b,c` or `all-numeric`: one column per series). Each column is read as cell
 * texts with their file rows and parsed per series (core/batch), so one series' bad cell faults
 * only that series.
 */
import { InputError } from '../errors.js';
import { parseStrictNumber, readColumns, type CsvOptions, type TableResult, type TextColumn } from '../csv/index.js';
import { splitLong, splitWide, type CellColumn, type SeriesRecord } from './series.js';

export interface BatchLayout {
  /** Long table: the key column naming each row's series. */
  readonly by?: string;
  /** Long table: the value column (may be left out when the file has just the key and one other column). */
  readonly column?: string;
  /** Long table: the status column of life data (1 failed, 0 suspended). */
  readonly censorColumn?: string;
  /** Wide table: the series' columns, or every numeric column. */
  readonly columns?: readonly string[] | 'all-numeric';
}

function selector(s: string): string | number {
  return /^[1-9][0-9]*$/.test(s.trim()) ? Number(s.trim()) : s;
}

function textColumn(text: string, select: string | number, csv: CsvOptions, skipBlank: boolean): { cells: CellColumn; table: TableResult } {
  const table = readColumns(text, [{ select, kind: 'text' }], { ...csv, skipInvalid: skipBlank || csv.skipInvalid === true });
  const col = table.columns[0] as TextColumn;
  return { cells: { column: col.column, texts: col.texts, rows: table.rowNumbers }, table };
}

/** Whether most non-blank cells of a column are numbers (the rest then fault that series, by row). */
function mostlyNumeric(cells: CellColumn, decimal: '.' | ','): boolean {
  let numbers = 0;
  for (const t of cells.texts) if (Number.isFinite(parseStrictNumber(t.trim(), decimal))) numbers++;
  return cells.texts.length > 0 && numbers * 2 > cells.texts.length;
}

/** A column holding exactly 1, 2, …, n (a row-number column): not a measured series. */
function isRowNumbers(cells: CellColumn): boolean {
  if (cells.texts.length < 3) return false;
  for (let i = 0; i < cells.texts.length; i++) if (parseStrictNumber((cells.texts[i] as string).trim()) !== i + 1) return false;
  return true;
}

export interface BatchRead {
  readonly series: readonly SeriesRecord[];
  /** What was read, in words, for the summary's header. */
  readonly layout: string;
  readonly warnings: readonly string[];
}

export function readBatch(text: string, layout: BatchLayout, csv: CsvOptions): BatchRead {
  const decimal = csv.decimal ?? '.';
  const split = { decimal, skipInvalid: csv.skipInvalid === true };
  if (layout.by !== undefined) {
    if (layout.columns !== undefined) throw new InputError('--by (one row per value, a key column) and --columns (one column per series) are two layouts; give one', {}, 'bad-option');
    const keys = textColumn(text, selector(layout.by), csv, false);
    const status = layout.censorColumn !== undefined ? textColumn(text, selector(layout.censorColumn), csv, true) : null;
    let valueSelect: string | number | undefined = layout.column !== undefined ? selector(layout.column) : undefined;
    if (valueSelect === undefined) {
      const taken = new Set([indexOf(keys.table), ...(status ? [indexOf(status.table)] : [])]);
      const others = keys.table.header.map((_, j) => j + 1).filter((j) => !taken.has(j));
      if (others.length !== 1) {
        throw new InputError(`with --by, name the value column with --column (the file has ${keys.table.header.length} columns)`, {}, 'no-column');
      }
      valueSelect = others[0] as number;
    }
    const values = textColumn(text, valueSelect, csv, true).cells;
    return {
      series: splitLong(keys.cells, values, status?.cells ?? null, split),
      layout: `long table: series named by column ${JSON.stringify(keys.cells.column)}, values in ${JSON.stringify(values.column)}${status ? `, status in ${JSON.stringify(status.cells.column)}` : ''}`,
      warnings: keys.table.warnings,
    };
  }
  if (layout.columns === undefined) throw new InputError('a batch needs --by KEY (long table) or --columns LIST|all-numeric (wide table)', {}, 'bad-option');
  const first = readColumns(text, [{ select: 1, kind: 'text' }], { ...csv, skipInvalid: true });
  const header = first.header;
  const wanted: (string | number)[] =
    layout.columns === 'all-numeric' ? header.map((_, j) => j + 1) : layout.columns.map(selector);
  const columns: CellColumn[] = [];
  const warnings: string[] = [...first.warnings];
  for (const w of wanted) {
    const { cells } = textColumn(text, w, csv, true);
    if (layout.columns === 'all-numeric') {
      if (!mostlyNumeric(cells, decimal)) continue;
      if (isRowNumbers(cells)) {
        warnings.push(`column ${JSON.stringify(cells.column)} holds the row numbers 1 … ${cells.texts.length}; it is not analysed`);
        continue;
      }
    }
    columns.push(cells);
  }
  if (columns.length === 0) throw new InputError('no numeric column found for --columns all-numeric', {}, 'no-column');
  return {
    series: splitWide(columns, split),
    layout: `wide table: ${columns.length} column${columns.length === 1 ? '' : 's'}, one series each`,
    warnings,
  };
}

function indexOf(table: TableResult): number {
  return (table.columns[0] as TextColumn).index;
}
