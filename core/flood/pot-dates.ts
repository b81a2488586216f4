/**
 * Dates of a dated series (peaks over a threshold) as whole days since 1970-01-01 (UTC): the
 * calendar date YYYY-MM-DD at the start of a cell (ISO 8601 calendar date; a time after it is
 * ignored). One reader for the CLI and the server, so both count the same days.
 */
import { InputError } from '../errors.js';

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})(?:$|[T ])/;

/** Days since 1970-01-01 of a YYYY-MM-DD date, or null when the text is not a valid calendar date. */
export function isoDayNumber(text: string): number | null {
  const m = ISO_DATE.exec(text.trim());
  if (!m) return null;
  const y = Number(m[1]);
  const mo = Number(m[2]);
  const d = Number(m[3]);
  const ms = Date.UTC(y, mo - 1, d);
  const back = new Date(ms);
  // Date.UTC rolls 2023-02-30 over to March: refuse a day the month does not have.
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d) return null;
  return ms / 86_400_000;
}

/** Day numbers of a column of date texts; the error names the file row and column of the first bad date. */
export function dayNumbers(texts: readonly string[], rowNumbers: ArrayLike<number>, column: string): Float64Array {
  const out = new Float64Array(texts.length);
  texts.forEach((text, i) => {
    const d = isoDayNumber(text);
    if (d === null) {
      const row = rowNumbers[i] as number;
      throw new InputError(`Row ${row}, column ${JSON.stringify(column)}: the date ${JSON.stringify(text)} is not a calendar date YYYY-MM-DD.`, { row, column, value: text }, 'bad-input');
    }
    out[i] = d;
  });
  return out;
}
