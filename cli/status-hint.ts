/**
 * A hint for life data given without its status column: a column other than the value column that
 * holds only 0 and 1 is probably a status (1 failed, 0 still running or removed unfailed). Without
 * --censor-column every value is analysed as a failure time, which understates the life; the hint
 * goes to standard error and the run goes on.
 */
import { readColumns, type ColumnRequest, type ColumnResult, type CsvOptions } from '../core/index.js';

/** At most this many data rows are looked at (the hint must cost little on a large file). */
export const HINT_ROWS = 10_000;

/** The text up to the end of its first `lines` lines (all of it when shorter), and whether it was cut. */
function firstLines(text: string, lines: number): { head: string; cut: boolean } {
  let at = -1;
  for (let i = 0; i < lines; i++) {
    at = text.indexOf('\n', at + 1);
    if (at < 0) return { head: text, cut: false };
  }
  return { head: text.slice(0, at + 1), cut: at + 1 < text.length };
}

/**
 * The warning for the 0/1 columns of a file with a header, or null. `read` is the value column as
 * read; the other columns are read as text from the first HINT_ROWS rows.
 */
export function statusColumnHint(text: string, read: ColumnResult, csv: CsvOptions): string | null {
  if (read.header.length < 2 || read.delimiter === '') return null;
  const { head, cut } = firstLines(text, HINT_ROWS + 1);
  const requests: ColumnRequest[] = [];
  for (let i = 1; i <= read.header.length; i++) if (i !== read.columnIndex) requests.push({ select: i, kind: 'text' });
  let columns;
  try {
    columns = readColumns(head, requests, { ...csv, delimiter: read.delimiter, skipInvalid: true }).columns;
  } catch {
    return null; // a hint never stops the run; the value column was read already
  }
  const binary = columns.filter((c) => c.kind === 'text' && c.texts.length >= 2 && c.texts.every((t) => t === '0' || t === '1')).map((c) => c.column);
  if (binary.length === 0) return null;
  const names = binary.map((c) => JSON.stringify(c)).join(', ');
  const where = cut ? ` in its first ${HINT_ROWS} rows` : '';
  return (
    `column${binary.length > 1 ? 's' : ''} ${names} hold${binary.length > 1 ? '' : 's'} only 0 and 1${where}: if ${binary.length > 1 ? 'one of them' : 'it'} marks failed (1) and ` +
    `still-running or removed (0) units, add --censor-column ${JSON.stringify(binary[0])}; without it every value is analysed as a failure time`
  );
}
