/**
 * Reading one numeric column (the common case) and several columns at once (a value column with
 * a status/censoring column and a subgroup column), both through the one-pass scanner.
 */
import { InputError } from '../errors.js';
import { columnLabel } from './columns.js';
import { scanTable, type ScanStorage } from './table.js';
import type { ColumnOptions, ColumnRequest, ColumnResult, CsvOptions, NumberColumn, TableResult } from './types.js';

/**
 * Read one column of strict numbers. Without `column`, a file with exactly one column is read;
 * otherwise the column must be named. `storage.shared`: the values on a SharedArrayBuffer;
 * `storage.handOff`: the values as a view of the scanner's array (no final copy).
 */
export function readColumn(text: string, options: ColumnOptions = {}, storage: Pick<ScanStorage, 'shared' | 'handOff'> = {}): ColumnResult {
  // The row numbers are not part of a ColumnResult: not kept.
  return columnResult(scanTable(text, columnPlan(options), options, { ...storage, rowNumbers: false }));
}

/** The one column readColumn reads: the chosen one, or the only one. */
export function columnPlan(options: ColumnOptions): (header: readonly string[], fieldCount: number) => ColumnRequest[] {
  return (header, fieldCount): ColumnRequest[] => {
    if (options.column !== undefined) return [{ select: options.column, kind: 'number' }];
    if (fieldCount === 1) return [{ select: 1, kind: 'number' }];
    const names: string[] = [];
    for (let j = 0; j < fieldCount && j < 12; j++) names.push(`${j + 1} ${JSON.stringify(columnLabel(header, j))}`);
      throw new InputError(
        `the file has ${fieldCount} columns; choose one by name or index (${names.join(', ')}${fieldCount > 12 ? ', ...' : ''})`,
        {},
        'no-column',
      );
  };
}

/** A one-column table as a ColumnResult. */
export function columnResult(table: TableResult): ColumnResult {
  const col = table.columns[0] as NumberColumn;
  return {
    values: col.values,
    column: col.column,
    columnIndex: col.index,
    rowsRead: table.rowsRead,
    skipped: table.skipped,
    blankLines: table.blankLines,
    delimiter: table.delimiter,
    delimiterDetected: table.delimiterDetected,
    header: table.header,
    warnings: table.warnings,
  };
}

/**
 * Read several columns in one pass, e.g. `[{ select: 'hours', kind: 'number' }, { select: 'status',
 * kind: 'number' }, { select: 'subgroup', kind: 'text' }]`. A row is kept only when all its
 * requested cells are valid, so the columns stay aligned (and `rowNumbers` says where each kept
 * row was in the file).
 */
export function readColumns(text: string, requests: readonly ColumnRequest[], options: CsvOptions = {}): TableResult {
  return scanTable(text, requests, options);
}
