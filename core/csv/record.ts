/**
 * The CSV scanner's record-level pieces: blank checks, the quoted-field errors, the header record
 * read as strings, and the not-a-text-file check (shared by the piece scanner, scan-piece.ts).
 * Quoting follows RFC 4180; line ends CRLF, LF and a lone CR.
 */
import { InputError } from '../errors.js';
import { columnLabel } from './columns.js';

/** Char codes the scanner looks for. */
export const LF = 10;
export const CR = 13;
export const QUOTE = 34;
export const SPACE = 32;
export const TAB = 9;

export interface Cursor {
  i: number;
  line: number;
}

export function isBlankRange(text: string, start: number, end: number): boolean {
  for (let k = start; k < end; k++) {
    const c = text.charCodeAt(k);
    if (c !== SPACE && c !== TAB) return false;
  }
  return true;
}

/** Only spaces, tabs and delimiters. */
export function isBlankRecord(text: string, start: number, end: number, delim: number): boolean {
  for (let k = start; k < end; k++) {
    const c = text.charCodeAt(k);
    if (c !== SPACE && c !== TAB && c !== delim) return false;
  }
  return true;
}

/** Shorten and quote a cell for a message (control characters escaped by JSON rules). */
export function showValue(s: string): string {
  const cut = s.length > 60 ? `${s.slice(0, 57)}...` : s;
  return JSON.stringify(cut);
}

export function unquote(text: string, start: number, end: number, escaped: boolean): string {
  const s = text.slice(start, end);
  return escaped ? s.replace(/""/g, '"') : s;
}

export function unterminated(row: number, column: string): InputError {
  return new InputError(
    `row ${row}, column ${JSON.stringify(column)}: a quoted field starts here but its closing quote (") is missing`,
    { row, column },
    'csv-parse',
  );
}

export function afterQuote(row: number, column: string, text: string, at: number): InputError {
  const rest = text.slice(at, at + 20).split(/[\r\n]/)[0] ?? '';
  return new InputError(
    `row ${row}, column ${JSON.stringify(column)}: text ${showValue(rest)} follows a closing quote; a quoted field must end at a delimiter or the line end (double any quote inside it)`,
    { row, column, value: rest },
    'csv-parse',
  );
}

/** Read one whole record as trimmed, unquoted strings (used for the header only). */
export function readRecordStrings(text: string, cur: Cursor, delim: number, header: readonly string[]): string[] {
  const n = text.length;
  const out: string[] = [];
  const row = cur.line;
  let i = cur.i;
  for (;;) {
    let value: string;
    if (i < n && text.charCodeAt(i) === QUOTE) {
      const q = i + 1;
      let escaped = false;
      i++;
      for (;;) {
        if (i >= n) throw unterminated(row, columnLabel(header, out.length));
        const c = text.charCodeAt(i);
        if (c === QUOTE) {
          if (i + 1 < n && text.charCodeAt(i + 1) === QUOTE) {
            escaped = true;
            i += 2;
            continue;
          }
          break;
        }
        if (c === LF) cur.line++;
        else if (c === CR) {
          cur.line++;
          if (i + 1 < n && text.charCodeAt(i + 1) === LF) i++;
        }
        i++;
      }
      value = unquote(text, q, i, escaped).trim();
      i++;
      let c = 0;
      while (i < n && ((c = text.charCodeAt(i)) === SPACE || c === TAB) && c !== delim) i++;
      if (i < n && (c = text.charCodeAt(i)) !== delim && c !== LF && c !== CR) {
        throw afterQuote(row, columnLabel(header, out.length), text, i);
      }
    } else {
      const s = i;
      while (i < n) {
        const c = text.charCodeAt(i);
        if (c === delim || c === LF || c === CR) break;
        i++;
      }
      value = text.slice(s, i).trim();
    }
    out.push(value);
    if (i >= n) break;
    const c = text.charCodeAt(i);
    i++;
    if (c === delim) continue;
    if (c === CR && i < n && text.charCodeAt(i) === LF) i++;
    cur.line++;
    break;
  }
  cur.i = i;
  return out;
}

/** Refuse text that is evidently not a text file (a NUL character near the start). */
export function checkText(text: string, start: number): void {
  const limit = Math.min(text.length, start + 65536);
  let line = 1;
  for (let k = start; k < limit; k++) {
    const c = text.charCodeAt(k);
    if (c === 0) {
      throw new InputError(
        `the file does not look like text (a NUL character on line ${line}); is it a spreadsheet workbook or a UTF-16 file? Save it as CSV (UTF-8)`,
        { row: line },
        'csv-parse',
      );
    }
    if (c === LF) line++;
  }
}
