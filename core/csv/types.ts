/**
 * Options and results of the CSV reader (core/csv). The reader works on a string already in
 * memory; reading the file is the caller's job (CLI, server, page).
 */

/** A column chosen by header name (exact, then case-insensitive) or by 1-based index. */
export type ColumnSelector = string | number;

/** Why a data row was dropped under `skipInvalid`. */
export type SkipReason =
  | 'blank'
  | 'missing-marker'
  | 'nan'
  | 'infinite'
  | 'out-of-range'
  | 'non-numeric'
  | 'missing-cell'
  | 'extra-fields';

export interface SkipCount {
  readonly reason: SkipReason;
  /** Rows dropped for this reason. */
  readonly count: number;
  /** 1-based file line of the first such row. */
  readonly firstRow: number;
  /** Column (label) of the first such cell. */
  readonly firstColumn: string;
  /** The first such cell's text, as it appeared (trimmed). */
  readonly firstValue: string;
}

/** The delimiters that are detected automatically. */
export type Delimiter = ',' | ';' | '\t';

export interface CsvOptions {
  /** Field delimiter; detected among comma, semicolon and tab when omitted. Any single character. */
  readonly delimiter?: string;
  /** Decimal separator; ',' is never guessed. Default '.'. */
  readonly decimal?: '.' | ',';
  /** Drop rows whose chosen cells are not numbers, counting them by reason. Default false (throw). */
  readonly skipInvalid?: boolean;
  /** Whether the first non-blank line is a header. Default true. Without one, columns are `#1`, `#2`, ... */
  readonly header?: boolean;
}

export interface ColumnOptions extends CsvOptions {
  /** The value column. May be omitted when the file has exactly one column. */
  readonly column?: ColumnSelector;
}

/** One column requested from `readColumns`. */
export interface ColumnRequest {
  readonly select: ColumnSelector;
  /** 'number': strict numbers into a Float64Array; 'text': trimmed, unquoted cell text (non-blank). */
  readonly kind: 'number' | 'text';
  /** 'text' only: keep a blank cell as '' instead of refusing the row (a blank that means something, e.g. "still running"). */
  readonly keepBlank?: boolean;
}

export interface NumberColumn {
  readonly kind: 'number';
  /** The column's label: its header name, or `#i` when the name is empty or there is no header. */
  readonly column: string;
  /** 1-based column index. */
  readonly index: number;
  readonly values: Float64Array;
}

export interface TextColumn {
  readonly kind: 'text';
  readonly column: string;
  readonly index: number;
  readonly texts: readonly string[];
}

export type ColumnData = NumberColumn | TextColumn;

/** What every read reports besides the data: nothing is dropped without being counted here. */
export interface ReadSummary {
  /** Data records read (not counting the header and blank lines). rowsRead = kept + Σ skipped. */
  readonly rowsRead: number;
  /** Rows dropped, by reason (empty unless `skipInvalid`). */
  readonly skipped: readonly SkipCount[];
  /** Blank lines (empty, only spaces/tabs, or only empty fields) that were passed over. */
  readonly blankLines: number;
  /** The delimiter used ('' = none: the file has one column), and whether it was detected or given. */
  readonly delimiter: string;
  readonly delimiterDetected: boolean;
  /** The header names as read (trimmed; empty names stay empty), or [] without a header. */
  readonly header: readonly string[];
  readonly warnings: readonly string[];
}

export interface ColumnResult extends ReadSummary {
  readonly values: Float64Array;
  /** Label of the column read. */
  readonly column: string;
  /** Its 1-based index. */
  readonly columnIndex: number;
}

export interface TableResult extends ReadSummary {
  /** In the order requested; every column has one entry per kept row. */
  readonly columns: readonly ColumnData[];
  /** 1-based file line of each kept row. */
  readonly rowNumbers: Int32Array;
}
