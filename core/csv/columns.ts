/**
 * Choosing a column: by header name (exact match first, then case-insensitive), or by 1-based
 * index (a number, or text such as "3" or "#3" when no header is named so). A name that several
 * columns share is refused with their indices, so that the user can pick one by index.
 */
import { InputError } from '../errors.js';
import type { ColumnSelector } from './types.js';

export interface ResolvedColumn {
  /** 0-based field index. */
  readonly field: number;
  /** The label used in results and messages. */
  readonly label: string;
}

/** The label of 0-based column j: its header name, or `#j+1` when empty or without a header. */
export function columnLabel(header: readonly string[], j: number): string {
  const name = header[j];
  return name !== undefined && name !== '' ? name : `#${j + 1}`;
}

function listColumns(header: readonly string[], fieldCount: number): string {
  const shown: string[] = [];
  for (let j = 0; j < fieldCount && j < 12; j++) shown.push(`${j + 1} ${JSON.stringify(columnLabel(header, j))}`);
  if (fieldCount > 12) shown.push(`... (${fieldCount} in all)`);
  return shown.join(', ');
}

function matches(header: readonly string[], pred: (h: string) => boolean): number[] {
  const out: number[] = [];
  header.forEach((h, j) => {
    if (pred(h)) out.push(j);
  });
  return out;
}

export function resolveColumn(
  selector: ColumnSelector,
  header: readonly string[],
  fieldCount: number,
): ResolvedColumn {
  const available = `the columns are: ${listColumns(header, fieldCount)}`;
  const byIndex = (k: number, shown: string): ResolvedColumn => {
    if (!Number.isInteger(k) || k < 1 || k > fieldCount) {
      throw new InputError(
        `column ${shown} does not exist: the file has ${fieldCount} column${fieldCount === 1 ? '' : 's'} (${available})`,
        { column: shown },
        'no-column',
      );
    }
    return { field: k - 1, label: columnLabel(header, k - 1) };
  };
  if (typeof selector === 'number') return byIndex(selector, String(selector));

  const wanted = selector.trim();
  if (wanted !== '') {
    const exact = matches(header, (h) => h === wanted);
    const pick = exact.length > 0 ? exact : matches(header, (h) => h.toLowerCase() === wanted.toLowerCase());
    if (pick.length === 1) return { field: pick[0] as number, label: columnLabel(header, pick[0] as number) };
    if (pick.length > 1) {
      throw new InputError(
        `column name ${JSON.stringify(wanted)} matches ${pick.length} columns (${pick.map((j) => j + 1).join(', ')}); choose one by its index`,
        { column: wanted },
        'no-column',
      );
    }
  }
  const m = /^#?(\d+)$/.exec(wanted);
  if (m) return byIndex(Number(m[1]), wanted);
  throw new InputError(`no column named ${JSON.stringify(selector)}; ${available}`, { column: selector }, 'no-column');
}

/** Warnings about the header itself: duplicate and empty names. */
export function headerWarnings(header: readonly string[]): string[] {
  const warnings: string[] = [];
  const seen = new Map<string, number[]>();
  header.forEach((h, j) => {
    if (h === '') return;
    const list = seen.get(h);
    if (list) list.push(j + 1);
    else seen.set(h, [j + 1]);
  });
  for (const [name, cols] of seen) {
    if (cols.length > 1) {
      warnings.push(`column name ${JSON.stringify(name)} appears ${cols.length} times (columns ${cols.join(', ')}); choose such a column by index`);
    }
  }
  const empty = matches(header, (h) => h === '').map((j) => j + 1);
  if (empty.length > 0) {
    warnings.push(`column${empty.length === 1 ? '' : 's'} ${empty.join(', ')} ha${empty.length === 1 ? 's' : 've'} no name; shown as ${empty.map((j) => `#${j}`).join(', ')}`);
  }
  return warnings;
}
