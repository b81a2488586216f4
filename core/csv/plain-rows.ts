/**
 * The CSV scanner's common case as a loop of its own: one number column, rows that end in LF with no
 * quote and no CR before `stopAt`, exactly as many fields as the header or fewer, and a cell that is
 * a valid number. Each such row is read as scanTablePiece's fast path reads it (the same cell range,
 * the same parseNumberRange, the same counters); the first row that is anything else (blank, quoted,
 * CR, extra or missing fields, not a number, no room left) is left where it starts, for the general
 * scanner. A small function of its own because a command reads a file once, from cold code: V8
 * compiles this loop at once, where the scanner's whole body (~500 lines) took long to compile and
 * its rows ran in unoptimised code meanwhile.
 */
import { parseNumberRange, type NumberFailure } from './number.js';

/** The scanner's place, read and advanced: [i, kept, line, rowsRead, nextLF, nextD] (positions in the text; nextLF/nextD as the scanner caches them). */
export type PlainRowState = Int32Array;

export const AT = 0;
export const KEPT = 1;
export const LINE = 2;
export const ROWS_READ = 3;
export const NEXT_LF = 4;
export const NEXT_D = 5;

/**
 * Reads plain rows from st[AT] until one is not plain or `stopAt` (the next CR or quote) is reached.
 * `field` is the 0-based field of the number column, `expectedFields` the header's width, `delim`
 * the delimiter as a one-character string ('' for none). Values go to `out` (capacity `cap`), their
 * 1-based file lines to `rows` when given.
 */
export function scanPlainRows(
  text: string,
  st: PlainRowState,
  stopAt: number,
  delim: string,
  field: number,
  expectedFields: number,
  decimalCode: number,
  out: Float64Array,
  cap: number,
  rows: Int32Array | null,
  failure: NumberFailure,
): void {
  const n = text.length;
  let i = st[AT] as number;
  let kept = st[KEPT] as number;
  let line = st[LINE] as number;
  let rowsRead = st[ROWS_READ] as number;
  let nextLF = st[NEXT_LF] as number;
  let nextD = st[NEXT_D] as number;
  const hasDelim = delim !== '';
  while (i < stopAt && kept < cap) {
    if (nextLF < i) {
      nextLF = text.indexOf('\n', i);
      if (nextLF < 0) nextLF = n;
    }
    const lineEnd = nextLF;
    // Ends in LF before the next CR or quote, and is not empty.
    if (lineEnd >= stopAt || lineEnd === i) break;
    // Where the delimiter cache stood before this row: a row left to the scanner leaves it there.
    const dBefore = nextD;
    let cs = -1;
    let ce = -1;
    let f = 0;
    if (hasDelim) {
      let fs = i;
      for (;;) {
        if (nextD < fs) {
          nextD = text.indexOf(delim, fs);
          if (nextD < 0) nextD = n;
        }
        const fe = nextD < lineEnd ? nextD : lineEnd;
        if (f === field) {
          cs = fs;
          ce = fe;
        }
        if (fe >= lineEnd) break;
        fs = fe + 1;
        f++;
      }
    } else if (field === 0) {
      cs = i;
      ce = lineEnd;
    }
    // A missing cell, more fields than the header, or not a number: left to the scanner.
    const v = cs < 0 || f >= expectedFields ? Number.NaN : parseNumberRange(text, cs, ce, decimalCode, failure);
    if (v !== v) {
      nextD = dBefore;
      break;
    }
    out[kept] = v;
    if (rows !== null) rows[kept] = line;
    kept++;
    rowsRead++;
    line++;
    i = lineEnd + 1;
  }
  st[AT] = i;
  st[KEPT] = kept;
  st[LINE] = line;
  st[ROWS_READ] = rowsRead;
  st[NEXT_LF] = nextLF;
  st[NEXT_D] = nextD;
}
