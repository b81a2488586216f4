/**
 * What the CLI says about its input, in the JSON report (`input`) and in the text report:
 * the file, the column, and every row that was read, dropped or passed over.
 */
import { SKIP_REASON_WORDS, delimiterName, type ColumnResult, type SkipCount } from '../core/index.js';

export interface CliInput {
  readonly file: string;
  readonly column: string;
  /** 1-based. */
  readonly columnIndex: number;
  readonly rowsRead: number;
  readonly skipped: readonly SkipCount[];
  readonly blankLines: number;
  /** '' when the file has one column and no delimiter. */
  readonly delimiter: string;
  readonly decimal: '.' | ',';
  readonly encoding: string;
  readonly warnings: readonly string[];
  /** Columns read besides the value column (status, subgroups, order; grouped: the class limits). */
  readonly otherColumns?: readonly { readonly role: string; readonly column: string }[];
}

export function cliInput(
  file: string,
  read: ColumnResult,
  decimal: '.' | ',',
  encoding: string,
  extraWarnings: readonly string[],
): CliInput {
  return {
    file,
    column: read.column,
    columnIndex: read.columnIndex,
    rowsRead: read.rowsRead,
    skipped: read.skipped,
    blankLines: read.blankLines,
    delimiter: read.delimiter,
    decimal,
    encoding,
    warnings: [...extraWarnings, ...read.warnings],
  };
}

/** "none dropped" or "3 dropped: 2 missing-value marker (first at row 5), ...", plus blank lines. */
export function describeSkipped(input: CliInput): string {
  const total = input.skipped.reduce((a, s) => a + s.count, 0);
  const parts: string[] = [];
  if (total === 0) parts.push('none dropped');
  else {
    parts.push(
      `${total} dropped (${input.skipped
        .map((s) => `${s.count} ${SKIP_REASON_WORDS[s.reason]}, first at row ${s.firstRow}`)
        .join('; ')})`,
    );
  }
  if (input.blankLines > 0) parts.push(`${input.blankLines} blank line${input.blankLines === 1 ? '' : 's'} passed over`);
  parts.push(input.delimiter === '' ? 'one column, no delimiter' : `${delimiterName(input.delimiter)}-separated`);
  if (input.decimal === ',') parts.push('decimal comma');
  return parts.join('; ');
}
