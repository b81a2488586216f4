/**
 * Reading the columns a workflow needs in one pass (core readColumns keeps them aligned row by
 * row): the value column with the status, subgroup and order columns, or the lower, upper and
 * count columns of grouped data. Status values are checked here, so an error names the file row,
 * the column and the value as written.
 */
import {
  InputError,
  isPlumblineError,
  parseStrictNumber,
  readColumns,
  type ColumnRequest,
  type ColumnResult,
  type DatasetInput,
  type GroupedClass,
  type NumberColumn,
  type TableResult,
  type TextColumn,
} from '../core/index.js';
import { columnArg, flagArg, type AnalyzeArgs } from './args.js';

export interface DatasetRead {
  readonly input: DatasetInput;
  /** The value column (or the count column for grouped data) as a ColumnResult, for the input summary. */
  readonly column: ColumnResult;
  /** Labels of the extra columns read, for the input summary. */
  readonly extraColumns: readonly { readonly role: string; readonly column: string }[];
  /** 1-based file line of each kept row. */
  readonly rowNumbers: Int32Array;
}

/** Whether the run needs more than the one value column. */
export function needsTable(args: AnalyzeArgs): boolean {
  return flagArg(args, 'grouped') || ['statusColumn', 'subgroupColumn', 'orderColumn'].some((name) => columnArg(args, name) !== undefined);
}

function selector(s: string): string | number {
  return /^[1-9][0-9]*$/.test(s.trim()) ? Number(s.trim()) : s;
}

function asColumnResult(t: TableResult, col: NumberColumn): ColumnResult {
  const { columns: _c, rowNumbers: _r, ...summary } = t;
  return { ...summary, values: col.values, column: col.column, columnIndex: col.index };
}

function statusOf(col: TextColumn, rows: Int32Array, file: string): Uint8Array {
  const out = new Uint8Array(col.texts.length);
  for (let i = 0; i < col.texts.length; i++) {
    const text = col.texts[i] as string;
    const v = parseStrictNumber(text);
    if (v !== 0 && v !== 1) {
      throw new InputError(
        `${file}: row ${rows[i] as number}, column ${JSON.stringify(col.column)}: status ${JSON.stringify(text)} is not 1 (failed) or 0 (still running or removed unfailed)`,
        { row: rows[i] as number, column: col.column, value: text },
        'bad-input',
      );
    }
    out[i] = v;
  }
  return out;
}

export function readDataset(text: string, args: AnalyzeArgs, file: string, csv: { delimiter?: string; decimal: '.' | ','; skipInvalid: boolean; header: boolean }): DatasetRead {
  if (flagArg(args, 'grouped')) {
    const names = { lower: columnArg(args, 'lowerColumn') ?? 'lower', upper: columnArg(args, 'upperColumn') ?? 'upper', count: columnArg(args, 'countColumn') ?? 'count' };
    const t = readColumns(
      text,
      [
        { select: selector(names.lower), kind: 'number' },
        { select: selector(names.upper), kind: 'number' },
        { select: selector(names.count), kind: 'number' },
      ],
      csv,
    );
    const [lo, up, ct] = t.columns as NumberColumn[];
    const rows: GroupedClass[] = [];
    for (let i = 0; i < (ct as NumberColumn).values.length; i++) {
      rows.push({ lower: (lo as NumberColumn).values[i] as number, upper: (up as NumberColumn).values[i] as number, count: (ct as NumberColumn).values[i] as number });
    }
    return {
      input: { grouped: rows },
      column: asColumnResult(t, ct as NumberColumn),
      extraColumns: [
        { role: 'lower limits', column: (lo as NumberColumn).column },
        { role: 'upper limits', column: (up as NumberColumn).column },
      ],
      rowNumbers: t.rowNumbers,
    };
  }
  const valueColumn = columnArg(args, 'column');
  if (valueColumn === undefined) {
    throw new InputError('with --censor-column, --subgroup-column or --order-column, name the value column with --column NAME', {}, 'bad-option');
  }
  const requests: ColumnRequest[] = [{ select: selector(valueColumn), kind: 'number' }];
  const roles: { role: 'status' | 'subgroup' | 'order'; label: string }[] = [];
  const statusColumnText = columnArg(args, 'statusColumn');
  if (statusColumnText !== undefined) {
    requests.push({ select: selector(statusColumnText), kind: 'text' });
    roles.push({ role: 'status', label: 'status' });
  }
  const subgroupColumnText = columnArg(args, 'subgroupColumn');
  if (subgroupColumnText !== undefined) {
    requests.push({ select: selector(subgroupColumnText), kind: 'text' });
    roles.push({ role: 'subgroup', label: 'subgroups' });
  }
  const orderColumnText = columnArg(args, 'orderColumn');
  if (orderColumnText !== undefined) {
    requests.push({ select: selector(orderColumnText), kind: 'number' });
    roles.push({ role: 'order', label: 'order' });
  }
  const t = readColumns(text, requests, csv);
  const value = t.columns[0] as NumberColumn;
  const input: { -readonly [K in keyof DatasetInput]: DatasetInput[K] } = { values: value.values };
  const extraColumns: { role: string; column: string }[] = [];
  roles.forEach((r, j) => {
    const col = t.columns[j + 1] as NumberColumn | TextColumn;
    if (col.index === value.index) throw new InputError(`the ${r.role} column ${JSON.stringify(col.column)} is the value column itself`, { column: col.column }, 'bad-option');
    extraColumns.push({ role: r.label, column: col.column });
    if (r.role === 'status') input.status = statusOf(col as TextColumn, t.rowNumbers, file);
    else if (r.role === 'subgroup') input.subgroups = (col as TextColumn).texts;
    else {
      const order = (col as NumberColumn).values;
      const seen = new Map<number, number>();
      for (let i = 0; i < order.length; i++) {
        const o = order[i] as number;
        const first = seen.get(o);
        if (first !== undefined) {
          throw new InputError(
            `${file}: row ${t.rowNumbers[i] as number}, column ${JSON.stringify(col.column)}: order value ${String(o)} repeats row ${first}; the order column must hold distinct times or years`,
            { row: t.rowNumbers[i] as number, column: col.column, value: String(o) },
            'bad-input',
          );
        }
        seen.set(o, t.rowNumbers[i] as number);
      }
      input.order = order;
    }
  });
  return { input, column: asColumnResult(t, value), extraColumns, rowNumbers: t.rowNumbers };
}

/** Errors from grouped classes name the class; add the file row it came from. */
export function withFileRow(e: unknown, file: string, rowNumbers: Int32Array | undefined): unknown {
  if (!rowNumbers || !isPlumblineError(e) || e.place.row === undefined) return e;
  const cls = /^Class (\d+)/.exec(e.message);
  if (!cls) return e;
  const row = rowNumbers[Number(cls[1]) - 1];
  if (row === undefined) return e;
  return new InputError(`${file}: row ${row}: ${e.message}`, { ...e.place, row }, e.code);
}
